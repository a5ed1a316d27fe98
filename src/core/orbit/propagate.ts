/**
 * SGP4 propagation (satellite.js 7.1.0) and the TEME → Earth-fixed transformation of position and velocity.
 *
 * SGP4/SDP4 itself: Vallado, Crawford, Hujsak & Kelso, "Revisiting Spacetrack Report #3", AIAA 2006-6753,
 *   as implemented by satellite.js (WGS-72 constants, improved mode 'i'). Output is in the True Equator, Mean
 *   Equinox (TEME) frame, km and km/s. Verified against the paper's 'tcppver.out' in test/core/orbit/propagate.test.ts.
 * TEME → ECEF (pseudo-Earth-fixed, polar motion neglected: < 15 m at the surface), Vallado, "Fundamentals of
 *   Astrodynamics and Applications", 4th ed., 2013, §3.7 (teme2ecef) and eq. 3-80 for the velocity:
 *     r_ecef = R₃(θ_GMST) r_teme
 *     v_ecef = R₃(θ_GMST) v_teme − ω⊕ × r_ecef,   ω⊕ = (0, 0, ω_E)
 *   θ_GMST from the IAU-82 GMST polynomial (satellite.js gstime, Vallado eq. 3-45) evaluated with UT1 ≈ UTC;
 *   |UT1 − UTC| < 0.9 s shifts the Earth-fixed longitude of the orbit by < 0.004°.
 */
import { eciToEcf, gstime, sgp4, twoline2satrec, type SatRec } from 'satellite.js';
import { err, ok, type Result } from '../result.ts';
import { EARTH_ROTATION_RAD_PER_S } from '../units.ts';
import { requireFinite } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';

/** Counts SGP4 evaluations, so callers and the benchmark can compare methods. */
export interface PropagationCounter {
  count: number;
}

/** A satellite ready to propagate. Opaque apart from the fields below. */
export interface OrbitModel {
  readonly satrec: SatRec;
  /** Element-set epoch as used by SGP4, ms since 1970 UTC. */
  readonly epochMs: number;
  /** Anomalistic period 2π/n₀ from SGP4's recovered mean motion, minutes. */
  readonly periodMin: number;
}

/** Satellite state at one instant. TEME and ECEF (WGS84 axes), km and km/s. */
export interface OrbitState {
  timeMs: number;
  positionTemeKm: Vec3;
  velocityTemeKmPerS: Vec3;
  positionEcefKm: Vec3;
  /** Earth-fixed velocity, including the −ω⊕ × r term. */
  velocityEcefKmPerS: Vec3;
}

export type PropagationErrorKind =
  | 'eccentricity-out-of-range'
  | 'mean-motion-below-zero'
  | 'perturbed-eccentricity-out-of-range'
  | 'semi-latus-rectum-below-zero'
  | 'decayed'
  | 'invalid-elements';

export interface PropagationError {
  kind: PropagationErrorKind;
  /** SGP4 error code (satrec.error), 0 when the elements did not even initialise. */
  code: number;
  message: string;
  timeMs?: number;
}

const MS_PER_MIN = 60_000;
const MS_PER_DAY = 86_400_000;
/** Julian date of 1970-01-01T00:00Z. */
const JD_UNIX_EPOCH = 2_440_587.5;

/** SGP4 error codes → kind and plain words (codes from Vallado et al. 2006, sgp4 routine). */
const SGP4_ERRORS: Record<number, [PropagationErrorKind, string]> = {
  1: ['eccentricity-out-of-range', 'mean eccentricity is outside 0 ≤ e < 1 — the elements are invalid or the orbit has decayed'],
  2: ['mean-motion-below-zero', 'mean motion has fallen below zero — the elements are invalid this far from their epoch'],
  3: ['perturbed-eccentricity-out-of-range', 'perturbed eccentricity is outside 0 ≤ e < 1 — the elements are invalid this far from their epoch'],
  4: ['semi-latus-rectum-below-zero', 'semi-latus rectum is below zero — the orbit has decayed'],
  6: ['decayed', 'the satellite has decayed (computed position is below the Earth’s surface)'],
};

