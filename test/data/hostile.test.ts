/**
 * The hostile-input corpus (test/fixtures/hostile/README.md): every case is refused with its expected sentence,
 * and the database hash is the same before and after, for restore, merge, the site import and the element store.
 */
import 'fake-indexeddb/auto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseTle } from '../../src/core/orbit/tle.ts';
import { restoreBackup } from '../../src/data/backup.ts';
import { commitSiteImport, previewSiteImport } from '../../src/data/exchange/siteImport.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { elementRepo } from '../../src/data/repo/elements.ts';
import { hashDb, seedSample, useTestDb } from './helpers.ts';

interface Case {
  file: string;
  against: ('restore' | 'merge' | 'import-csv' | 'import-geojson' | 'elements')[];
  kind?: string;
  message: string;
}
const DIR = new URL('../fixtures/hostile/', import.meta.url);
const cases = JSON.parse(readFileSync(new URL('cases.json', DIR), 'utf8')) as Case[];
const read = (f: string) => readFileSync(new URL(f, DIR), 'utf8');
/** A sentence for the crew: starts with a capital or a row name, has no engine wording. */
const ENGINE = /Cannot read|undefined|is not a function|Maximum call stack|Unexpected token|JSON\.parse|TypeError|RangeError/;

describe('hostile inputs change nothing and are refused in words', () => {
  const db = useTestDb();

  it('the corpus base file itself restores (so each case fails only for its own change)', async () => {
    await expect(restoreBackup(db(), read('backup-valid.json'))).resolves.toMatchObject({ sites: 3 });
  });

  for (const c of cases) {
    for (const how of c.against) {
      it(`${c.file} → ${how}`, async () => {
        await seedSample(db());
        const before = await hashDb(db());
        const text = read(c.file);
        const expected = new RegExp(c.message);
        if (how === 'restore' || how === 'merge') {
          const run = how === 'restore' ? restoreBackup(db(), text, { replace: true }) : mergeBackup(db(), text, { by: 'Ada Quill' });
          const err = (await run.then(() => null, (e: unknown) => e)) as { name?: string; kind?: string; message?: string } | null;
          expect(err).toMatchObject({ name: 'BackupError', kind: c.kind });
          expect(err?.message).toMatch(expected);
          expect(err?.message).not.toMatch(ENGINE);
        } else if (how === 'elements') {
          const r = parseTle(text);
          expect(r.sets).toEqual([]);
          expect(r.errors.map((e) => e.message).join('\n')).toMatch(expected);
          await elementRepo.put(db(), r.sets);
        } else {
          const preview = await previewSiteImport(db(), text, how === 'import-csv' ? 'csv' : 'geojson');
          expect(preview.accepted).toEqual([]);
          const reasons = preview.rejected.map((x) => x.reason).join('\n');
          expect(reasons).toMatch(expected);
          expect(reasons).not.toMatch(ENGINE);
          await commitSiteImport(db(), preview, { by: 'Ada Quill' });
        }
        expect(await hashDb(db())).toBe(before);
      });
    }
  }
});
