import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  aimForPass,
  azElFromEnu,
  losFromAzEl,
  azimuthToSatelliteDeg,
  incidenceFromLookDeg,
  lookFromIncidenceDeg,
  slantRangeFromLookM,
} from '../../../src/core/geometry/pointing.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG, normalizeAzimuthDeg, wrapSignedDeg } from '../../../src/core/units.ts';
import { norm } from '../../../src/core/vec3.ts';

const TOL_DEG = 1e-9;
const H_M = 693_000;

describe('trihedral boresight', () => {
  it('stands atan(1/√2) = 35.264390° above the base plate', () => {
    // Source: Robertson 1947, Bell System Technical Journal 26:852–869 (symmetry axis of the trihedral
    // makes 54.7356° with each edge, i.e. 35.2644° with the base plate); REFERENCES.md §1.
    expect(TRIHEDRAL_BORESIGHT_ELEVATION_DEG).toBeCloseTo(35.26439, 5);
    expect(90 - TRIHEDRAL_BORESIGHT_ELEVATION_DEG).toBeCloseTo(54.73561, 5);
  });
});

describe('aimForPass', () => {
  it('right-looking: reflector faces heading − 90°, left-looking heading + 90°', () => {
    // Source: side-looking geometry (Curlander & McDonough 1991, §1.2); REFERENCES.md §3.
    expect(azimuthToSatelliteDeg(350, 'right')).toBeCloseTo(260, 12);
    expect(azimuthToSatelliteDeg(350, 'left')).toBeCloseTo(80, 12);
    expect(azimuthToSatelliteDeg(190, 'right')).toBeCloseTo(100, 12);
  });

  it('worked case: incidence 40°, heading 190°, right-looking', () => {
    const a = aimForPass({ incidenceDeg: 40, headingDeg: 190, look: 'right' });
    expect(a.reflectorAzimuthDeg).toBeCloseTo(100, 10);
    expect(a.boresightElevationDeg).toBeCloseTo(50, 10);
    expect(a.baseTiltDeg).toBeCloseTo(50 - 35.2643896828, 8);
  });

  it('an exact line-of-sight azimuth from an orbit overrides heading ∓ 90°', () => {
    const a = aimForPass({ incidenceDeg: 40, headingDeg: 190, look: 'right', losAzimuthDeg: 100.25 });
    expect(a.reflectorAzimuthDeg).toBeCloseTo(100.25, 12);
    expect(azElFromEnu(a.losEnu).azimuthDeg).toBeCloseTo(100.25, 9);
    expect(() => aimForPass({ incidenceDeg: 40, headingDeg: 190, look: 'right', losAzimuthDeg: Number.NaN })).toThrow(/losAzimuthDeg must be a finite number/);
  });

  it('LOS is a unit vector whose az/el match the aim (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 89.99, noNaN: true }),
        fc.double({ min: -720, max: 720, noNaN: true }),
        fc.constantFrom('right' as const, 'left' as const),
        (inc, hdg, look) => {
          const a = aimForPass({ incidenceDeg: inc, headingDeg: hdg, look });
          expect(Math.abs(norm(a.losEnu) - 1)).toBeLessThan(1e-12);
          const ae = azElFromEnu(a.losEnu);
          expect(Math.abs(wrapSignedDeg(ae.azimuthDeg - a.reflectorAzimuthDeg))).toBeLessThan(1e-7);
          expect(Math.abs(ae.elevationDeg - (90 - inc))).toBeLessThan(1e-7);
          expect(a.reflectorAzimuthDeg).toBeGreaterThanOrEqual(0);
          expect(a.reflectorAzimuthDeg).toBeLessThan(360);
        },
      ),
    );
  });

  it('left and right looks face opposite ways (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -360, max: 360, noNaN: true }), (h) => {
        const d = wrapSignedDeg(azimuthToSatelliteDeg(h, 'right') - azimuthToSatelliteDeg(h, 'left'));
        expect(Math.abs(Math.abs(d) - 180)).toBeLessThan(1e-9);
      }),
    );
  });

  it.each([
    [{ incidenceDeg: 0, headingDeg: 10, look: 'right' as const }, /incidenceDeg must be in \(0, 90\)°/],
    [{ incidenceDeg: 90, headingDeg: 10, look: 'right' as const }, /incidenceDeg/],
    [{ incidenceDeg: Number.NaN, headingDeg: 10, look: 'right' as const }, /incidenceDeg must be a finite number, got NaN/],
    [{ incidenceDeg: 30, headingDeg: Infinity, look: 'right' as const }, /headingDeg must be a finite number/],
    [{ incidenceDeg: 30, headingDeg: 10, look: 'up' as never }, /look must be one of right, left/],
  ])('rejects bad geometry %#', (g, msg) => {
    expect(() => aimForPass(g)).toThrow(msg);
  });
});

