/**
 * Field-level checks of one NORAD two-line element set (TLE): line length, line number, catalogue number,
 * modulo-10 checksum and the numeric fields SGP4 needs.
 *
 * Column layout (1-based, inclusive) and the checksum rule: Hoots & Roehrich, "Spacetrack Report No. 3:
 *   Models for Propagation of NORAD Element Sets", 1980 (reprinted 1988), and Vallado, Crawford, Hujsak &
 *   Kelso, "Revisiting Spacetrack Report #3", AIAA 2006-6753, Appendix "TLE format". Checksum: the sum of
 *   all digits in columns 1–68, each '-' counting 1 and every other character 0, modulo 10, in column 69.
 * Two-digit epoch years 57–99 are 1957–1999, 00–56 are 2000–2056 (same sources).
 * Messages are written for a field user: they say which line and column, what was found and the likely cause.
 */

/** Characters in each TLE data line. */
export const TLE_LINE_LENGTH = 69;

/** A problem found in a TLE, located in the user's input. */
export interface TleError {
  /** 1-based line number in the text that was parsed. */
  lineNumber: number;
  /** 1-based column in that line. */
  column: number;
  /** Plain-words description, without the "line N, column C:" prefix (see formatTleError). */
  message: string;
}

/** "line 3, column 69: <message>", the way the CLI and the forms show a TleError. */
export const formatTleError = (e: TleError): string => `line ${e.lineNumber}, column ${e.column}: ${e.message}`;

/** The numbers of a checked set that the rest of the module uses. */
export interface TleNumbers {
  catalogNumber: string;
  epochMs: number;
}

/** Modulo-10 checksum of columns 1–68 (digits count their value, '-' counts 1). */
export function tleChecksum(line: string): number {
  let sum = 0;
  for (const ch of line.slice(0, TLE_LINE_LENGTH - 1)) {
    if (ch >= '0' && ch <= '9') sum += ch.charCodeAt(0) - 48;
    else if (ch === '-') sum += 1;
  }
  return sum % 10;
}

/** 1-based inclusive column range → substring. */
const col = (line: string, from: number, to: number) => line.slice(from - 1, to);

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)$/;
/** Implied-decimal exponent form used for n̈/6 and B*: " 12345-6" means 0.12345e-6. */
const IMPLIED = /^[ +-]?\d{1,5} ?[+-]\d$/;
const CATALOG = /^([A-HJ-NP-Z]\d{4}|[ \d]{4}\d)$/;

interface FieldSpec {
  from: number;
  to: number;
  label: string;
  test: (s: string) => string | null;
}

/** A decimal number, optionally inside [min, max]. Returns a problem description or null. */
function decimal(min?: number, max?: number, unit = '') {
  return (s: string): string | null => {
    const t = s.trim();
    if (!DECIMAL.test(t)) return `"${s}" is not a number`;
    const v = Number(t);
    if (min !== undefined && max !== undefined && !(v >= min && v <= max)) {
      return `${t}${unit} is outside ${min}–${max}${unit}`;
    }
    return null;
  };
}
const implied = (s: string) => (IMPLIED.test(s) ? null : `"${s}" is not in the form ±NNNNN±E`);
const digitsOnly = (s: string) => (/^\d+$/.test(s) ? null : `"${s}" must be digits only`);
const positive = (s: string) => {
  const bad = decimal()(s);
  if (bad) return bad;
  return Number(s) > 0 ? null : `${s.trim()} must be greater than 0`;
};

