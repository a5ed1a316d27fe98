import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { backupToJson, BACKUP_TABLES, exportBackup, restoreBackup, type BackupDocument } from '../../src/data/backup.ts';
import { openGlintmarkDb } from '../../src/data/db.ts';
import { BackupError } from '../../src/data/errors.ts';
import { T0_MS, dumpDb, seedSample, useTestDb } from './helpers.ts';

const records = async (db: Parameters<typeof dumpDb>[0]) => {
  const d = await dumpDb(db);
  return Object.fromEntries(BACKUP_TABLES.map((t) => [t, d[t]]));
};

describe('backup and restore', () => {
  const db = useTestDb();

  it('writes one versioned JSON document with photos inline as base64', async () => {
    const ids = await seedSample(db());
    const doc = await exportBackup(db(), { appVersion: '0.1.0', nowMs: T0_MS });
    expect(doc).toMatchObject({ format: 'glintmark-backup', formatVersion: 1, exportedAtUtc: '2027-07-02T12:00:00.000Z', app: { name: 'glintmark', version: '0.1.0', schemaVersion: 5 } });
    expect(doc.tables.photos).toEqual([expect.objectContaining({ id: ids.photo.id, mime: 'image/jpeg', bytes: 5, dataBase64: 'AQID+vs=' })]);
    expect(doc.tables.photos[0]).not.toHaveProperty('blob');
    expect(JSON.parse(backupToJson(doc))).toEqual(doc);
  });

  it('restores into an empty database exactly what was exported (every row, history and photo bytes)', async () => {
    await seedSample(db());
    const text = backupToJson(await exportBackup(db(), { appVersion: '0.1.0' }));
    const other = openGlintmarkDb(`restore-${crypto.randomUUID()}`);
    try {
      const counts = await restoreBackup(other, text);
      expect(counts).toMatchObject({ sites: 3, reflectors: 1, geometries: 1, installations: 1, inspections: 1, photos: 1 });
      expect(await records(other)).toEqual(await records(db()));
    } finally {
      await other.delete();
    }
  });

  /** Each failure class: the message, and the database unchanged (full dump before/after). */
  async function expectRefused(input: unknown, kind: string, message: string | RegExp, opts = {}) {
    const before = await dumpDb(db());
    const err = await restoreBackup(db(), input, { replace: true, ...opts }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(BackupError);
    expect((err as BackupError).kind).toBe(kind);
    expect((err as Error).message).toMatch(message);
    expect(await dumpDb(db())).toEqual(before);
  }
  async function seededDoc(): Promise<BackupDocument> {
    await seedSample(db());
    return JSON.parse(backupToJson(await exportBackup(db(), { appVersion: '0.1.0' }))) as BackupDocument;
  }

  it('refuses a file that is not JSON at all', async () => {
    await seedSample(db());
    await expectRefused('code,name,latitude\nMF-01,Fen,52\n', 'not-json', 'This file is not a Glintmark backup: it is not JSON (it starts with "code,name,la").');
    await expectRefused('   ', 'not-json', 'The file is empty');
  });

  it('refuses a truncated file', async () => {
    const text = JSON.stringify(await seededDoc());
    await expectRefused(text.slice(0, Math.floor(text.length / 2)), 'truncated', 'The backup file is incomplete (it ends in the middle of the data)');
  });

  it('refuses another format and a newer format version', async () => {
    const doc = await seededDoc();
    await expectRefused({ type: 'FeatureCollection', features: [] }, 'wrong-format', 'This file is not a Glintmark backup (its format is null, expected "glintmark-backup")');
    await expectRefused({ ...doc, formatVersion: 3 }, 'wrong-version', 'This backup was made by a newer Glintmark (backup format 3; this app reads format 1). Update the app');
    // Format 2 is the records.json inside a backup archive: useless without the archive's photos.
    await expectRefused({ ...doc, formatVersion: 2 }, 'wrong-format', 'This is the records file from inside a backup archive, without its photos.');
    await expectRefused(JSON.stringify({ ...doc, tables: { ...doc.tables, sites: undefined } }), 'invalid-record', 'its header or table lists are damaged. tables.sites: is required');
  });

  it('refuses bad coordinates, naming the row', async () => {
    const doc = await seededDoc();
    const k = doc.tables.sites.findIndex((s) => s.code === 'MF-02');
    doc.tables.sites[k].latDeg = 123;
    doc.tables.installations[0].measuredAzimuthDeg = 360;
    await expectRefused(
      doc,
      'invalid-record',
      `The backup was not restored: 2 problem(s) in its records. sites[${k}] (MF-02).latDeg: latitude must be in [-90, 90] degrees, got 123; installations[0].measuredAzimuthDeg: measured azimuth must be in [0, 360) degrees, got 360`,
    );
  });

  it('refuses duplicate ids and two live sites with one code', async () => {
    const doc = await seededDoc();
    await expectRefused({ ...doc, tables: { ...doc.tables, installations: [doc.tables.installations[0], doc.tables.installations[0]] } }, 'duplicate-id', `installations[1]: repeats the id ${doc.tables.installations[0].id} of installations[0]`);
    const k = doc.tables.sites.findIndex((s) => s.code === 'MF-01');
    const twin = { ...doc.tables.sites[k], id: crypto.randomUUID(), code: 'mf-01' };
    await expectRefused({ ...doc, tables: { ...doc.tables, sites: [...doc.tables.sites, twin] } }, 'duplicate-id', `sites[3] (mf-01): uses the same code as the live site sites[${k}]`);
  });

  it('refuses a photo that is too large, and damaged photo data', async () => {
    const doc = await seededDoc();
    await expectRefused(doc, 'photo-too-large', 'photos[0]: is 5 bytes, more than the 4 bytes photo limit', { maxPhotoBytes: 4 });
    doc.tables.photos[0].dataBase64 = 'not base64!';
    await expectRefused(doc, 'invalid-record', 'photos[0].dataBase64: is not valid base64');
  });

  it('carries the SHA-256 of each photo, refuses a photo whose bytes do not match it, and fills it in for older backups', async () => {
    const doc = await seededDoc();
    // SHA-256 of the seed photo's five bytes 01 02 03 FA FB, computed independently with Node's OpenSSL.
    const { createHash } = await import('node:crypto');
    const expected = createHash('sha256').update(Buffer.from([1, 2, 3, 250, 251])).digest('hex');
    expect(doc.tables.photos[0].sha256).toBe(expected);
    await expectRefused({ ...doc, tables: { ...doc.tables, photos: [{ ...doc.tables.photos[0], sha256: '0'.repeat(64) }] } }, 'invalid-record', 'photos[0].sha256: does not match the photo data');
    await expectRefused({ ...doc, tables: { ...doc.tables, photos: [{ ...doc.tables.photos[0], sha256: 'ABC' }] } }, 'invalid-record', 'sha256 must be 64 lowercase hexadecimal digits');
    const { sha256: _h, ...old } = doc.tables.photos[0];
    const other = openGlintmarkDb(`restore-${crypto.randomUUID()}`);
    try {
      await restoreBackup(other, { ...doc, tables: { ...doc.tables, photos: [old] } });
      expect((await other.photos.get(old.id))?.sha256).toBe(expected);
    } finally {
      await other.delete();
    }
  });

  it('refuses records that point to missing records', async () => {
    const doc = await seededDoc();
    const siteId = doc.tables.reflectors[0].siteId;
    doc.tables.sites = doc.tables.sites.filter((s) => s.id !== siteId);
    await expectRefused(doc, 'dangling-reference', `reflectors[0].siteId: points to sites ${siteId}, which is not in the backup or on this device`);
  });

  it('never replaces records already on the device unless asked to', async () => {
    const doc = await seededDoc();
    await expectRefused(doc, 'would-replace', /already holds \d+ records, and restoring would replace them all/, { replace: false });
  });

  it('is all or nothing: a failure while writing leaves the database as it was', async () => {
    const doc = await seededDoc();
    doc.tables.sites[0].notes = 'changed in the backup';
    const before = await dumpDb(db());
    db().inspections.hook('creating', () => {
      throw Object.assign(new Error('simulated full disk'), { name: 'QuotaExceededError' });
    });
    await expect(restoreBackup(db(), doc, { replace: true })).rejects.toThrow('simulated full disk');
    expect(await dumpDb(db())).toEqual(before);
  });
});
