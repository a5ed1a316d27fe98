/**
 * The one site-file reader shared by the app's import (siteImport.ts) and the planner (`plan --sites`): CSV or
 * GeoJSON text → checked SiteFields, one row at a time, with the reason for every row refused. Pure: no database.
 *
 * **Site CSV header set** (column names matched ignoring case and surrounding spaces; SITE_FILE_COLUMNS):
 *
 * | column | meaning | also accepted (older spellings) |
 * |---|---|---|
 * | `code` (required) | short unique site code | `site_code` |
 * | `latitude` (required) | degrees, WGS84, north positive | `latitude_deg`, `lat`, `lat_deg` |
 * | `longitude` (required) | degrees, WGS84, east positive; [180, 360] is wrapped | `longitude_deg`, `lon`, `lng`, `lon_deg` |
 * | `height_m` (required column; a cell may be empty = unknown, to be surveyed) | metres above the WGS84 ellipsoid | `height_ell_m` |
 * | `name` | site name | `site_name` |
 * | `height_msl_m` | metres above mean sea level, when only that is known | |
 * | `position_accuracy_m` | horizontal accuracy, m | `accuracy_m` |
 * | `reference_frame` | e.g. ITRF2020 (default WGS84) | |
 * | `frame_epoch` | decimal year | `frame_epoch_year` |
 * | `notes` | free text | |
 *
 * The app's own bookkeeping columns (`site_id`, `updated_at_utc`, `position_source`, `demo`, `rev`) and the
 * per-geometry columns of the planner's `plan` output are ignored; any other non-empty column is kept in the notes as
 * "column: value". So the planner's minimal `code,latitude,longitude,height_m`, the app's sites export and the
 * planner's `plan` output (one row per site and geometry: exact repeats are read once) are all site files.
 *
 * **Files an office already has.** A byte-order mark is dropped; CRLF, LF and CR line ends are accepted; the field
 * separator is detected from the header (comma, semicolon or tab). A decimal comma (52,1) is read only where it
 * cannot be mistaken: in a semicolon-separated file (the form spreadsheets write in decimal-comma locales), and in a
 * tab-separated file unless exactly three digits follow the comma (1,234 could be a thousands group). In a
 * comma-separated file a decimal comma is refused, naming the separator found and what to change.
 *
 * **GeoJSON** (RFC 7946): a FeatureCollection (or one Feature) of Point features, coordinates [lon, lat] or
 * [lon, lat, height above the ellipsoid]; properties as the CSV columns (`height_ell_m` / `height_m` when the
 * position has no third coordinate; none at all = height unknown). The properties the app's GeoJSON export adds
 * (installation_*, reflectors, ids, times) are ignored.
 *
 * A CSV cell the app's export protected against spreadsheet formulas ("'=…") is read back as written
 * (unprotectCsvCell).
 */
import { fieldIssues } from '../schema/validate.ts';
import type { SiteFields } from '../types.ts';
import { CsvSyntaxError, SEPARATOR_NAMES, detectCsvSeparator, parseCsv, unprotectCsvCell, type CsvSeparator } from '../../core/text/csv.ts';
import { geoJsonCrsProblem } from './geojson.ts';

export type SiteFileKind = 'csv' | 'geojson';

/** Columns of the site CSV header set, canonical name first, then the older spellings still read. */
export const SITE_FILE_COLUMNS = {
  code: ['code', 'site_code'],
  lat: ['latitude', 'latitude_deg', 'lat', 'lat_deg'],
  lon: ['longitude', 'longitude_deg', 'lon', 'lng', 'lon_deg'],
  height: ['height_m', 'height_ell_m'],
  name: ['name', 'site_name'],
  heightMsl: ['height_msl_m'],
  accuracy: ['position_accuracy_m', 'accuracy_m'],
  frame: ['reference_frame'],
  epoch: ['frame_epoch', 'frame_epoch_year'],
  notes: ['notes'],
} as const;
type Column = keyof typeof SITE_FILE_COLUMNS;
const REQUIRED: readonly Column[] = ['code', 'lat', 'lon', 'height'];
/** The minimal header every reader of site files accepts (the planner's contract). */
export const SITE_FILE_MINIMAL_HEADER = 'code,latitude,longitude,height_m';
/** The app's bookkeeping columns, and the per-geometry columns of the planner's `plan` output: not site fields. */
const IGNORED = new Set([
  'site_id', 'updated_at_utc', 'position_source', 'demo', 'rev',
  'incidence_deg', 'heading_deg', 'look', 'reflector_azimuth_deg', 'boresight_elevation_deg', 'base_tilt_deg', 'roll_deg',
  'peak_rcs_dbsm', 'loss_db', 'predicted_rcs_dbsm', 'satellite', 'direction', 'passes',
]);
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^([+-]?\d+),(\d+)$/;

