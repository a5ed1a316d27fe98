/**
 * The generic repository behind sites, reflectors, geometries, installations and inspections.
 * Every write validates first, runs in one read-write transaction together with its revision row, and
 * resolves only after that transaction has committed. Nothing here catches: errors reach the caller.
 */
import type { Table } from 'dexie';
import type { GlintmarkDb } from '../db.ts';
import { InvalidStateForEditError, RecordNotFoundError, StaleRecordError, ValidationError } from '../errors.ts';
import { TABLE_NOUN, parseFields, splitRow } from '../schema/validate.ts';
import type { EntityFieldsByTable, EntityRecord, EntityTable, RevisionRecord } from '../types.ts';
import { resolveContext, type WriteContext } from './context.ts';
import { CASCADE, REF_CHECKS, type RefCheck } from './refs.ts';
import { diffFields, history, makeRevision, snapshotOf } from './revisions.ts';
import { refreshSiteVisits } from './siteVisits.ts';

/** Tables every entity write may touch (reference checks, cascades, photos, history). */
export const WRITE_SCOPE = ['sites', 'reflectors', 'geometries', 'installations', 'inspections', 'photos', 'revisions', 'siteVisits'] as const;

/** Tables whose edits (V) or deletions (D, with cascades) can change a site's visit summary. */
const VISITS_ON_EDIT = new Set<EntityTable>(['installations', 'inspections']);
const VISITS_ON_DELETE = new Set<EntityTable>(['sites', 'reflectors', 'installations', 'inspections']);
const siteIdOf = (table: EntityTable, row: { id: string }) => (table === 'sites' ? row.id : (row as unknown as { siteId: string }).siteId);

/** Why an update that changes `demo` is refused. */
export const DEMO_FIXED = 'whether a record is demo data is set when the record is created and cannot be changed; create a new record instead';

export interface EditContext extends WriteContext {
  /** The rev the caller edited; a different current rev rejects with StaleRecordError. */
  expectedRev?: number;
}

export interface ListOptions {
  /** Include soft-deleted rows (default false). */
  includeDeleted?: boolean;
  /** Only rows of this site (ignored for sites). */
  siteId?: string;
  /** Only rows of this reflector (geometries, installations, inspections). */
  reflectorId?: string;
}

export interface EntityRepo<T extends EntityTable> {
  readonly table: T;
  /** Validate, check references, write the row (rev 1) and its 'create' revision. */
  create(db: GlintmarkDb, fields: EntityFieldsByTable[T], ctx: WriteContext): Promise<EntityRecord<T>>;
  /** Apply a partial change; a no-op patch writes nothing and returns the current row. */
  update(db: GlintmarkDb, id: string, patch: Partial<EntityFieldsByTable[T]>, ctx: EditContext): Promise<EntityRecord<T>>;
  /** Set deletedAtMs (and cascade to live children of a site or reflector). Already deleted: unchanged. */
  softDelete(db: GlintmarkDb, id: string, ctx: EditContext): Promise<EntityRecord<T>>;
  /** Clear deletedAtMs and restore the children the matching delete cascaded to. Live: unchanged. */
  undelete(db: GlintmarkDb, id: string, ctx: EditContext): Promise<EntityRecord<T>>;
  get(db: GlintmarkDb, id: string): Promise<EntityRecord<T> | undefined>;
  list(db: GlintmarkDb, opts?: ListOptions): Promise<EntityRecord<T>[]>;
}

/** Extra check run in the transaction (e.g. unique site code); `changed` as in RefCheck. */
export type ExtraCheck<T extends EntityTable> = (
  db: GlintmarkDb,
  id: string,
  f: EntityFieldsByTable[T],
  changed: (field: keyof EntityFieldsByTable[T]) => boolean,
) => Promise<void>;

