import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { geodesicInverse } from '../../../src/core/geodesy/bearing.ts';
import v from '../../fixtures/geodesy/geodesic_vectors.json';

// Per-quantity tolerances, set by the precision the values are printed with (see the fixture's notes).
const TABLE2_TOL_M = 1e-5; // end point printed to 1e-11° ≈ 1 µm
const TABLE2_TOL_DEG = 1e-8;
const QUOTED_6DP_TOL_DEG = 1e-6; // Tables 3-4 azimuths quoted to 6 decimals
const TABLE3_TOL_M = 1e-6; // quoted to 1 µm
const TABLE4_TOL_M = 1e-5; // quoted to 10 µm
const ORACLE_TOL_DEG = 1e-6; // short-line tangent-plane oracle (normal section ≈ geodesic over 100 m)
const ORACLE_TOL_M = 1e-5;

const angDiff = (a: number, b: number) => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

describe('geodesicInverse against Karney (2013), "Algorithms for geodesics", J. Geodesy 87:43-55', () => {
  it('Table 2 (direct problem, run inverse): 10 000 km at azimuth 30° from 40° N', () => {
    const t = v.karney_table2_direct;
    const r = geodesicInverse({ latDeg: t.lat1, lonDeg: t.lon1 }, { latDeg: t.lat2, lonDeg: t.lon2 });
    expect(Math.abs(r.distanceM - t.s12_m)).toBeLessThan(TABLE2_TOL_M);
    expect(angDiff(r.azimuthDeg, t.azi1)).toBeLessThan(TABLE2_TOL_DEG);
    expect(angDiff(r.backAzimuthDeg, t.azi2 + 180)).toBeLessThan(TABLE2_TOL_DEG);
  });

  it('Table 3: a 4.9 m line', () => {
    const t = v.karney_table3_short_inverse;
    const r = geodesicInverse({ latDeg: t.lat1, lonDeg: 0 }, { latDeg: t.lat2, lonDeg: t.lon12 });
    expect(Math.abs(r.distanceM - t.s12_m)).toBeLessThan(TABLE3_TOL_M);
    expect(angDiff(r.azimuthDeg, t.azi1)).toBeLessThan(QUOTED_6DP_TOL_DEG);
    expect(angDiff(r.backAzimuthDeg, t.azi2 + 180)).toBeLessThan(QUOTED_6DP_TOL_DEG);
  });

  it('Table 4: a nearly antipodal line', () => {
    const t = v.karney_table4_nearly_antipodal;
    const r = geodesicInverse({ latDeg: t.lat1, lonDeg: 0 }, { latDeg: t.lat2, lonDeg: t.lon12 });
    expect(Math.abs(r.distanceM - t.s12_m)).toBeLessThan(TABLE4_TOL_M);
    expect(angDiff(r.azimuthDeg, t.azi1)).toBeLessThan(QUOTED_6DP_TOL_DEG);
    expect(angDiff(r.backAzimuthDeg, t.azi2 + 180)).toBeLessThan(QUOTED_6DP_TOL_DEG);
  });

});

// Independent oracle: WGS84 geodetic ↔ ECEF (NIMA TR8350.2, 3rd ed., 2000, ch. 4; inverse by fixed-point iteration),
// a point 100 m away along azimuth A in the local tangent plane, projected back to the ellipsoid. Over 100 m the
// geodesic azimuth equals the tangent-plane azimuth to ~1e-9° and its length the chord to ~1e-9 m.
const A = 6_378_137, F = 1 / 298.257223563, E2 = F * (2 - F);
const d2r = Math.PI / 180;
function toEcef(latDeg: number, lonDeg: number, h = 0): number[] {
  const la = latDeg * d2r, lo = lonDeg * d2r;
  const N = A / Math.sqrt(1 - E2 * Math.sin(la) ** 2);
  return [(N + h) * Math.cos(la) * Math.cos(lo), (N + h) * Math.cos(la) * Math.sin(lo), (N * (1 - E2) + h) * Math.sin(la)];
}
function fromEcef([x, y, z]: number[]): { latDeg: number; lonDeg: number } {
  const p = Math.hypot(x, y);
  let la = Math.atan2(z, p * (1 - E2));
  for (let i = 0; i < 10; i++) {
    const N = A / Math.sqrt(1 - E2 * Math.sin(la) ** 2);
    const h = p / Math.cos(la) - N;
    la = Math.atan2(z, p * (1 - (E2 * N) / (N + h)));
  }
  return { latDeg: la / d2r, lonDeg: Math.atan2(y, x) / d2r };
}
function pointAlong(latDeg: number, lonDeg: number, azDeg: number, distM: number) {
  const la = latDeg * d2r, lo = lonDeg * d2r, az = azDeg * d2r;
  const east = [-Math.sin(lo), Math.cos(lo), 0];
  const north = [-Math.sin(la) * Math.cos(lo), -Math.sin(la) * Math.sin(lo), Math.cos(la)];
  const p0 = toEcef(latDeg, lonDeg);
  const e = distM * Math.sin(az), n = distM * Math.cos(az);
  return fromEcef([0, 1, 2].map((i) => p0[i] + e * east[i] + n * north[i]));
}

