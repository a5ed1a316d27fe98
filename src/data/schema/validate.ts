/** Validation entry points used by the repositories, backup restore, merge and import. */
import * as v from 'valibot';
import { ValidationError, type Issue } from '../errors.ts';
import type { EntityFieldsByTable, EntityTable } from '../types.ts';
import { FIELD_SCHEMAS, META_KEYS, recordMetaSchema } from './records.ts';
import { toIssues } from './fields.ts';
import { forbiddenKey, forbiddenKeyMessage } from './plain.ts';

/** Human names of the tables, singular, for messages. */
export const TABLE_NOUN: Record<EntityTable | 'photos', string> = {
  sites: 'site',
  reflectors: 'reflector',
  geometries: 'planned geometry',
  installations: 'installation',
  inspections: 'inspection',
  photos: 'photo',
};

/** Issues of the editable fields of one row, [] when valid. */
export function fieldIssues<T extends EntityTable>(table: T, fields: unknown, prefix = ''): Issue[] {
  const r = v.safeParse(FIELD_SCHEMAS[table], fields);
  return r.success ? [] : toIssues(r.issues, prefix);
}

/** The validated fields, or a ValidationError naming every problem. Unknown fields are errors. */
export function parseFields<T extends EntityTable>(table: T, fields: unknown): EntityFieldsByTable[T] {
  const schema: v.GenericSchema<unknown, EntityFieldsByTable[T]> = FIELD_SCHEMAS[table];
  const r = v.safeParse(schema, fields);
  if (!r.success) throw new ValidationError(`The ${TABLE_NOUN[table]}`, toIssues(r.issues));
  return r.output;
}

/**
 * Split a whole row into its RecordMeta part and its fields part (no validation). The parts have no prototype, so
 * a key named "__proto__" stays an ordinary (unknown, refused) field instead of becoming the parts' prototype.
 */
export function splitRow(row: Record<string, unknown>): { meta: Record<string, unknown>; fields: Record<string, unknown> } {
  const meta = Object.create(null) as Record<string, unknown>;
  const fields = Object.create(null) as Record<string, unknown>;
  for (const [k, val] of Object.entries(row)) {
    if ((META_KEYS as readonly string[]).includes(k)) meta[k] = val;
    else fields[k] = val;
  }
  return { meta, fields };
}

/** Issues of a whole row (meta + fields) as found in a backup, [] when valid. */
export function rowIssues(table: EntityTable, row: unknown, prefix: string): Issue[] {
  if (typeof row !== 'object' || row === null || Array.isArray(row)) return [{ path: prefix, message: 'must be an object' }];
  const bad = forbiddenKey(row);
  if (bad !== null) return [{ path: prefix, message: forbiddenKeyMessage(bad) }];
  const { meta, fields } = splitRow(row as Record<string, unknown>);
  const m = v.safeParse(recordMetaSchema, meta);
  const issues = m.success ? [] : toIssues(m.issues, prefix);
  return issues.concat(fieldIssues(table, fields, prefix));
}
