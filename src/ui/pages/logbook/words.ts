/**
 * Words and number formats shared by the Logbook screens. Pure: no React, no storage. Every figure shown says its
 * unit; times are shown in UTC (the records store ms since 1970 UTC).
 */
import { AZIMUTH_METHOD_LABELS, siteHeightKind, type AzimuthMethod, type CheckState, type ChecklistItem, type PositionSource, type SiteFields } from '../../../data/index.ts';

/** "61.20 m above the WGS84 ellipsoid" / "58.1 m above sea level (ellipsoidal height not known)" / "unknown, to be surveyed". */
export function siteHeightWords(s: Pick<SiteFields, 'heightEllM' | 'heightMslM'>): string {
  const kind = siteHeightKind(s);
  if (kind === 'ellipsoidal') return `${s.heightEllM!.toFixed(2)} m above the WGS84 ellipsoid`;
  if (kind === 'sea-level') return `${s.heightMslM!.toFixed(2)} m above sea level (ellipsoidal height not known)`;
  return 'unknown, to be surveyed';
}

/** "2026-06-15 10:00 UTC" for an instant in ms since 1970; "—" for none. */
export function fmtUtc(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms)) return '—';
  return `${new Date(ms).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/** "2026-06-15" (UTC date) for an instant; "—" for none. */
export function fmtUtcDate(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms)) return '—';
  return new Date(ms).toISOString().slice(0, 10);
}

/** ISO 8601 UTC to the second, as typed into the time fields: "2026-06-15T10:00:12Z". */
export function isoSecondsUtc(ms: number): string {
  return `${new Date(ms).toISOString().slice(0, 19)}Z`;
}

/** A stored instant as form text without losing milliseconds (so an untouched edit changes nothing). */
export function isoExactUtc(ms: number): string {
  return ms % 1000 === 0 ? isoSecondsUtc(ms) : new Date(ms).toISOString();
}

const DAY_MS = 86_400_000;

/** Last visit for the site list: "never visited", "today", "3 days ago (2026-06-12)". `nowMs` is passed in. */
export function fmtLastVisit(atMs: number | null, nowMs: number): string {
  if (atMs === null) return 'never visited';
  const days = Math.floor((nowMs - atMs) / DAY_MS);
  const date = fmtUtcDate(atMs);
  if (days < 1) return `today (${date})`;
  if (days === 1) return `yesterday (${date})`;
  return `${days} days ago (${date})`;
}

/** "850 m", "12.3 km", "240 km"; "—" without a distance. */
export function fmtDistanceM(m: number | null): string {
  if (m === null || !Number.isFinite(m)) return '—';
  if (m < 1000) return `${Math.round(m)} m`;
  if (m < 100_000) return `${(m / 1000).toFixed(1)} km`;
  return `${Math.round(m / 1000)} km`;
}

export const SORT_OPTIONS = [
  { value: 'lastVisit', label: 'Last visit' },
  { value: 'distance', label: 'Distance from here' },
  { value: 'code', label: 'Code' },
] as const;
export type ListSort = (typeof SORT_OPTIONS)[number]['value'];

export const POSITION_SOURCE_WORDS: Record<PositionSource, string> = {
  'gnss-phone': 'phone GNSS',
  'gnss-survey': 'survey GNSS',
  typed: 'typed',
  imported: 'imported',
};

export const METHOD_WORDS: Record<AzimuthMethod, string> = AZIMUTH_METHOD_LABELS;

export const CHECK_WORDS: Record<CheckState, string> = { ok: '✓ OK', issue: '⚠ Issue', 'not-checked': '– Not checked' };

export const CHECKLIST_LABELS: Record<ChecklistItem, string> = {
  debris: 'Debris in the corner',
  standingWater: 'Standing water',
  snowIce: 'Snow or ice',
  vegetation: 'Vegetation',
  damage: 'Damage to the panels',
  movement: 'Movement of the base',
};

export const PHOTO_ROLE_WORDS: Record<string, string> = {
  boresight: 'Along the boresight',
  north: 'View to the north',
  east: 'View to the east',
  south: 'View to the south',
  west: 'View to the west',
  base: 'Base',
  foundation: 'Foundation',
  other: 'Other',
};

/** Split a typed crew list ("Ann Lee, Bo; Cy") into names: commas or semicolons, blanks dropped. */
export function parseCrew(text: string): string[] {
  return text
    .split(/[,;\n]/)
    .map((s) => s.trim())
    .filter((s) => s !== '');
}

/**
 * Who a write is recorded as in the history: the phone's crew name from Settings, else the first crew member
 * named on the form, else a plain placeholder (the data layer needs a name).
 */
export function writtenBy(settingsCrewName: string, crew: readonly string[] = []): string {
  const name = settingsCrewName.trim() || crew[0] || 'crew (name not set)';
  return name.replace(/[\u0000-\u001F\u007F]/g, ' ').slice(0, 80);
}

/** A photo role in words ("Along the boresight"); unknown roles as stored. */
export const photoRoleLabel = (role: string): string => PHOTO_ROLE_WORDS[role] ?? role;

/** "2 reflectors, 1 installation" for what a site delete takes with it (zero counts left out). */
export function siteChildWords(n: { reflectors: number; geometries: number; installations: number; inspections: number }): string[] {
  const w = (k: number, one: string, many: string) => (k === 0 ? [] : [`${k} ${k === 1 ? one : many}`]);
  return [
    ...w(n.reflectors, 'reflector', 'reflectors'),
    ...w(n.installations, 'installation', 'installations'),
    ...w(n.inspections, 'inspection', 'inspections'),
    ...w(n.geometries, 'planned geometry', 'planned geometries'),
  ];
}
