/**
 * One orientation for several passes: the minimax compromise that maximises the worst-case RCS (minimises the
 * largest lossDb) over the given pass geometries, searching azimuth, tilt and roll.
 *
 * Method (ours; the pattern is that of pattern.ts): starts at the aim for the normalised mean of the lines of sight
 * (roll 0, and rolled ±45°) and at each pass's exact aim; a coarse Nelder–Mead on max lossDb (8° simplex) from each,
 * then the two best results restarted with simplex steps 2°, 0.5°, 0.1°, 0.02° (restarts shake the simplex off the
 * kinks where two losses are equal). A line of sight outside the corner counts as 1000 dB plus its angle off
 * boresight, so the search still has a slope there. Deterministic; a few thousand objective evaluations.
 * Validity: a local search from several starts — the best found, not a proven global optimum; loss is the
 * physical-optics loss, independent of a and λ.
 */
import { edgeCosinesFromBody, reflectorAxesEnu, type ReflectorOrientation } from '../geometry/orientation.ts';
import { aimForPass, azElFromEnu, type PassGeometry } from '../geometry/pointing.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG, normalizeAzimuthDeg, toDb, toDeg, wrapSignedDeg } from '../units.ts';
import { requireFinite } from '../validate.ts';
import { angleBetweenRad, normalize, type Vec3 } from '../vec3.ts';
import { rcsForOrientation } from './pattern.ts';
import { nelderMead } from './nelderMead.ts';
import { effectiveAreaRatio, peakAreaRatio, validateReflector, type Reflector, type TrihedralShape } from './trihedral.ts';

export interface CompromiseOptions {
  /** Worst-case loss above which one reflector per pass direction is recommended, dB (default 3). */
  maxAcceptableLossDb?: number;
}

export interface CompromiseGeometryLoss {
  geometry: PassGeometry;
  /** Loss for this pass at the compromise orientation, dB (+Infinity outside the corner). */
  lossDb: number;
  offBoresightDeg: number;
}

export interface Compromise {
  orientation: ReflectorOrientation;
  /** Largest lossDb over the geometries, dB. */
  worstLossDb: number;
  perGeometry: CompromiseGeometryLoss[];
  /** True when worstLossDb exceeds maxAcceptableLossDb: install one reflector per pass direction instead. */
  separateRecommended: boolean;
  message: string;
}

export const DEFAULT_MAX_LOSS_DB = 3;
const OUTSIDE_PENALTY_DB = 1000;
const COARSE_STEP_DEG = 8;
const COARSE_OPTS = { xTol: 1e-2, fTol: 1e-6, maxEvaluations: 200 };
const REFINED_BASINS = 2;
const RESTART_STEPS_DEG = [2, 0.5, 0.1, 0.02];
const FINE_OPTS = { xTol: 1e-7, fTol: 1e-10, maxEvaluations: 300 };
const EXACT_LOSS_DB = 1e-9;

/** Orientation from search parameters: azimuth wrapped, tilt clamped to [−90, 90], roll wrapped to (−180, 180]. */
function toOrientation(x: readonly number[]): ReflectorOrientation {
  return {
    azimuthDeg: normalizeAzimuthDeg(x[0]),
    tiltDeg: Math.min(90, Math.max(-90, x[1])),
    rollDeg: wrapSignedDeg(x[2]),
  };
}

/** Largest loss over the lines of sight, with the outside-the-corner penalty. */
function worstLossObjective(shape: TrihedralShape, losList: readonly Vec3[]): (x: readonly number[]) => number {
  const peak = peakAreaRatio(shape);
  return (x) => {
    const ax = reflectorAxesEnu(toOrientation(x));
    let worst = -Infinity;
    for (const k of losList) {
      const body: Vec3 = [
        ax.right[0] * k[0] + ax.right[1] * k[1] + ax.right[2] * k[2],
        ax.forward[0] * k[0] + ax.forward[1] * k[1] + ax.forward[2] * k[2],
        ax.up[0] * k[0] + ax.up[1] * k[1] + ax.up[2] * k[2],
      ];
      const ratio = effectiveAreaRatio(shape, edgeCosinesFromBody(body)) / peak;
      const loss = ratio > 0 ? -2 * toDb(ratio) : OUTSIDE_PENALTY_DB + toDeg(angleBetweenRad(ax.boresight, k));
      if (loss > worst) worst = loss;
    }
    return worst;
  };
}

