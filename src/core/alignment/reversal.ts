/**
 * Two-position reversal: separate the plate's tilt from the phone's own tilt bias.
 *
 * A phone's tilt reading carries a bias b (accelerometer offset, a case that does not sit flat). Reading 1 is taken
 * with the phone's top toward the open side: t₁ = T + b. The phone is then turned end for end on the same spot
 * (180° about the plate normal), so the plate's tilt enters with the opposite sign while the bias does not:
 * t₂ = −T + b. Hence
 *   T = (t₁ − t₂)/2,   b = (t₁ + t₂)/2.
 * Turning end for end also reverses the roll reading, so the same pair of formulas separates a roll bias
 * (feed it the two roll readings).
 * Source: the standard reversal technique — Evans, Hocken & Estler, "Self-calibration: reversal, redundancy, error
 *   separation, and 'absolute testing'", CIRP Annals 45(2), 1996 (the reversal method).
 * Validity: the bias must be the same in both positions (same phone, same spot, a few seconds apart) and the phone
 * must sit on the same patch of the plate, since the plate's flatness error is not reversed.
 */
import { requireInRange } from '../validate.ts';

export interface ReversalCalibration {
  /** Tilt of the plate, degrees (open side raised positive): (t₁ − t₂)/2. */
  tiltDeg: number;
  /** Bias of the phone's tilt reading, degrees: (t₁ + t₂)/2. Subtract it from later readings. */
  biasDeg: number;
}

const TILT_RANGE = { min: -90, max: 90, unit: '°' } as const;

/**
 * Reversal of two tilt (or two roll) readings: `t1Deg` with the phone's top toward the open side, `t2Deg` after
 * turning the phone end for end on the same spot. See the file header for the formula and its source.
 */
export function reversalCalibration(t1Deg: number, t2Deg: number): ReversalCalibration {
  requireInRange('t1Deg', t1Deg, TILT_RANGE);
  requireInRange('t2Deg', t2Deg, TILT_RANGE);
  return { tiltDeg: (t1Deg - t2Deg) / 2, biasDeg: (t1Deg + t2Deg) / 2 };
}

/** A reading with the phone's top toward the open side, corrected for the bias found by reversal: t − b. */
export function applyTiltBias(measuredTiltDeg: number, biasDeg: number): number {
  requireInRange('measuredTiltDeg', measuredTiltDeg, TILT_RANGE);
  requireInRange('biasDeg', biasDeg, { min: -45, max: 45, unit: '°' });
  return measuredTiltDeg - biasDeg;
}