export function makeEntityRepo<T extends EntityTable>(
  table: T,
  opts: { compare: (a: EntityRecord<T>, b: EntityRecord<T>) => number; extraCheck?: ExtraCheck<T> },
): EntityRepo<T> {
  const noun = TABLE_NOUN[table];
  const tbl = (db: GlintmarkDb) => db.table<EntityRecord<T>, string>(table);
  const refCheck = REF_CHECKS[table] as RefCheck<T>;
  const checks: ExtraCheck<T> = async (db, id, f, changed) => {
    await refCheck(db, id, f, changed);
    await opts.extraCheck?.(db, id, f, changed);
  };

  async function current(db: GlintmarkDb, id: string, expectedRev: number | undefined): Promise<EntityRecord<T>> {
    const cur = await tbl(db).get(id);
    if (!cur) throw new RecordNotFoundError(table, id);
    if (expectedRev !== undefined && cur.rev !== expectedRev) throw new StaleRecordError(table, id, expectedRev, cur.rev);
    return cur;
  }

  return {
    table,
    async create(db, fields, ctx) {
      const { by, nowMs } = resolveContext(ctx);
      const f = parseFields(table, fields);
      const id = crypto.randomUUID();
      const rec = { id, rev: 1, createdAtMs: nowMs, updatedAtMs: nowMs, deletedAtMs: null, ...f } as EntityRecord<T>;
      await db.transaction('rw', WRITE_SCOPE, async () => {
        await checks(db, id, f, () => true);
        await tbl(db).add(rec);
        await db.revisions.add(makeRevision({ table, recordId: id, rev: 1, atMs: nowMs, by, kind: 'create', snapshot: snapshotOf(rec) }));
        if (VISITS_ON_EDIT.has(table)) await refreshSiteVisits(db, [siteIdOf(table, rec)]);
      });
      return rec;
    },

    async update(db, id, patch, ctx) {
      const { by, nowMs } = resolveContext(ctx);
      return db.transaction('rw', WRITE_SCOPE, async () => {
        const cur = await current(db, id, ctx.expectedRev);
        if (cur.deletedAtMs !== null) throw new InvalidStateForEditError(`This ${noun} is deleted; restore it before editing.`);
        const curFields = splitRow(cur as unknown as Record<string, unknown>).fields;
        const f = parseFields(table, { ...curFields, ...patch });
        const changes = diffFields(curFields, f);
        if (changes.length === 0) return cur;
        const changed = new Set(changes.map((c) => c.field));
        // Demo is a property of creation: "Remove demo data" must never be able to reach a real record.
        if (changed.has('demo')) throw new ValidationError(`The ${noun}`, [{ path: 'demo', message: DEMO_FIXED }]);
        await checks(db, id, f, (k) => changed.has(k as string));
        const next = { ...cur, ...f, rev: cur.rev + 1, updatedAtMs: nowMs } as EntityRecord<T>;
        await tbl(db).put(next);
        await db.revisions.add(makeRevision({ table, recordId: id, rev: next.rev, atMs: nowMs, by, kind: 'update', changes }));
        if (VISITS_ON_EDIT.has(table)) await refreshSiteVisits(db, [siteIdOf(table, cur), siteIdOf(table, next)]);
        return next;
      });
    },

    async softDelete(db, id, ctx) {
      const { by, nowMs } = resolveContext(ctx);
      return db.transaction('rw', WRITE_SCOPE, async () => {
        const cur = await current(db, id, ctx.expectedRev);
        if (cur.deletedAtMs !== null) return cur;
        const rev = await setDeleted(db, table, cur, nowMs, by, null);
        for (const child of CASCADE[table] ?? []) {
          const rows = await db.table<EntityRecord<EntityTable>, string>(child.table).where(child.field).equals(id).toArray();
          for (const row of rows) if (row.deletedAtMs === null) await setDeleted(db, child.table, row, nowMs, by, rev.id);
        }
        if (VISITS_ON_DELETE.has(table)) await refreshSiteVisits(db, [siteIdOf(table, cur)]);
        return { ...cur, deletedAtMs: nowMs, rev: cur.rev + 1, updatedAtMs: nowMs };
      });
    },

    async undelete(db, id, ctx) {
      const { by, nowMs } = resolveContext(ctx);
      return db.transaction('rw', WRITE_SCOPE, async () => {
        const cur = await current(db, id, ctx.expectedRev);
        if (cur.deletedAtMs === null) return cur;
        const f = parseFields(table, splitRow(cur as unknown as Record<string, unknown>).fields);
        await checks(db, id, f, (k) => k === 'code');
        const deleteRev = (await history(db, table, id)).filter((r) => r.kind === 'delete').at(-1);
        const rev = await setDeleted(db, table, cur, nowMs, by, null);
        for (const child of CASCADE[table] ?? []) {
          const rows = await db.table<EntityRecord<EntityTable>, string>(child.table).where(child.field).equals(id).toArray();
          for (const row of rows) {
            if (row.deletedAtMs === null || !deleteRev) continue;
            const last = (await history(db, child.table, row.id)).at(-1);
            if (last?.kind === 'delete' && last.cascadeOf === deleteRev.id) await setDeleted(db, child.table, row, nowMs, by, rev.id);
          }
        }
        if (VISITS_ON_DELETE.has(table)) await refreshSiteVisits(db, [siteIdOf(table, cur)]);
        return { ...cur, deletedAtMs: null, rev: cur.rev + 1, updatedAtMs: nowMs };
      });
    },

    get: (db, id) => tbl(db).get(id),

    async list(db, o = {}) {
      const t: Table<EntityRecord<T>, string> = tbl(db);
      let rows: EntityRecord<T>[];
      if (o.reflectorId !== undefined && table !== 'sites' && table !== 'reflectors') rows = await t.where('reflectorId').equals(o.reflectorId).toArray();
      else if (o.siteId !== undefined && table !== 'sites') rows = await t.where('siteId').equals(o.siteId).toArray();
      else rows = await t.toArray();
      if (o.siteId !== undefined && table !== 'sites') rows = rows.filter((r) => (r as unknown as { siteId: string }).siteId === o.siteId);
      if (!o.includeDeleted) rows = rows.filter((r) => r.deletedAtMs === null);
      return rows.sort(opts.compare);
    },
  };
}

/** Toggle deletedAtMs (null ↔ now) on one row and write its revision; returns the revision. */
async function setDeleted(
  db: GlintmarkDb,
  table: EntityTable,
  row: EntityRecord<EntityTable>,
  nowMs: number,
  by: string,
  cascadeOf: string | null,
): Promise<RevisionRecord> {
  const deleting = row.deletedAtMs === null;
  const after = deleting ? nowMs : null;
  await db.table(table).put({ ...row, deletedAtMs: after, rev: row.rev + 1, updatedAtMs: nowMs });
  const rev = makeRevision({
    table,
    recordId: row.id,
    rev: row.rev + 1,
    atMs: nowMs,
    by,
    kind: deleting ? 'delete' : 'undelete',
    changes: [{ field: 'deletedAtMs', before: row.deletedAtMs, after }],
    cascadeOf,
  });
  await db.revisions.add(rev);
  return rev;
}
