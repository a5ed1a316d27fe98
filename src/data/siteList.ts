/**
 * The Logbook site list as a pure function: search and sort rows already read from the database, so typing
 * in the search box never queries IndexedDB again (hooks.ts) and the bench times the same code.
 */
import { EARTH_MEAN_RADIUS_M, toRad } from '../core/units.ts';
import type { SiteRecord } from './types.ts';

export type SiteSort = 'code' | 'lastVisit' | 'distance';

export interface Here {
  latDeg: number;
  lonDeg: number;
}

export interface SiteListQuery {
  /** Words that must all appear in the code, name or notes (case and accents ignored). */
  search?: string;
  sort?: SiteSort;
  /** Current position; needed for sort 'distance' (without it the list is sorted by code) and for distanceM. */
  here?: Here | null;
}

/** What the list reads per site: the site, the time of its latest live installation or inspection, and counts. */
export interface SiteListSource {
  site: SiteRecord;
  lastVisitAtMs: number | null;
  installationCount: number;
  inspectionCount: number;
}

export interface SiteListRow extends SiteListSource {
  /** Great-circle distance from `here`, or null without a position. */
  distanceM: number | null;
}

/**
 * Haversine great-circle distance on a sphere of the mean Earth radius R₁ = 6 371 008.8 m:
 *   d = 2R · asin √( sin²(Δφ/2) + cos φ₁ cos φ₂ sin²(Δλ/2) )
 * Source: R. W. Sinnott, "Virtues of the Haversine", Sky & Telescope 68(2):159, 1984.
 * Accuracy: within 0.5 % of the WGS84 geodesic (spherical model), ample for ordering a list;
 * test/data/siteList.test.ts sweeps it against geographiclib-geodesic.
 */
export function haversineDistanceM(a: Here, b: Here): number {
  const dPhi = toRad(b.latDeg - a.latDeg);
  const dLambda = toRad(b.lonDeg - a.lonDeg);
  const h = Math.sin(dPhi / 2) ** 2 + Math.cos(toRad(a.latDeg)) * Math.cos(toRad(b.latDeg)) * Math.sin(dLambda / 2) ** 2;
  return 2 * EARTH_MEAN_RADIUS_M * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** Lower case without accents, so "Fén" matches "fen". */
export function foldForSearch(s: string): string {
  return s.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase();
}

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });
const byCode = (a: SiteListRow, b: SiteListRow) => collator.compare(a.site.code, b.site.code) || a.site.id.localeCompare(b.site.id);

/**
 * Filter and sort. Sorts: 'code' natural order (MF-2 before MF-10); 'lastVisit' most recent first, never
 * visited last; 'distance' nearest first (by code without `here`). Ties fall back to code.
 */
export function filterAndSortSites(rows: readonly SiteListSource[], q: SiteListQuery = {}): SiteListRow[] {
  const words = foldForSearch(q.search ?? '').split(/\s+/).filter((w) => w !== '');
  const here = q.here ?? null;
  const out: SiteListRow[] = [];
  for (const r of rows) {
    if (words.length) {
      const hay = foldForSearch(`${r.site.code} ${r.site.name} ${r.site.notes}`);
      if (!words.every((w) => hay.includes(w))) continue;
    }
    out.push({ ...r, distanceM: here ? haversineDistanceM(here, r.site) : null });
  }
  const sort = q.sort ?? 'code';
  if (sort === 'lastVisit') out.sort((a, b) => (b.lastVisitAtMs ?? -Infinity) - (a.lastVisitAtMs ?? -Infinity) || byCode(a, b));
  else if (sort === 'distance' && here) out.sort((a, b) => (a.distanceM as number) - (b.distanceM as number) || byCode(a, b));
  else out.sort(byCode);
  return out;
}
