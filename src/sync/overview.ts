/**
 * The register page's read model, from the synced local data (works offline): every live site with its latest
 * installation, reflectors due for inspection, open conflicts.
 *
 * Due rule: a live reflector with a live installation and no live inspection (nor installation) in the last
 * 365 days is due. Yearly inspection is common practice, no source.
 */
import type { ConflictRecord, GlintmarkDb, InstallationRecord, ReflectorRecord, SiteRecord } from '../data/index.ts';

export const INSPECTION_INTERVAL_MS = 365 * 86_400_000;

export interface OverviewSite {
  site: SiteRecord;
  latestInstallation: InstallationRecord | null;
}
export interface DueReflector {
  site: SiteRecord;
  reflector: ReflectorRecord;
  lastVisitAtMs: number;
}
export interface RegisterOverview {
  sites: OverviewSite[];
  due: DueReflector[];
  openConflicts: ConflictRecord[];
}

export async function registerOverview(db: GlintmarkDb, nowMs: number): Promise<RegisterOverview> {
  const sites = (await db.sites.toArray()).filter((s) => s.deletedAtMs === null).sort((a, b) => a.code.localeCompare(b.code, undefined, { numeric: true }));
  const installations = (await db.installations.toArray()).filter((i) => i.deletedAtMs === null);
  const inspections = (await db.inspections.toArray()).filter((i) => i.deletedAtMs === null);
  const reflectors = (await db.reflectors.toArray()).filter((r) => r.deletedAtMs === null);
  const latestBy = <T>(rows: T[], key: (r: T) => string, at: (r: T) => number) => {
    const m = new Map<string, T>();
    for (const r of rows) {
      const cur = m.get(key(r));
      if (!cur || at(r) > at(cur)) m.set(key(r), r);
    }
    return m;
  };
  const instBySite = latestBy(installations, (i) => i.siteId, (i) => i.installedAtMs);
  const instByRefl = latestBy(installations, (i) => i.reflectorId, (i) => i.installedAtMs);
  const inspByRefl = latestBy(inspections, (i) => i.reflectorId, (i) => i.inspectedAtMs);
  const siteById = new Map(sites.map((s) => [s.id, s]));
  const due: DueReflector[] = [];
  for (const r of reflectors) {
    const inst = instByRefl.get(r.id);
    const site = siteById.get(r.siteId);
    if (!inst || !site) continue;
    const last = Math.max(inst.installedAtMs, inspByRefl.get(r.id)?.inspectedAtMs ?? -Infinity);
    if (nowMs - last > INSPECTION_INTERVAL_MS) due.push({ site, reflector: r, lastVisitAtMs: last });
  }
  const openConflicts = (await db.conflicts.toArray()).filter((c) => c.resolvedAtMs === null);
  return { sites: sites.map((site) => ({ site, latestInstallation: instBySite.get(site.id) ?? null })), due, openConflicts };
}
