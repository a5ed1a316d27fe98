import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { applyTiltBias, reversalCalibration } from '../../../src/core/alignment/reversal.ts';
import {
  deviceAnglesFromPlateOrientation,
  plateOrientationFromDeviceAngles,
  type DeviceOrientationAngles,
} from '../../../src/core/alignment/deviceOrientation.ts';
import { orientationFromAxes, reflectorAxesEnu, type ReflectorOrientation } from '../../../src/core/geometry/orientation.ts';
import type { Vec3 } from '../../../src/core/vec3.ts';

const TOL_DEG = 1e-9; // the reversal is exact for a constant bias; only rounding remains

/** A phone whose beta and gamma readings are offset by fixed biases (e.g. an accelerometer offset). */
function biasedReading(truePose: ReflectorOrientation, betaBiasDeg: number, gammaBiasDeg: number) {
  const a: DeviceOrientationAngles = deviceAnglesFromPlateOrientation(truePose);
  const r = plateOrientationFromDeviceAngles({ ...a, betaDeg: a.betaDeg + betaBiasDeg, gammaDeg: a.gammaDeg + gammaBiasDeg });
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

/** The phone turned end for end on the plate: top toward the inner corner, right edge toward the plate's left. */
function turnedEndForEnd(plate: ReflectorOrientation): ReflectorOrientation {
  const { forward, up } = reflectorAxesEnu(plate);
  const back: Vec3 = [-forward[0], -forward[1], -forward[2]];
  const o = orientationFromAxes(back, up);
  if (!o) throw new Error('degenerate');
  return o;
}

describe('reversalCalibration', () => {
  it('separates tilt and bias: (t1 − t2)/2 and (t1 + t2)/2', () => {
    expect(reversalCalibration(12.5, -11.5)).toEqual({ tiltDeg: 12, biasDeg: 0.5 });
    expect(reversalCalibration(-3, 3)).toEqual({ tiltDeg: -3, biasDeg: 0 });
  });

  it('recovers the plate tilt and the sensor bias from a simulated biased phone, signs included', () => {
    const plate: ReflectorOrientation = { azimuthDeg: 123, tiltDeg: 18.4, rollDeg: 2.5 };
    const betaBiasDeg = 0.7;
    const gammaBiasDeg = -0.4;
    const p1 = biasedReading(plate, betaBiasDeg, gammaBiasDeg);
    const p2 = biasedReading(turnedEndForEnd(plate), betaBiasDeg, gammaBiasDeg);
    // The raw readings are wrong by the bias…
    expect(p1.tiltDeg).toBeCloseTo(plate.tiltDeg + betaBiasDeg, 9);
    // …the reversal removes it: tilt bias = beta bias (tilt = beta for a phone on the plate).
    const t = reversalCalibration(p1.tiltDeg, p2.tiltDeg);
    expect(t.tiltDeg).toBeCloseTo(plate.tiltDeg, 9);
    expect(t.biasDeg).toBeCloseTo(betaBiasDeg, 9);
    expect(applyTiltBias(p1.tiltDeg, t.biasDeg)).toBeCloseTo(plate.tiltDeg, 9);
    // Turning end for end also reverses roll, so the same formula separates a roll bias (roll = −gamma).
    const r = reversalCalibration(p1.rollDeg, p2.rollDeg);
    expect(r.tiltDeg).toBeCloseTo(plate.rollDeg, 9);
    expect(r.biasDeg).toBeCloseTo(-gammaBiasDeg, 9);
  });

  it('holds for any plate tilt, roll, heading and bias (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359, noNaN: true }),
        fc.double({ min: -40, max: 40, noNaN: true }),
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        (azimuthDeg, tiltDeg, rollDeg, biasDeg) => {
          const plate = { azimuthDeg, tiltDeg, rollDeg };
          const t1 = biasedReading(plate, biasDeg, 0).tiltDeg;
          const t2 = biasedReading(turnedEndForEnd(plate), biasDeg, 0).tiltDeg;
          const c = reversalCalibration(t1, t2);
          expect(Math.abs(c.tiltDeg - tiltDeg)).toBeLessThan(TOL_DEG);
          expect(Math.abs(c.biasDeg - biasDeg)).toBeLessThan(TOL_DEG);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('rejects non-finite and out-of-range readings, naming them', () => {
    expect(() => reversalCalibration(NaN, 0)).toThrow(/t1Deg/);
    expect(() => reversalCalibration(0, 91)).toThrow(/t2Deg must be in \[-90, 90\]/);
    expect(() => applyTiltBias(10, Infinity)).toThrow(/biasDeg/);
    expect(() => applyTiltBias(10, 50)).toThrow(RangeError);
  });
});
