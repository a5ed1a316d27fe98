/**
 * Soft-deleted records, so a crew that has left a record's page can still find and restore it (undelete), and the
 * counts a site delete would cascade to, so the app can ask first. Read-only.
 */
import type { GlintmarkDb } from './db.ts';
import { TABLE_NOUN } from './schema/validate.ts';
import type { EntityTable, InstallationRecord, InspectionRecord, ReflectorRecord, SiteRecord } from './types.ts';

export interface DeletedEntry {
  table: Exclude<EntityTable, 'geometries'>;
  id: string;
  /** "site MF-01", "reflector A at MF-01", "installation of reflector A at MF-01, 2027-07-02". */
  label: string;
  siteId: string;
  deletedAtMs: number;
  /** True when its site (or reflector) is deleted too: restore that first (it brings this back with it). */
  parentDeleted: boolean;
}

const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** Deleted sites, reflectors, installations and inspections (of one site when `siteId` is given), newest first. */
export async function listDeletedRecords(db: GlintmarkDb, opts: { siteId?: string } = {}): Promise<DeletedEntry[]> {
  const [sites, reflectors, installations, inspections] = await db.transaction('r', ['sites', 'reflectors', 'installations', 'inspections'], () =>
    Promise.all([db.sites.toArray(), db.reflectors.toArray(), db.installations.toArray(), db.inspections.toArray()]),
  );
  const site = new Map<string, SiteRecord>(sites.map((s) => [s.id, s]));
  const refl = new Map<string, ReflectorRecord>(reflectors.map((r) => [r.id, r]));
  const code = (id: string) => site.get(id)?.code ?? 'a removed site';
  const siteGone = (id: string) => (site.get(id)?.deletedAtMs ?? null) !== null;
  const reflGone = (id: string) => (refl.get(id)?.deletedAtMs ?? null) !== null;
  const out: DeletedEntry[] = [];
  for (const s of sites) if (s.deletedAtMs !== null) out.push({ table: 'sites', id: s.id, label: `site ${s.code}`, siteId: s.id, deletedAtMs: s.deletedAtMs, parentDeleted: false });
  for (const r of reflectors) {
    if (r.deletedAtMs !== null) out.push({ table: 'reflectors', id: r.id, label: `reflector ${r.label} at ${code(r.siteId)}`, siteId: r.siteId, deletedAtMs: r.deletedAtMs, parentDeleted: siteGone(r.siteId) });
  }
  const child = (table: 'installations' | 'inspections', x: InstallationRecord | InspectionRecord, atMs: number) => {
    if (x.deletedAtMs === null) return;
    const noun = TABLE_NOUN[table];
    out.push({
      table, id: x.id, label: `${noun} of reflector ${refl.get(x.reflectorId)?.label ?? '?'} at ${code(x.siteId)}, ${day(atMs)}`,
      siteId: x.siteId, deletedAtMs: x.deletedAtMs, parentDeleted: siteGone(x.siteId) || reflGone(x.reflectorId),
    });
  };
  for (const i of installations) child('installations', i, i.installedAtMs);
  for (const i of inspections) child('inspections', i, i.inspectedAtMs);
  return out.filter((e) => opts.siteId === undefined || e.siteId === opts.siteId).sort((a, b) => b.deletedAtMs - a.deletedAtMs || a.label.localeCompare(b.label));
}

/** What deleting a site would delete with it: its live reflectors, geometries, installations and inspections. */
export async function siteChildCounts(db: GlintmarkDb, siteId: string): Promise<{ reflectors: number; geometries: number; installations: number; inspections: number }> {
  const live = <T extends { deletedAtMs: number | null }>(rows: T[]) => rows.filter((r) => r.deletedAtMs === null).length;
  return db.transaction('r', ['reflectors', 'geometries', 'installations', 'inspections'], async () => ({
    reflectors: live(await db.reflectors.where('siteId').equals(siteId).toArray()),
    geometries: live(await db.geometries.where('siteId').equals(siteId).toArray()),
    installations: live(await db.installations.where('siteId').equals(siteId).toArray()),
    inspections: live(await db.inspections.where('siteId').equals(siteId).toArray()),
  }));
}
