import { describe, expect, it } from 'vitest';
import { aimForPass, type PassGeometry } from '../../../src/core/geometry/pointing.ts';
import type { ReflectorOrientation } from '../../../src/core/geometry/orientation.ts';
import { compromiseOrientation } from '../../../src/core/reflector/compromise.ts';
import { misalignment } from '../../../src/core/reflector/misalignment.ts';
import type { Reflector, TrihedralShape } from '../../../src/core/reflector/trihedral.ts';

const TOL_DB = 1e-6;
const LOCAL_TOL_DB = 1e-3; // a neighbour may not beat the optimum by more than this
const tri: Reflector = { shape: 'triangular', edgeM: 0.9, wavelengthM: 0.0555 };
const sq: Reflector = { shape: 'square', edgeM: 0.6, wavelengthM: 0.0555 };

// Ascending and descending passes of one sun-synchronous orbit at 45° latitude: headings −14.3° and −165.7°
// ([derived] check values of ../shared/REFERENCES.md §3); both right-looking, so the LOS azimuths differ by ≈ 150°.
const ASC: PassGeometry = { incidenceDeg: 39, headingDeg: -14.3086, look: 'right' };
const DESC: PassGeometry = { incidenceDeg: 41, headingDeg: -165.6914, look: 'right' };
const CLOSE: PassGeometry[] = [
  { incidenceDeg: 36, headingDeg: 192, look: 'right' },
  { incidenceDeg: 44, headingDeg: 188, look: 'right' },
];
const FOUR: PassGeometry[] = [
  { incidenceDeg: 30, headingDeg: 190, look: 'right' },
  { incidenceDeg: 45, headingDeg: 190, look: 'right' },
  { incidenceDeg: 35, headingDeg: 185, look: 'right' },
  { incidenceDeg: 40, headingDeg: 175, look: 'right' },
];

const worstAt = (r: Reflector, o: ReflectorOrientation, gs: readonly PassGeometry[]) =>
  Math.max(...gs.map((g) => misalignment(r, o, g).lossDb));
const singleAim = (g: PassGeometry): ReflectorOrientation => {
  const a = aimForPass(g);
  return { azimuthDeg: a.reflectorAzimuthDeg, tiltDeg: a.baseTiltDeg, rollDeg: 0 };
};

