/** Checks of src/core/geometry/orientation.ts as the reflector code uses it (frames of CONVENTIONS.md). */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  bodyVectorFromDirection,
  edgeCosinesFromBody,
  enuToBody,
  orientationFromAxes,
  reflectorAxesEnu,
} from '../../../src/core/geometry/orientation.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG, wrapSignedDeg } from '../../../src/core/units.ts';
import { cross, dot, norm, type Vec3 } from '../../../src/core/vec3.ts';

const TOL = 1e-12; // on unit-vector components
const TOL_DEG = 1e-7;

const orientationArb = fc.record({
  azimuthDeg: fc.double({ min: 0, max: 359.999999, noNaN: true }),
  tiltDeg: fc.double({ min: -89.9, max: 89.9, noNaN: true }),
  rollDeg: fc.double({ min: -179.999, max: 180, noNaN: true }),
});

const close = (a: Vec3, b: Vec3, tol = TOL) => a.forEach((x, i) => expect(Math.abs(x - b[i])).toBeLessThan(tol));

describe('reflector axes', () => {
  it('level reflector facing north: forward = N, right = E, up = U, boresight 35.264° up', () => {
    const ax = reflectorAxesEnu({ azimuthDeg: 0, tiltDeg: 0, rollDeg: 0 });
    close(ax.forward, [0, 1, 0]);
    close(ax.right, [1, 0, 0]);
    close(ax.up, [0, 0, 1]);
    // Boresight elevation atan(1/√2) (Robertson 1947; REFERENCES.md §1).
    expect((Math.asin(ax.boresight[2]) * 180) / Math.PI).toBeCloseTo(TRIHEDRAL_BORESIGHT_ELEVATION_DEG, 10);
  });

  it('axes are orthonormal and right-handed; edges orthonormal; boresight makes 54.7356° with each edge (property)', () => {
    fc.assert(
      fc.property(orientationArb, (o) => {
        const ax = reflectorAxesEnu(o);
        close(cross(ax.right, ax.forward), ax.up);
        for (const e of ax.edges) expect(Math.abs(norm(e) - 1)).toBeLessThan(TOL);
        expect(Math.abs(dot(ax.edges[0], ax.edges[1]))).toBeLessThan(TOL);
        expect(Math.abs(dot(ax.edges[1], ax.edges[2]))).toBeLessThan(TOL);
        expect(Math.abs(dot(ax.edges[0], ax.edges[2]))).toBeLessThan(TOL);
        for (const e of ax.edges) expect(dot(e, ax.boresight)).toBeCloseTo(1 / Math.sqrt(3), 12);
      }),
    );
  });

  it('round trip reflectorAxesEnu → orientationFromAxes (property)', () => {
    fc.assert(
      fc.property(orientationArb, (o) => {
        const ax = reflectorAxesEnu(o);
        const back = orientationFromAxes(ax.forward, ax.up);
        expect(back).not.toBeNull();
        if (!back) return;
        expect(Math.abs(wrapSignedDeg(back.azimuthDeg - o.azimuthDeg))).toBeLessThan(TOL_DEG);
        expect(Math.abs(back.tiltDeg - o.tiltDeg)).toBeLessThan(TOL_DEG);
        expect(Math.abs(wrapSignedDeg(back.rollDeg - o.rollDeg))).toBeLessThan(TOL_DEG);
      }),
    );
  });

  it('edge cosines from the body vector equal dot products with the ENU edges (property)', () => {
    fc.assert(
      fc.property(
        orientationArb,
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (o, elevationDeg, azimuthOffsetDeg) => {
          const ax = reflectorAxesEnu(o);
          const b = bodyVectorFromDirection({ elevationDeg, azimuthOffsetDeg });
          const enu: Vec3 = [0, 1, 2].map((i) => b[0] * ax.right[i] + b[1] * ax.forward[i] + b[2] * ax.up[i]) as unknown as Vec3;
          close(enuToBody(ax, enu), b, 1e-12);
          const c = edgeCosinesFromBody(b);
          ax.edges.forEach((e, i) => expect(Math.abs(dot(e, enu) - c[i])).toBeLessThan(1e-12));
        },
      ),
    );
  });

  it('returns null when the bisector is vertical', () => {
    expect(orientationFromAxes([0, 0, 1], [1, 0, 0])).toBeNull();
  });
});
