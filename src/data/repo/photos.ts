/**
 * Photos belong to an installation or an inspection. Adding one writes the photo row, its 'create'
 * revision and the owner's updated photoIds (with the owner's revision) in one transaction; a photo
 * that is too large is refused before anything is written, so the text record is always kept.
 */
import * as v from 'valibot';
import type { GlintmarkDb } from '../db.ts';
import { InvalidStateForEditError, MissingReferenceError, PhotoTooLargeError, ValidationError } from '../errors.ts';
import { sha256Hex } from '../hash.ts';
import { lineText, toIssues } from '../schema/fields.ts';
import type { InspectionRecord, InstallationRecord, PhotoOwnerTable, PhotoRecord } from '../types.ts';
import { resolveContext, type WriteContext } from './context.ts';
import { WRITE_SCOPE } from './entity.ts';
import { makeRevision, snapshotOf } from './revisions.ts';

/** Views to take at an installation: along the boresight, the four cardinal views, the base and the foundation. */
export const SUGGESTED_PHOTO_ROLES = ['boresight', 'north', 'east', 'south', 'west', 'base', 'foundation'] as const;

/** Default ceiling for one photo: 8 MB (a 12-megapixel JPEG is typically 3–6 MB; common practice, no source). */
export const DEFAULT_MAX_PHOTO_BYTES = 8_000_000;

export interface PhotoOwner {
  table: PhotoOwnerTable;
  id: string;
}

export interface AddPhotoOptions extends WriteContext {
  maxBytes?: number;
  /** Defaults to blob.type. Must be an image type. */
  mime?: string;
  /** When the picture was taken; defaults to the write time. */
  takenAtMs?: number;
}

const roleSchema = lineText('photo role', { min: 1, max: 32 });
const MIME = /^image\/[a-z0-9.+-]+$/;

type Owner = InstallationRecord | InspectionRecord;
const ownerTable = (db: GlintmarkDb, t: PhotoOwnerTable) => db.table<Owner, string>(t);

export async function addPhoto(db: GlintmarkDb, owner: PhotoOwner, role: string, blob: Blob, opts: AddPhotoOptions): Promise<PhotoRecord> {
  const { by, nowMs } = resolveContext(opts);
  const maxBytes = opts.maxBytes ?? DEFAULT_MAX_PHOTO_BYTES;
  if (!(blob instanceof Blob)) throw new ValidationError('The photo', [{ path: 'blob', message: 'is not a picture file' }]);
  if (blob.size === 0) throw new ValidationError('The photo', [{ path: 'blob', message: 'is empty (0 bytes)' }]);
  if (blob.size > maxBytes) throw new PhotoTooLargeError(blob.size, maxBytes);
  const r = v.safeParse(roleSchema, role);
  if (!r.success) throw new ValidationError('The photo', toIssues(r.issues, 'role'));
  const mime = opts.mime ?? blob.type;
  if (!MIME.test(mime)) throw new ValidationError('The photo', [{ path: 'mime', message: `must be an image type such as image/jpeg, got ${JSON.stringify(mime)}` }]);
  const takenAtMs = opts.takenAtMs ?? nowMs;
  if (!Number.isInteger(takenAtMs) || takenAtMs < 0) throw new ValidationError('The photo', [{ path: 'takenAtMs', message: `must be ms since 1970, got ${takenAtMs}` }]);
  // Hashed before the transaction: a digest is not an IndexedDB request and would end the transaction.
  const sha256 = await sha256Hex(blob);
  const photo: PhotoRecord = {
    id: crypto.randomUUID(),
    rev: 1,
    createdAtMs: nowMs,
    updatedAtMs: nowMs,
    deletedAtMs: null,
    ownerTable: owner.table,
    ownerId: owner.id,
    role: r.output,
    mime,
    blob,
    bytes: blob.size,
    sha256,
    takenAtMs,
  };
  await db.transaction('rw', WRITE_SCOPE, async () => {
    const o = await ownerTable(db, owner.table).get(owner.id);
    if (!o || o.deletedAtMs !== null) throw new MissingReferenceError(owner.table, owner.id, 'no such live record to attach the photo to');
    await db.photos.add(photo);
    await db.revisions.add(makeRevision({ table: 'photos', recordId: photo.id, rev: 1, atMs: nowMs, by, kind: 'create', snapshot: snapshotOf(photo) }));
    await setOwnerPhotoIds(db, owner.table, o, [...o.photoIds, photo.id], nowMs, by);
  });
  return photo;
}