describe('geodesicInverse: sweep against a short-line tangent-plane oracle', () => {
  it('every 5° of azimuth at latitudes −80…80° and across the antimeridian', () => {
    let worstDeg = 0, worstM = 0;
    for (let lat = -80; lat <= 80; lat += 20) {
      for (const lon of [-179.9995, -3.2, 179.9995]) {
        for (let az = 0; az < 360; az += 5) {
          const p2 = pointAlong(lat, lon, az, 100);
          const r = geodesicInverse({ latDeg: lat, lonDeg: lon }, p2);
          const chord = Math.hypot(...toEcef(lat, lon).map((c, i) => c - toEcef(p2.latDeg, p2.lonDeg)[i]));
          worstDeg = Math.max(worstDeg, angDiff(r.azimuthDeg, az));
          worstM = Math.max(worstM, Math.abs(r.distanceM - chord));
        }
      }
    }
    expect(worstDeg).toBeLessThan(ORACLE_TOL_DEG);
    expect(worstM).toBeLessThan(ORACLE_TOL_M);
  });
});

describe('geodesicInverse: properties and bad input', () => {
  const latLon = fc.record({ latDeg: fc.double({ min: -89, max: 89, noNaN: true }), lonDeg: fc.double({ min: -180, max: 179.99, noNaN: true }) });

  it('swapping the ends swaps azimuth and back azimuth and keeps the distance (property)', () => {
    fc.assert(
      fc.property(latLon, latLon, (a, b) => {
        fc.pre(Math.abs(a.latDeg - b.latDeg) + Math.abs(a.lonDeg - b.lonDeg) > 1e-3);
        const ab = geodesicInverse(a, b);
        const ba = geodesicInverse(b, a);
        expect(Math.abs(ab.distanceM - ba.distanceM)).toBeLessThan(1e-6);
        // Nearly antipodal pairs have nearly equal alternative geodesics; compare the rest tightly.
        if (ab.distanceM < 19_900_000) {
          expect(angDiff(ab.azimuthDeg, ba.backAzimuthDeg)).toBeLessThan(1e-9);
          expect(angDiff(ab.backAzimuthDeg, ba.azimuthDeg)).toBeLessThan(1e-9);
        }
        expect(ab.azimuthDeg).toBeGreaterThanOrEqual(0);
        expect(ab.azimuthDeg).toBeLessThan(360);
      }),
      { numRuns: 300 },
    );
  });

  it('east-of-360 longitudes equal their wrapped values', () => {
    const a = geodesicInverse({ latDeg: 10, lonDeg: 350 }, { latDeg: 11, lonDeg: 355 });
    const b = geodesicInverse({ latDeg: 10, lonDeg: -10 }, { latDeg: 11, lonDeg: -5 });
    expect(a.distanceM).toBeCloseTo(b.distanceM, 6);
    expect(a.azimuthDeg).toBeCloseTo(b.azimuthDeg, 9);
  });

  it('coincident points have no azimuth: RangeError', () => {
    expect(() => geodesicInverse({ latDeg: 52.6, lonDeg: 0.27 }, { latDeg: 52.6, lonDeg: 0.27 })).toThrow(/at least 0.001 m apart/);
  });

  it('rejects out-of-range and non-finite coordinates, naming them', () => {
    expect(() => geodesicInverse({ latDeg: 91, lonDeg: 0 }, { latDeg: 0, lonDeg: 0 })).toThrow(/from\.latDeg must be in \[-90, 90\]/);
    expect(() => geodesicInverse({ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: NaN })).toThrow(/to\.lonDeg/);
  });
});