/** A site read from a file: the CSV line number (header = 1) or the GeoJSON feature index (from 0). */
export interface SiteFileRow {
  row: number;
  fields: SiteFields;
}

/** `row` as in SiteFileRow; 0 means the whole file. */
export interface SiteFileRejection {
  row: number;
  reason: string;
}

export interface SiteFileRead {
  kind: SiteFileKind;
  /** The CSV separator found (null for GeoJSON). */
  separator: CsvSeparator | null;
  sites: SiteFileRow[];
  rejected: SiteFileRejection[];
  /** Later rows that repeat an earlier site exactly (every field the same): read once, not refused. */
  repeats: SiteFileRejection[];
}

/** Raw values of one candidate, as text or numbers, before checking. */
type Raw = Partial<Record<Column, unknown>> & { extras: [string, string][] };

/** How numbers are written in this file. */
interface NumberStyle {
  separator: CsvSeparator | null;
}


function num(label: string, v: unknown, required: boolean, style: NumberStyle): number | null | string {
  if (v === undefined || v === null || v === '') return required ? `${label} is empty` : null;
  if (typeof v === 'number') return v;
  const s = String(v).trim();
  if (s === '') return required ? `${label} is empty` : null;
  if (NUMBER.test(s)) return Number(s);
  const dc = DECIMAL_COMMA.exec(s);
  if (dc && style.separator === ';') return Number(`${dc[1]}.${dc[2]}`);
  if (dc && style.separator === '\t') {
    if (dc[2].length !== 3) return Number(`${dc[1]}.${dc[2]}`);
    return `${label} ${JSON.stringify(s)} is ambiguous: in a tab-separated file it may be a decimal comma or a thousands separator; write it with a dot as the decimal separator`;
  }
  if (dc && style.separator === ',') {
    return `${label} ${JSON.stringify(s)} is not a number: this file separates fields with commas, so decimals must use a dot (${dc[1]}.${dc[2]}); or save the file with semicolons between fields`;
  }
  return `${label} ${JSON.stringify(s)} is not a number${s.includes(',') ? ' (use a dot as the decimal separator, and no thousands separators)' : ''}`;
}

const text = (v: unknown) => (v === undefined || v === null ? '' : String(v).trim());

/** Fields of one candidate (checked by the record schema, as every write is), or the reason it is refused. */
function toFields(raw: Raw, style: NumberStyle): SiteFields | string {
  const lat = num('latitude', raw.lat, true, style);
  const lon0 = num('longitude', raw.lon, true, style);
  const height = num('height', raw.height, false, style);
  const heightMsl = num('height above sea level', raw.heightMsl, false, style);
  const accuracy = num('position accuracy', raw.accuracy, false, style);
  const epoch = num('frame epoch', raw.epoch, false, style);
  for (const x of [lat, lon0, height, heightMsl, accuracy, epoch]) if (typeof x === 'string') return x;
  const lon = typeof lon0 === 'number' && lon0 >= 180 && lon0 <= 360 ? lon0 - 360 : lon0;
  const extra = raw.extras.map(([k, v]) => `${k}: ${v}`).join('\n');
  const notes = [text(raw.notes), extra].filter((s) => s !== '').join('\n');
  const fields: SiteFields = {
    code: text(raw.code),
    name: text(raw.name),
    latDeg: lat as number,
    lonDeg: lon as number,
    heightEllM: height as number | null,
    ...(heightMsl !== null ? { heightMslM: heightMsl as number } : {}),
    positionSource: 'imported',
    positionAccuracyM: accuracy as number | null,
    referenceFrame: text(raw.frame) || 'WGS84',
    frameEpoch: epoch as number | null,
    notes,
    demo: false,
  };
  const issues = fieldIssues('sites', fields);
  return issues.length ? issues.map((i) => i.message).join('; ') : fields;
}

