/**
 * −3 dB beamwidths of the trihedral pattern, found numerically on the physical-optics pattern of pattern.ts
 * (bracketing outward from boresight in 0.25° steps, then bisection to 1e-9°).
 *
 * Cuts through boresight b = (√2 f + u)/√3 (body frame, CONVENTIONS.md):
 *   elevation cut: the bisector's vertical plane (azimuth offset 0), elevation from 0° to 90° above the plate;
 *   azimuth cut:   the plane containing b and the `right` axis, direction cos θ · b + sin θ · right.
 * The pattern is a function of the shape only (σ/σ_peak = (A/A_peak)², A ∝ a²), so the widths do not depend on a
 * or λ in the optical model. Derived values (no published table; REFERENCES.md §1 [derived]):
 *   triangular: 38.887° full width in every cut through boresight. While c₁ + c₂ > c₃ the closed form is
 *     A/a² = s − 2/s with s = √3 cos θ (θ off boresight), a cone; the −3 dB cone θ₃ = acos(s₃/√3),
 *     s₃ = (g + √(g² + 8))/2, g = 10^(−3/20)/√3, gives 19.4437°, just inside that branch (which reaches
 *     19.47° toward each edge). The rule of thumb "about 40°" is from memory.
 *   square: 22.28° in elevation, 20.61° in azimuth, with a cusp at boresight.
 * Validity: the optical model of trihedral.ts; real reflectors add edge diffraction that rounds the cusp.
 */
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG, toRad } from '../units.ts';
import { requireOneOf } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';
import { rcsForBodyVector } from './pattern.ts';
import { TRIHEDRAL_SHAPES, type TrihedralShape } from './trihedral.ts';

export interface Beamwidth3dB {
  /** Full −3 dB width of the elevation cut, degrees (= elevationAboveDeg + elevationBelowDeg). */
  elevationFullDeg: number;
  /** Full −3 dB width of the azimuth cut, degrees (symmetric about boresight). */
  azimuthFullDeg: number;
  /** Angle from boresight up toward the vertical edge to the −3 dB point, degrees. */
  elevationAboveDeg: number;
  /** Angle from boresight down toward the base plate to the −3 dB point, degrees. */
  elevationBelowDeg: number;
}

const LOSS_DB = 3;
const STEP_DEG = 0.25;
const ROOT_TOL_DEG = 1e-9;

/** Smallest θ > 0 with lossDb(θ) = 3 along a cut; lossDb increases from 0 at θ = 0. */
function halfWidthDeg(lossAtDeg: (thetaDeg: number) => number, maxDeg: number): number {
  let lo = 0;
  let hi = STEP_DEG;
  while (lossAtDeg(hi) < LOSS_DB) {
    lo = hi;
    hi += STEP_DEG;
    if (hi > maxDeg) throw new RangeError(`no −3 dB point within ${maxDeg}° of boresight`);
  }
  while (hi - lo > ROOT_TOL_DEG) {
    const mid = (lo + hi) / 2;
    if (lossAtDeg(mid) < LOSS_DB) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

const UNIT_REFLECTOR = { edgeM: 1, wavelengthM: 1 } as const;
const cache = new Map<TrihedralShape, Beamwidth3dB>();

/** Full −3 dB widths of the elevation and azimuth cuts through boresight (shape only; memoised). */
export function beamwidth3dB(shape: TrihedralShape): Beamwidth3dB {
  requireOneOf('shape', shape, TRIHEDRAL_SHAPES);
  const hit = cache.get(shape);
  if (hit) return { ...hit };
  const r = { shape, ...UNIT_REFLECTOR };
  const elevationLoss = (elDeg: number) => {
    const e = toRad(elDeg);
    const v: Vec3 = [0, Math.cos(e), Math.sin(e)];
    return rcsForBodyVector(r, v).lossDb;
  };
  const b0 = TRIHEDRAL_BORESIGHT_ELEVATION_DEG;
  const elevationAboveDeg = halfWidthDeg((t) => elevationLoss(b0 + t), 90 - b0);
  const elevationBelowDeg = halfWidthDeg((t) => elevationLoss(b0 - t), b0);
  const bF = Math.sqrt(2 / 3), bU = Math.sqrt(1 / 3);
  const azimuthLoss = (tDeg: number) => {
    const t = toRad(tDeg);
    const v: Vec3 = [Math.sin(t), Math.cos(t) * bF, Math.cos(t) * bU];
    return rcsForBodyVector(r, v).lossDb;
  };
  const azimuthHalfDeg = halfWidthDeg(azimuthLoss, 90);
  const result: Beamwidth3dB = {
    elevationFullDeg: elevationAboveDeg + elevationBelowDeg,
    azimuthFullDeg: 2 * azimuthHalfDeg,
    elevationAboveDeg,
    elevationBelowDeg,
  };
  cache.set(shape, result);
  return { ...result };
}