/** Search parameters that put the boresight on `los` with the given roll. */
function aimParams(los: Vec3, fallbackAzimuthDeg: number, rollDeg: number): number[] {
  const { azimuthDeg, elevationDeg } = azElFromEnu(los);
  const horizontal = Math.hypot(los[0], los[1]) > 1e-9;
  return [horizontal ? azimuthDeg : fallbackAzimuthDeg, elevationDeg - TRIHEDRAL_BORESIGHT_ELEVATION_DEG, rollDeg];
}

/**
 * Minimax orientation for `geometries` (non-empty). A single geometry returns its exact aim (loss ≈ 0, roll 0).
 * Throws a RangeError for an empty list, a bad reflector, a bad geometry or a negative/non-finite limit.
 */
export function compromiseOrientation(r: Reflector, geometries: readonly PassGeometry[], opts: CompromiseOptions = {}): Compromise {
  validateReflector(r);
  if (geometries.length === 0) throw new RangeError('geometries must list at least one pass geometry, got 0');
  const maxLossDb = requireFinite('maxAcceptableLossDb', opts.maxAcceptableLossDb ?? DEFAULT_MAX_LOSS_DB);
  if (maxLossDb < 0) throw new RangeError(`maxAcceptableLossDb must be ≥ 0 dB, got ${maxLossDb}`);
  const aims = geometries.map((g) => aimForPass(g));
  const losList = aims.map((a) => a.losEnu);
  const objective = worstLossObjective(r.shape, losList);

  const mean = normalize(losList.reduce<Vec3>((s, k) => [s[0] + k[0], s[1] + k[1], s[2] + k[2]], [0, 0, 0]));
  const meanStart = aimParams(mean, aims[0].reflectorAzimuthDeg, 0);
  const starts = [
    meanStart,
    ...aims.map((a) => [a.reflectorAzimuthDeg, a.baseTiltDeg, 0]),
    [meanStart[0], meanStart[1], 45],
    [meanStart[0], meanStart[1], -45],
  ];

  let best = { x: starts[0], fx: objective(starts[0]) };
  for (const s of starts) {
    const fx = objective(s);
    if (fx < best.fx) best = { x: s, fx };
  }
  if (best.fx > EXACT_LOSS_DB) {
    // Coarse search from every start, then restarts with shrinking simplexes from the two best basins.
    const coarse = starts
      .map((s) => nelderMead(objective, s, [COARSE_STEP_DEG, COARSE_STEP_DEG, COARSE_STEP_DEG], COARSE_OPTS))
      .sort((a, b) => a.fx - b.fx);
    for (const c of coarse.slice(0, REFINED_BASINS)) {
      let cur: { x: readonly number[]; fx: number } = c;
      for (const step of RESTART_STEPS_DEG) {
        const m = nelderMead(objective, cur.x, [step, step, step], FINE_OPTS);
        if (m.fx < cur.fx) cur = m;
      }
      if (cur.fx < best.fx) best = { x: cur.x.slice(), fx: cur.fx };
    }
  }

  const orientation = toOrientation(best.x);
  const perGeometry = geometries.map((geometry, i) => {
    const s = rcsForOrientation(r, orientation, losList[i]);
    return { geometry, lossDb: s.lossDb, offBoresightDeg: s.offBoresightDeg };
  });
  const worstLossDb = Math.max(...perGeometry.map((p) => p.lossDb));
  const separateRecommended = worstLossDb > maxLossDb;
  return { orientation, worstLossDb, perGeometry, separateRecommended, message: describe(geometries.length, worstLossDb, maxLossDb) };
}

function describe(n: number, worstLossDb: number, maxLossDb: number): string {
  if (worstLossDb === Infinity) {
    return `no single orientation sees all ${n} passes inside the corner; install one reflector per pass direction`;
  }
  const worst = `worst-case loss ${worstLossDb.toFixed(2)} dB`;
  if (worstLossDb > maxLossDb) {
    return `${worst} exceeds the ${maxLossDb} dB limit; install one reflector per pass direction, each aimed at its own pass`;
  }
  return n === 1 ? `exact aim for the single pass (${worst})` : `one reflector serves all ${n} passes: ${worst}, within the ${maxLossDb} dB limit`;
}
