/**
 * The backup archive (a ZIP file, `.glintmark.zip`): a season's records and photos without one giant string.
 *
 *   manifest.json   { format: "glintmark-backup-archive", formatVersion: 1, createdAtUtc, app, counts per table,
 *                     records: { path, bytes, sha256 }, photos: [{ path, bytes, sha256 }] }      (stored)
 *   records.json    the backup document (format.ts) with formatVersion 2: photo rows carry `sha256` and `file`
 *                   instead of their bytes                                                       (deflated)
 *   photos/<sha256>.<ext>   each photo's bytes, once per distinct content                        (stored)
 *
 * Writing uses fflate's streaming Zip (fflate computes each entry's CRC-32 as the bytes pass). Photos are read one
 * at a time, hashed, passed through, and the archive Blob is built from parts in which each photo's bytes are the
 * stored photo Blob itself, so memory holds one photo at a time whatever the total.
 * Reading (readBackupArchive) verifies everything before a caller writes: the directory, that the entries are
 * exactly manifest + records + the photos the manifest lists, each CRC-32, each SHA-256 (against the manifest and
 * the entry's name), the manifest's counts against records.json, then records.json's validation (validate.ts).
 * Photo rows come back with `blob` = a slice of the archive (stored entries need no inflating).
 */
import { inflateSync, Zip, ZipDeflate, ZipPassThrough } from 'fflate';
import * as v from 'valibot';
import { CURRENT_SCHEMA_VERSION, type GlintmarkDb } from '../db.ts';
import { BackupError } from '../errors.ts';
import { SHA256_HEX, sha256Hex } from '../hash.ts';
import { fillPhotoHashes } from '../repo/photos.ts';
import { ARCHIVE_RECORDS_FORMAT_VERSION, BACKUP_FORMAT, BACKUP_TABLES, type BackupDocument, type BackupTable } from './format.ts';
import { checkBackup, type BackupCheckOptions, type CheckedBackup } from './validate.ts';
import { checkEntryData, rawEntryBytes, readZipDirectory, storedEntryBlob, ZipDamage, type ZipEntry } from './zipRead.ts';

export const ARCHIVE_FORMAT = 'glintmark-backup-archive';
export const ARCHIVE_FORMAT_VERSION = 1;
export const MANIFEST_PATH = 'manifest.json';
export const RECORDS_PATH = 'records.json';
/** The archive's media type. */
export const ARCHIVE_MIME = 'application/zip';

export interface ArchiveFileRef {
  path: string;
  bytes: number;
  sha256: string;
}

export interface ArchiveManifest {
  format: typeof ARCHIVE_FORMAT;
  formatVersion: typeof ARCHIVE_FORMAT_VERSION;
  createdAtUtc: string;
  app: { name: string; version: string; schemaVersion: number };
  /** Rows per table in records.json. */
  counts: Record<BackupTable, number>;
  records: ArchiveFileRef;
  photos: ArchiveFileRef[];
}

const fileRefSchema = v.strictObject({
  path: v.string(),
  bytes: v.pipe(v.number(), v.integer(), v.minValue(0)),
  sha256: v.pipe(v.string(), v.regex(SHA256_HEX)),
});
const manifestSchema = v.strictObject({
  format: v.literal(ARCHIVE_FORMAT),
  formatVersion: v.literal(ARCHIVE_FORMAT_VERSION),
  createdAtUtc: v.pipe(v.string(), v.isoTimestamp()),
  app: v.strictObject({ name: v.string(), version: v.string(), schemaVersion: v.number() }),
  counts: v.strictObject(Object.fromEntries(BACKUP_TABLES.map((t) => [t, v.pipe(v.number(), v.integer(), v.minValue(0))])) as unknown as Record<BackupTable, v.GenericSchema<number>>),
  records: fileRefSchema,
  photos: v.array(fileRefSchema),
});

/** File extension for a photo's mime type: image/jpeg → jpg, image/png → png, image/svg+xml → svg. */
export function photoExtension(mime: string): string {
  const sub = (mime.split('/')[1] ?? '').split('+')[0].replace(/[^a-z0-9]/g, '').slice(0, 8);
  return sub === 'jpeg' ? 'jpg' : sub || 'bin';
}

export interface ArchiveExportOptions {
  appVersion: string;
  nowMs?: number;
}

type Row = Record<string, unknown>;

const readTables = (db: GlintmarkDb) =>
  db.transaction('r', [...BACKUP_TABLES], async () => {
    const out: Record<string, Row[]> = {};
    for (const t of BACKUP_TABLES) out[t] = (await db.table(t).toArray()) as Row[];
    return out;
  });

