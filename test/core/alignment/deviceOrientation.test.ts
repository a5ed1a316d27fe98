import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  compassHeadingToAlphaDeg,
  deviceAnglesFromPlateOrientation,
  deviceRotationMatrixEnu,
  magneticToTrueAzimuthDeg,
  plateOrientationFromDeviceAngles,
  type DeviceOrientationAngles,
} from '../../../src/core/alignment/deviceOrientation.ts';
import type { ReflectorOrientation } from '../../../src/core/geometry/orientation.ts';

const TOL_DEG = 0.01; // round-trip tolerance asked of the module
const TOL_MATRIX = 1e-12; // matrix elements (dimensionless)

type M3 = number[][];
const d2r = Math.PI / 180;

/** Right-handed rotation by `deg` about a unit axis (Rodrigues' formula), written independently of the module. */
function axisRotation(axis: [number, number, number], deg: number): M3 {
  const [x, y, z] = axis;
  const c = Math.cos(deg * d2r), s = Math.sin(deg * d2r), k = 1 - c;
  return [
    [c + x * x * k, x * y * k - z * s, x * z * k + y * s],
    [y * x * k + z * s, c + y * y * k, y * z * k - x * s],
    [z * x * k - y * s, z * y * k + x * s, c + z * z * k],
  ];
}
const mul = (a: M3, b: M3): M3 => a.map((row) => [0, 1, 2].map((j) => row[0] * b[0][j] + row[1] * b[1][j] + row[2] * b[2][j]));
const X: [number, number, number] = [1, 0, 0];
const Y: [number, number, number] = [0, 1, 0];
const Z: [number, number, number] = [0, 0, 1];

/**
 * The plate's axes as matrix columns [right | forward | up] in ENU, built from first principles: start level with
 * the bisector north, roll about the bisector (right-hand side up for positive roll = rotation by −roll about +y),
 * raise the open side (rotation by +tilt about the right axis), then turn clockwise by the azimuth (−azimuth about up).
 */
function plateMatrix(o: ReflectorOrientation): M3 {
  return mul(axisRotation(Z, -o.azimuthDeg), mul(axisRotation(X, o.tiltDeg), axisRotation(Y, -o.rollDeg)));
}
/** The W3C matrix Rz(α)·Rx(β)·Ry(γ) composed from elementary rotations (W3C DeviceOrientation Event Specification). */
function w3cMatrix(a: DeviceOrientationAngles): M3 {
  return mul(axisRotation(Z, a.alphaDeg), mul(axisRotation(X, a.betaDeg), axisRotation(Y, a.gammaDeg)));
}
const maxAbsDiff = (a: M3, b: readonly (readonly number[])[]) =>
  Math.max(...a.flatMap((row, i) => row.map((v, j) => Math.abs(v - b[i][j]))));
const angleDiffDeg = (a: number, b: number) => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

function expectOrientationClose(got: ReflectorOrientation, want: ReflectorOrientation) {
  expect(angleDiffDeg(got.azimuthDeg, want.azimuthDeg)).toBeLessThan(TOL_DEG);
  expect(Math.abs(got.tiltDeg - want.tiltDeg)).toBeLessThan(TOL_DEG);
  expect(angleDiffDeg(got.rollDeg, want.rollDeg)).toBeLessThan(TOL_DEG);
}

/** Worst error of one round trip; checks the W3C ranges and the matrix identity on the way. */
function roundTripErrors(o: ReflectorOrientation): { angleDeg: number; matrix: number } {
  const a = deviceAnglesFromPlateOrientation(o);
  const inRanges =
    a.alphaDeg >= 0 && a.alphaDeg < 360 && a.betaDeg >= -180 && a.betaDeg < 180 && a.gammaDeg >= -90 && a.gammaDeg < 90;
  if (!inRanges) throw new Error(`angles outside the W3C ranges: ${JSON.stringify(a)}`);
  // The angles reproduce the plate's rotation matrix, through an independent composition of the W3C rotations.
  const matrix = Math.max(maxAbsDiff(w3cMatrix(a), plateMatrix(o)), maxAbsDiff(w3cMatrix(a), deviceRotationMatrixEnu(a)));
  const back = plateOrientationFromDeviceAngles(a);
  if (!back.ok) throw new Error(back.error.message);
  const angleDeg = Math.max(
    angleDiffDeg(back.value.azimuthDeg, o.azimuthDeg),
    Math.abs(back.value.tiltDeg - o.tiltDeg),
    angleDiffDeg(back.value.rollDeg, o.rollDeg),
  );
  return { angleDeg, matrix };
}
function roundTrip(o: ReflectorOrientation) {
  const e = roundTripErrors(o);
  expect(e.angleDeg).toBeLessThan(TOL_DEG);
  expect(e.matrix).toBeLessThan(TOL_MATRIX);
}

