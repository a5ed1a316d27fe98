import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { brentRoot } from '../../../src/core/orbit/brent.ts';

describe('brentRoot (Brent 1973, ch. 4)', () => {
  it('finds cos x = 0 in [0, 3] to the tolerance, in few evaluations', () => {
    const r = brentRoot(Math.cos, 0, 3, 1e-12);
    expect(Math.abs(r.x - Math.PI / 2)).toBeLessThan(1e-12);
    expect(r.evaluations).toBeLessThan(12);
  });

  it('brackets every root of a shifted cubic within the tolerance', () => {
    fc.assert(
      fc.property(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: 1e-9, max: 1e-2, noNaN: true }), (root, tol) => {
        const f = (x: number) => (x - root) ** 3 + (x - root);
        const r = brentRoot(f, -100, 100, tol);
        expect(Math.abs(r.x - root)).toBeLessThanOrEqual(tol);
      }),
    );
  });

  it('returns an endpoint that is already a root, and refuses a non-bracket', () => {
    expect(brentRoot((x) => x, 0, 1, 1e-9).x).toBe(0);
    expect(() => brentRoot((x) => x * x + 1, -1, 1, 1e-9)).toThrow(/do not bracket a root/);
    expect(() => brentRoot((x) => x, -1, 1, 0)).toThrow(/tol must be greater than 0/);
  });
});
