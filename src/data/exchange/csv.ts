/**
 * CSV as in RFC 4180 ("Common Format and MIME Type for Comma-Separated Values (CSV) Files", Shafranovich, 2005):
 * records end in CRLF; a field containing a comma, a double quote, CR or LF is enclosed in double quotes and
 * its quotes are doubled; the first record is a header. The reader also accepts bare LF line ends and a
 * leading byte-order mark, as spreadsheet programs write them.
 */

export type CsvValue = string | number | boolean | null | undefined;

const NEEDS_QUOTES = /[",\r\n]/;

/** One field: numbers in JavaScript's shortest round-trip form, null/undefined as an empty field. */
export function csvField(v: CsvValue): string {
  if (v === null || v === undefined) return '';
  const s = typeof v === 'string' ? v : String(v);
  return NEEDS_QUOTES.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Header plus rows, every record (the last one too) ended by CRLF. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvValue[])[]): string {
  const lines = [header.map(csvField).join(',')];
  for (const r of rows) lines.push(r.map(csvField).join(','));
  return lines.join('\r\n') + '\r\n';
}

export interface CsvRecord {
  /** 1-based line on which the record starts (a quoted field may span lines). */
  line: number;
  fields: string[];
}

export class CsvSyntaxError extends Error {
  override readonly name = 'CsvSyntaxError';
  constructor(
    readonly line: number,
    message: string,
  ) {
    super(`line ${line}: ${message}`);
  }
}

/** Records of a CSV text, blank lines skipped. Throws CsvSyntaxError for an unclosed or misplaced quote. */
export function parseCsv(text: string): CsvRecord[] {
  const s = text.startsWith('\uFEFF') ? text.slice(1) : text;
  const out: CsvRecord[] = [];
  let fields: string[] = [];
  let field = '';
  let line = 1;
  let start = 1;
  let i = 0;
  let quotedField = false;
  const endRecord = () => {
    fields.push(field);
    if (!(fields.length === 1 && fields[0] === '' && !quotedField)) out.push({ line: start, fields });
    fields = [];
    field = '';
    quotedField = false;
  };
  while (i < s.length) {
    const c = s[i];
    if (c === '"' && field === '' && !quotedField) {
      quotedField = true;
      const quoteLine = line;
      i++;
      for (;;) {
        if (i >= s.length) throw new CsvSyntaxError(quoteLine, 'a quoted field is never closed');
        const q = s[i];
        if (q === '"') {
          if (s[i + 1] === '"') {
            field += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        if (q === '\n') line++;
        field += q;
        i++;
      }
      if (i < s.length && s[i] !== ',' && s[i] !== '\r' && s[i] !== '\n') throw new CsvSyntaxError(line, 'text after a closing quote');
      continue;
    }
    if (c === '"') throw new CsvSyntaxError(line, 'a double quote inside an unquoted field (enclose the field in quotes and double the quote)');
    if (c === ',') {
      fields.push(field);
      field = '';
      quotedField = false;
      i++;
    } else if (c === '\r' || c === '\n') {
      endRecord();
      i += c === '\r' && s[i + 1] === '\n' ? 2 : 1;
      line++;
      start = line;
    } else {
      field += c;
      i++;
    }
  }
  if (field !== '' || fields.length > 0 || quotedField) endRecord();
  return out;
}

/** An instant as ISO 8601 UTC with milliseconds and Z, or null. */
export const isoUtc = (ms: number | null | undefined): string | null => (ms === null || ms === undefined ? null : new Date(ms).toISOString());
