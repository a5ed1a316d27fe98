/**
 * Valibot building blocks with plain-language messages ("latitude must be between -90 and 90 degrees, got 95").
 * Every number is checked finite (valibot's number() already refuses NaN); ranges say their unit.
 */
import * as v from 'valibot';
import type { Issue } from '../errors.ts';
import { RECORD_BOUNDS, boundsText, type Bounds } from './ranges.ts';

const shown = (x: unknown): string => {
  if (typeof x === 'string') return JSON.stringify(x.length > 40 ? x.slice(0, 40) + '…' : x);
  if (typeof x === 'number') return String(x);
  if (x === null) return 'null';
  if (x === undefined) return 'nothing';
  return Array.isArray(x) ? 'a list' : typeof x === 'object' ? 'an object' : String(x);
};

export function finiteNumber(label: string) {
  return v.pipe(
    v.number((i) => `${label} must be a number, got ${shown(i.input)}`),
    v.finite((i) => `${label} must be a finite number, got ${String(i.input)}`),
  );
}


/** A finite number inside a stated interval; the message names the interval with brackets and unit. */
export function rangeNumber(label: string, b: Bounds) {
  const text = boundsText(b);
  const msg = (i: { input: unknown }) => `${label} must be in ${text}, got ${String(i.input)}`;
  return v.pipe(
    finiteNumber(label),
    b.minOpen ? v.gtValue(b.min, msg) : v.minValue(b.min, msg),
    b.maxOpen ? v.ltValue(b.max, msg) : v.maxValue(b.max, msg),
  );
}

export function positiveNumber(label: string, unit: string) {
  return v.pipe(
    finiteNumber(label),
    v.gtValue(0, (i) => `${label} must be greater than 0 ${unit}, got ${String(i.input)}`),
  );
}

export function nonNegativeNumber(label: string, unit: string) {
  return v.pipe(
    finiteNumber(label),
    v.minValue(0, (i) => `${label} must be 0 ${unit} or more, got ${String(i.input)}`),
  );
}

export const latDeg = (label = 'latitude') => rangeNumber(label, RECORD_BOUNDS.latDeg);
export const lonDeg = (label = 'longitude') => rangeNumber(label, RECORD_BOUNDS.lonDeg);
/** Ellipsoidal heights between the deepest ocean trench and above the highest summit. */
export const heightEllM = (label = 'ellipsoidal height') => rangeNumber(label, RECORD_BOUNDS.heightEllM);
export const azimuthDeg = (label: string) => rangeNumber(label, { min: 0, max: 360, maxOpen: true, unit: 'degrees' });
export const tiltDeg = (label: string) => rangeNumber(label, { min: -90, max: 90, unit: 'degrees' });
export const rollDeg = (label: string) => rangeNumber(label, { min: -180, max: 180, minOpen: true, unit: 'degrees' });

/** An instant in ms since 1970-01-01T00:00Z: an integer in JavaScript's Date range. */
export function timeMs(label: string) {
  return v.pipe(
    finiteNumber(label),
    v.integer((i) => `${label} must be a whole number of milliseconds, got ${String(i.input)}`),
    v.minValue(0, (i) => `${label} must not be before 1970, got ${String(i.input)}`),
    v.maxValue(8.64e15, (i) => `${label} is beyond the last representable date, got ${String(i.input)}`),
  );
}

export function uuid(label: string) {
  return v.pipe(
    v.string((i) => `${label} must be an id string, got ${shown(i.input)}`),
    v.uuid((i) => `${label} must be a UUID, got ${shown(i.input)}`),
  );
}

// Control characters other than tab/newline/carriage return make exports and screens misbehave.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
const LINE_BREAK_OR_CONTROL = /[\u0000-\u001F\u007F]/;

/** Single-line text (codes, names, labels). */
export function lineText(label: string, opts: { min?: number; max: number }) {
  const min = opts.min ?? 0;
  return v.pipe(
    v.string((i) => `${label} must be text, got ${shown(i.input)}`),
    v.check((s) => s.length >= min, min === 1 ? `${label} must not be empty` : `${label} must have at least ${min} characters`),
    v.maxLength(opts.max, `${label} must have at most ${opts.max} characters`),
    v.check((s) => !LINE_BREAK_OR_CONTROL.test(s), `${label} must be one line without control characters`),
  );
}

/** Multi-line free text (notes). Stored as a plain string; the UI must render it as text, never as HTML. */
export function noteText(label: string, max = 20_000) {
  return v.pipe(
    v.string((i) => `${label} must be text, got ${shown(i.input)}`),
    v.maxLength(max, `${label} must have at most ${max} characters`),
    v.check((s) => !CONTROL.test(s), `${label} must not contain control characters`),
  );
}

export function bool(label: string) {
  return v.boolean((i) => `${label} must be true or false, got ${shown(i.input)}`);
}

export function oneOf<const T extends readonly string[]>(label: string, options: T) {
  return v.picklist(options, (i) => `${label} must be one of ${options.join(', ')}, got ${shown(i.input)}`);
}

export function listOf<TItem extends v.GenericSchema>(label: string, item: TItem, max = 1000) {
  return v.pipe(
    v.array(item, (i) => `${label} must be a list, got ${shown(i.input)}`),
    v.maxLength(max, `${label} must have at most ${max} entries`),
  );
}

/** Turn valibot issues into plain Issues ("path: message"); structural issues get plain wording too. */
export function toIssues(issues: readonly v.BaseIssue<unknown>[], prefix = ''): Issue[] {
  return issues.map((i) => {
    const dot = v.getDotPath(i) ?? '';
    const path = prefix && dot ? `${prefix}.${dot}` : prefix || dot;
    let message = i.message;
    if (i.type === 'strict_object' && i.kind === 'schema' && i.path) message = 'is not a known field';
    else if (i.type === 'object' || i.type === 'strict_object') {
      message = i.input === undefined ? 'is required' : `must be an object, got ${shown(i.input)}`;
    }
    return { path, message };
  });
}
