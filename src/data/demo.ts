/**
 * Remove demo records in one step, hard-deleting them with their photos, history and
 * conflicts in ONE transaction. A record is demo only if it was CREATED as demo: its row says demo and every
 * 'create' revision of it (there is one) says demo too. Updates cannot change the flag (repo/entity.ts) and merge
 * refuses versions that change it, but a row flagged by any other path (an older app, an edited file) still keeps
 * a real creation revision, so it is never removed. Real records are never touched. A demo record that a real record still
 * points to (e.g. a real reflector placed on a demo site) is kept, and reported, so no reference dangles.
 * Demo orbital element sets (`elements` with demo: true) are removed too; nothing points to an element set.
 */
import type { GlintmarkDb } from './db.ts';
import { rebuildSiteVisits } from './repo/siteVisits.ts';
import { ENTITY_TABLES, type EntityRecord, type EntityTable, type VersionedTable } from './types.ts';

export interface DemoRemovalReport {
  removed: Record<VersionedTable | 'revisions' | 'conflicts' | 'elements', number>;
  /** Demo records kept because a kept record points to them. */
  kept: { table: EntityTable; id: string; reason: string }[];
}

type AnyEntity = EntityRecord<EntityTable>;

/** The (table, id) pairs a row points to. */
function parentsOf(table: EntityTable, row: AnyEntity): [EntityTable, string][] {
  const r = row as unknown as { siteId?: string; reflectorId?: string | null; geometryIds?: string[] };
  const out: [EntityTable, string][] = [];
  if (table !== 'sites' && r.siteId) out.push(['sites', r.siteId]);
  if ((table === 'geometries' || table === 'installations' || table === 'inspections') && r.reflectorId) out.push(['reflectors', r.reflectorId]);
  if (table === 'installations') for (const g of r.geometryIds ?? []) out.push(['geometries', g]);
  return out;
}

export async function removeDemoData(db: GlintmarkDb): Promise<DemoRemovalReport> {
  const scope = [...ENTITY_TABLES, 'photos', 'revisions', 'conflicts', 'siteVisits', 'elements'];
  return db.transaction('rw', scope, async () => {
    const rows = new Map<EntityTable, AnyEntity[]>();
    for (const t of ENTITY_TABLES) rows.set(t, (await db.table(t).toArray()) as AnyEntity[]);
    const key = (t: string, id: string) => `${t}:${id}`;
    // What each record's creation revision says: true only if it has one and every one says demo.
    const createdDemo = new Map<string, boolean>();
    await db.revisions.each((rev) => {
      if (rev.kind !== 'create') return;
      const k = key(rev.table, rev.recordId);
      const says = rev.snapshot !== null && rev.snapshot.demo === true;
      createdDemo.set(k, (createdDemo.get(k) ?? true) && says);
    });
    const demo = new Set<string>();
    for (const [t, list] of rows) for (const r of list) if (r.demo === true && createdDemo.get(key(t, r.id)) === true) demo.add(key(t, r.id));

    // Keep every demo record reachable from a real record through parent references (to a fixpoint).
    const keptBy = new Map<string, string>();
    const queue: [EntityTable, AnyEntity][] = [];
    for (const [t, list] of rows) for (const r of list) if (!demo.has(key(t, r.id))) queue.push([t, r]);
    const byKey = new Map<string, [EntityTable, AnyEntity]>();
    for (const [t, list] of rows) for (const r of list) byKey.set(key(t, r.id), [t, r]);
    while (queue.length) {
      const [t, r] = queue.pop() as [EntityTable, AnyEntity];
      for (const [pt, pid] of parentsOf(t, r)) {
        const k = key(pt, pid);
        if (!demo.has(k) || keptBy.has(k)) continue;
        keptBy.set(k, `${t} ${r.id} points to it`);
        const parent = byKey.get(k);
        if (parent) queue.push(parent);
      }
    }

    const report: DemoRemovalReport = {
      removed: { sites: 0, reflectors: 0, geometries: 0, installations: 0, inspections: 0, photos: 0, revisions: 0, conflicts: 0, elements: 0 },
      kept: [],
    };
    const gone = new Set<string>();
    for (const t of ENTITY_TABLES) {
      const ids: string[] = [];
      for (const r of rows.get(t) ?? []) {
        const k = key(t, r.id);
        if (!demo.has(k)) continue;
        const why = keptBy.get(k);
        if (why) report.kept.push({ table: t, id: r.id, reason: why });
        else {
          ids.push(r.id);
          gone.add(k);
        }
      }
      await db.table(t).bulkDelete(ids);
      report.removed[t] = ids.length;
    }
    const photoIds = (await db.photos.toArray()).filter((p) => gone.has(key(p.ownerTable, p.ownerId))).map((p) => p.id);
    await db.photos.bulkDelete(photoIds);
    report.removed.photos = photoIds.length;
    for (const id of photoIds) gone.add(key('photos', id));
    const revIds = (await db.revisions.toArray()).filter((r) => gone.has(key(r.table, r.recordId))).map((r) => r.id);
    await db.revisions.bulkDelete(revIds);
    report.removed.revisions = revIds.length;
    const conflictIds = (await db.conflicts.toArray()).filter((c) => gone.has(key(c.table, c.recordId))).map((c) => c.id);
    await db.conflicts.bulkDelete(conflictIds);
    report.removed.conflicts = conflictIds.length;
    const elementIds = (await db.elements.toArray()).filter((e) => e.demo === true).map((e) => e.id);
    await db.elements.bulkDelete(elementIds);
    report.removed.elements = elementIds.length;
    await rebuildSiteVisits(db);
    return report;
  });
}
