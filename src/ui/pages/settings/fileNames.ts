/**
 * Names and types of the files the Settings screen writes, and how it tells an import file's kind.
 * Times in names are UTC (`Z`), so files from crews in different time zones sort together.
 */
import type { SiteImportKind } from '../../../data/index.ts';

const pad = (n: number, w = 2) => String(n).padStart(w, '0');

/** "YYYYMMDD-HHMMZ" of an instant (UTC). */
export function utcStamp(atMs: number): string {
  if (!Number.isFinite(atMs)) throw new RangeError(`atMs must be a finite time in ms since 1970, got ${atMs}`);
  const d = new Date(atMs);
  return `${d.getUTCFullYear()}${pad(d.getUTCMonth() + 1)}${pad(d.getUTCDate())}-${pad(d.getUTCHours())}${pad(d.getUTCMinutes())}Z`;
}

/** `glintmark-backup-YYYYMMDD-HHMMZ.glintmark.zip` (a ZIP archive; see src/data/backup/archive.ts) */
export const backupFileName = (atMs: number): string => `glintmark-backup-${utcStamp(atMs)}.glintmark.zip`;

/** What the restore and merge pickers accept: backup archives and the JSON backups of earlier versions. */
export const BACKUP_ACCEPT = '.zip,.json,application/zip,application/json';

export const EXPORT_KINDS = ['sites-geojson', 'sites-csv', 'installations-csv', 'inspections-csv'] as const;
export type ExportKind = (typeof EXPORT_KINDS)[number];

interface ExportFileType {
  /** Word in the file name. */
  stem: string;
  extension: string;
  /** Media type: RFC 7946 §12 for GeoJSON, RFC 4180 §3 for CSV (with its charset parameter). */
  mime: string;
  /** Button text. */
  label: string;
}

export const EXPORT_FILE_TYPES: Readonly<Record<ExportKind, ExportFileType>> = {
  'sites-geojson': { stem: 'sites', extension: 'geojson', mime: 'application/geo+json', label: 'Sites as GeoJSON (map)' },
  'sites-csv': { stem: 'sites', extension: 'csv', mime: 'text/csv;charset=utf-8', label: 'Sites as CSV' },
  'installations-csv': { stem: 'installations', extension: 'csv', mime: 'text/csv;charset=utf-8', label: 'Installations as CSV' },
  'inspections-csv': { stem: 'inspections', extension: 'csv', mime: 'text/csv;charset=utf-8', label: 'Inspections as CSV' },
};

/** `glintmark-<sites|installations|inspections>-YYYYMMDD-HHMMZ.<geojson|csv>` */
export function exportFileName(kind: ExportKind, atMs: number): string {
  const t = EXPORT_FILE_TYPES[kind];
  if (!t) throw new RangeError(`kind must be one of ${EXPORT_KINDS.join(', ')}, got ${String(kind)}`);
  return `glintmark-${t.stem}-${utcStamp(atMs)}.${t.extension}`;
}

/**
 * The kind of a site-import file: by its extension (.csv; .geojson or .json), otherwise by its first
 * character ({ or [ is JSON, anything else is read as CSV; the preview then says what is wrong with it).
 */
export function importKindOf(fileName: string, text: string): SiteImportKind {
  const ext = fileName.toLowerCase().match(/\.([a-z0-9]+)$/)?.[1];
  if (ext === 'csv' || ext === 'txt') return 'csv';
  if (ext === 'geojson' || ext === 'json') return 'geojson';
  const first = text.replace(/^\uFEFF/, '').trimStart()[0];
  return first === '{' || first === '[' ? 'geojson' : 'csv';
}
