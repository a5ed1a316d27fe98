/**
 * Full backup and restore. A backup is a ZIP archive (backup/archive.ts: records.json, each photo by its SHA-256,
 * a manifest) or, as written before, ONE versioned JSON document (backup/format.ts); both restore. Restore checks
 * the whole backup first (every hash, backup/validate.ts) and then replaces the record tables in ONE transaction:
 * either every row lands or none does. Drafts and meta stay as they are.
 */
import { base64ToBytes, blobToBase64 } from './base64.ts';
import { CURRENT_SCHEMA_VERSION, type GlintmarkDb } from './db.ts';
import { BackupError } from './errors.ts';
import { sha256Hex } from './hash.ts';
import { fillPhotoHashes } from './repo/photos.ts';
import { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, BACKUP_TABLES, type BackupDocument, type BackupPhoto, type BackupTable } from './backup/format.ts';
import { checkBackup, validateBackup, type BackupCheckOptions } from './backup/validate.ts';
import { readBackupArchive } from './backup/archive.ts';
import { looksLikeZip } from './backup/zipRead.ts';
import { setMeta } from './repo/meta.ts';
import { rebuildSiteVisits } from './repo/siteVisits.ts';

export { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, BACKUP_TABLES, validateBackup };
export { ARCHIVE_FORMAT, ARCHIVE_FORMAT_VERSION, ARCHIVE_MIME, exportBackupArchive, exportBackupRecords, readBackupArchive, writeBackupArchive, type ArchiveExportOptions, type ArchiveManifest } from './backup/archive.ts';
export type { BackupCheckOptions, BackupDocument, BackupPhoto, BackupTable };

export interface ExportOptions {
  /** App version written into the document (e.g. from package.json at build time). */
  appVersion: string;
  nowMs?: number;
}

/** Replace a stored blob by its base64 bytes (photo rows, and photo versions kept in conflicts). */
async function encodeBlobField(row: Record<string, unknown>): Promise<Record<string, unknown>> {
  if (!(row.blob instanceof Blob)) return row;
  const { blob, ...rest } = row;
  return { ...rest, dataBase64: await blobToBase64(blob as Blob) };
}

/**
 * The reverse of encodeBlobField, given the mime type that goes with the bytes. The photo's SHA-256 is computed
 * from the bytes: filled in when the row has none (backups before schema 5), checked when it has one.
 */
async function decodeBlobField(row: Record<string, unknown>, path: string): Promise<Record<string, unknown>> {
  if (typeof row.dataBase64 !== 'string') return row;
  const { dataBase64, ...rest } = row;
  const bytes = base64ToBytes(dataBase64 as string);
  const sha256 = await sha256Hex(bytes);
  if (typeof row.sha256 === 'string' && row.sha256 !== sha256) {
    const issue = { path: `${path}.sha256`, message: 'does not match the photo data (the photo is damaged)' };
    throw new BackupError('invalid-record', `The backup was not restored: a photo is damaged. ${issue.path}: ${issue.message}`, [issue]);
  }
  return { ...rest, sha256, blob: new Blob([bytes], { type: String(row.mime ?? '') }) };
}

/** Read every record table in one consistent snapshot and build the backup document. */
export async function exportBackup(db: GlintmarkDb, opts: ExportOptions): Promise<BackupDocument> {
  await fillPhotoHashes(db);
  const raw = await db.transaction('r', [...BACKUP_TABLES], async () => {
    const out: Record<string, Record<string, unknown>[]> = {};
    for (const t of BACKUP_TABLES) out[t] = (await db.table(t).toArray()) as Record<string, unknown>[];
    return out;
  });
  // Blob reads are not IndexedDB requests, so they happen after the read transaction.
  const photos = await Promise.all(raw.photos.map(encodeBlobField));
  const conflicts = await Promise.all(
    raw.conflicts.map(async (c) => ({ ...c, other: await encodeBlobField(c.other as Record<string, unknown>) })),
  );
  return {
    format: BACKUP_FORMAT,
    formatVersion: BACKUP_FORMAT_VERSION,
    exportedAtUtc: new Date(opts.nowMs ?? Date.now()).toISOString(),
    app: { name: 'glintmark', version: opts.appVersion, schemaVersion: CURRENT_SCHEMA_VERSION },
    tables: { ...raw, photos, conflicts } as unknown as BackupDocument['tables'],
  };
}

