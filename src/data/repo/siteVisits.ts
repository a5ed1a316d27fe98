/**
 * Derived per-site summary for the site list: time of the latest live installation or inspection and their
 * counts. It exists so opening the list reads 2 × (number of sites) small rows instead of every installation.
 * It is never edited directly: every write that can change it recomputes the affected sites from the source
 * rows in the same transaction; restore, merge, demo removal and the v3 migration rebuild it whole.
 * Not part of backups (it is rebuilt from them).
 */
import type { Table } from 'dexie';
import type { InspectionRecord, InstallationRecord, SiteVisitsRecord } from '../types.ts';

/** Table accessors, so the same code runs on a Dexie instance and inside an upgrade transaction. */
export interface VisitTables {
  installations: Table<InstallationRecord, string>;
  inspections: Table<InspectionRecord, string>;
  siteVisits: Table<SiteVisitsRecord, string>;
}

/** Summaries of the given rows, one per site that has at least one live installation or inspection. */
export function computeSiteVisits(installations: readonly InstallationRecord[], inspections: readonly InspectionRecord[]): SiteVisitsRecord[] {
  const out = new Map<string, SiteVisitsRecord>();
  const row = (siteId: string) => {
    let r = out.get(siteId);
    if (!r) out.set(siteId, (r = { siteId, lastVisitAtMs: null, installationCount: 0, inspectionCount: 0 }));
    return r;
  };
  for (const i of installations) {
    if (i.deletedAtMs !== null) continue;
    const r = row(i.siteId);
    r.installationCount++;
    r.lastVisitAtMs = Math.max(r.lastVisitAtMs ?? -Infinity, i.installedAtMs);
  }
  for (const i of inspections) {
    if (i.deletedAtMs !== null) continue;
    const r = row(i.siteId);
    r.inspectionCount++;
    r.lastVisitAtMs = Math.max(r.lastVisitAtMs ?? -Infinity, i.inspectedAtMs);
  }
  return [...out.values()];
}

/** Recompute the summaries of some sites (call inside the writing transaction). */
export async function refreshSiteVisits(t: VisitTables, siteIds: Iterable<string>): Promise<void> {
  for (const siteId of new Set(siteIds)) {
    const [inst, insp] = await Promise.all([
      t.installations.where('siteId').equals(siteId).toArray(),
      t.inspections.where('siteId').equals(siteId).toArray(),
    ]);
    const [r] = computeSiteVisits(inst, insp);
    if (r) await t.siteVisits.put(r);
    else await t.siteVisits.delete(siteId);
  }
}

/** Recompute every summary from scratch (call inside a transaction that includes the three tables). */
export async function rebuildSiteVisits(t: VisitTables): Promise<void> {
  const [inst, insp] = await Promise.all([t.installations.toArray(), t.inspections.toArray()]);
  await t.siteVisits.clear();
  await t.siteVisits.bulkPut(computeSiteVisits(inst, insp));
}