/**
 * The records of a backup without photo bytes (photo rows lose their blob): what records.json holds, for checks
 * such as "changed since the last backup" that must not read every photo.
 */
export async function exportBackupRecords(db: GlintmarkDb, opts: ArchiveExportOptions): Promise<BackupDocument> {
  const raw = await readTables(db);
  const strip = (r: Row) => {
    const { blob: _b, ...rest } = r;
    return rest;
  };
  const tables = { ...raw, photos: raw.photos.map(strip), conflicts: raw.conflicts.map((c) => ({ ...c, other: strip(c.other as Row) })) };
  const app = { name: 'glintmark', version: opts.appVersion, schemaVersion: CURRENT_SCHEMA_VERSION };
  return { format: BACKUP_FORMAT, formatVersion: ARCHIVE_RECORDS_FORMAT_VERSION, exportedAtUtc: new Date(opts.nowMs ?? Date.now()).toISOString(), app, tables } as unknown as BackupDocument;
}

/**
 * Write every record table, the history, open conflicts, element sets and every photo as a backup archive.
 * Rejects (nothing is changed) when a stored photo no longer matches its hash.
 */
export async function exportBackupArchive(db: GlintmarkDb, opts: ArchiveExportOptions): Promise<Blob> {
  return (await writeBackupArchive(db, opts)).blob;
}

/** exportBackupArchive, with the manifest it wrote (counts for the crew's message). */
export async function writeBackupArchive(db: GlintmarkDb, opts: ArchiveExportOptions): Promise<{ blob: Blob; manifest: ArchiveManifest }> {
  const nowMs = opts.nowMs ?? Date.now();
  await fillPhotoHashes(db);
  const raw = await readTables(db);

  // Photo bytes by path (one entry per distinct content); rows name their entry.
  const files = new Map<string, { blob: Blob; sha256: string; bytes: number; id: string }>();
  const toFileRow = async (row: Row): Promise<Row> => {
    if (!(row.blob instanceof Blob)) return row;
    const { blob, ...rest } = row;
    const sha256 = typeof row.sha256 === 'string' ? row.sha256 : await sha256Hex(blob);
    const path = `photos/${sha256}.${photoExtension(String(row.mime ?? ''))}`;
    if (!files.has(path)) files.set(path, { blob, sha256, bytes: blob.size, id: String(row.id) });
    return { ...rest, sha256, file: path };
  };
  const photos: Row[] = [];
  for (const p of raw.photos) photos.push(await toFileRow(p));
  const conflicts: Row[] = [];
  for (const c of raw.conflicts) conflicts.push({ ...c, other: await toFileRow(c.other as Row) });

  const app = { name: 'glintmark', version: opts.appVersion, schemaVersion: CURRENT_SCHEMA_VERSION };
  const createdAtUtc = new Date(nowMs).toISOString();
  const doc = { format: BACKUP_FORMAT, formatVersion: ARCHIVE_RECORDS_FORMAT_VERSION, exportedAtUtc: createdAtUtc, app, tables: { ...raw, photos, conflicts } };
  const recordsBytes = new TextEncoder().encode(JSON.stringify(doc));
  const manifest: ArchiveManifest = {
    format: ARCHIVE_FORMAT,
    formatVersion: ARCHIVE_FORMAT_VERSION,
    createdAtUtc,
    app,
    counts: Object.fromEntries(BACKUP_TABLES.map((t) => [t, raw[t].length])) as Record<BackupTable, number>,
    records: { path: RECORDS_PATH, bytes: recordsBytes.length, sha256: await sha256Hex(recordsBytes) },
    photos: [...files].map(([path, f]) => ({ path, bytes: f.bytes, sha256: f.sha256 })),
  };

  const parts: BlobPart[] = [];
  /** A photo's bytes as pushed, and the stored Blob that stands for them in the archive's parts. */
  let standIn: { bytes: Uint8Array; blob: Blob } | null = null;
  let failure: Error | null = null;
  const zip = new Zip((e, chunk) => {
    if (e) failure = e;
    else if (standIn && chunk === standIn.bytes) {
      parts.push(standIn.blob);
      standIn = null;
    } else parts.push(chunk as Uint8Array<ArrayBuffer>);
  });
  const mtime = new Date(Math.max(nowMs, Date.UTC(1980, 0, 2)));
  const add = (entry: ZipPassThrough | ZipDeflate, bytes: Uint8Array) => {
    entry.mtime = mtime;
    zip.add(entry);
    entry.push(bytes, true);
  };
  add(new ZipPassThrough(MANIFEST_PATH), new TextEncoder().encode(JSON.stringify(manifest, null, 1)));
  add(new ZipDeflate(RECORDS_PATH, { level: 6 }), recordsBytes);
  for (const [path, f] of files) {
    const bytes = new Uint8Array(await f.blob.arrayBuffer());
    if ((await sha256Hex(bytes)) !== f.sha256) {
      throw new Error(`A photo on this phone is damaged (photo ${f.id}: its bytes no longer match their SHA-256). The backup was not made.`);
    }
    standIn = { bytes, blob: f.blob };
    add(new ZipPassThrough(path), bytes);
    if (standIn) throw new Error('The backup archive could not be written (a photo was not passed through in one piece).');
  }
  zip.end();
  if (failure) throw failure;
  return { blob: new Blob(parts, { type: ARCHIVE_MIME }), manifest };
}

