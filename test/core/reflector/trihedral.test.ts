import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bodyVectorFromDirection, edgeCosinesFromBody } from '../../../src/core/geometry/orientation.ts';
import {
  checkOpticalRegion,
  effectiveAreaRatio,
  peakAreaRatio,
  peakRcsM2,
  validateReflector,
  type Reflector,
} from '../../../src/core/reflector/trihedral.ts';

const REL_TOL = 1e-12; // relative, for closed forms evaluated two ways in double precision
const TOL_RATIO = 1e-12; // absolute, on A/a² (order 0.01–1.7)

interface ClosedFormRow {
  elevationDeg: number;
  azimuthOffsetDeg: number;
  cosines: [number, number, number];
  branch: string;
  triangularAreaRatio: number;
}
const fixture = JSON.parse(
  readFileSync(new URL('../../fixtures/reflector/triangular-closed-form.json', import.meta.url), 'utf8'),
) as { rows: ClosedFormRow[] };

const unit = (v: [number, number, number]): [number, number, number] => {
  const n = Math.hypot(...v);
  return [v[0] / n, v[1] / n, v[2] / n];
};

describe('peakRcsM2', () => {
  it('triangular: a = 1 m, λ = 1 m gives 4π/3 = 4.188790 m²', () => {
    // Source: σ = 4π a⁴/(3λ²), Robertson 1947, BSTJ 26:852–869; Ruck et al. 1970, Radar Cross Section Handbook;
    // unit check value from ../shared/REFERENCES.md §1.
    expect(peakRcsM2({ shape: 'triangular', edgeM: 1, wavelengthM: 1 })).toBeCloseTo(4.18879, 6);
  });

  it('triangular and square follow 4π a⁴/(3λ²) and 12π a⁴/λ²', () => {
    // Source: Robertson 1947; Ruck, Barrick, Stuart & Krichbaum 1970; Knott, Shaeffer & Tuley, 2nd ed. 1993.
    const a = 0.8, lam = 0.0555;
    expect(peakRcsM2({ shape: 'triangular', edgeM: a, wavelengthM: lam })).toBeCloseTo((4 * Math.PI * a ** 4) / (3 * lam ** 2), 9);
    expect(peakRcsM2({ shape: 'square', edgeM: a, wavelengthM: lam })).toBeCloseTo((12 * Math.PI * a ** 4) / lam ** 2, 9);
    // Square/triangular = 9 (9.54 dB) for the same edge: same sources.
    expect(peakRcsM2({ shape: 'square', edgeM: a, wavelengthM: lam }) / peakRcsM2({ shape: 'triangular', edgeM: a, wavelengthM: lam })).toBeCloseTo(9, 12);
  });

  it('equals 4π A²/λ² with the boresight aperture of each shape', () => {
    // Source: σ = 4π A²/λ² (aperture form; Skolnik, Introduction to Radar Systems — from memory for the section).
    for (const shape of ['triangular', 'square'] as const) {
      const r: Reflector = { shape, edgeM: 1.3, wavelengthM: 0.031 };
      const A = peakAreaRatio(shape) * r.edgeM ** 2;
      expect(Math.abs((4 * Math.PI * A * A) / r.wavelengthM ** 2 / peakRcsM2(r) - 1)).toBeLessThan(REL_TOL);
    }
  });

  it.each([
    [{ shape: 'round', edgeM: 1, wavelengthM: 0.05 }, /shape must be one of triangular, square, got "round"/],
    [{ shape: 'square', edgeM: 0, wavelengthM: 0.05 }, /edgeM must be greater than 0 m, got 0/],
    [{ shape: 'square', edgeM: -1, wavelengthM: 0.05 }, /edgeM must be greater than 0 m, got -1/],
    [{ shape: 'square', edgeM: 1, wavelengthM: 0 }, /wavelengthM must be greater than 0 m, got 0/],
    [{ shape: 'square', edgeM: Number.NaN, wavelengthM: 0.05 }, /edgeM must be a finite number, got NaN/],
    [{ shape: 'square', edgeM: 1, wavelengthM: Infinity }, /wavelengthM must be a finite number, got Infinity/],
  ])('rejects a bad reflector %#', (r, msg) => {
    expect(() => validateReflector(r as Reflector)).toThrow(RangeError);
    expect(() => peakRcsM2(r as Reflector)).toThrow(msg);
  });
});

