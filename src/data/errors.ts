/**
 * Typed errors of the data layer. Repositories never catch: they reject with one of these (or a Dexie
 * error such as QuotaExceededError) and the UI switches on `error.name`. Every message is a plain
 * sentence a field user can read; nothing was written when one of these is thrown.
 */

/** One problem found by validation: a dotted path (e.g. "apex.latDeg") and a plain message. */
export interface Issue {
  path: string;
  message: string;
}

/** A record failed validation before writing. */
export class ValidationError extends Error {
  override readonly name = 'ValidationError';
  constructor(
    readonly what: string,
    readonly issues: Issue[],
  ) {
    super(`${what} was not saved: ${issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join('; ')}`);
  }
}

/** No row with that id (in that table). */
export class RecordNotFoundError extends Error {
  override readonly name = 'RecordNotFoundError';
  constructor(
    readonly table: string,
    readonly id: string,
  ) {
    super(`No ${table} record with id ${id} exists on this device.`);
  }
}

/** A referenced record (parent site, reflector, geometry, photo owner) is missing or deleted. */
export class MissingReferenceError extends Error {
  override readonly name = 'MissingReferenceError';
  constructor(
    readonly field: string,
    readonly id: string,
    detail: string,
  ) {
    super(`${field} ${id}: ${detail}`);
  }
}

/** A live site already uses that code. */
export class DuplicateCodeError extends Error {
  override readonly name = 'DuplicateCodeError';
  constructor(
    readonly code: string,
    readonly existingId: string,
  ) {
    super(`Site code "${code}" is already used by another site on this device; choose a different code.`);
  }
}

/** What one row of each table is called in messages. */
const RECORD_NOUN: Record<string, string> = {
  sites: 'site', reflectors: 'reflector', geometries: 'planned geometry', installations: 'installation',
  inspections: 'inspection', photos: 'photo', elements: 'element set',
};

/** The record changed since the caller read it (another tab, a merge). Reload and edit again. */
export class StaleRecordError extends Error {
  override readonly name = 'StaleRecordError';
  constructor(
    readonly table: string,
    readonly id: string,
    readonly expectedRev: number,
    readonly actualRev: number,
  ) {
    super(`This ${RECORD_NOUN[table] ?? table} record was changed elsewhere (now revision ${actualRev}, you edited revision ${expectedRev}); reload it and try again.`);
  }
}

/** The operation is not allowed in the record's current state (e.g. editing a deleted record). */
export class InvalidStateForEditError extends Error {
  override readonly name = 'InvalidStateForEditError';
}

/** A photo exceeds the size limit. The text records are untouched. */
export class PhotoTooLargeError extends Error {
  override readonly name = 'PhotoTooLargeError';
  constructor(
    readonly bytes: number,
    readonly maxBytes: number,
  ) {
    super(
      `The photo is ${formatSize(bytes)}, more than the ${formatSize(maxBytes)} limit; it was not saved ` +
        `(the record itself is kept). Retake it at a lower resolution.`,
    );
  }
}

export type BackupErrorKind =
  | 'not-json'
  | 'truncated'
  | 'wrong-format'
  | 'wrong-version'
  | 'invalid-record'
  | 'duplicate-id'
  | 'photo-too-large'
  | 'dangling-reference'
  | 'would-replace'
  /** A backup archive that is cut short, fails a checksum or hash, or lacks, adds or miscounts an entry. */
  | 'damaged-archive';

/** A backup document was refused; the database was not changed. */
export class BackupError extends Error {
  override readonly name = 'BackupError';
  constructor(
    readonly kind: BackupErrorKind,
    message: string,
    readonly issues: Issue[] = [],
  ) {
    super(message);
  }
}

/** A size for messages: "512 bytes", "85 kB", "2.5 MB" (SI prefixes). */
export function formatSize(bytes: number): string {
  if (bytes < 1000) return `${bytes} bytes`;
  if (bytes < 1_000_000) return `${Math.round(bytes / 1000)} kB`;
  return `${(bytes / 1_000_000).toFixed(1)} MB`;
}
