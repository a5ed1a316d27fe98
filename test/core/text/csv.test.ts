import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CsvSyntaxError, formatCsv, parseCsv, toCsv } from '../../../src/core/text/csv.ts';

// Rules from RFC 4180 (Shafranovich 2005), §2 items 1–7.
describe('RFC 4180 CSV', () => {
  it('parses quoted fields with commas, doubled quotes and line breaks, tracking start lines', () => {
    const text = 'code,notes\r\nA1,"has, comma"\r\nA2,"say ""hi"""\r\nA3,"two\nlines"\r\nA4,plain\r\n';
    const r = parseCsv(text);
    expect(r.map((x) => x.fields)).toEqual([
      ['code', 'notes'],
      ['A1', 'has, comma'],
      ['A2', 'say "hi"'],
      ['A3', 'two\nlines'],
      ['A4', 'plain'],
    ]);
    expect(r.map((x) => x.line)).toEqual([1, 2, 3, 4, 6]);
  });
  it('accepts LF-only files, a BOM, empty fields and no final line break', () => {
    expect(parseCsv('\ufeffa,b\n1,\n,2').map((x) => x.fields)).toEqual([['a', 'b'], ['1', ''], ['', '2']]);
  });
  it('skips blank lines', () => {
    expect(parseCsv('a\n\nb\n').map((x) => x.fields)).toEqual([['a'], ['b']]);
  });
  it('rejects an unclosed quote and junk after a closing quote, naming the line', () => {
    expect(() => parseCsv('a,b\n1,"open')).toThrow(CsvSyntaxError);
    expect(() => parseCsv('a,b\n1,"open')).toThrow(/line 2: a quoted field is never closed/);
    expect(() => parseCsv('a\n"x"y\n')).toThrow(/line 2: text after a closing quote/);
  });
  it('round-trips any table of strings (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.array(fc.string({ unit: fc.constantFrom('a', ',', '"', '\n', '\r', ' ', 'é') }), { minLength: 2, maxLength: 4 }), { minLength: 1, maxLength: 6 }),
        (rows) => {
          const back = parseCsv(formatCsv(rows, { protectFormulas: false })).map((r) => r.fields);
          const expected = rows.filter((r) => !(r.length === 1 && r[0] === ''));
          expect(back).toEqual(expected);
        },
      ),
    );
  });
  it('formats with CRLF and quotes only where needed', () => {
    expect(formatCsv([['a', 'b,c', 'd"e', 1.5, null]])).toBe('a,"b,c","d""e",1.5,\r\n');
  });
});

describe('RFC 4180 CSV: more cases', () => {
  it('keeps CR LF inside a quoted field and reports where each record starts', () => {
    const text = 'code,notes\r\nMF-01,"first\r\nsecond"\r\nMF-02,"said ""ok"""\r\n\r\nMF-03,\r\n';
    expect(parseCsv(text)).toEqual([
      { line: 1, fields: ['code', 'notes'] },
      { line: 2, fields: ['MF-01', 'first\r\nsecond'] },
      { line: 4, fields: ['MF-02', 'said "ok"'] },
      { line: 6, fields: ['MF-03', ''] },
    ]);
  });
  it('quotes a bare CR and writes a header with toCsv', () => {
    expect(toCsv(['a', 'b'], [['1', 'cr\rhere']])).toBe('a,b\r\n1,"cr\rhere"\r\n');
  });
});
