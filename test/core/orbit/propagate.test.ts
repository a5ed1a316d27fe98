import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { orbitModelFromTle, propagateAt, propagateTemeMin, type OrbitModel, type PropagationCounter } from '../../../src/core/orbit/propagate.ts';
import { DEMO_TLE } from '../../../src/demo/elements.ts';
import { norm, sub, type Vec3 } from '../../../src/core/vec3.ts';

/**
 * Source of the reference values: Vallado, Crawford, Hujsak & Kelso (2006), "Revisiting Spacetrack Report #3",
 * AIAA 2006-6753, verification files SGP4-VER.TLE and tcppver.out (see test/fixtures/orbit/README.md).
 * The verification lines carry start/stop/step after column 69, so they are not valid 69-character TLEs for our
 * strict parseTle; they go straight to satellite.js's twoline2satrec through orbitModelFromTle.
 * Tolerances: satellite.js 7.1.0 reproduces all 666 listed points (33334's lone t = 0 row aside) within
 * 1.17e-7 km and 8.5e-10 km/s (measured; the file prints 8 and 9 decimals), so we hold it to 1e-6 km (1 mm)
 * and 1e-8 km/s (0.01 mm/s) — tighter than the 1 m / 1 mm/s the plan asked for.
 */
const TOL_POS_KM = 1e-6;
const TOL_VEL_KM_PER_S = 1e-8;

const fixture = (name: string) => readFileSync(new URL(`../../fixtures/orbit/${name}`, import.meta.url), 'utf8');

interface VerCase {
  satnum: string;
  line1: string;
  line2: string;
  stopMin: number;
  rows: number[][];
}

function loadVerification(): VerCase[] {
  const tle = fixture('SGP4-VER.TLE').split(/\r?\n/).filter((l) => l.startsWith('1 ') || l.startsWith('2 '));
  const blocks: { satnum: string; rows: number[][] }[] = [];
  for (const l of fixture('tcppver.out').split(/\r?\n/)) {
    const head = /^\s*(\d+) xx\s*$/.exec(l);
    if (head) blocks.push({ satnum: head[1], rows: [] });
    else if (l.trim()) blocks[blocks.length - 1].rows.push(l.trim().split(/\s+/).slice(0, 7).map(Number));
  }
  const cases: VerCase[] = [];
  for (let i = 0; i < tle.length; i += 2) {
    const b = blocks[i / 2];
    // Blocks are in file order (catalogue number 20413 appears twice), so pair by position and check the number.
    expect(Number(tle[i].slice(2, 7))).toBe(Number(b.satnum));
    cases.push({ satnum: b.satnum, line1: tle[i], line2: tle[i + 1], stopMin: Number(tle[i + 1].slice(69).trim().split(/\s+/)[1]), rows: b.rows });
  }
  return cases;
}

const cases = loadVerification();
const model = (c: VerCase): OrbitModel => {
  const m = orbitModelFromTle(c.line1, c.line2);
  if (!m.ok) throw new Error(`satellite ${c.satnum}: ${m.error.message}`);
  return m.value;
};

function checkCase(c: VerCase): number {
  const m = model(c);
  for (const [tMin, x, y, z, vx, vy, vz] of c.rows) {
    const r = propagateTemeMin(m, tMin);
    expect(r.ok, `satellite ${c.satnum} at ${tMin} min`).toBe(true);
    if (!r.ok) continue;
    expect(norm(sub(r.value.positionTemeKm, [x, y, z])), `satellite ${c.satnum} position at ${tMin} min`).toBeLessThan(TOL_POS_KM);
    expect(norm(sub(r.value.velocityTemeKmPerS, [vx, vy, vz])), `satellite ${c.satnum} velocity at ${tMin} min`).toBeLessThan(TOL_VEL_KM_PER_S);
  }
  return c.rows.length;
}

