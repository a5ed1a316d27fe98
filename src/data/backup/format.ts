/**
 * The backup document, format version 1: ONE JSON document holding every record table, the history,
 * the open merge conflicts and every photo inline as base64 with its mime type.
 *
 * {
 *   "format": "glintmark-backup", "formatVersion": 1, "exportedAtUtc": "2027-07-02T12:00:00.000Z",
 *   "app": { "name": "glintmark", "version": "0.1.0", "schemaVersion": 2 },
 *   "tables": { "sites": [...], "reflectors": [...], "geometries": [...], "installations": [...],
 *               "inspections": [...], "photos": [{ ...row without blob, "dataBase64": "..." }],
 *               "revisions": [...], "conflicts": [...], "elements": [...] }
 * }
 * Rows keep their stored shape (times as `…AtMs`); drafts and meta are device-local and not included.
 * A reader refuses a higher formatVersion rather than guessing.
 *
 * `elements` (orbital element sets, schema version 4) was added without a format bump: backups written before it
 * simply lack the list, and readers of format 1 ignore table lists they do not know (the envelope is not strict).
 * A missing `elements` list means "this backup carries no element sets", so restore leaves the phone's sets as
 * they are (see backup.ts); an empty list means "none" and restore replaces them with none.
 */
import * as v from 'valibot';
import { SHA256_HEX } from '../hash.ts';
import { lineText, oneOf, timeMs, uuid } from '../schema/fields.ts';
import { recordMetaSchema } from '../schema/records.ts';
import {
  PHOTO_OWNER_TABLES,
  REVISION_KINDS,
  VERSIONED_TABLES,
  type ConflictRecord,
  type ElementSetRecord,
  type GeometryRecord,
  type InspectionRecord,
  type InstallationRecord,
  type PhotoRecord,
  type ReflectorRecord,
  type RevisionRecord,
  type SiteRecord,
} from '../types.ts';

export const BACKUP_FORMAT = 'glintmark-backup';
/** A backup saved as one JSON file, photos inline as base64. */
export const BACKUP_FORMAT_VERSION = 1;
/**
 * The same document as `records.json` inside a backup archive (archive.ts): photo rows carry `file` (the archive
 * entry with their bytes, `photos/<sha256>.<ext>`) and a required `sha256` instead of `dataBase64`.
 */
export const ARCHIVE_RECORDS_FORMAT_VERSION = 2;

/** A photo row in a backup: the stored row with the blob replaced by its bytes in base64. */
export type BackupPhoto = Omit<PhotoRecord, 'blob' | 'sha256'> & { sha256?: string | null; dataBase64: string };
/** A conflict row in a backup; a photo version inside `other` carries dataBase64 instead of blob. */
export type BackupConflict = ConflictRecord;

export interface BackupTables {
  sites: SiteRecord[];
  reflectors: ReflectorRecord[];
  geometries: GeometryRecord[];
  installations: InstallationRecord[];
  inspections: InspectionRecord[];
  photos: BackupPhoto[];
  revisions: RevisionRecord[];
  conflicts: BackupConflict[];
  /** Always present after validateBackup (an absent list reads as []); see the header for what absence means. */
  elements: ElementSetRecord[];
}

export interface BackupDocument {
  format: typeof BACKUP_FORMAT;
  formatVersion: typeof BACKUP_FORMAT_VERSION | typeof ARCHIVE_RECORDS_FORMAT_VERSION;
  exportedAtUtc: string;
  app: { name: string; version: string; schemaVersion: number };
  tables: BackupTables;
}

export const BACKUP_TABLES = ['sites', 'reflectors', 'geometries', 'installations', 'inspections', 'photos', 'revisions', 'conflicts', 'elements'] as const;
export type BackupTable = (typeof BACKUP_TABLES)[number];
/** Tables a backup may lack because they were added after format 1 was defined. */
export const OPTIONAL_BACKUP_TABLES: readonly BackupTable[] = ['elements'];

const tableList = (name: string) => v.array(v.unknown(), `the backup's ${name} list is missing or not a list`);

