/**
 * Monostatic RCS pattern of a trihedral: σ(k) = σ_peak · (A(k) / A_peak)², with A the physical-optics effective
 * aperture of trihedral.ts (σ = 4π A²/λ², so the pattern shape depends on the shape only, not on a or λ).
 * lossDb = −20 log₁₀(A / A_peak) ≥ 0. Outside the corner's octant σ = 0: rcsDbsm = −∞ and lossDb = +∞.
 * Properties (tested): 0 ≤ σ ≤ σ_peak, σ = 0 outside the octant, symmetric about the bisector's vertical plane.
 */
import {
  bodyVectorFromDirection,
  edgeCosinesFromBody,
  enuToBody,
  reflectorAxesEnu,
  type ReflectorFrameDirection,
  type ReflectorOrientation,
} from '../geometry/orientation.ts';
import { toDeg, toDb } from '../units.ts';
import { requireFinite } from '../validate.ts';
import { angleBetweenRad, norm, type Vec3 } from '../vec3.ts';
import { effectiveAreaRatio, peakAreaRatio, peakRcsM2, validateReflector, type Reflector } from './trihedral.ts';

export interface RcsSample {
  /** Monostatic RCS, m² (0 outside the corner). */
  rcsM2: number;
  /** 10 log₁₀(σ / 1 m²); −Infinity outside the corner. */
  rcsDbsm: number;
  /** Positive dB below the peak; +Infinity outside the corner. */
  lossDb: number;
}

export interface OrientedRcsSample extends RcsSample {
  /** Angle between the reflector's boresight and the line of sight, degrees, [0, 180]. */
  offBoresightDeg: number;
}

/** RCS for a body-frame unit vector (right, forward, up) toward the radar. Exported for callers with a body vector. */
export function rcsForBodyVector(r: Reflector, bodyUnit: Vec3): RcsSample {
  validateReflector(r);
  const ratio = effectiveAreaRatio(r.shape, edgeCosinesFromBody(bodyUnit)) / peakAreaRatio(r.shape);
  const peak = peakRcsM2(r);
  const rcsM2 = peak * ratio * ratio;
  // Math.max(0, ·) also turns a −0 into +0 at boresight.
  const lossDb = ratio > 0 ? Math.max(0, -2 * toDb(ratio)) : Infinity;
  return { rcsM2, rcsDbsm: rcsM2 > 0 ? toDb(rcsM2) : -Infinity, lossDb };
}

/** RCS toward a direction given in the reflector frame (elevation above the plate, azimuth offset from the bisector). */
export function rcsInReflectorFrame(r: Reflector, dir: ReflectorFrameDirection): RcsSample {
  return rcsForBodyVector(r, bodyVectorFromDirection(dir));
}

/**
 * RCS for a reflector with orientation `o` seen along the line of sight `losEnu` (site → radar, ENU; any non-zero
 * length, normalised here), plus the angle off boresight.
 */
export function rcsForOrientation(r: Reflector, o: ReflectorOrientation, losEnu: Vec3): OrientedRcsSample {
  losEnu.forEach((x, i) => requireFinite(`losEnu[${i}]`, x));
  const n = norm(losEnu);
  if (!(n > 0)) throw new RangeError(`losEnu must be a non-zero vector, got [${losEnu.join(', ')}]`);
  const axes = reflectorAxesEnu(o);
  const los: Vec3 = [losEnu[0] / n, losEnu[1] / n, losEnu[2] / n];
  const sample = rcsForBodyVector(r, enuToBody(axes, los));
  return { ...sample, offBoresightDeg: toDeg(angleBetweenRad(axes.boresight, los)) };
}
