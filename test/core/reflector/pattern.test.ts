import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { reflectorAxesEnu } from '../../../src/core/geometry/orientation.ts';
import { rcsForOrientation, rcsInReflectorFrame } from '../../../src/core/reflector/pattern.ts';
import { peakRcsM2, type Reflector, type TrihedralShape } from '../../../src/core/reflector/trihedral.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG } from '../../../src/core/units.ts';
import type { Vec3 } from '../../../src/core/vec3.ts';

const REL_TOL = 1e-12; // relative, RCS computed two ways in double precision
const TOL_DB = 1e-9;
const TOL_DEG = 1e-6;

const shapeArb = fc.constantFrom<TrihedralShape>('triangular', 'square');
const reflectorArb = fc.record({
  shape: shapeArb,
  edgeM: fc.double({ min: 0.05, max: 5, noNaN: true }),
  wavelengthM: fc.double({ min: 0.005, max: 0.5, noNaN: true }),
});
/** Directions inside the corner's octant: elevation (0, 90), azimuth offset (−45, 45). */
const insideArb = fc.record({
  elevationDeg: fc.double({ min: 0.01, max: 89.99, noNaN: true }),
  azimuthOffsetDeg: fc.double({ min: -44.99, max: 44.99, noNaN: true }),
});
const orientationArb = fc.record({
  azimuthDeg: fc.double({ min: 0, max: 359.999, noNaN: true }),
  tiltDeg: fc.double({ min: -89, max: 89, noNaN: true }),
  rollDeg: fc.double({ min: -179.999, max: 180, noNaN: true }),
});

describe('rcsInReflectorFrame', () => {
  it.each(['triangular', 'square'] as const)('%s: boresight (35.264390° above the plate, on the bisector) gives the peak', (shape) => {
    // Boresight elevation atan(1/√2) = 35.264390° (Robertson 1947; ../shared/REFERENCES.md §1).
    expect(TRIHEDRAL_BORESIGHT_ELEVATION_DEG).toBeCloseTo(35.26439, 6);
    const r: Reflector = { shape, edgeM: 0.9, wavelengthM: 0.0555 };
    const s = rcsInReflectorFrame(r, { elevationDeg: TRIHEDRAL_BORESIGHT_ELEVATION_DEG, azimuthOffsetDeg: 0 });
    expect(Math.abs(s.rcsM2 / peakRcsM2(r) - 1)).toBeLessThan(REL_TOL);
    expect(s.lossDb).toBeLessThan(TOL_DB);
    expect(s.lossDb).toBeGreaterThanOrEqual(0);
    expect(s.rcsDbsm).toBeCloseTo(10 * Math.log10(peakRcsM2(r)), 9);
  });

  it('is symmetric about the bisector plane: azimuth offset → −azimuth offset (property)', () => {
    fc.assert(
      fc.property(reflectorArb, insideArb, (r, d) => {
        const a = rcsInReflectorFrame(r, d);
        const b = rcsInReflectorFrame(r, { ...d, azimuthOffsetDeg: -d.azimuthOffsetDeg });
        expect(Math.abs(a.rcsM2 - b.rcsM2)).toBeLessThanOrEqual(REL_TOL * peakRcsM2(r));
      }),
    );
  });

  it('lies in [0, peak] everywhere (property)', () => {
    fc.assert(
      fc.property(
        reflectorArb,
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (r, elevationDeg, azimuthOffsetDeg) => {
          const s = rcsInReflectorFrame(r, { elevationDeg, azimuthOffsetDeg });
          expect(s.rcsM2).toBeGreaterThanOrEqual(0);
          expect(s.rcsM2).toBeLessThanOrEqual(peakRcsM2(r));
          expect(s.lossDb).toBeGreaterThanOrEqual(0);
        },
      ),
    );
  });

  it('is zero outside the octant: below the plate or beyond ±45° azimuth offset (property)', () => {
    fc.assert(
      fc.property(
        reflectorArb,
        fc.oneof(
          fc.record({ elevationDeg: fc.double({ min: -90, max: 0, noNaN: true }), azimuthOffsetDeg: fc.double({ min: -180, max: 180, noNaN: true }) }),
          fc.record({ elevationDeg: fc.double({ min: -90, max: 89.9, noNaN: true }), azimuthOffsetDeg: fc.double({ min: 45, max: 180, noNaN: true }) }),
          fc.record({ elevationDeg: fc.double({ min: -90, max: 89.9, noNaN: true }), azimuthOffsetDeg: fc.double({ min: -180, max: -45, noNaN: true }) }),
        ),
        (r, d) => {
          const s = rcsInReflectorFrame(r, d);
          expect(s.rcsM2).toBe(0);
          expect(s.rcsDbsm).toBe(-Infinity);
          expect(s.lossDb).toBe(Infinity);
        },
      ),
    );
  });

  it('is exactly zero on the faces (azimuth offset ±45°, elevation 0°) despite rounding of the angles', () => {
    const r: Reflector = { shape: 'square', edgeM: 1, wavelengthM: 0.05 };
    for (const d of [{ elevationDeg: 30, azimuthOffsetDeg: 45 }, { elevationDeg: 30, azimuthOffsetDeg: -45 }, { elevationDeg: 0, azimuthOffsetDeg: 10 }]) {
      expect(rcsInReflectorFrame(r, d).rcsM2).toBe(0);
    }
  });

  it('lossDb does not depend on edge or wavelength (property)', () => {
    fc.assert(
      fc.property(reflectorArb, reflectorArb, insideArb, (r1, r2, d) => {
        const a = rcsInReflectorFrame(r1, d);
        const b = rcsInReflectorFrame({ ...r2, shape: r1.shape }, d);
        if (Number.isFinite(a.lossDb)) expect(Math.abs(a.lossDb - b.lossDb)).toBeLessThan(TOL_DB);
        else expect(b.lossDb).toBe(Infinity);
      }),
    );
  });

  it('scales as a⁴/λ² at a fixed direction', () => {
    const d = { elevationDeg: 40, azimuthOffsetDeg: 12 };
    const s1 = rcsInReflectorFrame({ shape: 'square', edgeM: 1, wavelengthM: 0.1 }, d);
    const s2 = rcsInReflectorFrame({ shape: 'square', edgeM: 2, wavelengthM: 0.2 }, d);
    expect(s2.rcsM2 / s1.rcsM2).toBeCloseTo(16 / 4, 12);
  });

  it('rejects bad input with the parameter named', () => {
    const r: Reflector = { shape: 'triangular', edgeM: 1, wavelengthM: 0.05 };
    expect(() => rcsInReflectorFrame(r, { elevationDeg: 91, azimuthOffsetDeg: 0 })).toThrow(/elevationDeg must be in \[-90, 90\]/);
    expect(() => rcsInReflectorFrame(r, { elevationDeg: 30, azimuthOffsetDeg: Number.NaN })).toThrow(/azimuthOffsetDeg must be a finite number/);
    expect(() => rcsInReflectorFrame({ ...r, edgeM: -1 }, { elevationDeg: 30, azimuthOffsetDeg: 0 })).toThrow(/edgeM/);
  });
});