/** The document as the text to save (compact JSON, UTF-8 when written). */
export const backupToJson = (doc: BackupDocument): string => JSON.stringify(doc);

/** Remember when a backup file was last saved successfully (call after the file write succeeded). */
export const recordBackupSaved = (db: GlintmarkDb, nowMs = Date.now()): Promise<void> => setMeta(db, 'lastBackupAtMs', nowMs);

export interface RestoreOptions extends BackupCheckOptions {
  /**
   * Allow replacing records already on this device. Default false: restoring over existing records is
   * refused (BackupError 'would-replace'), so a restore can never silently throw away newer field work.
   */
  replace?: boolean;
}

export type TableCounts = Record<BackupTable, number>;

export type StoredRows = Record<BackupTable, Record<string, unknown>[]>;

/**
 * Rows of a validated document converted to stored rows (photo bytes back into Blobs, each photo's SHA-256
 * computed and checked). Rejects with BackupError when a photo's bytes do not match its stated hash.
 */
export async function storedRows(doc: BackupDocument): Promise<StoredRows> {
  const t = doc.tables as unknown as StoredRows;
  const photos: Record<string, unknown>[] = [];
  for (const [i, p] of t.photos.entries()) photos.push(await decodeBlobField(p, `photos[${i}]`));
  const conflicts: Record<string, unknown>[] = [];
  for (const [i, c] of t.conflicts.entries()) conflicts.push({ ...c, other: await decodeBlobField(c.other as Record<string, unknown>, `conflicts[${i}].other`) });
  return { ...t, photos, conflicts };
}

/** A backup read and checked in full, with its rows ready to store. */
export interface ReadBackup {
  doc: BackupDocument;
  hasElements: boolean;
  rows: StoredRows;
  /** 'archive' for a .glintmark.zip, 'json' for a JSON backup (format 1). */
  layout: 'archive' | 'json';
}

/**
 * Read and check any backup: a backup archive (a Blob starting with a ZIP header), a JSON backup as a Blob or File,
 * its text, or the parsed document. Nothing is written; throws BackupError.
 */
export async function readBackup(input: Blob | string | unknown, opts: BackupCheckOptions = {}): Promise<ReadBackup> {
  if (input instanceof Blob) {
    if (await looksLikeZip(input)) {
      const a = await readBackupArchive(input, opts);
      return { doc: a.doc, hasElements: a.hasElements, rows: a.rows, layout: 'archive' };
    }
    input = await input.text();
  }
  const { doc, hasElements } = checkBackup(input, opts);
  return { doc, hasElements, rows: await storedRows(doc), layout: 'json' };
}

/**
 * Validate the whole backup (archive or JSON, see readBackup), then write it in one transaction. Resolves with the
 * row counts written; rejects with BackupError (nothing written) or a Dexie error (nothing written).
 * A backup without an `elements` list (written before schema 4) leaves the phone's element sets as they are.
 */
export async function restoreBackup(db: GlintmarkDb, input: Blob | string | unknown, opts: RestoreOptions = {}): Promise<TableCounts> {
  const { hasElements, rows } = await readBackup(input, opts);
  const tables = BACKUP_TABLES.filter((t) => hasElements || t !== 'elements');
  return db.transaction('rw', [...BACKUP_TABLES, 'siteVisits'], async () => {
    if (!opts.replace) {
      let existing = 0;
      for (const t of tables) if (t !== 'conflicts') existing += await db.table(t).count();
      if (existing > 0) {
        throw new BackupError(
          'would-replace',
          `This device already holds ${existing} records, and restoring would replace them all. Nothing was restored. ` +
            'Use "merge" to combine the backup with them, or confirm replacing.',
        );
      }
    }
    const counts = { elements: 0 } as TableCounts;
    for (const t of tables) {
      await db.table(t).clear();
      await db.table(t).bulkAdd(rows[t]);
      counts[t] = rows[t].length;
    }
    await rebuildSiteVisits(db);
    return counts;
  });
}