const NOTHING = 'Nothing was changed on this phone.';

function damaged(what: string, truncated = false): BackupError {
  return new BackupError(
    'damaged-archive',
    truncated
      ? `The backup archive is incomplete (${what}), probably cut off while copying. ${NOTHING} Copy the file again.`
      : `The backup archive is damaged: ${what}. ${NOTHING} Copy the file again from where it was saved.`,
  );
}

const decode = (bytes: Uint8Array) => new TextDecoder('utf-8', { fatal: true }).decode(bytes);

/** The entry's uncompressed data, size and CRC-32 checked; `maxBytes` bounds what is read or inflated. */
async function entryData(blob: Blob, e: ZipEntry, maxBytes: number): Promise<Uint8Array> {
  if (e.size > maxBytes || e.compressedSize > maxBytes) throw damaged(`${e.name} is ${e.size} bytes, more than a backup holds`);
  const stored = await rawEntryBytes(blob, e);
  let data: Uint8Array;
  if (e.method === 0) data = stored;
  else if (e.method === 8) {
    try {
      data = inflateSync(stored, { out: new Uint8Array(e.size) });
    } catch {
      throw damaged(`${e.name} cannot be decompressed`);
    }
  } else throw damaged(`${e.name} uses a compression this app does not read (method ${e.method})`);
  checkEntryData(e, data);
  return data;
}

function parseJsonEntry(name: string, bytes: Uint8Array): unknown {
  try {
    return JSON.parse(decode(bytes)) as unknown;
  } catch {
    throw damaged(`${name} is not readable JSON`);
  }
}

export interface CheckedArchive extends CheckedBackup {
  manifest: ArchiveManifest;
  /** Stored rows: photo rows (and photo versions in conflicts) with `blob` = a slice of the archive. */
  rows: Record<BackupTable, Row[]>;
}

/** Largest manifest or records.json read (uncompressed). */
const MAX_JSON_BYTES = 512_000_000;

/**
 * Check a whole backup archive and return its rows, ready to write. Throws BackupError: 'damaged-archive'
 * (truncated, bad CRC-32 or SHA-256, missing, extra or duplicate entry, counts that disagree), 'wrong-format',
 * 'wrong-version' (a newer archive format), or any kind validate.ts gives for records.json.
 */
export async function readBackupArchive(blob: Blob, opts: BackupCheckOptions = {}): Promise<CheckedArchive> {
  try {
    return await readArchive(blob, opts);
  } catch (e) {
    if (e instanceof ZipDamage) throw damaged(e.message, e.truncated);
    throw e;
  }
}

