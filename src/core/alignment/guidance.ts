/**
 * Turning a measured plate orientation into plain instructions for the crew: which way to turn, raise or lower,
 * and when to hold.
 *
 * Errors are measured − target: azimuth wrapped to (−180°, 180°] (clockwise positive, CONVENTIONS.md), tilt and roll
 * plain differences. A negative azimuth error means the plate points anticlockwise of the target, so the crew turns
 * it clockwise (seen from above); a negative tilt error means the open side is too low; a negative roll error means
 * the right-hand side (seen facing along the bisector, i.e. looking out through the open side) is too low.
 */
import { wrapSignedDeg } from '../units.ts';
import { requireFinite, requireInRange, requirePositive } from '../validate.ts';

export interface AlignmentTolerance {
  azimuthDeg: number;
  tiltDeg: number;
  rollDeg: number;
}

/**
 * Tolerance presets, degrees (common practice, no source). `calibration` is for reflectors used as radiometric
 * references, `monitoring` for reflectors whose phase is tracked over time. Use `toleranceLossDb` with the reflector
 * pattern to see what each tolerance costs in signal.
 */
export const TOLERANCE_PRESETS: Readonly<Record<'calibration' | 'monitoring', Readonly<AlignmentTolerance>>> = {
  calibration: { azimuthDeg: 0.5, tiltDeg: 0.5, rollDeg: 1 },
  monitoring: { azimuthDeg: 2, tiltDeg: 1, rollDeg: 2 },
};

/** Signal loss (positive dB below peak) for given pointing errors, degrees. Supplied by the caller (reflector pattern). */
export type PointingLossDbFn = (errors: { azimuthErrorDeg: number; tiltErrorDeg: number; rollErrorDeg: number }) => number;

export interface ToleranceLoss {
  /** Worst loss with only the azimuth off by ± its tolerance, dB. */
  azimuthDb: number;
  tiltDb: number;
  rollDb: number;
  /** Worst loss with all three at ± their tolerances together (8 corners), dB. */
  combinedWorstDb: number;
}

/** What a tolerance costs: the loss function evaluated at ± each tolerance alone and at the 8 corners together. */
export function toleranceLossDb(tol: AlignmentTolerance, lossDb: PointingLossDbFn): ToleranceLoss {
  validateTolerance(tol);
  const at = (a: number, t: number, r: number) => {
    const v = lossDb({ azimuthErrorDeg: a, tiltErrorDeg: t, rollErrorDeg: r });
    return requireFinite('lossDb result', v);
  };
  const pm = [-1, 1];
  const worst = (f: (s: number) => number) => Math.max(...pm.map(f));
  let combinedWorstDb = -Infinity;
  for (const sa of pm) for (const st of pm) for (const sr of pm) {
    combinedWorstDb = Math.max(combinedWorstDb, at(sa * tol.azimuthDeg, st * tol.tiltDeg, sr * tol.rollDeg));
  }
  return {
    azimuthDb: worst((s) => at(s * tol.azimuthDeg, 0, 0)),
    tiltDb: worst((s) => at(0, s * tol.tiltDeg, 0)),
    rollDb: worst((s) => at(0, 0, s * tol.rollDeg)),
    combinedWorstDb,
  };
}

export interface AxisGuidance<E extends number | null = number> {
  /** measured − target, degrees (azimuth wrapped to (−180, 180]); null when azimuth was not measured. */
  errorDeg: E;
  within: boolean;
  instruction: string;
}

export interface Guidance {
  azimuth: AxisGuidance<number | null>;
  tilt: AxisGuidance;
  roll: AxisGuidance;
  /** All three within tolerance; false while the azimuth is unmeasured (null). */
  allWithin: boolean;
}

export const NO_AZIMUTH_INSTRUCTION =
  'no compass reading: set the azimuth by another method (sun shadow or a reference bearing, with a tape layout)';

/** Magnitude for an instruction: one decimal, two when one would show 0.0. */
const amount = (deg: number) => `${Math.abs(deg).toFixed(Math.abs(deg) < 0.05 ? 2 : 1)}°`;

function validateTolerance(tol: AlignmentTolerance): void {
  requirePositive('tol.azimuthDeg', tol.azimuthDeg, '°');
  requirePositive('tol.tiltDeg', tol.tiltDeg, '°');
  requirePositive('tol.rollDeg', tol.rollDeg, '°');
}

const TILT = { min: -90, max: 90, unit: '°' } as const;
const ROLL = { min: -180, max: 180, unit: '°' } as const;

/**
 * Instructions to bring the measured orientation onto the target, axis by axis; "hold" once within tolerance.
 * Target roll defaults to 0 (a level plate side to side).
 */
export function guidance(
  target: { azimuthDeg: number; tiltDeg: number; rollDeg?: number },
  measured: { azimuthDeg: number | null; tiltDeg: number; rollDeg: number },
  tol: AlignmentTolerance,
): Guidance {
  requireFinite('target.azimuthDeg', target.azimuthDeg);
  requireInRange('target.tiltDeg', target.tiltDeg, TILT);
  const targetRollDeg = requireInRange('target.rollDeg', target.rollDeg ?? 0, ROLL);
  if (measured.azimuthDeg !== null) requireFinite('measured.azimuthDeg', measured.azimuthDeg);
  requireInRange('measured.tiltDeg', measured.tiltDeg, TILT);
  requireInRange('measured.rollDeg', measured.rollDeg, ROLL);
  validateTolerance(tol);

  let azimuth: AxisGuidance<number | null>;
  if (measured.azimuthDeg === null) {
    azimuth = { errorDeg: null, within: false, instruction: NO_AZIMUTH_INSTRUCTION };
  } else {
    const e = wrapSignedDeg(measured.azimuthDeg - target.azimuthDeg);
    const within = Math.abs(e) <= tol.azimuthDeg;
    const instruction = within ? 'hold' : `turn ${amount(e)} ${e < 0 ? 'clockwise' : 'anticlockwise'}`;
    azimuth = { errorDeg: e, within, instruction };
  }

  const te = measured.tiltDeg - target.tiltDeg;
  const tiltWithin = Math.abs(te) <= tol.tiltDeg;
  const tilt = {
    errorDeg: te,
    within: tiltWithin,
    instruction: tiltWithin ? 'hold' : `${te < 0 ? 'raise' : 'lower'} the open side ${amount(te)}`,
  };

  const re = wrapSignedDeg(measured.rollDeg - targetRollDeg);
  const rollWithin = Math.abs(re) <= tol.rollDeg;
  const roll = {
    errorDeg: re,
    within: rollWithin,
    instruction: rollWithin ? 'hold' : `${re < 0 ? 'raise' : 'lower'} the right-hand side ${amount(re)}`,
  };

  return { azimuth, tilt, roll, allWithin: azimuth.within && tilt.within && roll.within };
}
