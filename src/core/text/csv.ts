/**
 * CSV as RFC 4180 defines it (Shafranovich, "Common Format and MIME Type for Comma-Separated Values (CSV) Files",
 * IETF RFC 4180, 2005, §2): records separated by CRLF (LF and CR accepted on input), fields separated by commas,
 * fields containing a comma, quote, CR or LF enclosed in double quotes, a quote inside a quoted field doubled.
 */

export interface CsvRecord {
  /** 1-based line number in the input where the record starts (for messages a user can act on). */
  line: number;
  fields: string[];
}

export class CsvSyntaxError extends Error {
  override name = 'CsvSyntaxError';
  constructor(
    message: string,
    readonly line: number,
  ) {
    super(message);
  }
}

/** Parse CSV text into records. A byte-order mark is dropped; blank lines are skipped. */
export function parseCsv(text: string): CsvRecord[] {
  const s = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const out: CsvRecord[] = [];
  let fields: string[] = [];
  let field = '';
  let line = 1;
  let recordLine = 1;
  let i = 0;
  let quoted = false;
  let fieldStarted = false;
  const endRecord = () => {
    fields.push(field);
    if (!(fields.length === 1 && fields[0] === '' && !fieldStarted)) out.push({ line: recordLine, fields });
    fields = [];
    field = '';
    fieldStarted = false;
  };
  while (i < s.length) {
    const c = s[i];
    if (quoted) {
      if (c === '"') {
        if (s[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        quoted = false;
        i++;
        const n = s[i];
        if (n !== undefined && n !== ',' && n !== '\n' && n !== '\r') {
          throw new CsvSyntaxError(`line ${line}: text after a closing quote; a quote inside a quoted field must be doubled ("")`, line);
        }
        continue;
      }
      if (c === '\n') line++;
      field += c;
      i++;
      continue;
    }
    if (c === '"') {
      if (field !== '') throw new CsvSyntaxError(`line ${line}: a quote in the middle of an unquoted field; quote the whole field`, line);
      quoted = true;
      fieldStarted = true;
      i++;
    } else if (c === ',') {
      fields.push(field);
      field = '';
      fieldStarted = true;
      i++;
    } else if (c === '\r' || c === '\n') {
      endRecord();
      i += c === '\r' && s[i + 1] === '\n' ? 2 : 1;
      line++;
      recordLine = line;
    } else {
      field += c;
      fieldStarted = true;
      i++;
    }
  }
  if (quoted) throw new CsvSyntaxError(`line ${recordLine}: a quoted field is never closed (the file may be cut short)`, recordLine);
  if (field !== '' || fields.length || fieldStarted) endRecord();
  return out;
}

export type CsvValue = string | number | boolean | null | undefined;

/**
 * Formula cells. A spreadsheet runs a cell that begins with =, +, -, @ (and, after its own trimming, TAB or CR)
 * as a formula; prefixing a single quote makes it text (OWASP, "CSV Injection", owasp.org/www-community/attacks/
 * CSV_Injection). A text cell already beginning with quotes before such a character gets one more quote, so
 * unprotectCsvCell reads every exported text back exactly. Plain numerals ("-1.25", "+3") are left alone: they
 * are numbers in a spreadsheet, not formulas.
 */
const FORMULA_START = /^'*[=+\-@\t\r]/;
const PROTECTED_START = /^'+[=+\-@\t\r]/;
const NUMERAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The text as written to a spreadsheet-safe CSV cell (before RFC 4180 quoting). */
export const protectCsvCell = (s: string): string => (FORMULA_START.test(s) && !NUMERAL.test(s) ? `'${s}` : s);

/** The reverse of protectCsvCell, for importers: one leading quote before =, +, -, @, TAB or CR is dropped. */
export const unprotectCsvCell = (s: string): string => (PROTECTED_START.test(s) ? s.slice(1) : s);

export interface CsvWriteOptions {
  /** Prefix formula-like text cells with a quote (default true; see protectCsvCell). Numbers are never changed. */
  protectFormulas?: boolean;
}

/** Quote a field only when RFC 4180 requires it; numbers in JavaScript's shortest round-trip form, null as empty. */
export function csvField(v: CsvValue, opts: CsvWriteOptions = {}): string {
  if (v === null || v === undefined) return '';
  const raw = String(v);
  const s = typeof v === 'string' && opts.protectFormulas !== false ? protectCsvCell(raw) : raw;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Format rows as RFC 4180 CSV: CRLF line breaks, trailing CRLF; formula-like text cells protected by default. */
export function formatCsv(rows: readonly (readonly CsvValue[])[], opts: CsvWriteOptions = {}): string {
  return rows.map((r) => r.map((v) => csvField(v, opts)).join(',')).join('\r\n') + '\r\n';
}

/** A header row plus data rows, as RFC 4180 CSV. */
export const toCsv = (header: readonly string[], rows: readonly (readonly CsvValue[])[], opts: CsvWriteOptions = {}): string =>
  formatCsv([header, ...rows], opts);
