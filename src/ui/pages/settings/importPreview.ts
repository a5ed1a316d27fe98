/**
 * The site-import preview as rows to show: every accepted site and every rejected row with its reason, in file
 * order. Values stay plain strings and numbers; the page renders them as text (never as HTML).
 */
import type { SiteFields, SiteImportPreview } from '../../../data/index.ts';
import { fmtNum } from '../../format.ts';

export interface PreviewRow {
  /** Stable React key. */
  key: string;
  /** "line 3" (CSV), "feature 0" (GeoJSON) or "whole file". */
  where: string;
  status: 'accepted' | 'rejected';
  code: string;
  name: string;
  /** "52.41230°, −1.23450°, 61.20 m" for accepted rows; "" for rejected ones. */
  position: string;
  /** Why the row was rejected; "" for accepted rows. */
  reason: string;
}

const signed = (x: number, digits: number) => (x < 0 ? `−${fmtNum(-x, digits)}` : fmtNum(x, digits));
const heightText = (f: SiteFields): string =>
  f.heightEllM !== null ? `${signed(f.heightEllM, 2)} m` : f.heightMslM != null ? `${signed(f.heightMslM, 2)} m above sea level` : 'height unknown';

/**
 * Where a rejection is. Row 0 is the whole file for CSV (lines start at 1); for GeoJSON it is also feature 0, so the
 * file-level reasons ("not a GeoJSON file…", "not a GeoJSON FeatureCollection…") tell the two apart.
 */
function rejectionWhere(kind: SiteImportPreview['kind'], row: number, reason: string): string {
  if (kind === 'csv') return row === 0 ? 'whole file' : `line ${row}`;
  return row === 0 && reason.startsWith('not a ') ? 'whole file' : `feature ${row}`;
}

export function previewRows(p: SiteImportPreview): PreviewRow[] {
  const accepted = p.accepted.map((a, i) => ({
    row: a.row,
    key: `a${i}`,
    where: p.kind === 'csv' ? `line ${a.row}` : `feature ${a.row}`,
    status: 'accepted' as const,
    code: a.fields.code,
    name: a.fields.name,
    position: `${signed(a.fields.latDeg, 5)}°, ${signed(a.fields.lonDeg, 5)}°, ${heightText(a.fields)}`,
    reason: '',
  }));
  const rejected = p.rejected.map((r, i) => ({
    row: r.row,
    key: `r${i}`,
    where: rejectionWhere(p.kind, r.row, r.reason),
    status: 'rejected' as const,
    code: '',
    name: '',
    position: '',
    reason: r.reason,
  }));
  return [...accepted, ...rejected].sort((a, b) => a.row - b.row).map(({ row: _row, ...r }) => r);
}

/** "Import 3 sites" / "Import 1 site". */
export const importButtonLabel = (n: number): string => `Import ${n} site${n === 1 ? '' : 's'}`;

/** One line above the table. */
export function previewSummary(p: SiteImportPreview): string {
  const a = p.accepted.length;
  const r = p.rejected.length;
  const acc = `${a} site${a === 1 ? '' : 's'} can be imported`;
  const rej = r === 0 ? 'nothing was rejected' : `${r} row${r === 1 ? ' was' : 's were'} rejected (reasons below)`;
  return `${acc}; ${rej}. Nothing is saved until you press "${importButtonLabel(a)}".`;
}
