import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { reduceToApex } from '../../../src/core/survey/apex.ts';

/** WGS84 (NIMA TR8350.2 Table 3.1), written out here for the independent constructions. */
const A = 6378137;
const F = 1 / 298.257223563;
const E2 = F * (2 - F);
const rad = (d: number) => (d * Math.PI) / 180;
type M3 = number[][];
const mul = (a: M3, b: M3): M3 => a.map((r) => [0, 1, 2].map((j) => r[0] * b[0][j] + r[1] * b[1][j] + r[2] * b[2][j]));
const apply = (a: M3, v: number[]) => a.map((r) => r[0] * v[0] + r[1] * v[1] + r[2] * v[2]);
/** Standard right-handed rotations about x, y, z (counter-clockwise for a positive angle). */
const rx = (t: number): M3 => [[1, 0, 0], [0, Math.cos(t), -Math.sin(t)], [0, Math.sin(t), Math.cos(t)]];
const ry = (t: number): M3 => [[Math.cos(t), 0, Math.sin(t)], [0, 1, 0], [-Math.sin(t), 0, Math.cos(t)]];
const rz = (t: number): M3 => [[Math.cos(t), -Math.sin(t), 0], [Math.sin(t), Math.cos(t), 0], [0, 0, 1]];
/**
 * Body (right, forward, up) → ENU for azimuth A (clockwise from north), tilt t (forward raised), roll ρ (right side
 * raised): yaw by −A about up, pitch by +t about right, then roll by −ρ about forward (a standard y-rotation by
 * +ρ would lower the right side), i.e. Rz(−A)·Rx(t)·Ry(−ρ).
 */
const bodyToEnu = (azDeg: number, tiltDeg: number, rollDeg: number): M3 => mul(mul(rz(-rad(azDeg)), rx(rad(tiltDeg))), ry(-rad(rollDeg)));
/** ENU → ECEF rotation at (φ, λ): columns east, north, up (Hofmann-Wellenhof et al., GNSS, 2008, eq. 10.7). */
const enuToEcef = (latDeg: number, lonDeg: number): M3 => {
  const p = rad(latDeg), l = rad(lonDeg);
  return [
    [-Math.sin(l), -Math.sin(p) * Math.cos(l), Math.cos(p) * Math.cos(l)],
    [Math.cos(l), -Math.sin(p) * Math.sin(l), Math.cos(p) * Math.sin(l)],
    [0, Math.cos(p), Math.sin(p)],
  ];
};
const geodeticToEcef = (latDeg: number, lonDeg: number, h: number) => {
  const p = rad(latDeg), l = rad(lonDeg);
  const n = A / Math.sqrt(1 - E2 * Math.sin(p) ** 2);
  return [(n + h) * Math.cos(p) * Math.cos(l), (n + h) * Math.cos(p) * Math.sin(l), (n * (1 - E2) + h) * Math.sin(p)];
};
const MM = 1e-3;

describe('apex reduction', () => {
  it('a level plate (tilt 0, roll 0): apex = mark + height · up, same latitude and longitude, at any azimuth', () => {
    for (const az of [0, 37, 190.5]) {
      const r = reduceToApex({ latDeg: 52.61, lonDeg: 0.27, heightM: 31.4 }, { kind: 'body', bodyM: [0, 0, 0.85], orientation: { azimuthDeg: az, tiltDeg: 0, rollDeg: 0 } });
      expect(r.apexHeightEllM).toBeCloseTo(32.25, 6);
      expect(r.apexLatDeg).toBeCloseTo(52.61, 11);
      expect(r.apexLonDeg).toBeCloseTo(0.27, 11);
      const want = geodeticToEcef(52.61, 0.27, 32.25);
      r.apexXyzM.forEach((x, i) => expect(Math.abs(x - want[i])).toBeLessThan(1e-6));
    }
  });

  it('an ENU offset moves the apex by exactly that many metres east, north and up (ECEF built here)', () => {
    const r = reduceToApex({ latDeg: -33.9, lonDeg: 151.2, heightM: 50 }, { kind: 'enu', enuM: [0.3, -0.2, 1.1] });
    const m = geodeticToEcef(-33.9, 151.2, 50);
    const d = apply(enuToEcef(-33.9, 151.2), [0.3, -0.2, 1.1]);
    r.apexXyzM.forEach((x, i) => expect(Math.abs(x - (m[i] + d[i]))).toBeLessThan(1e-6));
  });

  it('tilted and rolled mounts agree with rotation matrices written in the test (1 µm)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.double({ min: -179, max: 179, noNaN: true }),
        fc.double({ min: 0, max: 359.9, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        fc.tuple(fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true })),
        (lat, lon, az, tilt, roll, body) => {
          const r = reduceToApex({ latDeg: lat, lonDeg: lon, heightM: 10 }, { kind: 'body', bodyM: body, orientation: { azimuthDeg: az, tiltDeg: tilt, rollDeg: roll } });
          const enu = apply(bodyToEnu(az, tilt, roll), body);
          const d = apply(enuToEcef(lat, lon), enu);
          const m = geodeticToEcef(lat, lon, 10);
          r.steps.offsetEnuM.forEach((x, i) => expect(Math.abs(x - enu[i])).toBeLessThan(1e-9));
          r.apexXyzM.forEach((x, i) => expect(Math.abs(x - (m[i] + d[i]))).toBeLessThan(1e-6));
        },
      ),
      { seed: 14, numRuns: 200 },
    );
  });

  it('a worked case: forward offset 0.5 m at azimuth 90°, tilt 30° → 0.433 m east and 0.25 m up', () => {
    // f = (sin 90° cos 30°, cos 90° cos 30°, sin 30°) = (0.8660, 0, 0.5).
    const r = reduceToApex({ latDeg: 10, lonDeg: 20, heightM: 0 }, { kind: 'body', bodyM: [0, 0.5, 0], orientation: { azimuthDeg: 90, tiltDeg: 30, rollDeg: 0 } });
    expect(r.steps.offsetEnuM[0]).toBeCloseTo(0.5 * Math.cos(rad(30)), 12);
    expect(Math.abs(r.steps.offsetEnuM[1])).toBeLessThan(1e-12);
    expect(r.steps.offsetEnuM[2]).toBeCloseTo(0.25, 12);
    expect(r.apexHeightEllM).toBeCloseTo(0.25, 4); // the 0.433 m horizontal step drops below the ellipsoid by d²/2R ≈ 15 nm
    expect(Math.abs(r.apexHeightEllM - 0.25)).toBeLessThan(MM);
  });

  it('refuses an offset longer than 100 m and a bad angle', () => {
    expect(() => reduceToApex({ latDeg: 0, lonDeg: 0, heightM: 0 }, { kind: 'enu', enuM: [0, 0, 150] })).toThrow(/100 m/);
    expect(() => reduceToApex({ latDeg: 0, lonDeg: 0, heightM: 0 }, { kind: 'body', bodyM: [0, 0, 1], orientation: { azimuthDeg: 0, tiltDeg: 95, rollDeg: 0 } })).toThrow(/tiltDeg/);
  });
});
