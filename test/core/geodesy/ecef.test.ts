import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { eciToGeodetic, geodeticToEcf } from 'satellite.js';
import {
  ecefToEnu,
  ecefToGeodetic,
  enuBasis,
  enuToEcef,
  geodeticToEcefM,
  WGS84_B_M,
  WGS84_E2,
} from '../../../src/core/geodesy/ecef.ts';
import { WGS84_A_M } from '../../../src/core/units.ts';
import { cross, dot, norm, type Vec3 } from '../../../src/core/vec3.ts';

const TOL_M = 1e-3;
const TOL_DEG = 1e-9;
const TOL_UNIT = 1e-12;
/** satellite.js uses b = 6356.7523142 km, 0.045 mm from WGS84's 6356752.314245 m: 0.1 mm covers it. */
const TOL_ORACLE_M = 1e-4;

const lat = fc.double({ min: -90, max: 90, noNaN: true });
const lon = fc.double({ min: -180, max: 179.999999, noNaN: true });
const heightM = fc.double({ min: -10_000, max: 2_000_000, noNaN: true });

describe('geodeticToEcefM', () => {
  it('puts the equator at a and the pole at b (NIMA TR8350.2, Table 3.1/3.3)', () => {
    const eq = geodeticToEcefM({ latDeg: 0, lonDeg: 0, heightM: 0 });
    expect(Math.abs(eq[0] - WGS84_A_M)).toBeLessThan(TOL_M);
    const pole = geodeticToEcefM({ latDeg: 90, lonDeg: 0, heightM: 0 });
    // TR8350.2 Table 3.3: b = 6 356 752.3142 m, e² = 6.69437999014e-3
    expect(Math.abs(pole[2] - 6_356_752.3142)).toBeLessThan(TOL_M);
    expect(Math.abs(WGS84_B_M - 6_356_752.3142)).toBeLessThan(TOL_M);
    expect(Math.abs(WGS84_E2 - 6.69437999014e-3)).toBeLessThan(1e-14);
  });

  it('agrees with satellite.js geodeticToEcf (independent implementation) everywhere', () => {
    fc.assert(
      fc.property(lat, lon, heightM, (latDeg, lonDeg, h) => {
        const ours = geodeticToEcefM({ latDeg, lonDeg, heightM: h });
        const theirs = geodeticToEcf({ latitude: (latDeg * Math.PI) / 180, longitude: (lonDeg * Math.PI) / 180, height: h / 1000 });
        const d = norm([ours[0] - theirs.x * 1000, ours[1] - theirs.y * 1000, ours[2] - theirs.z * 1000]);
        expect(d).toBeLessThan(TOL_ORACLE_M);
      }),
    );
  });

  it('rejects bad input with the parameter named', () => {
    expect(() => geodeticToEcefM({ latDeg: 91, lonDeg: 0, heightM: 0 })).toThrow(/latDeg/);
    expect(() => geodeticToEcefM({ latDeg: 0, lonDeg: NaN, heightM: 0 })).toThrow(/lonDeg/);
    expect(() => geodeticToEcefM({ latDeg: 0, lonDeg: 0, heightM: Infinity })).toThrow(/heightM/);
  });
});

