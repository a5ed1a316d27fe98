/**
 * Validation of rows that arrive from the team register (src/sync/ pull), with the very schemas a backup file is
 * checked with (one validation for phone, file import and server). Photo rows travel without their bytes and
 * carry `sha256` instead of `dataBase64`.
 */
import * as v from 'valibot';
import { conflictRowSchema, photoRowSchema, revisionRowSchema } from './backup/format.ts';
import type { Issue } from './errors.ts';
import { toIssues } from './schema/fields.ts';
import { elementRowIssues } from './schema/elements.ts';
import { rowIssues } from './schema/validate.ts';
import { ENTITY_TABLES, type EntityTable, type VersionedTable } from './types.ts';

const SHA256_HEX = /^[0-9a-f]{64}$/;

const photoSyncRowSchema = v.strictObject({
  ...v.omit(photoRowSchema, ['dataBase64']).entries,
  sha256: v.pipe(v.string('sha256 must be text'), v.regex(SHA256_HEX, 'sha256 must be 64 lowercase hexadecimal digits')),
});

const schemaIssues = (schema: v.GenericSchema, row: unknown, path: string): Issue[] => {
  const r = v.safeParse(schema, row);
  return r.success ? [] : toIssues(r.issues, path);
};

/** Problems of one record row as sent by the register ([] when valid). */
export function syncRecordIssues(table: VersionedTable, row: unknown, path: string): Issue[] {
  if (table === 'photos') return schemaIssues(photoSyncRowSchema, row, path);
  if ((ENTITY_TABLES as readonly string[]).includes(table)) return rowIssues(table as EntityTable, row, path);
  return [{ path, message: `names an unknown table "${String(table)}"` }];
}

export const syncRevisionIssues = (row: unknown, path: string): Issue[] => schemaIssues(revisionRowSchema, row, path);
export const syncConflictIssues = (row: unknown, path: string): Issue[] => schemaIssues(conflictRowSchema, row, path);
export const syncElementIssues = (row: unknown, path: string): Issue[] => elementRowIssues(row, path);
