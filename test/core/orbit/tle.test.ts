import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { formatTleError, parseTle, tleAgeWarning, tleChecksum, type TleSet } from '../../../src/core/orbit/tle.ts';
import { DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';

// The invented demo satellites (src/demo/elements.ts).
const NAME = 'GLINT-A';
const L1 = '1 99001U 26990A   26332.50000000  .00000050  00000-0  10000-4 0  9996';
const L2 = '2 99001  98.1838 333.0000 0001150  90.0000   0.0000 14.59198740    12';
const B1 = '1 99002U 26990B   26332.50000000  .00000050  00000-0  10000-4 0  9997';
const B2 = '2 99002  98.1838 333.0000 0001150  90.0000 180.0000 14.59198740    12';
const EPOCH_MS = Date.UTC(2026, 10, 28, 12); // day 332.5 of 2026 = 28 Nov 12:00 UTC

/** Replace the character at 1-based `column` of a line. */
const put = (line: string, column: number, ch: string) => line.slice(0, column - 1) + ch + line.slice(column);

describe('tleChecksum', () => {
  it('sums digits, counts "-" as 1, ignores everything else (Spacetrack Report No. 3)', () => {
    expect(tleChecksum(L1)).toBe(6);
    expect(tleChecksum(L2)).toBe(2);
    expect(tleChecksum('1 -A.+ 9')).toBe(1 + 1 + 9 - 10);
  });
});

describe('parseTle: accepted forms', () => {
  it('reads a three-line set and its epoch', () => {
    const r = parseTle(DEMO_TLE);
    expect(r.errors).toEqual([]);
    expect(r.sets).toEqual<TleSet[]>([{ name: NAME, catalogNumber: '99001', line1: L1, line2: L2, epochMs: EPOCH_MS }]);
  });

  it('reads a set without a name line', () => {
    const r = parseTle(`${L1}\n${L2}\n`);
    expect(r.errors).toEqual([]);
    expect(r.sets[0].name).toBe('');
    expect(r.sets[0].catalogNumber).toBe('99001');
  });

  it('reads the "0 NAME" form, CRLF, trailing spaces, blank lines and leading/trailing whitespace', () => {
    const text = `\r\n  \r\n0 GLINT-A  \r\n${L1}   \r\n\r\n${L2}\t\r\n\r\n`;
    const r = parseTle(text);
    expect(r.errors).toEqual([]);
    expect(r.sets).toHaveLength(1);
    expect(r.sets[0].name).toBe('GLINT-A');
    expect(r.sets[0].line1).toBe(L1);
  });

  it('reads many sets, named and unnamed, in order', () => {
    const r = parseTle(`${DEMO_TLE}${B1}\n${B2}\n${DEMO_TLE_B}`);
    expect(r.errors).toEqual([]);
    expect(r.sets.map((s) => [s.name, s.catalogNumber])).toEqual([
      ['GLINT-A', '99001'],
      ['', '99002'],
      ['GLINT-B', '99002'],
    ]);
  });

  it('accepts old-style lines with CR only', () => {
    expect(parseTle(`${NAME}\r${L1}\r${L2}`).sets).toHaveLength(1);
  });
});

describe('parseTle: each bad set is reported with line, column and plain words', () => {
  it('wrong checksum', () => {
    const bad = put(L2, 69, '7');
    const r = parseTle(`${NAME}\n${L1}\n${bad}\n`);
    expect(r.sets).toEqual([]);
    expect(r.errors).toHaveLength(1);
    expect(formatTleError(r.errors[0])).toBe('line 3, column 69: checksum of line 2 of the element set is 7 but its digits add up to 2 — the line was probably mistyped or cut');
  });

  it('a mistyped digit is caught by the checksum', () => {
    const bad = put(L2, 14, '3'); // inclination 98.1838 → 98.1338
    const r = parseTle(`${L1}\n${bad}`);
    expect(r.errors[0]).toMatchObject({ lineNumber: 2, column: 69 });
    expect(r.errors[0].message).toMatch(/checksum of line 2 of the element set is 2 but its digits add up to 7/);
  });

  it('truncated line', () => {
    const r = parseTle(`${NAME}\n${L1.slice(0, 60)}\n${L2}`);
    expect(r.sets).toEqual([]);
    expect(r.errors[0]).toMatchObject({ lineNumber: 2, column: 61 });
    expect(r.errors[0].message).toBe('line 1 of the element set has 60 characters but needs 69 — the line was probably cut short');
  });

  it('extra text after column 69', () => {
    const r = parseTle(`${L1}\n${L2}  0.0  1440.0  360.0`);
    expect(r.errors[0]).toMatchObject({ lineNumber: 2, column: 70 });
    expect(r.errors[0].message).toMatch(/needs 69 — there is extra text at the end/);
  });

  it('mismatched catalogue numbers', () => {
    const r = parseTle(`${L1}\n${B2}`);
    expect(r.sets).toEqual([]);
    expect(formatTleError(r.errors[0])).toBe(
      'line 2, column 3: catalogue number 99002 does not match 99001 on line 1 — the two lines belong to different satellites',
    );
  });

  it('wrong line number', () => {
    const three = put(L2, 1, '3');
    const r = parseTle(`${NAME}\n${L1}\n${three}`);
    expect(r.sets).toEqual([]);
    expect(r.errors[0]).toMatchObject({ lineNumber: 3, column: 1 });
    expect(r.errors[0].message).toMatch(/must start with "2", found "3"/);
  });

  it('line 2 before line 1, and a line 1 without its line 2', () => {
    const r = parseTle(`${L2}\n${L1}\n`);
    expect(r.sets).toEqual([]);
    expect(r.errors.map((e) => [e.lineNumber, e.column])).toEqual([[1, 1], [2, 1]]);
    expect(r.errors[0].message).toMatch(/no line 1 before it/);
    expect(r.errors[1].message).toMatch(/no line 2 after it/);
  });

  it('garbage text', () => {
    const r = parseTle('hello, these are\nnot the elements you are looking for\n');
    expect(r.sets).toEqual([]);
    expect(r.errors).toHaveLength(2);
    expect(r.errors[0]).toMatchObject({ lineNumber: 1, column: 1 });
    expect(r.errors[0].message).toMatch(/not part of an element set/);
    expect(r.errors[1].message).toMatch(/not followed by an element set/);
  });

  it('empty text gives no sets and no errors (the caller says "nothing found")', () => {
    expect(parseTle('')).toEqual({ sets: [], errors: [] });
    expect(parseTle(' \n\r\n')).toEqual({ sets: [], errors: [] });
  });

  it('a non-numeric field with a valid checksum', () => {
    // 'X' counts 0 in the checksum, like the '0' it replaces.
    const bad = put(L2, 27, 'X');
    const r = parseTle(`${L1}\n${bad}`);
    expect(formatTleError(r.errors[0])).toBe('line 2, column 27: eccentricity: "X001150" must be digits only');
    const bad2 = put(L2, 15, 'x'); // inclination "98.18x8", checksum recomputed so only the field check can catch it
    const r2 = parseTle(`${L1}\n${bad2.slice(0, 68)}${tleChecksum(bad2)}`);
    expect(r2.errors[0]).toMatchObject({ lineNumber: 2, column: 9 });
    expect(r2.errors[0].message).toBe('inclination: " 98.18x8" is not a number');
  });

  it('a good + bad mix keeps the good sets and reports the bad one', () => {
    const text = `${DEMO_TLE}GLINT-X\n${L1}\n${put(L2, 69, '0')}\n${DEMO_TLE_B}`;
    const r = parseTle(text);
    expect(r.sets.map((s) => s.name)).toEqual(['GLINT-A', 'GLINT-B']);
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({ lineNumber: 6, column: 69 });
  });

  it('never throws on arbitrary text, and every error points inside the input', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.constantFrom(L1, L2, B1, B2, NAME, ''), fc.string({ maxLength: 80 })), { maxLength: 12 }), (lines) => {
        const text = lines.join('\n');
        const r = parseTle(text);
        const n = text.split(/\r\n|\r|\n/).length;
        for (const e of r.errors) {
          expect(e.lineNumber).toBeGreaterThanOrEqual(1);
          expect(e.lineNumber).toBeLessThanOrEqual(n);
          expect(e.column).toBeGreaterThanOrEqual(1);
          expect(e.message.length).toBeGreaterThan(10);
        }
      }),
    );
  });

  it('throws TypeError for a non-string', () => {
    expect(() => parseTle(42 as unknown as string)).toThrow(TypeError);
  });
});

describe('tleAgeWarning', () => {
  const set = parseTle(DEMO_TLE).sets[0];
  const day = 86_400_000;
  it('is silent within 14 days of the window', () => {
    expect(tleAgeWarning(set, EPOCH_MS + 10 * day, EPOCH_MS + 40 * day)).toBeNull();
    expect(tleAgeWarning(set, EPOCH_MS - 40 * day, EPOCH_MS - 13.9 * day)).toBeNull();
  });
  it('warns when the elements are older than 14 days at the window start', () => {
    expect(tleAgeWarning(set, EPOCH_MS + 20 * day, EPOCH_MS + 30 * day)).toMatch(/^GLINT-A: elements are from 2026-11-28T12:00Z, 20\.0 days before/);
  });
  it('warns when the window ends more than 14 days before the epoch', () => {
    expect(tleAgeWarning(set, EPOCH_MS - 30 * day, EPOCH_MS - 15 * day)).toMatch(/15\.0 days after the planning window/);
  });
  it('rejects an inverted window', () => {
    expect(() => tleAgeWarning(set, 2, 1)).toThrow(RangeError);
  });
});
