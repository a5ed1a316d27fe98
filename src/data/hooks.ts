/**
 * React hooks for the Logbook screens: thin useLiveQuery wrappers over queries.ts and the repositories.
 * Every hook returns undefined while loading; "not found" is null. They re-render when Dexie sees a
 * change to a table the query read (also from other tabs). Screens call these and the repositories,
 * never Dexie directly.
 */
import { listDeletedRecords, type DeletedEntry } from './deleted.ts';
import { useLiveQuery } from 'dexie-react-hooks';
import { createContext, useContext, useMemo } from 'react';
import { openGlintmarkDb, type GlintmarkDb } from './db.ts';
import { querySiteDetail, querySiteListSources, type SiteDetail } from './queries.ts';
import { geometryRepo, inspectionRepo, installationRepo, reflectorRepo } from './repo/entities.ts';
import { listConflicts } from './repo/conflicts.ts';
import { listPhotos, type PhotoOwner } from './repo/photos.ts';
import { history } from './repo/revisions.ts';
import { filterAndSortSites, type SiteListQuery, type SiteListRow } from './siteList.ts';
import type {
  ConflictRecord,
  GeometryRecord,
  InspectionRecord,
  InstallationRecord,
  PhotoRecord,
  ReflectorRecord,
  RevisionRecord,
  SiteRecord,
  VersionedTable,
} from './types.ts';

let appDb: GlintmarkDb | undefined;

/** The app's database ('glintmark'), created on first use. */
export function getAppDb(): GlintmarkDb {
  return (appDb ??= openGlintmarkDb());
}

/** Provide another database to the hooks below it (tests, previews); without a provider they use getAppDb(). */
export const GlintmarkDbContext = createContext<GlintmarkDb | null>(null);

export function useGlintmarkDb(): GlintmarkDb {
  return useContext(GlintmarkDbContext) ?? getAppDb();
}

/**
 * The site list. The database is read once per change; search and sort run in memory (siteList.ts), so
 * typing does not re-query. `here` changes re-sort without a query too.
 */
export function useSites(q: SiteListQuery = {}): SiteListRow[] | undefined {
  const db = useGlintmarkDb();
  const sources = useLiveQuery(() => querySiteListSources(db), [db]);
  const { search, sort, here } = q;
  const hereLat = here?.latDeg;
  const hereLon = here?.lonDeg;
  return useMemo(
    () =>
      sources &&
      filterAndSortSites(sources, {
        search,
        sort,
        here: hereLat === undefined || hereLon === undefined ? null : { latDeg: hereLat, lonDeg: hereLon },
      }),
    [sources, search, sort, hereLat, hereLon],
  );
}

/** One site (deleted ones too); null when it does not exist. */
export function useSite(id: string): SiteRecord | null | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(async () => (await db.sites.get(id)) ?? null, [db, id]);
}

/** Everything the site screen shows: live reflectors, geometries, installations, inspections, history, open conflicts. */
export function useSiteDetail(id: string): SiteDetail | null | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(() => querySiteDetail(db, id), [db, id]);
}

export function useReflectors(siteId: string): ReflectorRecord[] | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(() => reflectorRepo.list(db, { siteId }), [db, siteId]);
}

export function useGeometries(siteId: string): GeometryRecord[] | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(() => geometryRepo.list(db, { siteId }), [db, siteId]);
}

export function useInstallation(id: string): InstallationRecord | null | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(async () => (await installationRepo.get(db, id)) ?? null, [db, id]);
}

export function useInspection(id: string): InspectionRecord | null | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(async () => (await inspectionRepo.get(db, id)) ?? null, [db, id]);
}

/** The history of one record, oldest first. */
export function useHistory(table: VersionedTable, id: string): RevisionRecord[] | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(() => history(db, table, id), [db, table, id]);
}

/** Live photos of an installation or inspection, oldest picture first. */
export function usePhotos(owner: PhotoOwner): PhotoRecord[] | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(() => listPhotos(db, owner), [db, owner.table, owner.id]);
}

/** Open merge conflicts, newest first. */
export function useOpenConflicts(): ConflictRecord[] | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(() => listConflicts(db), [db]);
}

/** Soft-deleted records (of one site when given), newest first: see listDeletedRecords. */
export function useDeletedRecords(siteId?: string): DeletedEntry[] | undefined {
  const db = useGlintmarkDb();
  return useLiveQuery(() => listDeletedRecords(db, siteId === undefined ? {} : { siteId }), [db, siteId]);
}

/**
 * A live read for screens whose query lives in a layer above this one (src/sync): reruns when the tables it reads
 * change, in this tab or another. undefined while loading.
 */
export function useLiveRead<T>(querier: () => Promise<T>, deps: readonly unknown[]): T | undefined {
  return useLiveQuery(querier, [...deps]);
}