interface Parsed {
  candidates: { row: number; raw: Raw }[];
  rejected: SiteFileRejection[];
  separator: CsvSeparator | null;
}

const whole = (reason: string, separator: CsvSeparator | null = null): Parsed => ({ candidates: [], rejected: [{ row: 0, reason }], separator });
const looksLikeJson = (t: string) => /^\uFEFF?\s*[{[]/.test(t);

function parseCsvSites(input: string): Parsed {
  if (looksLikeJson(input)) return whole('not a CSV file: it looks like JSON (import it as GeoJSON)');
  if (input.includes('\u0000')) return whole('not a CSV file: it is not text');
  const separator = detectCsvSeparator(input);
  const sepName = SEPARATOR_NAMES[separator];
  let records;
  try {
    records = parseCsv(input, { separator });
  } catch (e) {
    if (e instanceof CsvSyntaxError) return { candidates: [], rejected: [{ row: e.line, reason: `not a valid CSV file: ${e.message}` }], separator };
    throw e;
  }
  if (records.length === 0) return whole(`the file is empty; expected a header such as ${SITE_FILE_MINIMAL_HEADER}`, separator);
  const [header, ...rows] = records;
  const names = header.fields.map((h) => h.trim().toLowerCase());
  const index = {} as Record<Column, number>;
  for (const c of Object.keys(SITE_FILE_COLUMNS) as Column[]) index[c] = names.findIndex((n) => (SITE_FILE_COLUMNS[c] as readonly string[]).includes(n));
  const missing = REQUIRED.filter((c) => index[c] < 0);
  if (missing.length) {
    const list = missing.map((c) => SITE_FILE_COLUMNS[c][0]).join(', ');
    const found = names.length === 1 ? `the header has one column (fields separated by ${sepName}s found none): separate the columns with commas, semicolons or tabs` : `the header (fields separated by ${sepName}s) must name ${REQUIRED.map((c) => SITE_FILE_COLUMNS[c][0]).join(', ')}`;
    return { candidates: [], rejected: [{ row: header.line, reason: `missing column ${list}; ${found}` }], separator };
  }
  const known = new Set(Object.values(index).filter((i) => i >= 0));
  const candidates: Parsed['candidates'] = [];
  const rejected: SiteFileRejection[] = [];
  for (const r of rows) {
    if (r.fields.length !== names.length) {
      const hint =
        separator === ',' && r.fields.length > names.length
          ? ' (fields are separated by commas here, so a decimal comma such as 52,1 splits a number in two: use a dot for decimals, or save the file with semicolons between fields)'
          : ` (fields are separated by ${sepName}s)`;
      rejected.push({ row: r.line, reason: `has ${r.fields.length} fields but the header has ${names.length}${hint}` });
      continue;
    }
    const raw: Raw = { extras: [] };
    // Cells the app's export protected against spreadsheet formulas ("'=…") are read back as written.
    const cells = r.fields.map(unprotectCsvCell);
    for (const c of Object.keys(SITE_FILE_COLUMNS) as Column[]) if (index[c] >= 0) raw[c] = cells[index[c]];
    cells.forEach((v, i) => {
      if (!known.has(i) && !IGNORED.has(names[i]) && v.trim() !== '') raw.extras.push([header.fields[i].trim(), v]);
    });
    candidates.push({ row: r.line, raw });
  }
  return { candidates, rejected, separator };
}

/** Properties our own GeoJSON export writes that are not site fields. */
const EXPORT_ONLY = new Set(['reflectors', 'reflector_count', 'height_ell_m', 'height_m', 'height_msl_m']);
const USED = new Set(['code', 'name', 'notes', 'position_accuracy_m', 'reference_frame', 'frame_epoch_year', 'frame_epoch']);
const isExportProperty = (k: string) => IGNORED.has(k) || EXPORT_ONLY.has(k) || k.startsWith('installation_');

function parseGeoJsonSites(input: string): Parsed {
  let data: unknown;
  try {
    data = JSON.parse(input.charCodeAt(0) === 0xfeff ? input.slice(1) : input);
  } catch {
    return whole('not a GeoJSON file: the text is not JSON');
  }
  const crs = geoJsonCrsProblem(data);
  if (crs) return whole(crs);
  const o = (data ?? {}) as { type?: unknown; features?: unknown };
  const features = o.type === 'FeatureCollection' && Array.isArray(o.features) ? (o.features as unknown[]) : o.type === 'Feature' ? [data] : null;
  if (!features) return whole(`not a GeoJSON FeatureCollection (its type is ${JSON.stringify(o.type ?? null)})`);
  const candidates: Parsed['candidates'] = [];
  const rejected: SiteFileRejection[] = [];
  features.forEach((f, row) => {
    const ft = (f ?? {}) as { type?: unknown; geometry?: { type?: unknown; coordinates?: unknown } | null; properties?: unknown };
    const c = ft.geometry?.coordinates;
    const props = (typeof ft.properties === 'object' && ft.properties !== null ? ft.properties : {}) as Record<string, unknown>;
    let reason: string | null = null;
    if (ft.type !== 'Feature') reason = 'is not a GeoJSON Feature';
    else if (ft.geometry?.type !== 'Point') reason = `has no Point geometry (found ${JSON.stringify(ft.geometry?.type ?? null)})`;
    else if (!Array.isArray(c) || c.length < 2 || c.length > 3 || !c.every((x) => typeof x === 'number')) reason = 'Point coordinates must be 2 or 3 numbers [longitude, latitude, height]';
    if (reason) return rejected.push({ row, reason });
    const coords = c as number[];
    const height = coords[2] ?? props.height_ell_m ?? props.height_m ?? null;
    const raw: Raw = {
      code: props.code, name: props.name, lat: coords[1], lon: coords[0], height, heightMsl: props.height_msl_m,
      accuracy: props.position_accuracy_m, frame: props.reference_frame, epoch: props.frame_epoch_year ?? props.frame_epoch, notes: props.notes, extras: [],
    };
    for (const [k, v] of Object.entries(props)) {
      if (!USED.has(k) && !isExportProperty(k) && v !== null && v !== '') raw.extras.push([k, typeof v === 'string' ? v : JSON.stringify(v)]);
    }
    candidates.push({ row, raw });
  });
  return { candidates, rejected, separator: null };
}

/** CSV or GeoJSON, from the text itself (JSON starts with { or [). */
export const siteFileKindOf = (input: string): SiteFileKind => (looksLikeJson(input) ? 'geojson' : 'csv');

/**
 * Read and check a site file. A code repeated in the file is refused on its later rows, unless the row repeats the
 * earlier site exactly (the planner's `plan` output has one row per site and geometry): then it is read once.
 */
export function readSiteFile(input: string, kind: SiteFileKind = siteFileKindOf(input)): SiteFileRead {
  const parsed = kind === 'csv' ? parseCsvSites(input) : parseGeoJsonSites(input);
  const style: NumberStyle = { separator: parsed.separator };
  const rejected = [...parsed.rejected];
  const sites: SiteFileRow[] = [];
  const repeats: SiteFileRejection[] = [];
  const seen = new Map<string, SiteFileRow>();
  const where = (row: number) => (kind === 'csv' ? `line ${row}` : `feature ${row}`);
  for (const { row, raw } of parsed.candidates) {
    const f = toFields(raw, style);
    if (typeof f === 'string') {
      rejected.push({ row, reason: f });
      continue;
    }
    const key = f.code.toLowerCase();
    const first = seen.get(key);
    if (first === undefined) {
      const s = { row, fields: f };
      seen.set(key, s);
      sites.push(s);
    } else if (JSON.stringify({ ...first.fields, code: key }) === JSON.stringify({ ...f, code: key })) {
      repeats.push({ row, reason: `same site as ${where(first.row)} (code ${f.code}, every field the same); read once` });
    } else rejected.push({ row, reason: `code ${f.code} repeats the code of ${where(first.row)}` });
  }
  rejected.sort((a, b) => a.row - b.row);
  return { kind, separator: parsed.separator, sites, rejected, repeats };
}

/**
 * "line 3" / "feature 2" / "whole file" for a rejection. Row 0 is the whole file for CSV; for GeoJSON it is also
 * feature 0, and the file-level reasons (which start "not a ") tell the two apart.
 */
export function siteFileWhere(kind: SiteFileKind, r: SiteFileRejection): string {
  if (kind === 'csv') return r.row === 0 ? 'whole file' : `line ${r.row}`;
  return r.row === 0 && r.reason.startsWith('not a ') ? 'whole file' : `feature ${r.row}`;
}