describe('plateOrientationFromDeviceAngles: hand-checked cases', () => {
  it('flat phone, top toward north: alpha = beta = gamma = 0 → azimuth 0, tilt 0, roll 0', () => {
    const r = plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 0, gammaDeg: 0 });
    expect(r).toEqual({ ok: true, value: { azimuthDeg: 0, tiltDeg: 0, rollDeg: 0 } });
  });

  it('beta = +20 raises the top edge: tilt +20 (open side up)', () => {
    const r = plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 20, gammaDeg: 0 });
    if (!r.ok) throw new Error('expected ok');
    expectOrientationClose(r.value, { azimuthDeg: 0, tiltDeg: 20, rollDeg: 0 });
  });

  it('gamma = +10 lowers the right-hand side: roll −10 (from column 1 of R: up-component −cos β sin γ)', () => {
    const R = deviceRotationMatrixEnu({ alphaDeg: 0, betaDeg: 0, gammaDeg: 10 });
    expect(R[2][0]).toBeCloseTo(-Math.sin(10 * d2r), 12); // the device x axis (right edge) points below the horizon
    const r = plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 0, gammaDeg: 10 });
    if (!r.ok) throw new Error('expected ok');
    expectOrientationClose(r.value, { azimuthDeg: 0, tiltDeg: 0, rollDeg: -10 });
  });

  it('alpha is anticlockwise: alpha = 90 points the top edge west (azimuth 270); alpha 30, beta 10 → 330, tilt 10', () => {
    const w = plateOrientationFromDeviceAngles({ alphaDeg: 90, betaDeg: 0, gammaDeg: 0 });
    if (!w.ok) throw new Error('expected ok');
    expectOrientationClose(w.value, { azimuthDeg: 270, tiltDeg: 0, rollDeg: 0 });
    const r = plateOrientationFromDeviceAngles({ alphaDeg: 30, betaDeg: 10, gammaDeg: 0 });
    if (!r.ok) throw new Error('expected ok');
    expectOrientationClose(r.value, { azimuthDeg: 330, tiltDeg: 10, rollDeg: 0 });
  });

  it('phone flipped over its top (beta 150): top points back south, raised 30°, screen down (roll 180)', () => {
    const r = plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 150, gammaDeg: 0 });
    if (!r.ok) throw new Error('expected ok');
    expectOrientationClose(r.value, { azimuthDeg: 180, tiltDeg: 30, rollDeg: 180 });
  });
});

describe('round trip plate orientation → W3C angles → plate orientation', () => {
  it('every heading 0–359°, tilts 0–60°, rolls ±20° (grid)', () => {
    let worstDeg = 0, worstMatrix = 0;
    for (let az = 0; az < 360; az += 1) {
      for (let tilt = 0; tilt <= 60; tilt += 7.5) {
        for (let roll = -20; roll <= 20; roll += 5) {
          const e = roundTripErrors({ azimuthDeg: az, tiltDeg: tilt, rollDeg: roll });
          worstDeg = Math.max(worstDeg, e.angleDeg);
          worstMatrix = Math.max(worstMatrix, e.matrix);
        }
      }
    }
    expect(worstDeg).toBeLessThan(TOL_DEG);
    expect(worstMatrix).toBeLessThan(TOL_MATRIX);
  });

  it('random orientations, including negative tilts and large rolls (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        fc.double({ min: -179, max: 179, noNaN: true }),
        (azimuthDeg, tiltDeg, rollDeg) => roundTrip({ azimuthDeg, tiltDeg, rollDeg }),
      ),
      { numRuns: 2000 },
    );
  });

  it('any W3C angles give back the same rotation after plate → angles (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
        fc.double({ min: -70, max: 70, noNaN: true }),
        fc.double({ min: -89.9, max: 89.9, noNaN: true }),
        (alphaDeg, betaDeg, gammaDeg) => {
          const r = plateOrientationFromDeviceAngles({ alphaDeg, betaDeg, gammaDeg });
          if (!r.ok) throw new Error('expected ok');
          const again = deviceAnglesFromPlateOrientation(r.value);
          expect(maxAbsDiff(w3cMatrix(again), w3cMatrix({ alphaDeg, betaDeg, gammaDeg }))).toBeLessThan(TOL_MATRIX);
        },
      ),
      { numRuns: 1000 },
    );
  });
});

