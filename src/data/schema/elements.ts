/**
 * Validation of stored orbital element sets (table `elements`, schema version 4). Beyond the field types, the two
 * data lines must still parse as one clean element set (checksums, line numbers, fields: core/orbit/tle.ts) whose
 * catalogue number and epoch are the ones stored beside them, so a damaged or hand-edited row is refused.
 */
import * as v from 'valibot';
import { formatTleError, parseTle } from '../../core/orbit/tle.ts';
import type { Issue } from '../errors.ts';
import type { ElementSetFields } from '../types.ts';
import { bool, lineText, timeMs, toIssues } from './fields.ts';
import { recordMetaSchema } from './records.ts';

/** Length of a two-line element data line (Hoots & Roehrich, Spacetrack Report No. 3, 1980). */
const TLE_LINE_CHARS = 69;

const dataLine = (label: string) => lineText(label, { min: TLE_LINE_CHARS, max: TLE_LINE_CHARS });

const fieldEntries = {
  catalogNumber: lineText('catalogue number', { min: 1, max: 9 }),
  name: lineText('satellite name', { max: 80 }),
  line1: dataLine('element line 1'),
  line2: dataLine('element line 2'),
  epochMs: timeMs('elements epoch'),
  addedAtMs: timeMs('time added'),
  demo: bool('demo'),
};

/** The problem with the data lines as a set, or null when they parse to this catalogue number and epoch. */
export function elementLinesProblem(f: Pick<ElementSetFields, 'catalogNumber' | 'line1' | 'line2' | 'epochMs'>): string | null {
  const parsed = parseTle(`${f.line1}\n${f.line2}`);
  if (parsed.errors.length > 0) return `the element lines are not a valid set: ${formatTleError(parsed.errors[0])}`;
  const set = parsed.sets[0];
  if (!set) return 'the element lines are not a valid set';
  if (set.catalogNumber !== f.catalogNumber) return `the element lines are for catalogue number ${set.catalogNumber}, not ${f.catalogNumber}`;
  if (set.epochMs !== f.epochMs) return `the stored epoch ${f.epochMs} differs from the epoch in line 1 (${set.epochMs})`;
  return null;
}

/** Whole-object check (runs only when every field has the right type). */
const linesCheck = <T extends ElementSetFields>() =>
  v.check<T, (i: v.CheckIssue<T>) => string>(
    (x) => elementLinesProblem(x) === null,
    (i) => elementLinesProblem(i.input) ?? 'the element lines are not a valid set',
  );

export const elementSetFieldsSchema = v.pipe(v.strictObject(fieldEntries), linesCheck());

/** A whole stored row (RecordMeta + fields), as found in backups. */
export const elementSetRowSchema = v.pipe(v.strictObject({ ...recordMetaSchema.entries, ...fieldEntries }), linesCheck());

/** Issues of one backup row, [] when valid; paths start with `prefix` (e.g. "elements[2] (99001)"). */
export function elementRowIssues(row: unknown, prefix: string): Issue[] {
  const r = v.safeParse(elementSetRowSchema, row);
  return r.success ? [] : toIssues(r.issues, prefix);
}
