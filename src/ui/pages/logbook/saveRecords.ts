/**
 * The save steps of the installation and inspection forms, over the repositories (no React, testable with
 * fake-indexeddb). Order, as the data README asks: check the parents, record the planned geometries (reusing ones the
 * site already has), write the text record, then add photos one by one — a photo that fails (too large, storage
 * full) is reported and never loses the record. Every write goes through withReopen.
 */
import {
  addPhoto,
  geometryRepo,
  inspectionRepo,
  installationRepo,
  MissingReferenceError,
  reflectorRepo,
  siteRepo,
  withReopen,
  type GeometryFields,
  type GlintmarkDb,
  type InspectionFields,
  type InspectionRecord,
  type InstallationRecord,
  type PhotoOwner,
} from '../../../data/index.ts';
import { saveErrorMessage } from './errorWords.ts';
import { matchGeometries } from './geometryPlan.ts';
import type { InstallationCoreFields } from './installationForm.ts';

export interface PendingPhoto {
  role: string;
  blob: Blob;
}

/** The photos chosen on a form (by role; a cleared role is left out), to add once the record is stored. */
export const pendingPhotos = (files: Partial<Record<string, Blob>>): PendingPhoto[] => Object.entries(files).flatMap(([role, blob]) => (blob ? [{ role, blob }] : []));

export interface PhotoFailure {
  role: string;
  message: string;
}

export interface SaveOutcome<R> {
  /** The record as stored after its photos were added. */
  record: R;
  photoErrors: PhotoFailure[];
}

/** Reject (writing nothing) unless the site and the reflector on it are live. */
async function checkParents(db: GlintmarkDb, siteId: string, reflectorId: string): Promise<void> {
  const site = await siteRepo.get(db, siteId);
  if (!site || site.deletedAtMs !== null) throw new MissingReferenceError('site', siteId, 'this site is not (or no longer) in the logbook; choose another');
  const r = await reflectorRepo.get(db, reflectorId);
  if (!r || r.deletedAtMs !== null || r.siteId !== siteId) {
    throw new MissingReferenceError('reflector', reflectorId, `this reflector is not (or no longer) on site ${site.code}; choose another`);
  }
}

/** Add photos one by one; failures are collected in plain words, successes stay. */
export async function addPhotos(db: GlintmarkDb, owner: PhotoOwner, photos: readonly PendingPhoto[], by: string): Promise<PhotoFailure[]> {
  const failures: PhotoFailure[] = [];
  for (const p of photos) {
    try {
      await withReopen(db, () => addPhoto(db, owner, p.role, p.blob, { by }));
    } catch (e) {
      failures.push({ role: p.role, message: saveErrorMessage(e, false) });
    }
  }
  return failures;
}

/** Ids of the planned geometries for the installation: matching stored ones, the rest created now. */
export async function recordGeometries(db: GlintmarkDb, siteId: string, wanted: readonly GeometryFields[], by: string): Promise<string[]> {
  if (wanted.length === 0) return [];
  const stored = await geometryRepo.list(db, { siteId });
  const matched = matchGeometries(wanted, stored);
  const ids: string[] = [];
  for (let i = 0; i < wanted.length; i++) {
    const id = matched[i] ?? (await withReopen(db, () => geometryRepo.create(db, wanted[i], { by }))).id;
    if (!ids.includes(id)) ids.push(id);
  }
  return ids;
}

export async function createInstallation(
  db: GlintmarkDb,
  core: InstallationCoreFields,
  geometries: readonly GeometryFields[],
  photos: readonly PendingPhoto[],
  by: string,
): Promise<SaveOutcome<InstallationRecord>> {
  await checkParents(db, core.siteId, core.reflectorId);
  const geometryIds = await recordGeometries(db, core.siteId, geometries, by);
  const created = await withReopen(db, () => installationRepo.create(db, { ...core, geometryIds, photoIds: [] }, { by }));
  const photoErrors = await addPhotos(db, { table: 'installations', id: created.id }, photos, by);
  return { record: (await installationRepo.get(db, created.id)) ?? created, photoErrors };
}

export async function createInspection(
  db: GlintmarkDb,
  fields: Omit<InspectionFields, 'photoIds'>,
  photos: readonly PendingPhoto[],
  by: string,
): Promise<SaveOutcome<InspectionRecord>> {
  await checkParents(db, fields.siteId, fields.reflectorId);
  const created = await withReopen(db, () => inspectionRepo.create(db, { ...fields, photoIds: [] }, { by }));
  const photoErrors = await addPhotos(db, { table: 'inspections', id: created.id }, photos, by);
  return { record: (await inspectionRepo.get(db, created.id)) ?? created, photoErrors };
}
