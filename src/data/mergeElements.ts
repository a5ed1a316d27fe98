/**
 * The `elements` part of mergeBackup (orbital element sets), run inside merge's transaction.
 *
 * Rows match by id, as for records: not here → added; equal → unchanged; higher rev → the incoming row replaces
 * ours (updated); lower rev → ours stays (localNewer). The same rev with different content (both phones changed
 * the set) keeps the version with the later element epoch — a property of the orbit data, not of a phone clock —
 * and the local one at equal epochs; it is reported as a conflict (element sets have no history to keep).
 * Afterwards each catalogue number the merge touched has at most one live set: the one with the latest epoch
 * (then the latest change) stays and the others are soft-deleted, so the two phones converge on the same set.
 */
import type { TableMergeReport } from './merge.ts';
import type { GlintmarkDb } from './db.ts';
import { deepEqual } from './equal.ts';
import type { ElementSetRecord } from './types.ts';

/** Which of two versions of a set to keep: the later epoch, then the later change, then the smaller id. */
const better = (a: ElementSetRecord, b: ElementSetRecord): ElementSetRecord =>
  a.epochMs !== b.epochMs ? (a.epochMs > b.epochMs ? a : b) : a.updatedAtMs !== b.updatedAtMs ? (a.updatedAtMs > b.updatedAtMs ? a : b) : a.id < b.id ? a : b;

export async function mergeElementSets(db: GlintmarkDb, incoming: readonly ElementSetRecord[], report: TableMergeReport, nowMs: number): Promise<void> {
  const touched = new Set<string>();
  for (const theirs of incoming) {
    const mine = await db.elements.get(theirs.id);
    touched.add(theirs.catalogNumber);
    if (!mine) {
      await db.elements.add(theirs);
      report.added++;
    } else if (deepEqual(mine, theirs)) {
      report.unchanged++;
    } else if (theirs.rev > mine.rev) {
      await db.elements.put(theirs);
      touched.add(mine.catalogNumber);
      report.updated++;
    } else if (theirs.rev < mine.rev) {
      report.localNewer++;
    } else {
      const takeTheirs = theirs.epochMs > mine.epochMs;
      if (takeTheirs) {
        await db.elements.put(theirs);
        touched.add(mine.catalogNumber);
      }
      const kept = takeTheirs ? 'the incoming set (later epoch)' : 'the local set';
      report.conflicts.push({ table: 'elements', id: theirs.id, reason: `element set ${theirs.catalogNumber} revision ${theirs.rev} differs between the phones; ${kept} is kept` });
    }
  }
  for (const catalogNumber of touched) {
    const live = (await db.elements.where('catalogNumber').equals(catalogNumber).toArray()).filter((r) => r.deletedAtMs === null);
    if (live.length < 2) continue;
    const keep = live.reduce(better);
    for (const r of live) if (r.id !== keep.id) await db.elements.put({ ...r, rev: r.rev + 1, updatedAtMs: nowMs, deletedAtMs: nowMs });
  }
}