describe('compromiseOrientation', () => {
  it.each([tri, sq])('single geometry returns the exact aim, roll 0 ($shape)', (r) => {
    const g: PassGeometry = { incidenceDeg: 37.5, headingDeg: 192.3, look: 'right' };
    const c = compromiseOrientation(r, [g]);
    const a = aimForPass(g);
    expect(c.worstLossDb).toBeLessThan(TOL_DB);
    expect(c.orientation.rollDeg).toBe(0);
    expect(c.orientation.azimuthDeg).toBeCloseTo(a.reflectorAzimuthDeg, 9);
    expect(c.orientation.tiltDeg).toBeCloseTo(a.baseTiltDeg, 9);
    expect(c.separateRecommended).toBe(false);
    expect(c.perGeometry).toHaveLength(1);
    expect(c.perGeometry[0].offBoresightDeg).toBeLessThan(1e-5);
  });

  it.each([tri, sq])('two close geometries: small worst loss, no worse than aiming at either ($shape)', (r) => {
    const c = compromiseOrientation(r, CLOSE);
    expect(c.worstLossDb).toBeLessThan(1.5);
    for (const g of CLOSE) expect(c.worstLossDb).toBeLessThanOrEqual(worstAt(r, singleAim(g), CLOSE) + TOL_DB);
    expect(c.separateRecommended).toBe(false);
    expect(c.message).toMatch(/one reflector serves all 2 passes/);
    // Minimax balance: with two passes the optimum loses the same on both.
    expect(Math.abs(c.perGeometry[0].lossDb - c.perGeometry[1].lossDb)).toBeLessThan(1e-3);
  });

  it.each([tri, sq])('ascending + descending ≈ 150° apart: recommends one reflector per direction ($shape)', (r) => {
    const c = compromiseOrientation(r, [ASC, DESC]);
    expect(c.worstLossDb).toBeGreaterThan(3);
    expect(c.separateRecommended).toBe(true);
    expect(c.message).toMatch(/one reflector per pass direction/);
  });

  it.each<[Reflector, PassGeometry[]]>([
    [tri, CLOSE],
    [sq, CLOSE],
    [tri, FOUR],
    [sq, FOUR],
    [tri, [ASC, DESC]],
  ])('is a local minimum of the worst loss: no neighbour within 0.5° is better (%#)', (r, gs) => {
    const c = compromiseOrientation(r, gs);
    const o = c.orientation;
    expect(Math.abs(c.worstLossDb - worstAt(r, o, gs))).toBeLessThan(1e-9);
    for (const d of [0.5, 0.05]) {
      for (const da of [-d, 0, d]) for (const dt of [-d, 0, d]) for (const dr of [-d, 0, d]) {
        const n = { azimuthDeg: (o.azimuthDeg + da + 360) % 360, tiltDeg: o.tiltDeg + dt, rollDeg: o.rollDeg + dr };
        expect(worstAt(r, n, gs)).toBeGreaterThan(c.worstLossDb - LOCAL_TOL_DB);
      }
    }
  });

  it.each<TrihedralShape>(['triangular', 'square'])('is no worse than a brute-force grid search (%s, four passes)', (shape) => {
    const r = { ...tri, shape };
    const c = compromiseOrientation(r, FOUR);
    let bruteDb = Infinity;
    for (let az = 80; az <= 120; az += 2) for (let tilt = -10; tilt <= 40; tilt += 2) for (let roll = -30; roll <= 30; roll += 10) {
      bruteDb = Math.min(bruteDb, worstAt(r, { azimuthDeg: az, tiltDeg: tilt, rollDeg: roll }, FOUR));
    }
    expect(c.worstLossDb).toBeLessThanOrEqual(bruteDb + TOL_DB);
  });

  it('is deterministic and keeps angles in their ranges', () => {
    const a = compromiseOrientation(sq, FOUR);
    expect(compromiseOrientation(sq, FOUR)).toEqual(a);
    expect(a.orientation.azimuthDeg).toBeGreaterThanOrEqual(0);
    expect(a.orientation.azimuthDeg).toBeLessThan(360);
    expect(Math.abs(a.orientation.tiltDeg)).toBeLessThanOrEqual(90);
    expect(a.orientation.rollDeg).toBeGreaterThan(-180);
    expect(a.orientation.rollDeg).toBeLessThanOrEqual(180);
    expect(a.perGeometry.map((p) => p.geometry)).toEqual(FOUR);
  });

  it('honours maxAcceptableLossDb', () => {
    const c = compromiseOrientation(tri, CLOSE, { maxAcceptableLossDb: 0.001 });
    expect(c.separateRecommended).toBe(true);
    expect(c.message).toMatch(/exceeds the 0.001 dB limit/);
  });

  it('rejects an empty list, a bad limit, a bad geometry and a bad reflector', () => {
    expect(() => compromiseOrientation(tri, [])).toThrow(/geometries must list at least one pass geometry, got 0/);
    expect(() => compromiseOrientation(tri, CLOSE, { maxAcceptableLossDb: -1 })).toThrow(/maxAcceptableLossDb must be ≥ 0 dB, got -1/);
    expect(() => compromiseOrientation(tri, CLOSE, { maxAcceptableLossDb: Number.NaN })).toThrow(/maxAcceptableLossDb must be a finite number/);
    expect(() => compromiseOrientation(tri, [{ incidenceDeg: 0, headingDeg: 10, look: 'right' }])).toThrow(/incidenceDeg/);
    expect(() => compromiseOrientation({ ...tri, wavelengthM: 0 }, CLOSE)).toThrow(/wavelengthM/);
  });
});
