/**
 * The merge decision for ONE versioned record, as a pure function: the rules of merge.ts (file merge on the
 * phone) stated once so the team register's server and the phone's sync apply exactly the same ones.
 *
 *  - not here → add;
 *  - same content (photo bytes never change after creation, so photos compare by their fields) → unchanged;
 *  - higher incoming rev → the incoming row replaces ours; if our current version is not in the incoming
 *    history (both sides edited), ours is kept as a conflict (`kept: 'incoming'`);
 *  - lower incoming rev → ours stays ("localNewer") when the incoming version is in our history; otherwise the
 *    incoming version is kept as a conflict (`kept: 'local'`) with its history, which is not merged;
 *  - same rev, different content → ours stays and the incoming version is kept as a conflict.
 * updatedAtMs is only used to find the revision that produced a row, never to pick a side (phone clocks drift).
 * No storage, no clock, no randomness: the caller applies the decision inside its own transaction.
 */
import { deepEqual } from './equal.ts';
import type { RevisionRecord } from './types.ts';

/** The RecordMeta part every versioned row carries (other fields compared as a whole). */
export type MergeRow = Record<string, unknown> & { id: string; rev: number; updatedAtMs: number; deletedAtMs: number | null };

export type MergeDecision =
  | { action: 'add' }
  | { action: 'unchanged' }
  /** Write the incoming row. `conflict` set: keep OUR version as a conflict row (kept: 'incoming'). */
  | { action: 'replace'; conflict: { kept: 'incoming'; reason: string } | null }
  | { action: 'local-newer' }
  /** Keep ours; keep the incoming version (and its revisions, not merged) as a conflict row (kept: 'local'). */
  | { action: 'keep-local-conflict'; conflict: { kept: 'local'; reason: string } };

/** A photo row compares by its fields: drop the blob (phone) before comparing. */
export const withoutBlob = (r: Record<string, unknown>): Record<string, unknown> => {
  const { blob: _blob, ...rest } = r;
  return rest;
};

/** The revision that produced `row` (same rev and time), if the list has it. */
export const headOf = (row: MergeRow, revs: readonly RevisionRecord[]): RevisionRecord | undefined =>
  revs.find((r) => r.rev === row.rev && r.atMs === row.updatedAtMs);

/**
 * Decide what to do with `incoming` given our stored version `mine` (undefined when absent), our revisions of
 * that record and the incoming revisions of that record.
 */
export function decideRecordMerge(
  mine: MergeRow | undefined,
  incoming: MergeRow,
  myRevs: readonly RevisionRecord[],
  theirRevs: readonly RevisionRecord[],
): MergeDecision {
  if (!mine) return { action: 'add' };
  if (deepEqual(withoutBlob(mine), withoutBlob(incoming))) return { action: 'unchanged' };
  if (incoming.rev > mine.rev) {
    const myHead = headOf(mine, myRevs);
    const diverged = !myHead || !theirRevs.some((x) => x.id === myHead.id);
    return {
      action: 'replace',
      conflict: diverged
        ? { kept: 'incoming', reason: `edited on both phones: incoming revision ${incoming.rev} replaced local revision ${mine.rev}; the local version is kept here` }
        : null,
    };
  }
  if (incoming.rev < mine.rev) {
    const theirHead = headOf(incoming, theirRevs);
    if (theirHead && myRevs.some((x) => x.id === theirHead.id)) return { action: 'local-newer' };
    return {
      action: 'keep-local-conflict',
      conflict: { kept: 'local', reason: `edited on both phones: local revision ${mine.rev} kept; the incoming revision ${incoming.rev} is not in its history` },
    };
  }
  return { action: 'keep-local-conflict', conflict: { kept: 'local', reason: `revision ${mine.rev} differs between the phones; the local version is kept` } };
}

/** What to do with one incoming history row given ours with the same id (undefined when absent). */
export function decideRevisionMerge(mine: RevisionRecord | undefined, incoming: RevisionRecord): 'add' | 'unchanged' | 'conflict' {
  if (!mine) return 'add';
  return deepEqual(mine, incoming) ? 'unchanged' : 'conflict';
}

export const REVISION_CONFLICT_REASON = 'a history row with this id differs between the phones; the local row is kept';

/** Element sets (reference data, no history): merge.ts's mergeElements rules for one row. */
export type ElementDecision = 'add' | 'unchanged' | 'replace' | 'local-newer' | 'conflict-take-incoming' | 'conflict-keep-local';

export function decideElementMerge(
  mine: (MergeRow & { epochMs: number }) | undefined,
  incoming: MergeRow & { epochMs: number },
): ElementDecision {
  if (!mine) return 'add';
  if (deepEqual(mine, incoming)) return 'unchanged';
  if (incoming.rev > mine.rev) return 'replace';
  if (incoming.rev < mine.rev) return 'local-newer';
  return incoming.epochMs > mine.epochMs ? 'conflict-take-incoming' : 'conflict-keep-local';
}