function sgp4Error(code: number, timeMs?: number): PropagationError {
  const [kind, message] = SGP4_ERRORS[code] ?? (['invalid-elements', `SGP4 failed with code ${code}`] as const);
  return { kind, code, message, timeMs };
}

/** Julian date (UTC) for ms since 1970. */
const julianDateFromMs = (timeMs: number): number => timeMs / MS_PER_DAY + JD_UNIX_EPOCH;

/** Initialise SGP4 from the two lines of a (checked) element set. */
export function orbitModelFromTle(line1: string, line2: string): Result<OrbitModel, PropagationError> {
  let satrec: SatRec;
  try {
    satrec = twoline2satrec(line1, line2);
  } catch (e) {
    return err({ kind: 'invalid-elements', code: 0, message: `SGP4 could not read the elements: ${e instanceof Error ? e.message : String(e)}` });
  }
  if (satrec.error) return err(sgp4Error(satrec.error));
  if (!(satrec.no > 0) || !Number.isFinite(satrec.jdsatepoch)) {
    return err({ kind: 'invalid-elements', code: 0, message: 'SGP4 could not read the mean motion or epoch from the elements' });
  }
  const epochMs = (satrec.jdsatepoch - JD_UNIX_EPOCH) * MS_PER_DAY;
  return ok({ satrec, epochMs, periodMin: (2 * Math.PI) / satrec.no });
}

/** TEME position (km) and velocity (km/s) at `minutesFromEpoch`; the raw SGP4 step, counted. */
export function propagateTemeMin(
  model: OrbitModel,
  minutesFromEpoch: number,
  counter?: PropagationCounter,
): Result<{ positionTemeKm: Vec3; velocityTemeKmPerS: Vec3 }, PropagationError> {
  requireFinite('minutesFromEpoch', minutesFromEpoch);
  if (counter) counter.count += 1;
  const pv = sgp4(model.satrec, minutesFromEpoch);
  if (!pv || model.satrec.error) {
    return err(sgp4Error(model.satrec.error || 6, model.epochMs + minutesFromEpoch * MS_PER_MIN));
  }
  const { position: p, velocity: v } = pv;
  return ok({ positionTemeKm: [p.x, p.y, p.z], velocityTemeKmPerS: [v.x, v.y, v.z] });
}

/**
 * Satellite state at `timeMs` (UTC): TEME from SGP4, then Earth-fixed position and velocity
 * (see file header for the formulas). One SGP4 evaluation, added to `counter`.
 */
export function propagateAt(model: OrbitModel, timeMs: number, counter?: PropagationCounter): Result<OrbitState, PropagationError> {
  if (!Number.isFinite(timeMs)) throw new RangeError(`timeMs must be a finite number, got ${timeMs}`);
  const teme = propagateTemeMin(model, (timeMs - model.epochMs) / MS_PER_MIN, counter);
  if (!teme.ok) return teme;
  const { positionTemeKm: r, velocityTemeKmPerS: v } = teme.value;
  const gmstRad = gstime(julianDateFromMs(timeMs));
  const re = eciToEcf({ x: r[0], y: r[1], z: r[2] }, gmstRad);
  const ve = eciToEcf({ x: v[0], y: v[1], z: v[2] }, gmstRad);
  const w = EARTH_ROTATION_RAD_PER_S;
  const positionEcefKm: Vec3 = [re.x, re.y, re.z];
  // v_ecef = R v_teme − ω × r_ecef, with ω × r = (−ω y, ω x, 0).
  const velocityEcefKmPerS: Vec3 = [ve.x + w * re.y, ve.y - w * re.x, ve.z];
  return ok({ timeMs, positionTemeKm: r, velocityTemeKmPerS: v, positionEcefKm, velocityEcefKmPerS });
}