const LINE1_FIELDS: FieldSpec[] = [
  { from: 19, to: 20, label: 'epoch year', test: digitsOnly },
  { from: 21, to: 32, label: 'epoch day of year', test: decimal(1, 366.99999999) },
  { from: 34, to: 43, label: 'first derivative of mean motion', test: decimal() },
  { from: 45, to: 52, label: 'second derivative of mean motion', test: implied },
  { from: 54, to: 61, label: 'drag term (B*)', test: implied },
];
const LINE2_FIELDS: FieldSpec[] = [
  { from: 9, to: 16, label: 'inclination', test: decimal(0, 180, '°') },
  { from: 18, to: 25, label: 'right ascension of the ascending node', test: decimal(0, 360, '°') },
  { from: 27, to: 33, label: 'eccentricity', test: digitsOnly },
  { from: 35, to: 42, label: 'argument of perigee', test: decimal(0, 360, '°') },
  { from: 44, to: 51, label: 'mean anomaly', test: decimal(0, 360, '°') },
  { from: 53, to: 63, label: 'mean motion (revolutions per day)', test: positive },
];

/** One line's own checks: length, line number, catalogue number, checksum, numeric fields. */
function checkLine(line: string, lineNumber: number, which: 1 | 2): TleError | null {
  const at = (column: number, message: string): TleError => ({ lineNumber, column, message });
  const what = `line ${which} of the element set`;
  if (line[0] !== String(which)) {
    return at(1, `${what} must start with "${which}", found "${line[0]}" — the lines are out of order or one is missing`);
  }
  if (line.length < TLE_LINE_LENGTH) {
    return at(line.length + 1, `${what} has ${line.length} characters but needs ${TLE_LINE_LENGTH} — the line was probably cut short`);
  }
  if (line.length > TLE_LINE_LENGTH) {
    return at(TLE_LINE_LENGTH + 1, `${what} has ${line.length} characters but needs ${TLE_LINE_LENGTH} — there is extra text at the end`);
  }
  if (line[1] !== ' ') return at(2, `column 2 must be a space, found "${line[1]}"`);
  const cat = col(line, 3, 7);
  if (!CATALOG.test(cat)) return at(3, `catalogue number "${cat}" must be 5 digits (or a letter and 4 digits)`);
  const stated = line[TLE_LINE_LENGTH - 1];
  const sum = tleChecksum(line);
  if (!/\d/.test(stated)) return at(TLE_LINE_LENGTH, `the checksum of ${what} must be a digit, found "${stated}" — the line was probably mistyped or cut`);
  if (Number(stated) !== sum) {
    return at(TLE_LINE_LENGTH, `checksum of ${what} is ${stated} but its digits add up to ${sum} — the line was probably mistyped or cut`);
  }
  for (const f of which === 1 ? LINE1_FIELDS : LINE2_FIELDS) {
    const problem = f.test(col(line, f.from, f.to));
    if (problem) return at(f.from, `${f.label}: ${problem}`);
  }
  return null;
}

/** Epoch (ms since 1970 UTC) from the two-digit year (columns 19–20) and day of year (columns 21–32) of line 1. */
export function tleEpochMs(line1: string): number {
  const yy = Number(col(line1, 19, 20));
  const year = yy < 57 ? 2000 + yy : 1900 + yy;
  const day = Number(col(line1, 21, 32));
  return Date.UTC(year, 0, 1) + (day - 1) * 86_400_000;
}

/** Check a pair of lines; returns the first problem found, or the set's catalogue number and epoch. */
export function checkTlePair(
  line1: string,
  line1Number: number,
  line2: string,
  line2Number: number,
): { ok: true; value: TleNumbers } | { ok: false; error: TleError } {
  const e1 = checkLine(line1, line1Number, 1);
  if (e1) return { ok: false, error: e1 };
  const e2 = checkLine(line2, line2Number, 2);
  if (e2) return { ok: false, error: e2 };
  const c1 = col(line1, 3, 7);
  const c2 = col(line2, 3, 7);
  if (c1 !== c2) {
    return {
      ok: false,
      error: {
        lineNumber: line2Number,
        column: 3,
        message: `catalogue number ${c2.trim()} does not match ${c1.trim()} on line ${line1Number} — the two lines belong to different satellites`,
      },
    };
  }
  return { ok: true, value: { catalogNumber: c1.trim(), epochMs: tleEpochMs(line1) } };
}
