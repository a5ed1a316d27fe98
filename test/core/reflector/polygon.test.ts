import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { nelderMead } from '../../../src/core/reflector/nelderMead.ts';
import { convexOverlapArea, signedAreaFlat, type Point2 } from '../../../src/core/reflector/polygon.ts';
import { effectiveAreaRatio } from '../../../src/core/reflector/trihedral.ts';

const TOL_AREA = 1e-12;

const square = (x: number, y: number, s: number): Point2[] => [[x, y], [x + s, y], [x + s, y + s], [x, y + s]];

describe('convexOverlapArea (Sutherland–Hodgman clipping)', () => {
  it('overlapping, disjoint, nested and clockwise squares', () => {
    expect(convexOverlapArea(square(0, 0, 1), square(0.5, 0.25, 1))).toBeCloseTo(0.5 * 0.75, 15);
    expect(convexOverlapArea(square(0, 0, 1), square(2, 0, 1))).toBe(0);
    expect(convexOverlapArea(square(0, 0, 3), square(1, 1, 1))).toBeCloseTo(1, 15);
    expect(convexOverlapArea(square(0, 0, 1).reverse(), square(0.5, 0.5, 1).reverse())).toBeCloseTo(0.25, 15);
    expect(signedAreaFlat(square(0, 0, 2).flat(), 4)).toBe(4);
  });

  it('applied to the triangular aperture, reproduces the published closed form (property)', () => {
    // The overlap rule (Robertson 1947) with this clipper against Doerry's two-branch closed form (Sandia report,
    // 2nd ed.; Brock & Doerry 2009, SAND2009-2993). REFERENCES.md §1 expects agreement to ~1e-12.
    fc.assert(
      fc.property(
        fc.tuple(fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true })),
        (v) => {
          const n = Math.hypot(...v);
          const c: [number, number, number] = [v[0] / n, v[1] / n, v[2] / n];
          // Plane basis: u ∝ c × (0, 0, 1) or c × (1, 0, 0), v = c × u.
          const a = Math.abs(c[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
          let u = [c[1] * a[2] - c[2] * a[1], c[2] * a[0] - c[0] * a[2], c[0] * a[1] - c[1] * a[0]];
          const un = Math.hypot(u[0], u[1], u[2]);
          u = u.map((x) => x / un);
          const w = [c[1] * u[2] - c[2] * u[1], c[2] * u[0] - c[0] * u[2], c[0] * u[1] - c[1] * u[0]];
          const tri: Point2[] = [0, 1, 2].map((i) => [u[i], w[i]]);
          const overlap = convexOverlapArea(tri, tri.map(([x, y]) => [-x, -y]));
          expect(Math.abs(overlap - effectiveAreaRatio('triangular', c))).toBeLessThan(TOL_AREA);
        },
      ),
    );
  });
});

describe('nelderMead', () => {
  it('finds the Rosenbrock minimum (1, 1) from (−1.2, 1)', () => {
    // Standard test function and start point: Rosenbrock, The Computer Journal 3(3):175–184, 1960.
    const f = (x: readonly number[]) => 100 * (x[1] - x[0] ** 2) ** 2 + (1 - x[0]) ** 2;
    const m = nelderMead(f, [-1.2, 1], [0.5, 0.5], { xTol: 1e-10, fTol: 1e-20, maxEvaluations: 5000 });
    expect(m.x[0]).toBeCloseTo(1, 6);
    expect(m.x[1]).toBeCloseTo(1, 6);
    expect(m.evaluations).toBeLessThanOrEqual(5002);
  });
});
