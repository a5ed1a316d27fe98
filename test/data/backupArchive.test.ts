/**
 * The backup archive: its layout (read back with fflate's whole-file unzip and Node's OpenSSL SHA-256, not with
 * the app's reader), round trips through restore and merge, and every kind of damage refused with a plain
 * sentence and the database unchanged (hashDb before and after).
 */
import 'fake-indexeddb/auto';
import { createHash } from 'node:crypto';
import { unzipSync, zipSync, strFromU8, strToU8, type Zippable } from 'fflate';
import { describe, expect, it } from 'vitest';
import { BACKUP_TABLES, exportBackupArchive, restoreBackup } from '../../src/data/backup.ts';
import { crc32 } from '../../src/data/backup/crc32.ts';
import { openGlintmarkDb, type GlintmarkDb } from '../../src/data/db.ts';
import { BackupError } from '../../src/data/errors.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { addPhoto } from '../../src/data/repo/photos.ts';
import { randomBytes } from '../helpers/random.ts';
import { BY, T0_MS, dumpDb, hashDb, seedSample, useTestDb } from './helpers.ts';

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');
const bytesOf = async (b: Blob) => new Uint8Array(await b.arrayBuffer());
const records = async (db: GlintmarkDb) => {
  const d = await dumpDb(db);
  return Object.fromEntries(BACKUP_TABLES.map((t) => [t, d[t]]));
};

describe('CRC-32', () => {
  it('gives the catalogue check value', () => {
    // Greg Cook, "Catalogue of parametrised CRC algorithms", CRC-32/ISO-HDLC: check = 0xCBF43926 for "123456789".
    expect(crc32(new TextEncoder().encode('123456789'))).toBe(0xcbf43926);
    // Continuation over pieces equals the whole (chunked reading), also across the 8-byte steps.
    const b = randomBytes(1003, 5);
    expect(crc32(b.subarray(501), crc32(b.subarray(0, 501)))).toBe(crc32(b));
    expect(crc32(new Uint8Array(0))).toBe(0);
  });
});

