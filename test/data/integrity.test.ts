/**
 * Validation that cannot be walked around: prototype keys, nesting depth, string sizes, non-object rows, and the
 * repositories' link rules, all checked before a restore or merge writes anything. Every refusal is a BackupError
 * with a plain sentence, and the database hash is the same before and after (hashDb in helpers.ts).
 */
import 'fake-indexeddb/auto';
import { beforeEach, afterEach, describe, expect, it } from 'vitest';
import { backupToJson, exportBackup, restoreBackup, type BackupDocument } from '../../src/data/backup.ts';
import { openGlintmarkDb, type GlintmarkDb } from '../../src/data/db.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { reflectorRepo } from '../../src/data/repo/entities.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { hashDb, reflectorFields, seedSample, siteFields, useTestDb } from './helpers.ts';

const A = { by: 'Ada Quill' };

describe('backup validation cannot be walked around', () => {
  const target = useTestDb();
  let source: GlintmarkDb;
  beforeEach(() => {
    source = openGlintmarkDb(`source-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await source.delete();
  });

  const docOf = async (): Promise<BackupDocument> => {
    await seedSample(source);
    return exportBackup(source, { appVersion: '0.1.0' });
  };

  /** Restore and merge both refuse `text` with a message matching `message`, and change nothing. */
  async function expectRefused(text: string, message: RegExp) {
    await seedSample(target());
    const before = await hashDb(target());
    for (const run of [() => restoreBackup(target(), text, { replace: true }), () => mergeBackup(target(), text, A)]) {
      const err = await run().then(
        () => null,
        (e: unknown) => e,
      );
      expect(err).toMatchObject({ name: 'BackupError' });
      expect((err as Error).message).toMatch(message);
      expect((err as Error).message).not.toMatch(/Cannot read|undefined|Maximum call stack|is not a function/);
    }
    expect(await hashDb(target())).toBe(before);
  }

  it('a site row whose fields hide behind a __proto__ key is refused, naming the key', async () => {
    const doc = await docOf();
    const text = backupToJson(doc);
    // JSON.parse makes "__proto__" an own property; plain assignment of it would set the prototype instead.
    const s = doc.tables.sites[0];
    const { id, rev, createdAtMs, updatedAtMs, deletedAtMs, ...fields } = s;
    const hidden = `${JSON.stringify({ id, rev, createdAtMs, updatedAtMs, deletedAtMs }).slice(0, -1)},"__proto__":${JSON.stringify(fields)}}`;
    const forged = text.replace(JSON.stringify(s), hidden);
    expect(forged).toContain('"__proto__":{"code"');
    await expectRefused(forged, /sites\[0\].*__proto__/);
  });

  it('constructor and prototype keys at any depth are refused', async () => {
    const doc = await docOf();
    // A revision snapshot is an open object (any field names), so only the key rule can catch this.
    const text = backupToJson(doc).replace('"snapshot":{', '"snapshot":{"constructor":{"prototype":{"x":1}},');
    expect(text).toContain('"constructor"');
    await expectRefused(text, /revisions\[\d+\]\.snapshot: .*"constructor"/);
  });

  it('a photo row of null is a sentence, not an engine error', async () => {
    const doc = await docOf();
    (doc.tables as unknown as { photos: unknown[] }).photos = [null];
    await expectRefused(backupToJson(doc), /photos\[0\]: must be an object/);
  });

  it('a revision nested thousands of levels deep is refused in words', async () => {
    const doc = await docOf();
    const deep = '['.repeat(5000) + ']'.repeat(5000);
    const text = backupToJson(doc).replace('"changes":[]', `"changes":[{"field":"notes","before":"","after":${deep}}]`);
    await expectRefused(text, /nested more than \d+ levels/);
  });

  it('a huge string where no field allows one is refused in words', async () => {
    const doc = await docOf();
    const text = backupToJson(doc).replace('"changes":[]', `"changes":[{"field":"notes","before":"","after":"${'x'.repeat(2_000_000)}"}]`);
    await expectRefused(text, /text of 2000000 characters.*at most/);
  });
});

describe('restore and merge apply the repositories’ link rules to every row', () => {
  const target = useTestDb();
  let source: GlintmarkDb;
  beforeEach(() => {
    source = openGlintmarkDb(`source-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await source.delete();
  });

  async function expectRefused(doc: BackupDocument, message: RegExp) {
    await siteRepo.create(target(), siteFields({ code: 'ZZ-9' }), A);
    const before = await hashDb(target());
    const restore = await restoreBackup(target(), backupToJson(doc), { replace: true }).catch((e: unknown) => e);
    const merge = await mergeBackup(target(), backupToJson(doc), A).catch((e: unknown) => e);
    for (const err of [restore, merge]) {
      expect(err).toMatchObject({ name: 'BackupError', kind: 'dangling-reference' });
      expect((err as Error).message).toMatch(message);
    }
    expect(await hashDb(target())).toBe(before);
  }

  it('a live reflector on a deleted site', async () => {
    const { site } = await seedSample(source);
    const doc = await exportBackup(source, { appVersion: '0.1.0' });
    const s = doc.tables.sites.find((x) => x.id === site.id)!;
    s.deletedAtMs = s.updatedAtMs;
    await expectRefused(doc, /reflectors\[0\] \(A\)\.siteId: .*deleted/);
  });

  it('an installation whose site differs from its reflector’s', async () => {
    const { site2 } = await seedSample(source);
    const doc = await exportBackup(source, { appVersion: '0.1.0' });
    doc.tables.installations[0].siteId = site2.id;
    await expectRefused(doc, /installations\[0\]\.reflectorId: .*another site/);
  });

  it('a photo whose owner does not list it', async () => {
    await seedSample(source);
    const doc = await exportBackup(source, { appVersion: '0.1.0' });
    doc.tables.installations[0].photoIds = [];
    await expectRefused(doc, /photos\[0\]\.ownerId: .*does not list/);
  });

  it('an installation that lists a photo of another record', async () => {
    const { site, refl } = await seedSample(source);
    const other = await reflectorRepo.create(source, reflectorFields(site.id, { label: 'B' }), A);
    const doc = await exportBackup(source, { appVersion: '0.1.0' });
    expect(refl.id).not.toBe(other.id);
    doc.tables.inspections[0].photoIds = [doc.tables.photos[0].id];
    await expectRefused(doc, /inspections\[0\]\.photoIds\[0\]: .*not a live photo of this record/);
  });

  it('a geometry on one site pointing to a reflector of another', async () => {
    const { site2 } = await seedSample(source);
    const doc = await exportBackup(source, { appVersion: '0.1.0' });
    doc.tables.geometries[0].siteId = site2.id;
    // The installation lists that geometry too, so its site check fires as well; the geometry comes first.
    await expectRefused(doc, /geometries\[0\]\.reflectorId: .*another site/);
  });
});
