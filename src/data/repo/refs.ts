/**
 * Reference checks run inside the writing transaction: parents must exist and be live, children must sit
 * on the same site as their parents, and listed photos must belong to the record.
 */
import type { GlintmarkDb } from '../db.ts';
import { MissingReferenceError } from '../errors.ts';
import type { EntityFieldsByTable, EntityTable, PhotoOwnerTable } from '../types.ts';

async function liveSite(db: GlintmarkDb, siteId: string): Promise<void> {
  const s = await db.sites.get(siteId);
  if (!s) throw new MissingReferenceError('site', siteId, 'no such site on this device');
  if (s.deletedAtMs !== null) throw new MissingReferenceError('site', siteId, `site ${s.code} is deleted; restore it first`);
}

async function liveReflectorOn(db: GlintmarkDb, reflectorId: string, siteId: string): Promise<void> {
  const r = await db.reflectors.get(reflectorId);
  if (!r) throw new MissingReferenceError('reflector', reflectorId, 'no such reflector on this device');
  if (r.deletedAtMs !== null) throw new MissingReferenceError('reflector', reflectorId, `reflector ${r.label} is deleted; restore it first`);
  if (r.siteId !== siteId) throw new MissingReferenceError('reflector', reflectorId, `reflector ${r.label} belongs to another site`);
}

async function ownedPhotos(db: GlintmarkDb, table: PhotoOwnerTable, ownerId: string, photoIds: readonly string[]): Promise<void> {
  if (photoIds.length === 0) return;
  const photos = await db.photos.bulkGet([...photoIds]);
  photos.forEach((p, i) => {
    if (!p || p.deletedAtMs !== null || p.ownerTable !== table || p.ownerId !== ownerId) {
      throw new MissingReferenceError('photo', photoIds[i], 'is not a live photo of this record; add photos with addPhoto');
    }
  });
}

/**
 * `changed(field)` tells whether the write sets that field (always true on create). Geometry and photo lists
 * are checked only when they change, so deleting a planned geometry never blocks editing an installation's notes.
 */
export type RefCheck<T extends EntityTable> = (
  db: GlintmarkDb,
  id: string,
  f: EntityFieldsByTable[T],
  changed: (field: keyof EntityFieldsByTable[T]) => boolean,
) => Promise<void>;

export const REF_CHECKS: { [K in EntityTable]: RefCheck<K> } = {
  sites: async () => {},
  reflectors: async (db, _id, f) => liveSite(db, f.siteId),
  geometries: async (db, _id, f) => {
    await liveSite(db, f.siteId);
    if (f.reflectorId !== null) await liveReflectorOn(db, f.reflectorId, f.siteId);
  },
  installations: async (db, id, f, changed) => {
    await liveSite(db, f.siteId);
    await liveReflectorOn(db, f.reflectorId, f.siteId);
    if (changed('photoIds')) await ownedPhotos(db, 'installations', id, f.photoIds);
    if (!changed('geometryIds')) return;
    const geos = await db.geometries.bulkGet(f.geometryIds);
    geos.forEach((g, i) => {
      const gid = f.geometryIds[i];
      if (!g || g.deletedAtMs !== null) throw new MissingReferenceError('geometry', gid, 'no such live planned geometry');
      if (g.siteId !== f.siteId) throw new MissingReferenceError('geometry', gid, 'belongs to another site');
    });
  },
  inspections: async (db, id, f, changed) => {
    await liveSite(db, f.siteId);
    await liveReflectorOn(db, f.reflectorId, f.siteId);
    if (changed('photoIds')) await ownedPhotos(db, 'inspections', id, f.photoIds);
  },
};

/** Child tables that a soft delete of a parent cascades to, and the field that points at the parent. */
export const CASCADE: Partial<Record<EntityTable, { table: EntityTable; field: 'siteId' | 'reflectorId' }[]>> = {
  sites: [
    { table: 'reflectors', field: 'siteId' },
    { table: 'geometries', field: 'siteId' },
    { table: 'installations', field: 'siteId' },
    { table: 'inspections', field: 'siteId' },
  ],
  reflectors: [
    { table: 'geometries', field: 'reflectorId' },
    { table: 'installations', field: 'reflectorId' },
    { table: 'inspections', field: 'reflectorId' },
  ],
};
