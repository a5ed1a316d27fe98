/**
 * The merge rule for one record, as a pure function: file merge (merge.ts) and the sync pull (src/sync/) both
 * decide with it, so a backup from another phone and a page from the team register are judged alike.
 *
 *  - not here → 'add';
 *  - same content (photo blobs left out: photo bytes never change after creation) → 'unchanged';
 *  - higher incoming rev → 'replace'; `diverged` when our current version is not in the incoming history
 *    (both sides edited), so ours must be kept as a conflict;
 *  - lower incoming rev → 'keep-local'; `diverged` when the incoming version is not in our history;
 *  - same rev, different content → 'keep-local', diverged.
 * `updatedAtMs` never picks a side: phone clocks drift, and a silent pick would drop an edit.
 */
import { deepEqual } from './equal.ts';
import type { RevisionRecord } from './types.ts';

export type MergeRow = Record<string, unknown> & { id: string; rev: number; updatedAtMs: number };

export type MergeDecision =
  | { action: 'add' }
  | { action: 'unchanged' }
  | { action: 'replace'; diverged: boolean }
  | { action: 'keep-local'; diverged: boolean; sameRev: boolean };

export const withoutBlob = (r: Record<string, unknown>): Record<string, unknown> => {
  const { blob: _blob, ...rest } = r;
  return rest;
};

/** The revision that produced `row` (same rev and time), if the list has it. */
export const headOf = (row: MergeRow, revs: readonly RevisionRecord[]): RevisionRecord | undefined =>
  revs.find((r) => r.rev === row.rev && r.atMs === row.updatedAtMs);

/** Is `row`'s head revision among `history` (by id)? */
export const inHistory = (row: MergeRow, rowRevs: readonly RevisionRecord[], history: readonly RevisionRecord[]): boolean => {
  const head = headOf(row, rowRevs);
  return head !== undefined && history.some((x) => x.id === head.id);
};

/**
 * Decide what happens to `mine` (undefined when not here) given `incoming`. `myRevs` / `theirRevs` are the
 * revisions each side holds for that record.
 */
export function decideRecordMerge(mine: MergeRow | undefined, myRevs: readonly RevisionRecord[], incoming: MergeRow, theirRevs: readonly RevisionRecord[]): MergeDecision {
  if (!mine) return { action: 'add' };
  if (deepEqual(withoutBlob(mine), withoutBlob(incoming))) return { action: 'unchanged' };
  if (incoming.rev > mine.rev) return { action: 'replace', diverged: !inHistory(mine, myRevs, theirRevs) };
  if (incoming.rev < mine.rev) return { action: 'keep-local', diverged: !inHistory(incoming, theirRevs, myRevs), sameRev: false };
  return { action: 'keep-local', diverged: true, sameRev: true };
}
