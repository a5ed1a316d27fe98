/**
 * Checks for typed form values, with the same limits and plain messages as the data layer's validation, so a
 * bad value is marked beside its field before any write is tried. Pure.
 */
import { parseIsoUtcMs } from '../../../core/time.ts';
import { requireInRange, type RangeSpec } from '../../../core/validate.ts';
import { parseField } from '../../components/fields.tsx';
import { parseCrew } from './words.ts';

/** Errors by form field; a field without an entry is fine. */
export type FieldErrors<K extends string> = Partial<Record<K, string>>;

/** A checked field: its value when fine, else its error; neither for a field left out of the check. */
export interface Checked<T> {
  value?: T;
  error?: string;
}

/** True when any field has an error. */
export const hasErrors = (errors: FieldErrors<string>): boolean => Object.values(errors).some((e) => e !== undefined);

/** A required number inside a range ("Latitude must be in [-90, 90]°, got 95"). */
export function num(label: string, text: string, spec: RangeSpec): Checked<number> {
  return parseField(label, text, (n, v) => requireInRange(n, v, spec));
}

/** A number of an optional group (apex, fix, re-measurement): checked as `num` when the group is used, else nothing. */
export function groupNum(used: boolean, label: string, text: string, spec: RangeSpec): Checked<number> {
  return used ? num(label, text, spec) : {};
}

/** True when every field of a group is empty (the group is not used). */
export const allBlank = (...texts: string[]): boolean => texts.every((x) => x.trim() === '');

/** The crew names typed on a form (see parseCrew); each at most 80 characters. */
export function crewNames(text: string): { value: string[]; error?: string } {
  const names = parseCrew(text);
  const bad = names.find((c) => c.length > 80);
  return { value: names, error: bad ? `Crew name "${bad.slice(0, 20)}…" is longer than 80 characters` : undefined };
}

/** For draft-shape checks: a stored value is a string. */
export const isStr = (x: unknown): x is string => typeof x === 'string';

/** An optional number: an empty field is null (unknown), anything else must be a number in range. */
export function optNum(label: string, text: string, spec: RangeSpec): { value?: number | null; error?: string } {
  if (text.trim() === '') return { value: null };
  return num(label, text, spec);
}

const LINE_BREAK_OR_CONTROL = /[\u0000-\u001F\u007F]/;
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

/** One line of text (codes, names, labels): trimmed, `min`..`max` characters, no line breaks. */
export function line(label: string, text: string, opts: { min?: number; max: number }): { value?: string; error?: string } {
  const t = text.trim();
  const min = opts.min ?? 0;
  if (t.length < min) return { error: min === 1 ? `${label} is empty` : `${label} needs at least ${min} characters` };
  if (t.length > opts.max) return { error: `${label} must have at most ${opts.max} characters, it has ${t.length}` };
  if (LINE_BREAK_OR_CONTROL.test(t)) return { error: `${label} must be one line` };
  return { value: t };
}

/** Free text (notes, drainage): line breaks allowed, other control characters not. */
export function note(label: string, text: string, max = 20_000): { value?: string; error?: string } {
  if (text.length > max) return { error: `${label} must have at most ${max} characters, it has ${text.length}` };
  if (CONTROL.test(text)) return { error: `${label} contains a control character; retype it` };
  return { value: text };
}

/** A UTC instant typed as ISO 8601 ("2026-06-15T10:00Z"); a missing zone is read as UTC, as the label says. */
export function utcTime(label: string, text: string): { value?: number; error?: string } {
  const t = text.trim().replace(' ', 'T');
  if (t === '') return { error: `${label} is empty` };
  const fixed = /T\d{2}:\d{2}(:\d{2}(\.\d+)?)?$/.test(t) ? `${t}Z` : t;
  try {
    const ms = parseIsoUtcMs(fixed, label, { requireTime: true });
    if (ms < 0) return { error: `${label} must not be before 1970` };
    return { value: Math.round(ms) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}

/** Ranges the data layer enforces, with units as the forms show them. */
export const RANGES = {
  latDeg: { min: -90, max: 90, unit: '°' },
  /** Typed longitudes up to 360° are accepted and wrapped to [−180°, 180°). */
  lonDeg: { min: -180, max: 360, maxInclusive: false, unit: '°' },
  heightEllM: { min: -12000, max: 10000, unit: 'm' },
  accuracyM: { min: 0, max: 1e6, unit: 'm' },
  frameEpoch: { min: 1900, max: 2200, unit: '(decimal year)' },
  azimuthDeg: { min: 0, max: 360, maxInclusive: false, unit: '°' },
  tiltDeg: { min: -90, max: 90, unit: '°' },
  /** Typed rolls of −180° are accepted and stored as +180° (the same rotation). */
  rollDeg: { min: -180, max: 180, unit: '°' },
  declinationDeg: { min: -180, max: 180, unit: '°' },
  lossDb: { min: 0, max: 1000, unit: 'dB' },
  edgeM: { min: 0, max: 20, minInclusive: false, unit: 'm' },
  meshOpeningMm: { min: 0, max: 1000, minInclusive: false, unit: 'mm' },
  apexAboveMarkM: { min: -10, max: 50, unit: 'm' },
  arpOffsetM: { min: -10, max: 10, unit: 'm' },
  frequencyGhz: { min: 0.1, max: 100, unit: 'GHz' },
} satisfies Record<string, RangeSpec>;

/** Longitude into [−180°, 180°). */
export const wrapLonDeg = (lonDeg: number): number => (lonDeg >= 180 ? lonDeg - 360 : lonDeg);
/** Roll into (−180°, 180°]. */
export const wrapRollDeg = (rollDeg: number): number => (rollDeg <= -180 ? rollDeg + 360 : rollDeg);
