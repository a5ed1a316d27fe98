/**
 * Plain data only: a copy of JSON-like input (a parsed backup, a row) made iteratively, so no depth of nesting can
 * overflow the stack, that refuses what a Glintmark file never holds and what would let a row past validation:
 *  - keys named `__proto__`, `constructor` or `prototype` at any depth (JSON.parse makes `"__proto__"` an own
 *    property; copying it with plain assignment would set the copy's prototype, so inherited values would pass
 *    a schema check while the stored row lacks them);
 *  - nesting deeper than MAX_NESTING levels;
 *  - text longer than MAX_TEXT_CHARS (a field may allow more, e.g. photo bytes in base64: `longText`);
 *  - values that are not data (functions, symbols, class instances other than Blob).
 * The copy is built from fresh objects, so later code reads only own, checked values.
 */
import type { Issue } from '../errors.ts';

export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);
/** Deepest nesting below a row: a conflict's revision's change of a reflector's construction is about 6. */
export const MAX_NESTING = 32;
/** Longest text in any field of a row (notes allow 20 000 characters). */
export const MAX_TEXT_CHARS = 100_000;

export interface PlainLimits {
  maxNesting?: number;
  maxTextChars?: number;
  /** A larger text limit for values under this key (e.g. dataBase64), or undefined for the default. */
  longText?: (key: string) => number | undefined;
}

export type PlainResult = { ok: true; value: unknown } | { ok: false; issue: Issue };

const kindOf = (x: unknown): string =>
  typeof x === 'function' ? 'a function' : typeof x === 'symbol' ? 'a symbol' : typeof x === 'bigint' ? 'a big integer' : `an object of type ${Object.prototype.toString.call(x).slice(8, -1)}`;

const isPlainObject = (x: object): boolean => {
  const p = Object.getPrototypeOf(x) as unknown;
  return p === Object.prototype || p === null;
};

/** A problem of one object's keys (a forbidden key), or null. */
export function forbiddenKey(o: object): string | null {
  for (const k of Object.keys(o)) if (FORBIDDEN_KEYS.has(k)) return k;
  return null;
}

export const forbiddenKeyMessage = (key: string): string =>
  `has a field named ${JSON.stringify(key)}, which a Glintmark record never has (the file was altered or is not from Glintmark)`;

/**
 * Copy `input` as plain data, or the first problem found, its path starting with `prefix`
 * (e.g. "sites[0] (MF-01)" → "sites[0] (MF-01).construction: has a field named …").
 */
export function copyPlain(input: unknown, prefix: string, limits: PlainLimits = {}): PlainResult {
  const maxNesting = limits.maxNesting ?? MAX_NESTING;
  const maxText = limits.maxTextChars ?? MAX_TEXT_CHARS;
  const root: { value: unknown } = { value: undefined };
  type Frame = { value: unknown; depth: number; path: string; key: string; put: (v: unknown) => void };
  const stack: Frame[] = [{ value: input, depth: 0, path: prefix, key: '', put: (v) => (root.value = v) }];
  const join = (path: string, key: string) => (path ? `${path}.${key}` : key);
  while (stack.length) {
    const f = stack.pop() as Frame;
    const x = f.value;
    if (x === null || x === undefined || typeof x === 'boolean' || typeof x === 'number') {
      f.put(x);
      continue;
    }
    if (typeof x === 'string') {
      const max = limits.longText?.(f.key) ?? maxText;
      if (x.length > max) return { ok: false, issue: { path: f.path, message: `is a text of ${x.length} characters; this field holds at most ${max}` } };
      f.put(x);
      continue;
    }
    if (typeof x !== 'object') return { ok: false, issue: { path: f.path, message: `is ${kindOf(x)}, not data` } };
    if (typeof Blob !== 'undefined' && x instanceof Blob) {
      f.put(x);
      continue;
    }
    if (f.depth >= maxNesting) {
      return { ok: false, issue: { path: f.path, message: `is nested more than ${maxNesting} levels deep, which a Glintmark record never is (the file is damaged or not from Glintmark)` } };
    }
    if (Array.isArray(x)) {
      const out: unknown[] = new Array<unknown>(x.length);
      f.put(out);
      for (let i = x.length - 1; i >= 0; i--) stack.push({ value: x[i], depth: f.depth + 1, path: `${f.path}[${i}]`, key: f.key, put: (v) => (out[i] = v) });
      continue;
    }
    if (!isPlainObject(x)) return { ok: false, issue: { path: f.path, message: `is ${kindOf(x)}, not data` } };
    const bad = forbiddenKey(x);
    if (bad !== null) return { ok: false, issue: { path: f.path, message: forbiddenKeyMessage(bad) } };
    const out: Record<string, unknown> = {};
    f.put(out);
    const keys = Object.keys(x);
    for (let i = keys.length - 1; i >= 0; i--) {
      const k = keys[i];
      // Safe: k is none of the forbidden keys, so this assignment defines an own property.
      stack.push({ value: (x as Record<string, unknown>)[k], depth: f.depth + 1, path: join(f.path, k), key: k, put: (v) => (out[k] = v) });
    }
  }
  return { ok: true, value: root.value };
}
