/**
 * Read models for the Logbook screens. Each is an async function of the database that uses only Dexie
 * calls, so it can run inside useLiveQuery/liveQuery and re-run when the tables it read change.
 */
import type { GlintmarkDb } from './db.ts';
import { history } from './repo/revisions.ts';
import type { SiteListSource } from './siteList.ts';
import type {
  ConflictRecord,
  GeometryRecord,
  InspectionRecord,
  InstallationRecord,
  ReflectorRecord,
  RevisionRecord,
  SiteRecord,
} from './types.ts';

/** Live sites with the time of their latest live installation or inspection (one read transaction). */
export async function querySiteListSources(db: GlintmarkDb): Promise<SiteListSource[]> {
  return db.transaction('r', ['sites', 'siteVisits'], async () => {
    const [sites, visits] = await Promise.all([db.sites.toArray(), db.siteVisits.toArray()]);
    const bySite = new Map(visits.map((v) => [v.siteId, v]));
    return sites
      .filter((s) => s.deletedAtMs === null)
      .map((site) => {
        const v = bySite.get(site.id);
        return { site, lastVisitAtMs: v?.lastVisitAtMs ?? null, installationCount: v?.installationCount ?? 0, inspectionCount: v?.inspectionCount ?? 0 };
      });
  });
}

export interface SiteDetail {
  site: SiteRecord;
  /** Live children, in list order (reflectors by label, installations and inspections newest first). */
  reflectors: ReflectorRecord[];
  geometries: GeometryRecord[];
  installations: InstallationRecord[];
  inspections: InspectionRecord[];
  /** The site's own history, oldest first. */
  history: RevisionRecord[];
  /** Open merge conflicts about the site, its children or their photos. */
  conflicts: ConflictRecord[];
}

const live = <T extends { deletedAtMs: number | null }>(rows: T[]) => rows.filter((r) => r.deletedAtMs === null);

/** Everything the site screen shows; null when no such site exists (deleted sites are returned, flagged by deletedAtMs). */
export async function querySiteDetail(db: GlintmarkDb, siteId: string): Promise<SiteDetail | null> {
  return db.transaction('r', ['sites', 'reflectors', 'geometries', 'installations', 'inspections', 'revisions', 'conflicts'], async () => {
    const site = await db.sites.get(siteId);
    if (!site) return null;
    const [reflectors, geometries, installations, inspections, siteHistory, conflicts] = await Promise.all([
      db.reflectors.where('siteId').equals(siteId).toArray(),
      db.geometries.where('siteId').equals(siteId).toArray(),
      db.installations.where('siteId').equals(siteId).toArray(),
      db.inspections.where('siteId').equals(siteId).toArray(),
      history(db, 'sites', siteId),
      db.conflicts.filter((c) => c.resolvedAtMs === null).toArray(),
    ]);
    const owned = [...installations, ...inspections];
    const ids = new Set([siteId, ...[...reflectors, ...geometries, ...owned].map((x) => x.id), ...owned.flatMap((x) => x.photoIds)]);
    return {
      site,
      reflectors: live(reflectors).sort((a, b) => a.label.localeCompare(b.label, undefined, { numeric: true })),
      geometries: live(geometries).sort((a, b) => a.createdAtMs - b.createdAtMs),
      installations: live(installations).sort((a, b) => b.installedAtMs - a.installedAtMs),
      inspections: live(inspections).sort((a, b) => b.inspectedAtMs - a.inspectedAtMs),
      history: siteHistory,
      conflicts: conflicts.filter((c) => ids.has(c.recordId)),
    };
  });
}
