/**
 * Validation of what a phone or the planner sends: a push body, checked with the SAME record schemas as a backup
 * file (src/data/schema, src/data/backup) before anything is written. Every issue names its place in the body.
 */
import * as v from 'valibot';
import { photoRowSchema, revisionRowSchema } from '../data/backup/format.ts';
import type { Issue } from '../data/errors.ts';
import { elementRowIssues } from '../data/schema/elements.ts';
import { timeMs, toIssues, uuid } from '../data/schema/fields.ts';
import { rowIssues } from '../data/schema/validate.ts';
import { ENTITY_TABLES, VERSIONED_TABLES, type ElementSetRecord, type EntityTable, type RevisionRecord, type VersionedTable } from '../data/types.ts';
import { badRequest } from './errors.ts';

/** A photo row as it travels to and from the register: the backup row without its bytes, plus their SHA-256. */
const { dataBase64: _data, ...photoEntries } = photoRowSchema.entries;
export const registerPhotoRowSchema = v.strictObject({
  ...photoEntries,
  sha256: v.pipe(v.string('sha256 must be text'), v.regex(/^[0-9a-f]{64}$/, 'sha256 must be 64 lowercase hexadecimal characters')),
});

export type Row = Record<string, unknown> & { id: string; rev: number; createdAtMs: number; updatedAtMs: number; deletedAtMs: number | null };

export interface Change {
  table: VersionedTable;
  row: Row;
  revisions: RevisionRecord[];
}

export interface Batch {
  changes: Change[];
  resolvedConflicts: { conflictId: string; resolvedAtMs: number }[];
  elements: ElementSetRecord[];
  /** Conflict rows carried by a backup file (never by a phone push). */
  conflicts: Record<string, unknown>[];
}

export interface PushBody extends Omit<Batch, 'conflicts'> {
  pushId: number;
}

const envelope = v.strictObject({
  pushId: v.pipe(v.number('pushId must be a number'), v.safeInteger('pushId must be a whole number'), v.minValue(1, 'pushId must be 1 or more')),
  changes: v.pipe(
    v.array(
      v.strictObject({
        table: v.picklist(VERSIONED_TABLES, `table must be one of ${VERSIONED_TABLES.join(', ')}`),
        row: v.unknown(),
        revisions: v.array(v.unknown(), 'revisions must be a list'),
      }),
      'changes must be a list',
    ),
    v.maxLength(20_000, 'a push holds at most 20000 changes; send the rest in the next one'),
  ),
  resolvedConflicts: v.optional(v.array(v.strictObject({ conflictId: uuid('conflict id'), resolvedAtMs: timeMs('resolution time') }), 'resolvedConflicts must be a list'), []),
  elements: v.optional(v.array(v.unknown(), 'elements must be a list'), []),
});

/** -0 and 0 are the same figure; JSONB keeps only one of them, so compare and store 0. */
function normalise(x: unknown): unknown {
  if (Object.is(x, -0)) return 0;
  if (Array.isArray(x)) return x.map(normalise);
  if (typeof x === 'object' && x !== null) return Object.fromEntries(Object.entries(x).map(([k, y]) => [k, normalise(y)]));
  return x;
}

/** PostgreSQL text cannot hold U+0000; refuse it with a clear message instead of failing inside the database. */
function hasNul(x: unknown): boolean {
  if (typeof x === 'string') return x.includes('\u0000');
  if (Array.isArray(x)) return x.some(hasNul);
  if (typeof x === 'object' && x !== null) return Object.entries(x).some(([k, y]) => k.includes('\u0000') || hasNul(y));
  return false;
}

export function rowProblems(table: VersionedTable, row: unknown, where: string): Issue[] {
  if (table === 'photos') {
    const r = v.safeParse(registerPhotoRowSchema, row);
    return r.success ? [] : toIssues(r.issues, where);
  }
  return rowIssues(table as EntityTable, row, where);
}

export function revisionProblems(rev: unknown, table: VersionedTable, recordId: string, where: string): Issue[] {
  const r = v.safeParse(revisionRowSchema, rev);
  if (!r.success) return toIssues(r.issues, where);
  if (r.output.table !== table || r.output.recordId !== recordId) return [{ path: where, message: `belongs to ${r.output.table} ${r.output.recordId}, not to the ${table} row it travels with` }];
  return [];
}

const fail = (issues: Issue[]) => {
  const shown = issues.slice(0, 5).map((i) => `${i.path}: ${i.message}`).join('; ');
  const more = issues.length > 5 ? ` (and ${issues.length - 5} more)` : '';
  return badRequest('invalid-record', `Nothing was stored: ${shown}${more}.`, issues);
};

/** Check a whole push body; throws RegisterError 400 naming every problem (nothing is stored then). */
export function parsePush(body: unknown): PushBody {
  if (hasNul(body)) throw badRequest('invalid-text', 'Nothing was stored: a text holds the character U+0000, which the register cannot keep.');
  const env = v.safeParse(envelope, body);
  if (!env.success) throw fail(toIssues(env.issues));
  const issues: Issue[] = [];
  const seen = new Set<string>();
  const revSeen = new Set<string>();
  env.output.changes.forEach((c, i) => {
    issues.push(...rowProblems(c.table, c.row, `changes[${i}].row`));
    const id = (c.row as { id?: unknown })?.id;
    const key = `${c.table}:${String(id)}`;
    if (seen.has(key)) issues.push({ path: `changes[${i}]`, message: `repeats ${c.table} ${String(id)}` });
    seen.add(key);
    c.revisions.forEach((r, k) => {
      issues.push(...revisionProblems(r, c.table, String(id), `changes[${i}].revisions[${k}]`));
      const rid = String((r as { id?: unknown })?.id);
      if (revSeen.has(rid)) issues.push({ path: `changes[${i}].revisions[${k}]`, message: `repeats the revision id ${rid}` });
      revSeen.add(rid);
    });
  });
  env.output.elements.forEach((e, i) => issues.push(...elementRowIssues(e, `elements[${i}]`)));
  if (issues.length) throw fail(issues);
  return normalise({ ...env.output }) as PushBody;
}

export { ENTITY_TABLES };
