/**
 * The Logbook database: Dexie schema, versions and migrations. Only indexed properties are listed;
 * blobs and nested objects are never indexed (Dexie docs: index only what a where() clause uses).
 *
 * RULE: a version block with an upgrade() must never be altered once shipped; add a new version instead
 * (Dexie, "Database Versioning": "A version with an upgrader attached must never be altered").
 * A table is removed only by declaring it `null` in a new version.
 */
import Dexie, { type Table, type Transaction } from 'dexie';
import type {
  ConflictRecord,
  DraftRecord,
  ElementSetRecord,
  GeometryRecord,
  InspectionRecord,
  InstallationRecord,
  MetaRecord,
  PhotoRecord,
  ReflectorRecord,
  RevisionRecord,
  SiteRecord,
  SiteVisitsRecord,
} from './types.ts';
import { rebuildSiteVisits } from './repo/siteVisits.ts';

export type GlintmarkDb = Dexie & {
  sites: Table<SiteRecord, string>;
  reflectors: Table<ReflectorRecord, string>;
  geometries: Table<GeometryRecord, string>;
  installations: Table<InstallationRecord, string>;
  inspections: Table<InspectionRecord, string>;
  photos: Table<PhotoRecord, string>;
  revisions: Table<RevisionRecord, string>;
  drafts: Table<DraftRecord, string>;
  meta: Table<MetaRecord, string>;
  conflicts: Table<ConflictRecord, string>;
  siteVisits: Table<SiteVisitsRecord, string>;
  elements: Table<ElementSetRecord, string>;
};

export const CURRENT_SCHEMA_VERSION = 5;

/**
 * Version 1 (released 0.1). Sites had `gnssFix: boolean` instead of `positionSource`; installations had a
 * single `geometryId: string | null` and no `declinationModel`. No conflicts table.
 * Exported so the migration test writes real v1 databases with exactly these stores.
 */
export const SCHEMA_V1 = {
  sites: 'id, code',
  reflectors: 'id, siteId',
  geometries: 'id, siteId, reflectorId',
  installations: 'id, siteId, reflectorId, [siteId+installedAtMs]',
  inspections: 'id, siteId, reflectorId, [siteId+inspectedAtMs]',
  photos: 'id, [ownerTable+ownerId]',
  revisions: 'id, [table+recordId]',
  drafts: 'key',
  meta: 'key',
} as const;

/** Version 2: installations get a multi-entry index on geometryIds; merge conflicts get their own table. */
export const SCHEMA_V2 = {
  installations: 'id, siteId, reflectorId, [siteId+installedAtMs], *geometryIds',
  conflicts: 'id, [table+recordId]',
} as const;

/**
 * Version 3: a derived per-site summary (last visit, counts) so the site list does not read every installation.
 * Its upgrade builds the summary from the existing rows; records themselves are not changed.
 */
export const SCHEMA_V3 = {
  siteVisits: 'siteId',
} as const;

/**
 * Version 4: orbital element sets move from localStorage into the database (`elements`, indexed by catalogue
 * number). A new, empty table: no upgrade; existing tables are unchanged. The one-time import of the sets an
 * older app kept in localStorage is done by the Passes screen's store (repo/elements.ts `importElementSetsOnce`),
 * because the browser's localStorage is not reachable from an IndexedDB upgrade transaction.
 */
export const SCHEMA_V4 = {
  elements: 'id, catalogNumber',
} as const;

/**
 * Version 5: every photo row carries `sha256` (64 lowercase hex digits of its bytes), which names the photo's
 * file in a backup archive and lets a merge compare bytes. No new index. The upgrade cannot hash: an IndexedDB
 * upgrade transaction commits as soon as it waits on anything that is not an IndexedDB request, and
 * `crypto.subtle.digest` is not one. So the upgrade only marks existing photos `sha256: null`, and
 * `fillPhotoHashes` (repo/photos.ts) hashes them after opening: the app calls it at start, and every backup export
 * and merge calls it first, so no archive or merge ever meets a photo without its hash.
 */
export const SCHEMA_V5 = {} as const;

/** v4 → v5: existing photos get `sha256: null` (hashed after opening by fillPhotoHashes); nothing else changes. */
async function upgradeV4ToV5(tx: Transaction): Promise<void> {
  await tx
    .table('photos')
    .toCollection()
    .modify((p: Record<string, unknown>) => {
      if (typeof p.sha256 !== 'string') p.sha256 = null;
    });
}

/** The declination model the 0.1 release used for every compass reading (its only model). */
export const V1_DECLINATION_MODEL = 'WMM2020';

/**
 * v1 → v2, per row, without bumping `rev` or writing revisions: a schema migration is not an edit by
 * the crew, and two phones migrating the same record produce the same row, so merges stay conflict-free.
 *   sites: positionSource = gnssFix ? 'gnss-phone' : 'typed'; gnssFix removed.
 *   installations: geometryIds = geometryId ? [geometryId] : []; geometryId removed;
 *     declinationModel = declinationDeg !== null ? 'WMM2020' : null.
 */
async function upgradeV1ToV2(tx: Transaction): Promise<void> {
  let sites = 0;
  let installations = 0;
  await tx
    .table('sites')
    .toCollection()
    .modify((s: Record<string, unknown>) => {
      s.positionSource = s.gnssFix === true ? 'gnss-phone' : 'typed';
      delete s.gnssFix;
      sites++;
    });
  await tx
    .table('installations')
    .toCollection()
    .modify((i: Record<string, unknown>) => {
      const g = i.geometryId;
      i.geometryIds = typeof g === 'string' && g !== '' ? [g] : [];
      delete i.geometryId;
      i.declinationModel = typeof i.declinationDeg === 'number' ? V1_DECLINATION_MODEL : null;
      installations++;
    });
  await tx.table('meta').put({ key: 'migration-v1-v2', value: { atMs: Date.now(), sites, installations } });
}

/**
 * A Dexie instance with the Glintmark schema. Tests pass a unique name for an isolated database;
 * the app uses the default. The database opens lazily on the first query.
 */
export function openGlintmarkDb(name = 'glintmark'): GlintmarkDb {
  const db = new Dexie(name) as GlintmarkDb;
  // Version 1: never alter (migrated databases depend on it).
  db.version(1).stores(SCHEMA_V1);
  // Version 2: never alter (it has an upgrade).
  db.version(2).stores(SCHEMA_V2).upgrade(upgradeV1ToV2);
  // Version 3: never alter (it has an upgrade).
  db.version(3)
    .stores(SCHEMA_V3)
    .upgrade((tx) => rebuildSiteVisits({ installations: tx.table('installations'), inspections: tx.table('inspections'), siteVisits: tx.table('siteVisits') }));
  // Version 4: never alter once shipped.
  db.version(4).stores(SCHEMA_V4);
  // Version 5: never alter once shipped (it has an upgrade); add a new version for further changes.
  db.version(5).stores(SCHEMA_V5).upgrade(upgradeV4ToV5);
  db.on('populate', (tx) => {
    tx.table('meta').add({ key: 'schema', value: { createdWithVersion: CURRENT_SCHEMA_VERSION, createdAtMs: Date.now() } });
  });
  return db;
}
