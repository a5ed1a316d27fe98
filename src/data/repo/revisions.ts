/**
 * History rows. Each write adds one RevisionRecord in the same transaction as the row it describes:
 * 'create' carries the full snapshot (photo blobs left out), later kinds carry field-level changes.
 */
import type { GlintmarkDb } from '../db.ts';
import { deepEqual } from '../equal.ts';
import type { FieldChange, RevisionKind, RevisionRecord, VersionedTable } from '../types.ts';

/** Keys that change on every write and are implied by the revision itself. */
const IMPLIED = new Set(['rev', 'updatedAtMs']);

/** Field-level changes from `before` to `after` (top-level keys; nested objects compared and stored whole). */
export function diffFields(before: object, after: object): FieldChange[] {
  const b = before as Record<string, unknown>;
  const a = after as Record<string, unknown>;
  const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => !IMPLIED.has(k) && k !== 'blob');
  return keys
    .filter((k) => !deepEqual(b[k], a[k]))
    .map((k) => ({ field: k, before: b[k] ?? null, after: a[k] ?? null }));
}

/** A snapshot for a 'create' revision: the row without its blob. */
export function snapshotOf(row: object): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, val] of Object.entries(row)) if (k !== 'blob') out[k] = val;
  return out;
}

export interface NewRevision {
  table: VersionedTable;
  recordId: string;
  rev: number;
  atMs: number;
  by: string;
  kind: RevisionKind;
  changes?: FieldChange[];
  snapshot?: Record<string, unknown> | null;
  cascadeOf?: string | null;
}

export function makeRevision(r: NewRevision): RevisionRecord {
  return {
    id: crypto.randomUUID(),
    table: r.table,
    recordId: r.recordId,
    rev: r.rev,
    atMs: r.atMs,
    by: r.by,
    kind: r.kind,
    changes: r.changes ?? [],
    snapshot: r.snapshot ?? null,
    cascadeOf: r.cascadeOf ?? null,
  };
}

/** Every revision of one record, oldest first (by rev, then time; merged branches may share a rev). */
export async function history(db: GlintmarkDb, table: VersionedTable, id: string): Promise<RevisionRecord[]> {
  const rows = await db.revisions.where('[table+recordId]').equals([table, id]).toArray();
  return rows.sort((x, y) => x.rev - y.rev || x.atMs - y.atMs || x.id.localeCompare(y.id));
}

/**
 * The record as it was after revision `rev`, rebuilt by replaying the history over the create snapshot;
 * undefined when the history does not start with a snapshot or does not reach `rev`.
 */
export function versionAt(revisions: readonly RevisionRecord[], rev: number): Record<string, unknown> | undefined {
  const first = revisions.find((r) => r.kind === 'create' && r.snapshot);
  if (!first?.snapshot || rev < first.rev) return undefined;
  const state: Record<string, unknown> = { ...first.snapshot };
  for (const r of revisions) {
    if (r.rev <= first.rev || r.rev > rev) continue;
    for (const c of r.changes) state[c.field] = c.after;
    state.rev = r.rev;
    state.updatedAtMs = r.atMs;
  }
  return state.rev === rev ? state : undefined;
}