describe('ecefToGeodetic (Heikkinen)', () => {
  it('round-trips geodetic → ECEF → geodetic within 1 mm and 1e-9°', () => {
    fc.assert(
      fc.property(lat, lon, heightM, (latDeg, lonDeg, h) => {
        const back = ecefToGeodetic(geodeticToEcefM({ latDeg, lonDeg, heightM: h }));
        expect(Math.abs(back.latDeg - latDeg)).toBeLessThan(TOL_DEG);
        expect(Math.abs(back.heightM - h)).toBeLessThan(TOL_M);
        // Longitude is meaningless at the poles; compare it through the horizontal position instead.
        const dLonM = Math.abs(((back.lonDeg - lonDeg + 540) % 360) - 180) * (Math.PI / 180) * WGS84_A_M * Math.cos((latDeg * Math.PI) / 180);
        expect(dLonM).toBeLessThan(TOL_M);
      }),
      { numRuns: 2000 },
    );
  });

  it('agrees with satellite.js eciToGeodetic (iterative) at satellite heights', () => {
    fc.assert(
      fc.property(lat.filter((x) => Math.abs(x) < 89.9), lon, fc.double({ min: 200_000, max: 1_500_000, noNaN: true }), (latDeg, lonDeg, h) => {
        const p = geodeticToEcefM({ latDeg, lonDeg, heightM: h });
        const theirs = eciToGeodetic({ x: p[0] / 1000, y: p[1] / 1000, z: p[2] / 1000 }, 0);
        const ours = ecefToGeodetic(p);
        // satellite.js's b differs by 0.045 mm; its 20 fixed-point iterations converge to ~1e-9°.
        expect(Math.abs(ours.latDeg - (theirs.latitude * 180) / Math.PI)).toBeLessThan(1e-8);
        expect(Math.abs(ours.heightM - theirs.height * 1000)).toBeLessThan(1e-3);
      }),
    );
  });

  it('returns longitude in [−180, 180) and handles the poles', () => {
    expect(ecefToGeodetic(geodeticToEcefM({ latDeg: 10, lonDeg: 180, heightM: 0 })).lonDeg).toBeCloseTo(-180, 9);
    const np = ecefToGeodetic([0, 0, WGS84_B_M + 100]);
    expect(np.latDeg).toBe(90);
    expect(Math.abs(np.heightM - 100)).toBeLessThan(TOL_M);
    expect(np.lonDeg).toBe(0);
  });

  it('refuses points near the Earth centre and non-finite input', () => {
    expect(() => ecefToGeodetic([1000, 0, 0])).toThrow(RangeError);
    expect(() => ecefToGeodetic([NaN, 0, 0])).toThrow(/x/);
  });
});

describe('enuBasis', () => {
  it('is orthonormal and right-handed (east × north = up) everywhere', () => {
    fc.assert(
      fc.property(lat, lon, (latDeg, lonDeg) => {
        const { east, north, up } = enuBasis(latDeg, lonDeg);
        for (const v of [east, north, up]) expect(Math.abs(norm(v) - 1)).toBeLessThan(TOL_UNIT);
        expect(Math.abs(dot(east, north))).toBeLessThan(TOL_UNIT);
        expect(Math.abs(dot(east, up))).toBeLessThan(TOL_UNIT);
        expect(Math.abs(dot(north, up))).toBeLessThan(TOL_UNIT);
        const c = cross(east, north);
        expect(norm([c[0] - up[0], c[1] - up[1], c[2] - up[2]])).toBeLessThan(TOL_UNIT);
      }),
    );
  });

  it('up is the ellipsoid normal: parallel to the gradient (x/a², y/a², z/b²) at the surface point', () => {
    fc.assert(
      fc.property(lat, lon, (latDeg, lonDeg) => {
        const [x, y, z] = geodeticToEcefM({ latDeg, lonDeg, heightM: 0 });
        const g: Vec3 = [x / WGS84_A_M ** 2, y / WGS84_A_M ** 2, z / WGS84_B_M ** 2];
        const up = enuBasis(latDeg, lonDeg).up;
        expect(norm(cross(up, g)) / norm(g)).toBeLessThan(1e-12);
        expect(dot(up, g)).toBeGreaterThan(0);
      }),
    );
  });

  it('north points to the pole and east along the parallel', () => {
    const b = enuBasis(0, 0);
    expect(b.north).toEqual([-0, -0, 1]);
    expect(b.east).toEqual([-0, 1, 0]);
  });

  it('ecefToEnu and enuToEcef are inverses', () => {
    fc.assert(
      fc.property(lat, lon, fc.tuple(fc.double({ min: -1e7, max: 1e7, noNaN: true }), fc.double({ min: -1e7, max: 1e7, noNaN: true }), fc.double({ min: -1e7, max: 1e7, noNaN: true })), (latDeg, lonDeg, v) => {
        const b = enuBasis(latDeg, lonDeg);
        const back = enuToEcef(b, ecefToEnu(b, v));
        expect(norm([back[0] - v[0], back[1] - v[1], back[2] - v[2]])).toBeLessThan(1e-8 * Math.max(1, norm(v)));
      }),
    );
  });
});
