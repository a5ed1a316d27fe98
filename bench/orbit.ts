/**
 * Pass search cost: findPasses (coarse scan + prefilter + Brent) against brute force (SGP4 every second, local
 * minima of slant range kept when the site is in the swath on the right), same satellite, site and 30 days,
 * measured in the same run. Prints SGP4 evaluation counts, wall times and their ratios; asserts nothing.
 */
import { performance } from 'node:perf_hooks';
import { ecefToEnu, enuBasis, geodeticToEcefM } from '../src/core/geodesy/ecef.ts';
import { findPasses, DEFAULT_INCIDENCE_MAX_DEG, DEFAULT_INCIDENCE_MIN_DEG } from '../src/core/orbit/passes.ts';
import { orbitModelFromTle, propagateAt, type PropagationCounter } from '../src/core/orbit/propagate.ts';
import { parseTle } from '../src/core/orbit/tle.ts';
import { toDeg } from '../src/core/units.ts';
import { cross, dot, norm, scale, sub, type Vec3 } from '../src/core/vec3.ts';
import { DEMO_TLE } from '../src/demo/elements.ts';
import { timeMs } from './timing.ts';

const DAYS = 30;
const START_MS = Date.UTC(2026, 11, 1);
// Marrowby Fen (invented site).
const SITE = { latDeg: 52.3, lonDeg: 5.1, heightM: 10 };

function bruteForce(line1: string, line2: string): { timesMs: number[]; propagations: number } {
  const model = orbitModelFromTle(line1, line2);
  if (!model.ok) throw new Error(model.error.message);
  const counter: PropagationCounter = { count: 0 };
  const siteKm = scale(geodeticToEcefM(SITE), 1e-3);
  const basis = enuBasis(SITE.latDeg, SITE.lonDeg);
  const stateAt = (t: number) => {
    const s = propagateAt(model.value, t, counter);
    if (!s.ok) throw new Error(s.error.message);
    return s.value;
  };
  const timesMs: number[] = [];
  const n = DAYS * 86_400;
  let r2 = norm(sub(stateAt(START_MS).positionEcefKm, siteKm));
  let r1 = norm(sub(stateAt(START_MS + 1000).positionEcefKm, siteKm));
  for (let k = 2; k <= n; k++) {
    const t = START_MS + k * 1000;
    const s = stateAt(t);
    const r0 = norm(sub(s.positionEcefKm, siteKm));
    if (r1 < r2 && r1 <= r0) {
      const m = stateAt(t - 1000);
      const rho: Vec3 = sub(m.positionEcefKm, siteKm);
      const los = ecefToEnu(basis, rho);
      const incDeg = toDeg(Math.atan2(Math.hypot(los[0], los[1]), los[2]));
      const right = dot(cross(m.velocityEcefKmPerS, rho), basis.up) > 0;
      if (right && incDeg >= DEFAULT_INCIDENCE_MIN_DEG && incDeg <= DEFAULT_INCIDENCE_MAX_DEG) timesMs.push(t - 1000);
    }
    r2 = r1;
    r1 = r0;
  }
  return { timesMs, propagations: counter.count };
}

export async function bench(): Promise<void> {
  const set = parseTle(DEMO_TLE).sets[0];
  const fast = await timeMs(() => findPasses(set, SITE, { startMs: START_MS, days: DAYS }), 5);
  const t0 = performance.now();
  const brute = bruteForce(set.line1, set.line2);
  const bruteMs = performance.now() - t0;

  const found = fast.result.passes.map((p) => p.timeMs);
  const maxDiffS = Math.max(...brute.timesMs.map((t) => Math.min(...found.map((f) => Math.abs(f - t))) / 1000));
  console.log(`findPasses, GLINT-A over Marrowby Fen, ${DAYS} days: ${found.length} passes`);
  console.log(`  findPasses:  ${fast.result.propagations} SGP4 evaluations, ${fast.medianMs.toFixed(1)} ms (median of 5)`);
  console.log(`  brute force: ${brute.propagations} SGP4 evaluations, ${bruteMs.toFixed(0)} ms (one run, 1 s steps), ${brute.timesMs.length} passes`);
  console.log(`  ratio: ${(brute.propagations / fast.result.propagations).toFixed(0)}× fewer evaluations, ${(bruteMs / fast.medianMs).toFixed(0)}× less time`);
  console.log(`  same passes: ${brute.timesMs.length === found.length ? 'yes' : 'NO'}; largest time difference ${maxDiffS.toFixed(3)} s (brute force resolves 1 s)`);
}
