/**
 * The 14-parameter (time-dependent) Helmert transformation between terrestrial reference frames,
 * position-vector convention, as the IERS/IGN publishes the ITRF transformation tables:
 *
 *   X₂ = X₁ + T + D·X₁ + R·X₁,     R = ⎡  0  −R3   R2 ⎤
 *                                     ⎢  R3   0  −R1 ⎥
 *                                     ⎣ −R2  R1    0 ⎦
 *   P(t) = P(t₀) + Ṗ·(t − t₀)  for each of the seven parameters P ∈ {T1, T2, T3, D, R1, R2, R3}.
 *
 * Source: Altamimi, Z., Rebischung, P., Métivier, L., Collilieux, X., "ITRF2014: A new release of the
 *   International Terrestrial Reference Frame modeling nonlinear station motions", J. Geophys. Res. Solid Earth
 *   121:6109–6131, 2016, eq. (1) and Table 4 conventions; IERS Conventions (2010), IERS Technical Note 36, §4.1.
 *   Units of the published tables: T in mm, D in ppb (10⁻⁹), R in milliarcseconds; rates per year.
 * The inverse solves (I + D + R)·X₁ = X₂ − T exactly (3×3 linear solve) rather than flipping signs, so a round
 *   trip returns the input to well below 1 µm.
 * Validity: the small-angle form is exact to first order in the parameters (≤ 10⁻⁷ rad, ≤ 10⁻⁸ in scale), i.e. the
 *   second-order terms are below 10⁻¹³ × 6.4·10⁶ m ≈ 1 nm.
 */
import { requireFinite } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';

/** Milliarcseconds to radians: 1 mas = π / (180 · 3600 · 1000) rad. */
export const MAS_TO_RAD = Math.PI / (180 * 3600 * 1000);

/** One published row: parameters at the reference epoch and their rates, in the tables' units. */
export interface Helmert14 {
  /** Translations T1, T2, T3, mm. */
  tMm: Vec3;
  /** Scale D, ppb. */
  dPpb: number;
  /** Rotations R1, R2, R3, milliarcseconds. */
  rMas: Vec3;
  /** Rates of T, mm/yr. */
  tRateMmPerYr: Vec3;
  /** Rate of D, ppb/yr. */
  dRatePpbPerYr: number;
  /** Rates of R, mas/yr. */
  rRateMasPerYr: Vec3;
  /** Reference epoch t₀ of the parameters, decimal year. */
  epochYear: number;
}

/** The seven parameters evaluated at one epoch, in SI units (m, unitless, rad). */
export interface Helmert7 {
  tM: Vec3;
  d: number;
  rRad: Vec3;
}

/** P(t) = P(t₀) + Ṗ (t − t₀), converted to m, unitless and rad. */
export function helmertAtEpoch(p: Helmert14, epochYear: number): Helmert7 {
  requireFinite('epoch', epochYear);
  const dt = epochYear - p.epochYear;
  const t = (i: 0 | 1 | 2) => (p.tMm[i] + p.tRateMmPerYr[i] * dt) / 1000;
  const r = (i: 0 | 1 | 2) => (p.rMas[i] + p.rRateMasPerYr[i] * dt) * MAS_TO_RAD;
  return { tM: [t(0), t(1), t(2)], d: (p.dPpb + p.dRatePpbPerYr * dt) * 1e-9, rRad: [r(0), r(1), r(2)] };
}

/** The matrix I + D + R of the position-vector convention, rows. */
function linearPart(h: Helmert7): [Vec3, Vec3, Vec3] {
  const [r1, r2, r3] = h.rRad;
  const s = 1 + h.d;
  return [
    [s, -r3, r2],
    [r3, s, -r1],
    [-r2, r1, s],
  ];
}

/** Forward: X₂ = X₁ + T + D X₁ + R X₁ (metres). */
export function applyHelmert7(h: Helmert7, x: Vec3): Vec3 {
  const m = linearPart(h);
  const row = (i: 0 | 1 | 2) => m[i][0] * x[0] + m[i][1] * x[1] + m[i][2] * x[2] + h.tM[i];
  return [row(0), row(1), row(2)];
}

/** Inverse: X₁ from X₂, solving (I + D + R) X₁ = X₂ − T by Cramer's rule (the matrix is within 10⁻⁸ of I). */
export function invertHelmert7(h: Helmert7, x2: Vec3): Vec3 {
  const m = linearPart(h);
  const b: Vec3 = [x2[0] - h.tM[0], x2[1] - h.tM[1], x2[2] - h.tM[2]];
  const det3 = (a: readonly Vec3[]) =>
    a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1]) -
    a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0]) +
    a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0]);
  const d = det3(m);
  const col = (j: number): number => det3(m.map((row, i) => row.map((v, k) => (k === j ? b[i] : v)) as unknown as Vec3)) / d;
  return [col(0), col(1), col(2)];
}