describe('rcsForOrientation', () => {
  /** ENU line of sight for a reflector-frame direction, built from the axes (k = cos e cos a f + cos e sin a r + sin e u). */
  function losFor(o: { azimuthDeg: number; tiltDeg: number; rollDeg: number }, elDeg: number, azDeg: number): Vec3 {
    const ax = reflectorAxesEnu(o);
    const e = (elDeg * Math.PI) / 180, a = (azDeg * Math.PI) / 180;
    const cf = Math.cos(e) * Math.cos(a), cr = Math.cos(e) * Math.sin(a), cu = Math.sin(e);
    return [0, 1, 2].map((i) => cf * ax.forward[i] + cr * ax.right[i] + cu * ax.up[i]) as unknown as Vec3;
  }

  it('agrees with rcsInReflectorFrame for any orientation (property)', () => {
    fc.assert(
      fc.property(reflectorArb, orientationArb, insideArb, (r, o, d) => {
        const a = rcsForOrientation(r, o, losFor(o, d.elevationDeg, d.azimuthOffsetDeg));
        const b = rcsInReflectorFrame(r, d);
        expect(Math.abs(a.rcsM2 - b.rcsM2)).toBeLessThanOrEqual(1e-9 * peakRcsM2(r));
      }),
    );
  });

  it('reports 0° off boresight and no loss along the boresight, any LOS length', () => {
    const r: Reflector = { shape: 'square', edgeM: 1, wavelengthM: 0.03 };
    const o = { azimuthDeg: 123, tiltDeg: 8, rollDeg: -4 };
    const b = reflectorAxesEnu(o).boresight;
    const s = rcsForOrientation(r, o, [b[0] * 7, b[1] * 7, b[2] * 7]);
    expect(s.offBoresightDeg).toBeLessThan(TOL_DEG);
    expect(s.lossDb).toBeLessThan(TOL_DB);
  });

  it('off-boresight angle: level reflector, LOS at the horizon straight out of the open side is 35.264°', () => {
    const r: Reflector = { shape: 'triangular', edgeM: 1, wavelengthM: 0.03 };
    const s = rcsForOrientation(r, { azimuthDeg: 90, tiltDeg: 0, rollDeg: 0 }, [1, 0, 0]);
    expect(s.offBoresightDeg).toBeCloseTo(TRIHEDRAL_BORESIGHT_ELEVATION_DEG, 9);
    expect(s.lossDb).toBe(Infinity); // grazing the base plate: c₃ = 0
  });

  it('rejects a zero or non-finite line of sight', () => {
    const r: Reflector = { shape: 'triangular', edgeM: 1, wavelengthM: 0.03 };
    const o = { azimuthDeg: 0, tiltDeg: 0, rollDeg: 0 };
    expect(() => rcsForOrientation(r, o, [0, 0, 0])).toThrow(/losEnu must be a non-zero vector/);
    expect(() => rcsForOrientation(r, o, [Number.NaN, 0, 1])).toThrow(/losEnu\[0\] must be a finite number/);
    expect(() => rcsForOrientation(r, { ...o, tiltDeg: 95 }, [0, 0, 1])).toThrow(/tiltDeg/);
  });
});
