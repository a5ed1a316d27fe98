/**
 * Import sites from CSV or GeoJSON in two steps: previewSiteImport reads and checks everything and writes
 * nothing; commitSiteImport writes every accepted site in one transaction, or none.
 *
 * CSV: header row required; columns matched case-insensitively. Required: code, latitude, longitude, height_m
 * (aliases: latitude_deg/lat, longitude_deg/lon/lng, height_ell_m; heights are ellipsoidal metres). Optional:
 * name, notes, position_accuracy_m, reference_frame (default WGS84), frame_epoch. Glintmark's own bookkeeping
 * columns (site_id, updated_at_utc, position_source, demo, rev) are ignored; any other non-empty column is
 * appended to the notes as "column: value". GeoJSON (RFC 7946): a FeatureCollection (or one Feature) of Point
 * features; height from the third coordinate or a height_ell_m/height_m property; properties as for CSV.
 * Longitudes in [180, 360] are wrapped to [-180, 180). Imported sites get positionSource 'imported' and new ids.
 * Text is kept as plain strings: the UI must show it as text, never as HTML.
 */
import type { GlintmarkDb } from '../db.ts';
import { geoJsonCrsProblem } from './geojson.ts';
import { siteRepo } from '../repo/sites.ts';
import { WRITE_SCOPE } from '../repo/entity.ts';
import type { WriteContext } from '../repo/context.ts';
import { fieldIssues } from '../schema/validate.ts';
import type { SiteFields, SiteRecord } from '../types.ts';
import { CsvSyntaxError, parseCsv, unprotectCsvCell } from '../../core/text/csv.ts';

export type SiteImportKind = 'csv' | 'geojson';

/** A site ready to be written, with where it came from (CSV line number, or GeoJSON feature index from 0). */
export interface SiteDraft {
  row: number;
  fields: SiteFields;
}

/** `row` is the CSV line number (1 = header) or the GeoJSON feature index; 0 means the whole file. */
export interface ImportRejection {
  row: number;
  reason: string;
}

export interface SiteImportPreview {
  kind: SiteImportKind;
  accepted: SiteDraft[];
  rejected: ImportRejection[];
}

const COLUMNS = {
  code: ['code', 'site_code'],
  name: ['name', 'site_name'],
  lat: ['latitude', 'latitude_deg', 'lat', 'lat_deg'],
  lon: ['longitude', 'longitude_deg', 'lon', 'lng', 'lon_deg'],
  height: ['height_m', 'height_ell_m'],
  accuracy: ['position_accuracy_m', 'accuracy_m'],
  frame: ['reference_frame'],
  epoch: ['frame_epoch', 'frame_epoch_year'],
  notes: ['notes'],
} as const;
type Column = keyof typeof COLUMNS;
const REQUIRED: Column[] = ['code', 'lat', 'lon', 'height'];
const IGNORED = new Set(['site_id', 'updated_at_utc', 'position_source', 'demo', 'rev']);
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Raw values of one candidate, as text or numbers, before checking. */
type Raw = Partial<Record<Column, unknown>> & { extras: [string, string][] };

function num(label: string, v: unknown, required: boolean): number | null | string {
  if (v === undefined || v === null || v === '') return required ? `${label} is empty` : null;
  if (typeof v === 'number') return v;
  const s = String(v).trim();
  if (!NUMBER.test(s)) return `${label} ${JSON.stringify(s)} is not a number${s.includes(',') ? ' (use a dot as the decimal separator)' : ''}`;
  return Number(s);
}

/** Fields of one candidate, or the reason it is refused. */
function toFields(raw: Raw): SiteFields | string {
  const lat = num('latitude', raw.lat, true);
  const lon0 = num('longitude', raw.lon, true);
  const height = num('height', raw.height, true);
  const accuracy = num('position accuracy', raw.accuracy, false);
  const epoch = num('frame epoch', raw.epoch, false);
  for (const x of [lat, lon0, height, accuracy, epoch]) if (typeof x === 'string') return x;
  const lon = typeof lon0 === 'number' && lon0 >= 180 && lon0 <= 360 ? lon0 - 360 : lon0;
  const text = (v: unknown) => (v === undefined || v === null ? '' : String(v).trim());
  const extra = raw.extras.map(([k, v]) => `${k}: ${v}`).join('\n');
  const notes = [text(raw.notes), extra].filter((s) => s !== '').join('\n');
  const fields = {
    code: text(raw.code),
    name: text(raw.name),
    latDeg: lat as number,
    lonDeg: lon as number,
    heightEllM: height as number,
    positionSource: 'imported',
    positionAccuracyM: accuracy as number | null,
    referenceFrame: text(raw.frame) || 'WGS84',
    frameEpoch: epoch as number | null,
    notes,
    demo: false,
  } satisfies SiteFields;
  const issues = fieldIssues('sites', fields);
  return issues.length ? issues.map((i) => i.message).join('; ') : fields;
}

interface Parsed {
  candidates: { row: number; raw: Raw }[];
  rejected: ImportRejection[];
}