describe('SGP4 against the Vallado et al. (2006) verification output', () => {
  it('has 33 cases in both files', () => {
    expect(cases).toHaveLength(33);
  });

  it('satellite 00005 (near-Earth, e = 0.186): every listed time', () => {
    // First row, t = 0 (also quoted in REFERENCES.md §4): r = (7022.46529266, −1400.08296755, 0.03995155) km.
    expect(checkCase(cases.find((c) => c.satnum === '5') as VerCase)).toBe(13);
  });

  it('satellite 06251 (near-Earth, drag): every listed time', () => {
    expect(checkCase(cases.find((c) => c.satnum === '6251') as VerCase)).toBe(25);
  });

  it('every other case, every listed time (deep space, resonance, decay)', () => {
    let n = 0;
    for (const c of cases) if (c.satnum !== '33334') n += checkCase(c);
    expect(n).toBe(666);
  });

  it('satellite 33334 (intentional error case) comes back as a Result error, not a throw', () => {
    const c = cases.find((x) => x.satnum === '33334') as VerCase;
    const m = orbitModelFromTle(c.line1, c.line2);
    expect(m.ok).toBe(false);
    if (!m.ok) {
      expect(m.error.kind).toBe('perturbed-eccentricity-out-of-range');
      expect(m.error.message).toMatch(/eccentricity/);
    }
  });

  it('where a listing stops early, the next step is a Result error (decay or invalid elements)', () => {
    const stopsEarly = cases.filter((c) => c.satnum !== '33334' && c.rows.length && c.rows[c.rows.length - 1][0] < c.stopMin);
    // The second 20413 set (minutes 1 844 000–1 845 100) decays at 1 844 340 min.
    expect(stopsEarly.map((c) => c.satnum).sort()).toEqual(['20413', '22312', '28350', '28872', '29141', '33333']);
    for (const c of stopsEarly) {
      const last = c.rows[c.rows.length - 1][0];
      const step = Number(c.line2.slice(69).trim().split(/\s+/)[2]);
      const r = propagateTemeMin(model(c), Math.min(last + step, c.stopMin));
      expect(r.ok, `satellite ${c.satnum}`).toBe(false);
      if (!r.ok) expect(r.error.message.length).toBeGreaterThan(20);
    }
  });
});

describe('propagateAt: Earth-fixed state', () => {
  const lines = DEMO_TLE.trim().split('\n');
  const demo = orbitModelFromTle(lines[1], lines[2]);
  if (!demo.ok) throw new Error(demo.error.message);
  const t0 = Date.UTC(2026, 11, 1, 5, 0, 0);
  const at = (t: number) => {
    const s = propagateAt(demo.value, t);
    if (!s.ok) throw new Error(s.error.message);
    return s.value;
  };

  it('Earth-fixed velocity equals the time derivative of the Earth-fixed position (includes −ω × r)', () => {
    // Central difference over ±0.5 s (truncation ≈ 4e-7 km/s). SGP4's own velocity differs from the derivative of
    // its position by up to 2.1e-5 km/s (measured in TEME as well, so it is the model, not our rotation), and the
    // ~40 µs resolution of a Julian date in gstime adds ~2 cm of position jitter. Leaving out −ω × r would be an
    // error of ~0.5 km/s, so 1e-4 km/s separates right from wrong by more than three orders of magnitude.
    const TOL_FD_KM_PER_S = 1e-4;
    for (let k = 0; k < 50; k++) {
      const t = t0 + k * 123_457;
      const d: Vec3 = sub(at(t + 500).positionEcefKm, at(t - 500).positionEcefKm);
      const fd: Vec3 = [d[0], d[1], d[2]];
      expect(norm(sub(at(t).velocityEcefKmPerS, fd))).toBeLessThan(TOL_FD_KM_PER_S);
    }
  });

  it('keeps the TEME state and rotates it by GMST only (|r| and z unchanged)', () => {
    const s = at(t0);
    expect(Math.abs(norm(s.positionEcefKm) - norm(s.positionTemeKm))).toBeLessThan(1e-9);
    expect(s.positionEcefKm[2]).toBe(s.positionTemeKm[2]);
  });

  it('counts propagations', () => {
    const counter: PropagationCounter = { count: 0 };
    propagateAt(demo.value, t0, counter);
    propagateAt(demo.value, t0 + 1000, counter);
    expect(counter.count).toBe(2);
  });

  it('reports the period 2π/n from SGP4\'s recovered (Brouwer) mean motion: 98.62 min for 14.59198740 rev/day (Kozai)', () => {
    expect(Math.abs(demo.value.periodMin - 98.623)).toBeLessThan(0.001);
  });

  it('rejects a non-finite time', () => {
    expect(() => propagateAt(demo.value, NaN)).toThrow(/timeMs/);
  });
});
