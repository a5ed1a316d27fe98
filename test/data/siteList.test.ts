import fc from 'fast-check';
import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { filterAndSortSites, foldForSearch, haversineDistanceM, type SiteListSource } from '../../src/data/siteList.ts';
import type { SiteRecord } from '../../src/data/types.ts';
import { T0_MS, siteFields } from './helpers.ts';

const src = (code: string, o: Partial<SiteRecord> = {}, lastVisitAtMs: number | null = null): SiteListSource => ({
  site: { id: crypto.randomUUID(), rev: 1, createdAtMs: T0_MS, updatedAtMs: T0_MS, deletedAtMs: null, ...siteFields({ code }), ...o },
  lastVisitAtMs,
  installationCount: 0,
  inspectionCount: 0,
});

describe('site list search and sort', () => {
  const rows = [
    src('MF-10', { name: 'Marrowby Fen east', latDeg: 52.0, lonDeg: 0.0 }, T0_MS + 5),
    src('MF-2', { name: 'Fén north', latDeg: 52.5, lonDeg: 0.0 }, null),
    src('HR-1', { name: 'Hollin Ridge', notes: 'gate key at the farm', latDeg: 51.0, lonDeg: 0.0 }, T0_MS + 9),
  ];
  const codes = (r: { site: SiteRecord }[]) => r.map((x) => x.site.code);

  it('sorts codes in natural order by default', () => {
    expect(codes(filterAndSortSites(rows))).toEqual(['HR-1', 'MF-2', 'MF-10']);
  });
  it('sorts by last visit, most recent first, never-visited last', () => {
    expect(codes(filterAndSortSites(rows, { sort: 'lastVisit' }))).toEqual(['HR-1', 'MF-10', 'MF-2']);
  });
  it('sorts by distance from here, and by code without a position', () => {
    const r = filterAndSortSites(rows, { sort: 'distance', here: { latDeg: 52.6, lonDeg: 0 } });
    expect(codes(r)).toEqual(['MF-2', 'MF-10', 'HR-1']);
    expect(r[0].distanceM).toBeCloseTo(11_119.5, 0); // 0.1° of arc on the 6 371 008.8 m sphere
    expect(codes(filterAndSortSites(rows, { sort: 'distance' }))).toEqual(['HR-1', 'MF-2', 'MF-10']);
  });
  it('searches code, name and notes; every word must match; case and accents ignored', () => {
    expect(codes(filterAndSortSites(rows, { search: 'fen' }))).toEqual(['MF-2', 'MF-10']);
    expect(codes(filterAndSortSites(rows, { search: 'FEN north' }))).toEqual(['MF-2']);
    expect(codes(filterAndSortSites(rows, { search: 'gate' }))).toEqual(['HR-1']);
    expect(codes(filterAndSortSites(rows, { search: 'mf-1' }))).toEqual(['MF-10']);
    expect(codes(filterAndSortSites(rows, { search: '   ' }))).toHaveLength(3);
    expect(foldForSearch('Ångström Fén')).toBe('angstrom fen');
  });
});

describe('haversine distance', () => {
  // Oracle: geographiclib-geodesic 2.2.0 (Karney, "Algorithms for geodesics", J. Geodesy 87:43, 2013) on WGS84.
  // A sphere differs from the ellipsoid by up to about 0.56 % in distance (from memory; ellipticity ~ 1/298
  // applied to the meridian curvature), so 0.6 % bounds it with margin for every pair.
  const REL_TOL = 0.006;
  const geod = geodesic.Geodesic.WGS84;

  it('agrees with the WGS84 geodesic within 0.6 % for any pair of points', () => {
    const lat = fc.double({ min: -90, max: 90, noNaN: true });
    const lon = fc.double({ min: -180, max: 179.999999, noNaN: true });
    fc.assert(
      fc.property(lat, lon, lat, lon, (la1, lo1, la2, lo2) => {
        const s12 = geod.Inverse(la1, lo1, la2, lo2).s12 as number;
        fc.pre(s12 > 1000);
        const d = haversineDistanceM({ latDeg: la1, lonDeg: lo1 }, { latDeg: la2, lonDeg: lo2 });
        expect(Math.abs(d - s12) / s12).toBeLessThan(REL_TOL);
      }),
      { numRuns: 2000 },
    );
  });

  it('is symmetric and zero for the same point, across the antimeridian', () => {
    const a = { latDeg: 10, lonDeg: 179.9 };
    const b = { latDeg: 10, lonDeg: -179.9 };
    expect(haversineDistanceM(a, b)).toBeCloseTo(haversineDistanceM(b, a), 9);
    expect(haversineDistanceM(a, a)).toBe(0);
    expect(haversineDistanceM(a, b)).toBeLessThan(25_000);
  });
});