describe('look angle ↔ incidence, spherical Earth', () => {
  // Check values [derived] in ../shared/REFERENCES.md §3: R = 6371.0088 km, H = 693 km.
  it('look 30° → incidence 33.6685°, slant range 815.282 km', () => {
    expect(incidenceFromLookDeg(30, H_M)).toBeCloseTo(33.6685, 4);
    expect(slantRangeFromLookM(30, H_M) / 1000).toBeCloseTo(815.282, 3);
  });
  it('look 40° → incidence 45.4555°, slant range 942.320 km', () => {
    expect(incidenceFromLookDeg(40, H_M)).toBeCloseTo(45.4555, 4);
    expect(slantRangeFromLookM(40, H_M) / 1000).toBeCloseTo(942.32, 3);
  });
  it('round trips (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 55, noNaN: true }), fc.double({ min: 200e3, max: 1000e3, noNaN: true }), (look, h) => {
        expect(Math.abs(lookFromIncidenceDeg(incidenceFromLookDeg(look, h), h) - look)).toBeLessThan(TOL_DEG * 1e3);
      }),
    );
  });
  it('nadir has zero incidence and slant range equal to the height', () => {
    expect(incidenceFromLookDeg(0, H_M)).toBe(0);
    expect(slantRangeFromLookM(0, H_M)).toBe(H_M);
  });
  it('a look beyond the horizon is an error naming the look angle', () => {
    expect(() => incidenceFromLookDeg(70, H_M)).toThrow(/looks past the horizon/);
    expect(() => incidenceFromLookDeg(30, -1)).toThrow(/orbitHeightM must be greater than 0/);
  });
});

describe('angle helpers', () => {
  it('normalise azimuths into [0, 360) with +0', () => {
    expect(normalizeAzimuthDeg(-90)).toBe(270);
    expect(normalizeAzimuthDeg(360)).toBe(0);
    expect(Object.is(normalizeAzimuthDeg(-0), 0)).toBe(true);
    expect(Object.is(normalizeAzimuthDeg(-720), 0)).toBe(true);
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (a) => {
        const n = normalizeAzimuthDeg(a);
        expect(n >= 0 && n < 360).toBe(true);
      }),
    );
  });
  it('signed wrap into (−180, 180]', () => {
    expect(wrapSignedDeg(180)).toBe(180);
    expect(wrapSignedDeg(-180)).toBe(180);
    expect(wrapSignedDeg(350)).toBe(-10);
  });
});

describe('bad vectors and angles at the boundary', () => {
  it('rejects NaN in line-of-sight helpers, naming the parameter', () => {
    expect(() => losFromAzEl(Number.NaN, 10)).toThrow(/azimuthDeg must be a finite number, got NaN/);
    expect(() => losFromAzEl(10, 91)).toThrow(/elevationDeg must be in \[-90, 90\]°, got 91/);
    expect(() => azElFromEnu([Number.NaN, 1, 0])).toThrow(/v\[0\] must be a finite number/);
  });
});