describe('phone near vertical', () => {
  it('top edge 80° up gives the error with its tilt and a plain message, not a number', () => {
    const r = plateOrientationFromDeviceAngles({ alphaDeg: 40, betaDeg: 80, gammaDeg: 5 });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.kind).toBe('phone-near-vertical');
    expect(r.error.tiltDeg).toBeCloseTo(80, 9);
    expect(r.error.message).toMatch(/almost upright/);
    expect(r.error.message).toMatch(/lay it flat on the base plate/);
  });

  it('exactly upright (beta ±90, gimbal lock) and top down (beta −85) are errors too', () => {
    for (const betaDeg of [90, -90, -85, 89.999]) {
      const r = plateOrientationFromDeviceAngles({ alphaDeg: 10, betaDeg, gammaDeg: 30 });
      expect(r.ok).toBe(false);
    }
  });

  it('the limit follows maxTiltDeg (default 75°)', () => {
    expect(plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 74.9, gammaDeg: 0 }).ok).toBe(true);
    expect(plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 75.1, gammaDeg: 0 }).ok).toBe(false);
    expect(plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 50, gammaDeg: 0 }, { maxTiltDeg: 45 }).ok).toBe(false);
    expect(() => plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 0, gammaDeg: 0 }, { maxTiltDeg: 90 })).toThrow(
      /maxTiltDeg must be in \(0, 90\)/,
    );
  });
});

describe('bad input', () => {
  it('non-finite angles throw RangeError naming the angle', () => {
    expect(() => plateOrientationFromDeviceAngles({ alphaDeg: NaN, betaDeg: 0, gammaDeg: 0 })).toThrow(RangeError);
    expect(() => plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: Infinity, gammaDeg: 0 })).toThrow(/betaDeg/);
    expect(() => plateOrientationFromDeviceAngles({ alphaDeg: 0, betaDeg: 0, gammaDeg: -Infinity })).toThrow(/gammaDeg/);
    expect(() => compassHeadingToAlphaDeg(NaN)).toThrow(/headingDeg/);
    expect(() => magneticToTrueAzimuthDeg(10, 200)).toThrow(/declinationDeg must be in \[-180, 180\]/);
  });
});

describe('magnetic → true, compass heading → alpha', () => {
  it('adds an east-positive declination and wraps into [0, 360)', () => {
    expect(magneticToTrueAzimuthDeg(350, 15)).toBeCloseTo(5, 12);
    expect(magneticToTrueAzimuthDeg(10, -12)).toBeCloseTo(358, 12);
  });

  it('alpha = 360 − heading; a flat phone with that alpha has the heading as its azimuth', () => {
    expect(compassHeadingToAlphaDeg(0)).toBe(0);
    expect(compassHeadingToAlphaDeg(90)).toBe(270);
    expect(compassHeadingToAlphaDeg(359.5)).toBeCloseTo(0.5, 12);
    for (let h = 0; h < 360; h += 15) {
      const r = plateOrientationFromDeviceAngles({ alphaDeg: compassHeadingToAlphaDeg(h), betaDeg: 0, gammaDeg: 0 });
      if (!r.ok) throw new Error('expected ok');
      expect(angleDiffDeg(r.value.azimuthDeg, h)).toBeLessThan(1e-9);
    }
  });
});