/** The envelope; rows are checked one by one afterwards so every message can name its row. */
export const envelopeSchema = v.object({
  format: v.literal(BACKUP_FORMAT),
  formatVersion: v.picklist([BACKUP_FORMAT_VERSION, ARCHIVE_RECORDS_FORMAT_VERSION]),
  exportedAtUtc: v.pipe(v.string('exportedAtUtc must be text'), v.isoTimestamp('exportedAtUtc must be an ISO 8601 time')),
  app: v.object({ name: v.string('app.name must be text'), version: v.string('app.version must be text'), schemaVersion: v.number() }),
  tables: v.object(
    Object.fromEntries(BACKUP_TABLES.map((t) => [t, OPTIONAL_BACKUP_TABLES.includes(t) ? v.optional(tableList(t)) : tableList(t)])) as Record<
      BackupTable,
      ReturnType<typeof tableList> | v.OptionalSchema<ReturnType<typeof tableList>, undefined>
    >,
  ),
});

export const photoRowSchema = v.strictObject({
  ...recordMetaSchema.entries,
  ownerTable: oneOf('photo owner table', PHOTO_OWNER_TABLES),
  ownerId: uuid('photo owner id'),
  role: lineText('photo role', { min: 1, max: 32 }),
  mime: v.pipe(v.string('mime must be text'), v.regex(/^image\/[a-z0-9.+-]+$/, 'mime must be an image type such as image/jpeg')),
  bytes: v.pipe(v.number('bytes must be a number'), v.integer('bytes must be a whole number'), v.minValue(1, 'bytes must be 1 or more')),
  // Schema 5. Optional: backups written before it have none (the restore computes it from the bytes); when
  // present it must match the bytes.
  sha256: v.optional(v.nullable(v.pipe(v.string('sha256 must be text'), v.regex(SHA256_HEX, 'sha256 must be 64 lowercase hexadecimal digits')))),
  takenAtMs: timeMs('photo time'),
  dataBase64: v.string('the photo data (dataBase64) must be text'),
});

/** A photo row in an archive's records.json: the bytes are the archive entry `file`, named by their SHA-256. */
export const archivePhotoRowSchema = v.strictObject({
  ...v.omit(photoRowSchema, ['dataBase64', 'sha256']).entries,
  sha256: v.pipe(v.string('sha256 must be text'), v.regex(SHA256_HEX, 'sha256 must be 64 lowercase hexadecimal digits')),
  file: v.pipe(v.string('file must be text'), v.regex(/^photos\/[0-9a-f]{64}\.[a-z0-9]{1,8}$/, 'file must name a photo entry such as photos/<sha256>.jpg')),
});

const changeSchema = v.strictObject({ field: v.string('change field must be text'), before: v.unknown(), after: v.unknown() });

export const revisionRowSchema = v.strictObject({
  id: uuid('revision id'),
  table: oneOf('revision table', VERSIONED_TABLES),
  recordId: uuid('revision record id'),
  rev: v.pipe(v.number('rev must be a number'), v.integer('rev must be a whole number'), v.minValue(1, 'rev must be 1 or more')),
  atMs: timeMs('revision time'),
  by: lineText('revision author', { max: 80 }),
  kind: oneOf('revision kind', REVISION_KINDS),
  changes: v.array(changeSchema, 'revision changes must be a list'),
  snapshot: v.nullable(v.record(v.string(), v.unknown(), 'revision snapshot must be an object')),
  cascadeOf: v.nullable(uuid('revision cascadeOf')),
});

export const conflictRowSchema = v.strictObject({
  id: uuid('conflict id'),
  table: oneOf('conflict table', VERSIONED_TABLES),
  recordId: uuid('conflict record id'),
  reason: v.string('conflict reason must be text'),
  kept: oneOf('conflict kept side', ['local', 'incoming'] as const),
  other: v.record(v.string(), v.unknown(), 'conflict other version must be an object'),
  otherRevisions: v.array(revisionRowSchema, 'conflict otherRevisions must be a list'),
  detectedAtMs: timeMs('conflict time'),
  resolvedAtMs: v.nullable(timeMs('conflict resolution time')),
});