describe('checkOpticalRegion', () => {
  it('flags an edge shorter than 10 λ as a Result, not an exception', () => {
    const small = checkOpticalRegion({ shape: 'triangular', edgeM: 0.2, wavelengthM: 0.24 });
    expect(small.ok).toBe(false);
    if (!small.ok) {
      expect(small.error.kind).toBe('below-optical-region');
      expect(small.error.edgeWavelengths).toBeCloseTo(0.2 / 0.24, 12);
      expect(small.error.message).toMatch(/10 λ/);
    }
    expect(checkOpticalRegion({ shape: 'triangular', edgeM: 1, wavelengthM: 0.1 }).ok).toBe(true);
  });
});

describe('effectiveAreaRatio, triangular closed form', () => {
  it('is 1/√3 at boresight', () => {
    // Source: Doerry, Reflectors for SAR Performance Testing (Sandia, 2nd ed.): s = √3 → s − 2/s = 1/√3.
    const s = 1 / Math.sqrt(3);
    expect(effectiveAreaRatio('triangular', [s, s, s])).toBeCloseTo(1 / Math.sqrt(3), 15);
  });

  it('matches hand-derived values at chosen cosines, both branches', () => {
    // Source: Doerry (Sandia report, 2nd ed.) and Brock & Doerry 2009, SAND2009-2993 — the two-branch form.
    // c = (0.2, 0.3, √0.87): c1 + c2 = 0.5 ≤ c3 = 0.9327 → 4·0.2·0.3/s (derived by hand).
    const c3 = Math.sqrt(0.87);
    expect(effectiveAreaRatio('triangular', [0.3, c3, 0.2])).toBeCloseTo(0.24 / (0.5 + c3), 14);
    // c = (0.5, 0.5, √0.5): c1 + c2 = 1 > 0.7071 → s − 2/s with s = 1 + √0.5 (derived by hand).
    const s = 1 + Math.SQRT1_2;
    expect(effectiveAreaRatio('triangular', [Math.SQRT1_2, 0.5, 0.5])).toBeCloseTo(s - 2 / s, 14);
  });

  it('matches the fixture directions through the reflector frame (test/fixtures/reflector)', () => {
    // [derived] values from a separate Python evaluation of the Doerry closed form; see the fixture README.
    for (const row of fixture.rows) {
      const c = edgeCosinesFromBody(bodyVectorFromDirection(row));
      c.forEach((ci, i) => expect(ci).toBeCloseTo(row.cosines[i], 13));
      expect(Math.abs(effectiveAreaRatio('triangular', c) - row.triangularAreaRatio)).toBeLessThan(TOL_RATIO);
    }
    expect(new Set(fixture.rows.map((r) => r.branch)).size).toBe(2);
  });

  it('is continuous at the branch boundary c1 + c2 = c3, where both branches equal 2 c1 c2 / c3', () => {
    // Continuity check suggested in ../shared/REFERENCES.md §1 (a 1/√3-scaled branch would fail here).
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 1, noNaN: true }), fc.double({ min: 0.05, max: 1, noNaN: true }), (p, q) => {
        const c = unit([p, q, p + q]);
        const onBoundary = (2 * c[0] * c[1]) / c[2];
        const s = c[0] + c[1] + c[2];
        expect(Math.abs((4 * c[0] * c[1]) / s - onBoundary)).toBeLessThan(1e-12);
        expect(Math.abs(s - 2 / s - onBoundary)).toBeLessThan(1e-12);
        expect(Math.abs(effectiveAreaRatio('triangular', c) - onBoundary)).toBeLessThan(1e-12);
        const DELTA = 1e-7;
        const above = effectiveAreaRatio('triangular', unit([p, q, p + q + DELTA]));
        const below = effectiveAreaRatio('triangular', unit([p, q, p + q - DELTA]));
        expect(Math.abs(above - below)).toBeLessThan(1e-5);
      }),
    );
  });

  it('does not depend on the order of the cosines', () => {
    fc.assert(
      fc.property(fc.tuple(fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true })), (v) => {
        const c = unit(v);
        for (const shape of ['triangular', 'square'] as const) {
          const ref = effectiveAreaRatio(shape, c);
          expect(effectiveAreaRatio(shape, [c[2], c[0], c[1]])).toBeCloseTo(ref, 12);
          expect(effectiveAreaRatio(shape, [c[1], c[0], c[2]])).toBeCloseTo(ref, 12);
        }
      }),
    );
  });
});