async function readArchive(blob: Blob, opts: BackupCheckOptions): Promise<CheckedArchive> {
  const entries = await readZipDirectory(blob);
  const byName = new Map<string, ZipEntry>();
  for (const e of entries) {
    if (byName.has(e.name)) throw damaged(`it holds ${e.name} twice`);
    byName.set(e.name, e);
  }
  const manifestEntry = byName.get(MANIFEST_PATH);
  if (!manifestEntry) throw damaged(`its ${MANIFEST_PATH} is missing (is this a Glintmark backup archive?)`);
  const m = parseJsonEntry(MANIFEST_PATH, await entryData(blob, manifestEntry, MAX_JSON_BYTES));
  const mo = (typeof m === 'object' && m !== null ? m : {}) as Record<string, unknown>;
  if (mo.format !== ARCHIVE_FORMAT) {
    throw new BackupError('wrong-format', `This file is not a Glintmark backup archive (its manifest names the format ${JSON.stringify(mo.format ?? null)}). ${NOTHING}`);
  }
  if (mo.formatVersion !== ARCHIVE_FORMAT_VERSION) {
    const newer = typeof mo.formatVersion === 'number' && mo.formatVersion > ARCHIVE_FORMAT_VERSION;
    throw new BackupError(
      'wrong-version',
      newer
        ? `This backup archive was made by a newer Glintmark (archive format ${String(mo.formatVersion)}; this app reads format ${ARCHIVE_FORMAT_VERSION}). Update the app, then restore. ${NOTHING}`
        : `This backup archive has an unknown format version (${JSON.stringify(mo.formatVersion ?? null)}); this app reads format ${ARCHIVE_FORMAT_VERSION}. ${NOTHING}`,
    );
  }
  const parsed = v.safeParse(manifestSchema, m);
  if (!parsed.success) throw damaged(`its ${MANIFEST_PATH} is not as this app writes it (${parsed.issues[0].message} at ${v.getDotPath(parsed.issues[0]) ?? 'the top'})`);
  const manifest = parsed.output as ArchiveManifest;

  // Exactly the listed entries: the manifest, the records and each photo, nothing missing and nothing added.
  const listed = new Map(manifest.photos.map((p) => [p.path, p]));
  if (listed.size !== manifest.photos.length) throw damaged(`its ${MANIFEST_PATH} lists a photo twice`);
  if (manifest.records.path !== RECORDS_PATH) throw damaged(`its ${MANIFEST_PATH} names the records ${JSON.stringify(manifest.records.path)}, not ${RECORDS_PATH}`);
  for (const name of byName.keys()) {
    if (name !== MANIFEST_PATH && name !== RECORDS_PATH && !listed.has(name)) throw damaged(`it holds a file its manifest does not list (${name}); it was changed after the backup was made`);
  }
  const recordsEntry = byName.get(RECORDS_PATH);
  if (!recordsEntry) throw damaged(`its ${RECORDS_PATH} (every record and the history) is missing`);
  for (const p of manifest.photos) if (!byName.has(p.path)) throw damaged(`the photo ${p.path}, listed in its manifest, is missing`);

  const recordsBytes = await entryData(blob, recordsEntry, MAX_JSON_BYTES);
  if (recordsBytes.length !== manifest.records.bytes || (await sha256Hex(recordsBytes as Uint8Array<ArrayBuffer>)) !== manifest.records.sha256) {
    throw damaged(`${RECORDS_PATH} does not match the SHA-256 in its manifest`);
  }
  const checked = checkBackup(parseJsonEntry(RECORDS_PATH, recordsBytes), opts, 'archive');
  const t = checked.doc.tables as unknown as Record<BackupTable, Row[]>;
  for (const table of BACKUP_TABLES) {
    const n = t[table]?.length ?? 0;
    if (n !== manifest.counts[table]) throw damaged(`its manifest counts ${manifest.counts[table]} ${table} but ${RECORDS_PATH} holds ${n}`);
  }

  // Every photo row names a listed entry with its hash and size.
  const maxPhoto = Math.max(...manifest.photos.map((p) => p.bytes), 0);
  const refOf = (row: Row, path: string): ArchiveFileRef => {
    const ref = listed.get(String(row.file));
    if (!ref) throw damaged(`${path} names ${String(row.file)}, which its manifest does not list`);
    if (ref.sha256 !== row.sha256 || !ref.path.startsWith(`photos/${ref.sha256}.`)) throw damaged(`${path} and the manifest disagree about the SHA-256 of ${ref.path}`);
    if (ref.bytes !== row.bytes) throw damaged(`${path} says ${String(row.bytes)} bytes but the manifest says ${ref.bytes} for ${ref.path}`);
    return ref;
  };
  t.photos.forEach((p, i) => refOf(p, `photos[${i}]`));
  t.conflicts.forEach((c, i) => {
    const o = c.other as Row;
    if (typeof o.file === 'string') refOf(o, `conflicts[${i}].other`);
  });

  // Each photo entry: stored, size, CRC-32 and SHA-256; read one at a time.
  for (const p of manifest.photos) {
    const e = byName.get(p.path) as ZipEntry;
    if (e.method !== 0) throw damaged(`${p.path} is compressed, but photos are stored uncompressed`);
    if (e.size !== p.bytes) throw damaged(`${p.path} holds ${e.size} bytes where its manifest says ${p.bytes}`);
    const bytes = await entryData(blob, e, maxPhoto);
    if ((await sha256Hex(bytes as Uint8Array<ArrayBuffer>)) !== p.sha256) throw damaged(`the photo ${p.path} does not match its SHA-256`);
  }

  const withBlob = (row: Row): Row => {
    if (typeof row.file !== 'string') return row;
    const { file, ...rest } = row;
    return { ...rest, blob: storedEntryBlob(blob, byName.get(file) as ZipEntry, String(row.mime ?? '')) };
  };
  const rows = { ...t, photos: t.photos.map(withBlob), conflicts: t.conflicts.map((c) => ({ ...c, other: withBlob(c.other as Row) })) };
  return { ...checked, doc: checked.doc as BackupDocument, manifest, rows };
}