async function setOwnerPhotoIds(db: GlintmarkDb, table: PhotoOwnerTable, o: Owner, photoIds: string[], nowMs: number, by: string): Promise<void> {
  await ownerTable(db, table).put({ ...o, photoIds, rev: o.rev + 1, updatedAtMs: nowMs });
  const changes = [{ field: 'photoIds', before: o.photoIds, after: photoIds }];
  await db.revisions.add(makeRevision({ table, recordId: o.id, rev: o.rev + 1, atMs: nowMs, by, kind: 'update', changes }));
}

async function toggle(db: GlintmarkDb, photoId: string, ctx: WriteContext, deleting: boolean): Promise<PhotoRecord> {
  const { by, nowMs } = resolveContext(ctx);
  return db.transaction('rw', WRITE_SCOPE, async () => {
    const p = await db.photos.get(photoId);
    if (!p) throw new MissingReferenceError('photo', photoId, 'no such photo on this device');
    if ((p.deletedAtMs !== null) === deleting) return p;
    const o = await ownerTable(db, p.ownerTable).get(p.ownerId);
    if (!deleting && (!o || o.deletedAtMs !== null)) {
      throw new InvalidStateForEditError(`The photo's ${p.ownerTable === 'installations' ? 'installation' : 'inspection'} is deleted; restore it first.`);
    }
    const next: PhotoRecord = { ...p, deletedAtMs: deleting ? nowMs : null, rev: p.rev + 1, updatedAtMs: nowMs };
    await db.photos.put(next);
    const changes = [{ field: 'deletedAtMs', before: p.deletedAtMs, after: next.deletedAtMs }];
    await db.revisions.add(makeRevision({ table: 'photos', recordId: p.id, rev: next.rev, atMs: nowMs, by, kind: deleting ? 'delete' : 'undelete', changes }));
    if (o) {
      const ids = deleting ? o.photoIds.filter((x) => x !== p.id) : [...o.photoIds.filter((x) => x !== p.id), p.id];
      await setOwnerPhotoIds(db, p.ownerTable, o, ids, nowMs, by);
    }
    return next;
  });
}

/** Soft-delete a photo and take it out of its owner's photoIds. */
export const softDeletePhoto = (db: GlintmarkDb, photoId: string, ctx: WriteContext) => toggle(db, photoId, ctx, true);
/** Restore a soft-deleted photo and put it back in its (live) owner's photoIds. */
export const undeletePhoto = (db: GlintmarkDb, photoId: string, ctx: WriteContext) => toggle(db, photoId, ctx, false);

export const getPhoto = (db: GlintmarkDb, id: string): Promise<PhotoRecord | undefined> => db.photos.get(id);

/** Photos of one record, oldest picture first. */
export async function listPhotos(db: GlintmarkDb, owner: PhotoOwner, opts: { includeDeleted?: boolean } = {}): Promise<PhotoRecord[]> {
  const rows = await db.photos.where('[ownerTable+ownerId]').equals([owner.table, owner.id]).toArray();
  return rows.filter((p) => opts.includeDeleted || p.deletedAtMs === null).sort((a, b) => a.takenAtMs - b.takenAtMs || a.id.localeCompare(b.id));
}

/**
 * Hash every photo that has no `sha256` yet (photos stored before schema 5), one at a time: read, digest outside
 * any transaction, then write the hash in a short transaction if the row still lacks it. Not a crew edit, so no
 * rev bump and no revision (like the schema upgrades; two phones hashing the same photo write the same value).
 * Resolves with the number of photos hashed. Safe to call again at any time; it is a no-op once all are hashed.
 */
export async function fillPhotoHashes(db: GlintmarkDb): Promise<number> {
  const ids = await db.photos.filter((p) => typeof p.sha256 !== 'string').primaryKeys();
  let n = 0;
  for (const id of ids) {
    const p = await db.photos.get(id);
    if (!p || typeof p.sha256 === 'string') continue;
    const sha256 = await sha256Hex(p.blob);
    await db.transaction('rw', db.photos, async () => {
      const now = await db.photos.get(id);
      if (now && typeof now.sha256 !== 'string') await db.photos.put({ ...now, sha256 });
    });
    n++;
  }
  return n;
}