describe('effectiveAreaRatio, square', () => {
  it('is √3 at boresight: the whole regular hexagon of side a√(2/3)', () => {
    // Analytic: the cube corner seen along its diagonal projects to a regular hexagon, side a·√(1 − 1/3), area
    // (3√3/2)(2/3)a² = √3 a², centred on the apex, so it coincides with its reflection. Then 4π(√3 a²)²/λ²
    // = 12π a⁴/λ², the published peak (Robertson 1947; Ruck et al. 1970).
    const s = 1 / Math.sqrt(3);
    const hexagonArea = ((3 * Math.sqrt(3)) / 2) * (2 / 3);
    expect(effectiveAreaRatio('square', [s, s, s])).toBeCloseTo(hexagonArea, 14);
    expect(hexagonArea).toBeCloseTo(Math.sqrt(3), 15);
  });

  it('falls to zero toward a face, like the triangular pattern', () => {
    const c = unit([1, 1, 1e-9]);
    expect(effectiveAreaRatio('square', c)).toBeLessThan(1e-6);
    expect(effectiveAreaRatio('triangular', c)).toBeLessThan(1e-6);
  });
});

describe('effectiveAreaRatio, bounds and bad input', () => {
  it('is 0 for any non-positive cosine (outside the octant)', () => {
    for (const shape of ['triangular', 'square'] as const) {
      expect(effectiveAreaRatio(shape, unit([0, 1, 1]))).toBe(0);
      expect(effectiveAreaRatio(shape, unit([-0.1, 1, 1]))).toBe(0);
      expect(effectiveAreaRatio(shape, [0, 0, -1])).toBe(0);
    }
  });

  it('lies in [0, peak] for any unit vector (property)', () => {
    fc.assert(
      fc.property(fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true })), (v) => {
        fc.pre(Math.hypot(...v) > 1e-3);
        const c = unit(v);
        for (const shape of ['triangular', 'square'] as const) {
          const r = effectiveAreaRatio(shape, c);
          expect(r).toBeGreaterThanOrEqual(0);
          expect(r).toBeLessThanOrEqual(peakAreaRatio(shape));
        }
      }),
    );
  });

  it.each([
    [[Number.NaN, 0.5, 0.5], /cosines\[0\] must be a finite number, got NaN/],
    [[0.5, Infinity, 0.5], /cosines\[1\] must be a finite number/],
    [[0.5, 0.5, 0.5], /cosines must be the direction cosines of a unit vector/],
  ])('rejects %j', (c, msg) => {
    expect(() => effectiveAreaRatio('triangular', c as [number, number, number])).toThrow(msg);
  });

  it('rejects an unknown shape', () => {
    expect(() => effectiveAreaRatio('round' as never, unit([1, 1, 1]))).toThrow(/shape must be one of triangular, square/);
    expect(() => peakAreaRatio('round' as never)).toThrow(RangeError);
  });
});
