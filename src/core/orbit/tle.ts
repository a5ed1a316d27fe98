/**
 * Reading two-line element sets (TLEs) as a field user pastes or downloads them.
 *
 * Accepted: one or many sets, each optionally preceded by a name line (any line not starting with "1 " or "2 ";
 * the "0 NAME" form of three-line element files is accepted too), CRLF or LF line ends, trailing spaces,
 * blank lines anywhere. Each set is checked (tleFields.ts): line length 69, line numbers, matching catalogue
 * numbers, both checksums, and the numeric fields. A bad set is reported with its line and column and skipped;
 * the good sets are kept. A control character inside a line (a TAB, often from a spreadsheet) is such a problem.
 * Format: Hoots & Roehrich, Spacetrack Report No. 3 (1980); Vallado et al. 2006
 * (AIAA 2006-6753).
 */
import { checkTlePair, TLE_LINE_LENGTH, type TleError } from './tleFields.ts';

export { formatTleError, tleChecksum, type TleError } from './tleFields.ts';

/** One checked element set. */
export interface TleSet {
  /** Name from the name line, trimmed ("" when the set had none). */
  name: string;
  /** Catalogue number, columns 3–7 of both lines, trimmed (e.g. "99001"). */
  catalogNumber: string;
  /** The two data lines exactly as checked (69 characters each). */
  line1: string;
  line2: string;
  /** Element-set epoch, ms since 1970-01-01T00:00Z. */
  epochMs: number;
}

export interface TleParseResult {
  sets: TleSet[];
  errors: TleError[];
}

/** A display label for a set: its name, or its catalogue number when it has none. */
export const tleLabel = (set: TleSet): string => set.name || set.catalogNumber;

const isLine1 = (s: string) => s.startsWith('1 ');
const isLine2 = (s: string) => s.startsWith('2 ');
/** A data line with a wrong line number ("3 99001 …"): a digit, a space, and about a TLE line's length. */
const looksLikeDataLine = (s: string) => /^\d /.test(s) && s.length >= TLE_LINE_LENGTH - 9 && !s.startsWith('0 ');

const shorten = (s: string) => (s.length > 24 ? `${s.slice(0, 24)}…` : s);

interface NumberedLine {
  text: string;
  lineNumber: number;
}

/**
 * Parse TLE text. Never throws on content: every problem becomes a TleError and parsing continues
 * with the next set. Throws TypeError only when `text` is not a string.
 */
export function parseTle(text: string): TleParseResult {
  if (typeof text !== 'string') throw new TypeError(`TLE text must be a string, got ${typeof text}`);
  const lines: NumberedLine[] = text
    .split(/\r\n|\r|\n/)
    .map((raw, i) => ({ text: raw.replace(/\s+$/, ''), lineNumber: i + 1 }))
    .filter((l) => l.text.trim() !== '');
  const sets: TleSet[] = [];
  const errors: TleError[] = [];
  const fail = (l: NumberedLine, column: number, message: string) => errors.push({ lineNumber: l.lineNumber, column, message });

  let name: NumberedLine | null = null;
  let i = 0;
  while (i < lines.length) {
    const l = lines[i];
    if (isLine1(l.text)) {
      const next = lines[i + 1];
      if (!next || isLine1(next.text) || (!isLine2(next.text) && !looksLikeDataLine(next.text))) {
        fail(l, 1, `line 1 of the element set has no line 2 after it — the set is incomplete`);
        name = null;
        i += 1;
        continue;
      }
      // A control character (a TAB from a spreadsheet or word processor) is refused here, with its place, so the
      // set is reported and skipped instead of reaching the store, which would refuse the whole paste.
      const control = [
        name ? controlProblem(name, 'the name line') : null,
        controlProblem(l, 'line 1 of the element set'),
        controlProblem(next, 'line 2 of the element set'),
      ].filter((e): e is TleError => e !== null);
      if (control.length) {
        errors.push(...control);
        name = null;
        i += 2;
        continue;
      }
      const checked = checkTlePair(l.text, l.lineNumber, next.text, next.lineNumber);
      if (checked.ok) {
        sets.push({
          name: name ? nameFrom(name.text) : '',
          catalogNumber: checked.value.catalogNumber,
          line1: l.text,
          line2: next.text,
          epochMs: checked.value.epochMs,
        });
      } else {
        errors.push(checked.error);
      }
      name = null;
      i += 2;
      continue;
    }
    if (isLine2(l.text) || looksLikeDataLine(l.text)) {
      fail(l, 1, `"${shorten(l.text)}" is a data line with no line 1 before it — a line is missing or out of order`);
      name = null;
      i += 1;
      continue;
    }
    if (name) fail(name, 1, `"${shorten(name.text)}" is not part of an element set (a name line must be followed by line 1)`);
    name = l;
    i += 1;
  }
  if (name) fail(name, 1, `"${shorten(name.text)}" is not followed by an element set (expected a line starting with "1 ")`);
  errors.sort((a, b) => a.lineNumber - b.lineNumber);
  return { sets, errors };
}

const CONTROL = /[\u0000-\u001F\u007F]/;
const CONTROL_NAMES: Record<string, string> = { '\t': 'a tab', '\u0000': 'a NUL character', '\u007F': 'a DEL character' };

/** A TleError for the first control character in a line (trailing white space is already trimmed), or null. */
function controlProblem(l: NumberedLine, what: string): TleError | null {
  const m = CONTROL.exec(l.text);
  if (!m) return null;
  const c = m[0];
  const which = CONTROL_NAMES[c] ?? `a control character (code ${c.charCodeAt(0)})`;
  return { lineNumber: l.lineNumber, column: m.index + 1, message: `${what} has ${which} at column ${m.index + 1}; element lines use spaces only — copy the set again from its source as plain text` };
}

/** Name from a name line: "0 NAME" → "NAME"; otherwise the trimmed line. */
function nameFrom(line: string): string {
  const t = line.trim();
  return t.startsWith('0 ') ? t.slice(2).trim() : t;
}

/** Days beyond which an element set is called stale (common practice, no source: SGP4 errors grow ~1–3 km/day). */
export const TLE_MAX_AGE_DAYS = 14;

/**
 * A warning when the set's epoch lies more than TLE_MAX_AGE_DAYS from the planning window
 * [windowStartMs, windowEndMs], else null. Pass times drift by seconds, incidence by tenths of a degree.
 */
export function tleAgeWarning(set: TleSet, windowStartMs: number, windowEndMs: number): string | null {
  if (!Number.isFinite(windowStartMs) || !Number.isFinite(windowEndMs) || windowEndMs < windowStartMs) {
    throw new RangeError(`window must have finite start ≤ end, got ${windowStartMs}..${windowEndMs}`);
  }
  const dayMs = 86_400_000;
  const before = (windowStartMs - set.epochMs) / dayMs;
  const after = (set.epochMs - windowEndMs) / dayMs;
  const epoch = new Date(set.epochMs).toISOString().slice(0, 16) + 'Z';
  const who = tleLabel(set);
  if (before > TLE_MAX_AGE_DAYS) {
    return `${who}: elements are from ${epoch}, ${before.toFixed(1)} days before the planning window — pass times may be off by seconds or more; get fresh elements`;
  }
  if (after > TLE_MAX_AGE_DAYS) {
    return `${who}: elements are from ${epoch}, ${after.toFixed(1)} days after the planning window — predictions backwards that far are unreliable; use elements from near the window`;
  }
  return null;
}
