/**
 * Acceptance: a backup archive at a season's size. 40 photos of 6 MB (240 MB, seeded random bytes that do not
 * compress) with records and their edit history are backed up, restored into an empty database and merged into
 * another; every record, revision and photo byte is compared with what was put in (rows as read from the source
 * database, photo bytes as generated), with plain structural equality and byte comparison.
 */
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { exportBackupArchive, restoreBackup } from '../../src/data/backup.ts';
import { openGlintmarkDb, type GlintmarkDb } from '../../src/data/db.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { installationRepo, reflectorRepo } from '../../src/data/repo/entities.ts';
import { addPhoto } from '../../src/data/repo/photos.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { randomBytes } from '../helpers/random.ts';
import { T0_MS, installationFields, reflectorFields, siteFields, useTestDb } from './helpers.ts';

const PHOTOS = 40;
const PHOTO_BYTES = 6_000_000;
const TABLES = ['sites', 'reflectors', 'installations', 'photos', 'revisions'] as const;

/** Rows of the record tables sorted by id; photo blobs replaced by their size (bytes are compared separately). */
async function rowsOf(db: GlintmarkDb) {
  const out: Record<string, unknown[]> = {};
  for (const t of TABLES) {
    const rows = (await db.table(t).toArray()) as Record<string, unknown>[];
    out[t] = rows.map((r) => (r.blob instanceof Blob ? { ...r, blob: r.blob.size } : r)).sort((a, b) => String(a.id).localeCompare(String(b.id)));
  }
  return out;
}

describe('season-size backup archive', () => {
  const db = useTestDb();

  it('backs up 240 MB of photos with records and history, restores and merges them byte for byte', { timeout: 180_000 }, async () => {
    const put = new Map<string, Uint8Array>();
    let photoNo = 0;
    for (let s = 0; s < 8; s++) {
      const ctx = { by: 'Ada Quill', nowMs: T0_MS + s * 1000 };
      const site = await siteRepo.create(db(), siteFields({ code: `MF-${10 + s}`, latDeg: 52 + s / 100 }), ctx);
      await siteRepo.update(db(), site.id, { notes: `gate ${s}, edited` }, { by: 'Bo Marsh', nowMs: T0_MS + s * 1000 + 1 });
      const refl = await reflectorRepo.create(db(), reflectorFields(site.id), ctx);
      const inst = await installationRepo.create(db(), installationFields(site.id, refl.id), ctx);
      await installationRepo.update(db(), inst.id, { measuredAzimuthDeg: 256.4 }, { by: 'Bo Marsh', nowMs: T0_MS + s * 1000 + 2 });
      for (let k = 0; k < PHOTOS / 8; k++, photoNo++) {
        const bytes = randomBytes(PHOTO_BYTES, 1000 + photoNo);
        const p = await addPhoto(db(), { table: 'installations', id: inst.id }, 'north', new Blob([bytes], { type: 'image/jpeg' }), { ...ctx, nowMs: T0_MS + s * 1000 + 10 + k });
        put.set(p.id, bytes);
      }
    }
    const want = await rowsOf(db());
    expect(want.photos).toHaveLength(PHOTOS);
    expect(want.revisions.length).toBeGreaterThan(PHOTOS * 2);

    const archive = await exportBackupArchive(db(), { appVersion: '0.1.0', nowMs: T0_MS + 86_400_000 });
    expect(archive.size).toBeGreaterThan(PHOTOS * PHOTO_BYTES);

    for (const mode of ['restore', 'merge'] as const) {
      const other = openGlintmarkDb(`season-${mode}-${crypto.randomUUID()}`);
      try {
        if (mode === 'restore') await restoreBackup(other, archive);
        else await mergeBackup(other, archive, { by: 'Cy Fenn' });
        expect(await rowsOf(other)).toEqual(want);
        for (const [id, bytes] of put) {
          const got = new Uint8Array(await ((await other.photos.get(id))?.blob ?? new Blob()).arrayBuffer());
          expect(got.length, id).toBe(PHOTO_BYTES);
          expect(Buffer.compare(Buffer.from(got), Buffer.from(bytes)), id).toBe(0);
        }
      } finally {
        await other.delete();
      }
    }
  });
});