describe('backup archive', () => {
  const db = useTestDb();

  async function seeded() {
    const ids = await seedSample(db());
    const big = randomBytes(6_000_000, 17);
    const photo = await addPhoto(db(), { table: 'installations', id: ids.inst.id }, 'north', new Blob([big], { type: 'image/jpeg' }), { ...BY, nowMs: T0_MS + 60 });
    const archive = await exportBackupArchive(db(), { appVersion: '0.1.0', nowMs: T0_MS });
    return { ids, big, photo, archive };
  }

  it('holds manifest.json, records.json and each photo stored by its SHA-256, with hashes and counts', async () => {
    const { big, photo, archive } = await seeded();
    const files = unzipSync(await bytesOf(archive));
    const photoPath = `photos/${sha(big)}.jpg`;
    expect(Object.keys(files).sort()).toEqual(['manifest.json', photoPath, `photos/${sha(new Uint8Array([1, 2, 3, 250, 251]))}.jpg`, 'records.json'].sort());
    expect(Buffer.compare(Buffer.from(files[photoPath]), Buffer.from(big))).toBe(0);
    const manifest = JSON.parse(strFromU8(files['manifest.json'])) as Record<string, unknown>;
    const doc = JSON.parse(strFromU8(files['records.json'])) as { formatVersion: number; tables: Record<string, Record<string, unknown>[]> };
    expect(manifest).toMatchObject({
      format: 'glintmark-backup-archive',
      formatVersion: 1,
      createdAtUtc: '2027-07-02T12:00:00.000Z',
      app: { name: 'glintmark', version: '0.1.0', schemaVersion: 6 },
      counts: { sites: 3, reflectors: 1, geometries: 1, installations: 1, inspections: 1, photos: 2, conflicts: 0, elements: 0, revisions: doc.tables.revisions.length },
      records: { path: 'records.json', bytes: files['records.json'].length, sha256: sha(files['records.json']) },
    });
    expect(manifest.photos).toContainEqual({ path: photoPath, bytes: 6_000_000, sha256: sha(big) });
    expect(doc.formatVersion).toBe(2);
    const row = doc.tables.photos.find((p) => p.id === photo.id);
    expect(row).toMatchObject({ sha256: sha(big), file: photoPath, bytes: 6_000_000 });
    expect(row).not.toHaveProperty('blob');
    expect(row).not.toHaveProperty('dataBase64');
    // Photos are stored uncompressed: the archive is barely larger than its photos.
    expect(archive.size).toBeLessThan(6_000_000 + 20_000);
  });

  it('restores into an empty database and merges into another: every row, history and photo byte', { timeout: 120_000 }, async () => {
    const { archive } = await seeded();
    const want = await records(db());
    for (const mode of ['restore', 'merge'] as const) {
      const other = openGlintmarkDb(`archive-${mode}-${crypto.randomUUID()}`);
      try {
        if (mode === 'restore') await restoreBackup(other, archive);
        else await mergeBackup(other, archive, BY);
        expect(await records(other)).toEqual(want);
      } finally {
        await other.delete();
      }
    }
  });

  /** Rebuild the archive's entries with changes (fflate's own writer, photos stored), so CRCs are valid. */
  async function rebuilt(archive: Blob, change: (files: Record<string, Uint8Array>) => void): Promise<Blob> {
    const files = unzipSync(await bytesOf(archive));
    change(files);
    const z: Zippable = {};
    for (const [k, val] of Object.entries(files)) z[k] = [val, { level: 0 }];
    return new Blob([zipSync(z)]);
  }
  const editManifest = (f: Record<string, Uint8Array>, edit: (m: Record<string, unknown>) => void) => {
    const m = JSON.parse(strFromU8(f['manifest.json'])) as Record<string, unknown>;
    edit(m);
    f['manifest.json'] = strToU8(JSON.stringify(m));
  };

  it('refuses damaged archives with a plain sentence, and changes nothing on restore or merge', { timeout: 120_000 }, async () => {
    const { big, archive } = await seeded();
    const bytes = await bytesOf(archive);
    const photoPath = `photos/${sha(big)}.jpg`;
    // Offset of the big photo's bytes: find its first 64 bytes in the archive.
    const at = Buffer.from(bytes).indexOf(Buffer.from(big.subarray(0, 64)));
    expect(at).toBeGreaterThan(0);
    const flipped = bytes.slice();
    flipped[at + 1000] ^= 0xff;

    const cases: [string, Blob, string, RegExp][] = [
      ['truncated', new Blob([bytes.subarray(0, Math.floor(bytes.length / 2))]), 'damaged-archive', /^The backup archive is incomplete \(its table of contents at the end of the file is missing\), probably cut off while copying\. Nothing was changed on this phone\./],
      ['bad CRC', new Blob([flipped]), 'damaged-archive', new RegExp(`^The backup archive is damaged: ${photoPath} does not match its checksum \\(CRC-32\\)\\. Nothing was changed`)],
      ['bad hash', await rebuilt(archive, (f) => { f[photoPath] = f[photoPath].slice(); f[photoPath][5] ^= 1; }), 'damaged-archive', new RegExp(`the photo ${photoPath} does not match its SHA-256`)],
      ['records changed', await rebuilt(archive, (f) => { f['records.json'] = strToU8(strFromU8(f['records.json']).replace('Marrowby', 'Marrowbx')); }), 'damaged-archive', /records\.json does not match the SHA-256 in its manifest/],
      ['missing entry', await rebuilt(archive, (f) => { delete f[photoPath]; }), 'damaged-archive', new RegExp(`the photo ${photoPath}, listed in its manifest, is missing`)],
      ['missing records', await rebuilt(archive, (f) => { delete f['records.json']; }), 'damaged-archive', /its records\.json \(every record and the history\) is missing/],
      ['extra entry', await rebuilt(archive, (f) => { f['photos/extra.jpg'] = new Uint8Array([1]); }), 'damaged-archive', /it holds a file its manifest does not list \(photos\/extra\.jpg\)/],
      ['wrong counts', await rebuilt(archive, (f) => editManifest(f, (m) => { (m.counts as Record<string, number>).sites = 4; })), 'damaged-archive', /its manifest counts 4 sites but records\.json holds 3/],
      ['newer format', await rebuilt(archive, (f) => editManifest(f, (m) => { m.formatVersion = 2; })), 'wrong-version', /^This backup archive was made by a newer Glintmark \(archive format 2; this app reads format 1\)\. Update the app, then restore\./],
      ['no manifest', await rebuilt(archive, (f) => { delete f['manifest.json']; }), 'damaged-archive', /its manifest\.json is missing/],
    ];
    // The database holds records, so restore uses replace: true (the check must refuse before any write).
    const before = await hashDb(db());
    for (const [name, input, kind, message] of cases) {
      for (const op of ['restore', 'merge'] as const) {
        const e = await (op === 'restore' ? restoreBackup(db(), input, { replace: true }) : mergeBackup(db(), input, BY)).catch((x: unknown) => x);
        expect(e, `${name} / ${op}`).toBeInstanceOf(BackupError);
        expect((e as BackupError).kind, `${name} / ${op}`).toBe(kind);
        expect((e as Error).message, `${name} / ${op}`).toMatch(message);
        expect(await hashDb(db()), `${name} / ${op}`).toBe(before);
      }
    }
  });

  it('refuses the bare records.json taken out of an archive, naming what to restore instead', async () => {
    const { archive } = await seeded();
    const records = strFromU8(unzipSync(await bytesOf(archive))['records.json']);
    const e = await restoreBackup(db(), new Blob([records], { type: 'application/json' }), { replace: true }).catch((x: unknown) => x);
    expect((e as Error).message).toMatch(/^This is the records file from inside a backup archive, without its photos\. Restore the whole archive/);
  });
});
