/**
 * Orbital element sets kept on the phone (table `elements`, schema version 4).
 *
 * One live set per catalogue number. Adding a set for a number already stored updates that row (rev + 1), so a
 * removal or a newer set travels to another phone by merge like any record. Removing is a soft delete for the same
 * reason. Element sets are reference data (re-loadable from a file), not field work: no history rows are written.
 * Every write validates first (the lines must parse as the set they claim to be) and is one transaction.
 */
import * as v from 'valibot';
import type { GlintmarkDb } from '../db.ts';
import { ValidationError, type Issue } from '../errors.ts';
import { elementSetFieldsSchema } from '../schema/elements.ts';
import { toIssues } from '../schema/fields.ts';
import type { ElementSetFields, ElementSetRecord } from '../types.ts';

/** An element set as read from text (core/orbit/tle.ts `TleSet` has this shape). */
export interface ElementSetInput {
  name: string;
  catalogNumber: string;
  line1: string;
  line2: string;
  epochMs: number;
}

export interface PutElementSetsOptions {
  /** Mark the sets as the invented demonstration satellites (default false). */
  demo?: boolean;
  /** Time of the change, ms since 1970 UTC; default Date.now(). */
  nowMs?: number;
}

const checkNow = (nowMs: number | undefined): number => {
  const t = nowMs ?? Date.now();
  if (!Number.isInteger(t) || t < 0) throw new ValidationError('The element set', [{ path: 'nowMs', message: `must be a whole number of ms since 1970, got ${t}` }]);
  return t;
};

function parseSet(fields: ElementSetFields, i: number): ElementSetFields {
  const r = v.safeParse(elementSetFieldsSchema, fields);
  if (!r.success) throw new ValidationError(`The element set ${JSON.stringify(fields.catalogNumber ?? '')}`, toIssues(r.issues, `sets[${i}]`));
  return r.output;
}

const byAddedThenNumber = (a: ElementSetRecord, b: ElementSetRecord) =>
  a.addedAtMs - b.addedAtMs || a.catalogNumber.localeCompare(b.catalogNumber, 'en', { numeric: true }) || a.id.localeCompare(b.id);

/** All rows with this catalogue number, live first, then the most recently changed. */
async function rowsOf(db: GlintmarkDb, catalogNumber: string): Promise<ElementSetRecord[]> {
  const rows = await db.elements.where('catalogNumber').equals(catalogNumber).toArray();
  return rows.sort((a, b) => Number(a.deletedAtMs !== null) - Number(b.deletedAtMs !== null) || b.updatedAtMs - a.updatedAtMs);
}

export const elementRepo = {
  /** Live sets, oldest added first (then by catalogue number); deleted ones too with includeDeleted. */
  async list(db: GlintmarkDb, opts: { includeDeleted?: boolean } = {}): Promise<ElementSetRecord[]> {
    const rows = await db.elements.toArray();
    return rows.filter((r) => opts.includeDeleted || r.deletedAtMs === null).sort(byAddedThenNumber);
  },

  get(db: GlintmarkDb, id: string): Promise<ElementSetRecord | undefined> {
    return db.elements.get(id);
  },

  /**
   * Add or replace (by catalogue number) in one transaction; a number given twice keeps the last. Resolves with
   * the rows written. Rejects with ValidationError (nothing written) when a set's lines do not parse as that set.
   */
  async put(db: GlintmarkDb, sets: readonly ElementSetInput[], opts: PutElementSetsOptions = {}): Promise<ElementSetRecord[]> {
    const nowMs = checkNow(opts.nowMs);
    const byNumber = new Map<string, ElementSetFields>();
    sets.forEach((s, i) => {
      const f = parseSet({ catalogNumber: s.catalogNumber, name: s.name, line1: s.line1, line2: s.line2, epochMs: s.epochMs, addedAtMs: nowMs, demo: opts.demo === true }, i);
      byNumber.set(f.catalogNumber, f);
    });
    return db.transaction('rw', ['elements'], async () => {
      const out: ElementSetRecord[] = [];
      for (const f of byNumber.values()) {
        const [target, ...others] = await rowsOf(db, f.catalogNumber);
        // A second live row for one number can only come from an older merge; retire it.
        for (const o of others) if (o.deletedAtMs === null) await db.elements.put({ ...o, rev: o.rev + 1, updatedAtMs: nowMs, deletedAtMs: nowMs });
        const row: ElementSetRecord = target
          ? { ...target, ...f, rev: target.rev + 1, updatedAtMs: nowMs, deletedAtMs: null }
          : { id: crypto.randomUUID(), rev: 1, createdAtMs: nowMs, updatedAtMs: nowMs, deletedAtMs: null, ...f };
        await db.elements.put(row);
        out.push(row);
      }
      return out;
    });
  },

  /** Soft-delete the live set with this catalogue number; resolves with it, or undefined when there was none. */
  async remove(db: GlintmarkDb, catalogNumber: string, opts: { nowMs?: number } = {}): Promise<ElementSetRecord | undefined> {
    const nowMs = checkNow(opts.nowMs);
    return db.transaction('rw', ['elements'], async () => {
      let removed: ElementSetRecord | undefined;
      for (const r of await rowsOf(db, catalogNumber)) {
        if (r.deletedAtMs !== null) continue;
        removed = { ...r, rev: r.rev + 1, updatedAtMs: nowMs, deletedAtMs: nowMs };
        await db.elements.put(removed);
      }
      return removed;
    });
  },
};

export interface ElementImportResult {
  imported: number;
  /** Sets left out: their lines did not parse, or the number was already stored. */
  skipped: Issue[];
}

/**
 * Import element sets kept by an older app (in localStorage) exactly once per database: the first call writes
 * the sets whose catalogue number is not stored yet and records the import in meta 'elements-import-v1' in the
 * same transaction; every later call resolves with null and writes nothing.
 */
export async function importElementSetsOnce(db: GlintmarkDb, sets: readonly ElementSetFields[], nowMs = Date.now()): Promise<ElementImportResult | null> {
  const atMs = checkNow(nowMs);
  return db.transaction('rw', ['elements', 'meta'], async () => {
    if (await db.meta.get('elements-import-v1')) return null;
    const result: ElementImportResult = { imported: 0, skipped: [] };
    for (const [i, s] of sets.entries()) {
      const r = v.safeParse(elementSetFieldsSchema, s);
      if (!r.success) {
        result.skipped.push(...toIssues(r.issues, `sets[${i}]`));
        continue;
      }
      if ((await rowsOf(db, r.output.catalogNumber)).some((x) => x.deletedAtMs === null)) {
        result.skipped.push({ path: `sets[${i}]`, message: `catalogue number ${r.output.catalogNumber} is already stored` });
        continue;
      }
      await db.elements.add({ id: crypto.randomUUID(), rev: 1, createdAtMs: atMs, updatedAtMs: atMs, deletedAtMs: null, ...r.output });
      result.imported++;
    }
    await db.meta.put({ key: 'elements-import-v1', value: { atMs, imported: result.imported, skipped: result.skipped.length } });
    return result;
  });
}