function parseCsvSites(text: string): Parsed {
  const t = text.trimStart();
  if (t.startsWith('{') || t.startsWith('[')) return { candidates: [], rejected: [{ row: 0, reason: 'not a CSV file: it looks like JSON (import it as GeoJSON)' }] };
  if (text.includes('\u0000')) return { candidates: [], rejected: [{ row: 0, reason: 'not a CSV file: it is not text' }] };
  let records;
  try {
    records = parseCsv(text);
  } catch (e) {
    if (e instanceof CsvSyntaxError) return { candidates: [], rejected: [{ row: e.line, reason: `not a valid CSV file: ${e.message}` }] };
    throw e;
  }
  if (records.length === 0) return { candidates: [], rejected: [{ row: 0, reason: 'the file is empty' }] };
  const [header, ...rows] = records;
  const names = header.fields.map((h) => h.trim().toLowerCase());
  const index = {} as Record<Column, number>;
  for (const c of Object.keys(COLUMNS) as Column[]) index[c] = names.findIndex((n) => (COLUMNS[c] as readonly string[]).includes(n));
  const missing = REQUIRED.filter((c) => index[c] < 0);
  if (missing.length) {
    const list = missing.map((c) => `"${COLUMNS[c][0]}"`).join(', ');
    return { candidates: [], rejected: [{ row: header.line, reason: `missing column ${list}; the header must name code, latitude, longitude and height_m` }] };
  }
  const known = new Set(Object.values(index).filter((i) => i >= 0));
  const candidates: Parsed['candidates'] = [];
  const rejected: ImportRejection[] = [];
  for (const r of rows) {
    if (r.fields.length !== names.length) {
      rejected.push({ row: r.line, reason: `has ${r.fields.length} fields but the header has ${names.length}` });
      continue;
    }
    const raw: Raw = { extras: [] };
    // Cells our export protected against spreadsheet formulas ("'=…") are read back as written.
    const cells = r.fields.map(unprotectCsvCell);
    for (const c of Object.keys(COLUMNS) as Column[]) if (index[c] >= 0) raw[c] = cells[index[c]];
    cells.forEach((v, i) => {
      if (!known.has(i) && !IGNORED.has(names[i]) && v.trim() !== '') raw.extras.push([header.fields[i].trim(), v]);
    });
    candidates.push({ row: r.line, raw });
  }
  return { candidates, rejected };
}

/** Properties our own GeoJSON export writes that are not site fields. */
const isExportProperty = (k: string) => IGNORED.has(k) || k.startsWith('installation_') || k === 'height_ell_m' || k === 'height_m';

function parseGeoJsonSites(text: string): Parsed {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return { candidates: [], rejected: [{ row: 0, reason: 'not a GeoJSON file: the text is not JSON' }] };
  }
  const crs = geoJsonCrsProblem(data);
  if (crs) return { candidates: [], rejected: [{ row: 0, reason: crs }] };
  const o = (data ?? {}) as { type?: unknown; features?: unknown };
  const features = o.type === 'FeatureCollection' && Array.isArray(o.features) ? (o.features as unknown[]) : o.type === 'Feature' ? [data] : null;
  if (!features) return { candidates: [], rejected: [{ row: 0, reason: `not a GeoJSON FeatureCollection (its type is ${JSON.stringify(o.type ?? null)})` }] };
  const candidates: Parsed['candidates'] = [];
  const rejected: ImportRejection[] = [];
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
    const height = coords[2] ?? props.height_ell_m ?? props.height_m;
    if (height === undefined) return rejected.push({ row, reason: 'no height: add a third coordinate or a height_ell_m property' });
    const raw: Raw = { code: props.code, name: props.name, lat: coords[1], lon: coords[0], height, accuracy: props.position_accuracy_m, frame: props.reference_frame, epoch: props.frame_epoch_year ?? props.frame_epoch, notes: props.notes, extras: [] };
    for (const [k, v] of Object.entries(props)) {
      const used = ['code', 'name', 'notes', 'position_accuracy_m', 'reference_frame', 'frame_epoch_year', 'frame_epoch'].includes(k);
      if (!used && !isExportProperty(k) && v !== null && v !== '') raw.extras.push([k, typeof v === 'string' ? v : JSON.stringify(v)]);
    }
    candidates.push({ row, raw });
  });
  return { candidates, rejected };
}

/** Read and check an import; writes nothing. Duplicate codes (in the file or among live sites) are rejected. */
export async function previewSiteImport(db: GlintmarkDb, text: string, kind: SiteImportKind): Promise<SiteImportPreview> {
  const parsed = kind === 'csv' ? parseCsvSites(text) : parseGeoJsonSites(text);
  const rejected = [...parsed.rejected];
  const accepted: SiteDraft[] = [];
  const liveCodes = new Set((await db.sites.filter((s) => s.deletedAtMs === null).toArray()).map((s) => s.code.toLowerCase()));
  const seen = new Map<string, number>();
  const where = (row: number) => (kind === 'csv' ? `line ${row}` : `feature ${row}`);
  for (const { row, raw } of parsed.candidates) {
    const f = toFields(raw);
    if (typeof f === 'string') {
      rejected.push({ row, reason: f });
      continue;
    }
    const key = f.code.toLowerCase();
    const first = seen.get(key);
    if (first !== undefined) rejected.push({ row, reason: `code ${f.code} repeats the code of ${where(first)}` });
    else if (liveCodes.has(key)) rejected.push({ row, reason: `code ${f.code} is already used by a site on this device` });
    else {
      seen.set(key, row);
      accepted.push({ row, fields: f });
    }
  }
  rejected.sort((a, b) => a.row - b.row);
  return { kind, accepted, rejected };
}

/** Write every accepted site (re-checked) in one transaction; any failure writes nothing. */
export async function commitSiteImport(db: GlintmarkDb, preview: SiteImportPreview, ctx: WriteContext): Promise<SiteRecord[]> {
  return db.transaction('rw', WRITE_SCOPE, async () => {
    const out: SiteRecord[] = [];
    for (const d of preview.accepted) out.push(await siteRepo.create(db, d.fields, ctx));
    return out;
  });
}
