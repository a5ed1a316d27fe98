import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { deviceAnglesFromPlateOrientation } from '../../../src/core/alignment/deviceOrientation.ts';
import { TOLERANCE_PRESETS } from '../../../src/core/alignment/guidance.ts';
import { aimForPass } from '../../../src/core/geometry/pointing.ts';
import { declination } from '../../../src/core/magnetic/declination.ts';
import {
  computeAlign,
  CueGate,
  declinationAt,
  MIN_CUE_GAP_MS,
  passesFrom,
  positionFrom,
  reflectorFrom,
  toleranceCost,
  toleranceFor,
  type AlignInput,
  type PositionInput,
} from '../../../src/ui/pages/align/computeAlign.ts';
import { LiveAlignment } from '../../../src/ui/pages/align/liveAlign.ts';
import { DEFAULT_SETTINGS } from '../../../src/ui/state/settings.ts';
import { DEFAULT_WORKFLOW, type Workflow } from '../../../src/ui/state/workflow.ts';

const TOL_DEG = 1e-6;
const TOL_DB = 1e-6;
/** An invented site ("Marrowby Fen") and an instant inside WMM2025. */
const SITE: PositionInput = { latDeg: 52.61, lonDeg: 0.31, heightEllM: 45, label: 'site MF-1' };
const T_MS = Date.UTC(2026, 5, 15, 10, 0, 0);
const DECL = declinationAt(SITE, T_MS);
/** One typed pass geometry (the screen starts with none). */
const PLANNED: Workflow['geometries'] = [{ incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'typed' }];
const PASSES = passesFrom(PLANNED);
const REFLECTOR = reflectorFrom(DEFAULT_WORKFLOW);
const TARGET = (() => {
  const a = aimForPass(PASSES[0].geometry);
  return { azimuthDeg: a.reflectorAzimuthDeg, tiltDeg: a.baseTiltDeg, rollDeg: 0 };
})();

/** The live state a phone lying on a plate at `trueO` would produce (its compass reads true − declination). */
function liveFor(trueO: { azimuthDeg: number; tiltDeg: number; rollDeg: number }, absolute = true) {
  if (!DECL.ok) throw new Error('test site must be inside the model dates');
  const mag = { ...trueO, azimuthDeg: (((trueO.azimuthDeg - DECL.declinationDeg) % 360) + 360) % 360 };
  const a = deviceAnglesFromPlateOrientation(mag);
  const live = new LiveAlignment();
  for (let t = 0; t <= 1000; t += 20) live.push({ alphaDeg: a.alphaDeg, betaDeg: a.betaDeg, gammaDeg: a.gammaDeg, absolute, source: absolute ? 'deviceorientationabsolute' : 'relative', timeMs: t });
  return live.snapshot(1000);
}

const input = (over: Partial<AlignInput>): AlignInput => ({
  target: TARGET,
  live: liveFor(TARGET),
  declination: DECL,
  tiltBiasDeg: 0,
  tol: TOLERANCE_PRESETS.monitoring,
  reflector: REFLECTOR,
  passes: PASSES,
  ...over,
});

describe('declinationAt', () => {
  it('gives the WMM2025 value of the core and names the model', () => {
    const d = declinationAt(SITE, T_MS);
    const core = declination({ latDeg: SITE.latDeg, lonDeg: SITE.lonDeg, heightM: 45, timeMs: T_MS });
    expect(d.ok && core.ok && Math.abs(d.declinationDeg - core.value.declinationDeg)).toBeLessThan(TOL_DEG);
    expect(d.ok && d.text).toMatch(/WMM2025/);
    expect(d.ok && d.text).toMatch(/site MF-1/);
  });

  it('says so, and gives none, outside the model dates or without a position', () => {
    const out = declinationAt(SITE, Date.UTC(2031, 0, 1));
    expect(out.ok).toBe(false);
    expect(!out.ok && out.message).toMatch(/2025-01-01 to 2030-01-01/);
    expect(declinationAt(null, T_MS).ok).toBe(false);
  });
});

describe('computeAlign', () => {
  it('is within tolerance when the plate sits on the target (sweep of targets)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 359.9, noNaN: true }), fc.double({ min: -40, max: 40, noNaN: true }), fc.double({ min: -20, max: 20, noNaN: true }), (az, tilt, roll) => {
        const target = { azimuthDeg: az, tiltDeg: tilt, rollDeg: roll };
        const v = computeAlign(input({ target, live: liveFor(target) }));
        return v.state === 'within' && Math.abs(v.guidance!.azimuth.errorDeg!) < TOL_DEG && Math.abs(v.guidance!.tilt.errorDeg) < TOL_DEG && /within tolerance/i.test(v.statusText);
      }),
      { numRuns: 40 },
    );
  });

  it('gives the signed azimuth error and the turn that removes it', () => {
    const plus = computeAlign(input({ live: liveFor({ ...TARGET, azimuthDeg: TARGET.azimuthDeg + 3 }) }));
    expect(plus.guidance!.azimuth.errorDeg!).toBeCloseTo(3, 6);
    expect(plus.guidance!.azimuth.instruction).toBe('turn 3.0° anticlockwise');
    expect(plus.state).toBe('adjust');
    expect(plus.statusText).not.toMatch(/within tolerance/i);
    const minus = computeAlign(input({ live: liveFor({ ...TARGET, azimuthDeg: TARGET.azimuthDeg - 3 }) }));
    expect(minus.guidance!.azimuth.instruction).toBe('turn 3.0° clockwise');
  });

  it('subtracts the phone’s tilt bias', () => {
    const v = computeAlign(input({ live: liveFor({ ...TARGET, tiltDeg: TARGET.tiltDeg + 0.7 }), tiltBiasDeg: 0.7 }));
    expect(v.measured!.tiltDeg).toBeCloseTo(TARGET.tiltDeg, 6);
    expect(v.state).toBe('within');
  });

  it('without a compass shows no azimuth and says tilt and roll are within', () => {
    const v = computeAlign(input({ live: liveFor(TARGET, false) }));
    expect(v.measured!.azimuthTrueDeg).toBeNull();
    expect(v.azimuthNote).toMatch(/Compass unavailable/);
    expect(v.state).toBe('tilt-roll-within');
    expect(v.azimuthAssumed).toBe(true);
  });

  it('shows no true azimuth outside the model dates', () => {
    const v = computeAlign(input({ declination: declinationAt(SITE, Date.UTC(2024, 0, 1)) }));
    expect(v.measured!.azimuthTrueDeg).toBeNull();
    expect(v.measured!.azimuthMagDeg).not.toBeNull();
    expect(v.azimuthNote).toMatch(/No true azimuth: .*WMM2025/);
  });

  it('says "cannot measure" when the phone is near vertical', () => {
    const live = new LiveAlignment();
    live.push({ alphaDeg: 0, betaDeg: 88, gammaDeg: 0, absolute: true, source: 'deviceorientationabsolute', timeMs: 0 });
    const v = computeAlign(input({ live: live.snapshot(0) }));
    expect(v.state).toBe('cannot-measure');
    expect(v.statusText).toMatch(/^Cannot measure/);
  });

  it('asks for a plan when there is no target, still showing what is measured', () => {
    const v = computeAlign(input({ target: null }));
    expect(v.state).toBe('no-target');
    expect(v.statusText).toBe('Plan an aim first');
    expect(v.measured).not.toBeNull();
  });

  it('predicts the loss per pass at the current orientation, ~0 dB on a single-pass target', () => {
    const v = computeAlign(input({}));
    expect(v.losses).toHaveLength(1);
    expect(v.losses[0].lossDb).toBeLessThan(TOL_DB);
    const off = computeAlign(input({ live: liveFor({ ...TARGET, tiltDeg: TARGET.tiltDeg + 5 }) }));
    expect(off.worstLossDb!).toBeGreaterThan(0.1);
  });
});

describe('toleranceCost', () => {
  it('the tighter calibration preset never costs more than monitoring', () => {
    const cal = toleranceCost(REFLECTOR, TARGET, TOLERANCE_PRESETS.calibration, PASSES).cost!;
    const mon = toleranceCost(REFLECTOR, TARGET, TOLERANCE_PRESETS.monitoring, PASSES).cost!;
    expect(cal.combinedWorstDb).toBeGreaterThan(0);
    expect(cal.combinedWorstDb).toBeLessThanOrEqual(mon.combinedWorstDb);
    expect(mon.combinedWorstDb).toBeGreaterThanOrEqual(Math.max(mon.azimuthDb, mon.tiltDb, mon.rollDb) - TOL_DB);
  });

  it('says why when no pass is planned', () => {
    expect(toleranceCost(REFLECTOR, TARGET, TOLERANCE_PRESETS.calibration, []).message).toMatch(/No planned pass/);
  });
});

describe('helpers', () => {
  it('picks the custom tolerance only when chosen', () => {
    expect(toleranceFor(DEFAULT_SETTINGS)).toBe(TOLERANCE_PRESETS.monitoring);
    expect(toleranceFor({ ...DEFAULT_SETTINGS, tolerancePreset: 'custom' })).toEqual(DEFAULT_SETTINGS.customToleranceDeg);
  });

  it('prefers the planned site, then the phone fix, then typed coordinates', () => {
    const fix = { latDeg: 1, lonDeg: 2, heightEllM: null, horizontalAccuracyM: 4 };
    const site = { latDeg: 3, lonDeg: 4, heightEllM: 5, source: 'typed' as const, code: 'MF-1' };
    expect(positionFrom(site, fix, {})!.label).toBe('site MF-1');
    expect(positionFrom(null, fix, { latDeg: 9, lonDeg: 9 })!.label).toBe('phone GNSS ±4.0 m');
    expect(positionFrom(null, null, { latDeg: 9, lonDeg: 8 })).toMatchObject({ latDeg: 9, lonDeg: 8, label: 'typed position' });
    expect(positionFrom(null, null, { latDeg: 9 })).toBeNull();
  });

  it('skips planned passes that do not parse', () => {
    const p = passesFrom([...PLANNED, { incidenceDeg: '95', headingDeg: '10', look: 'right', source: 'typed' }]);
    expect(p).toHaveLength(1);
  });

  it('cues on entering tolerance, not while staying in it, and not more often than every 3 s', () => {
    const g = new CueGate();
    expect(g.update(false, 0)).toBe(false);
    expect(g.update(true, 100)).toBe(true);
    expect(g.update(true, 200)).toBe(false);
    expect(g.update(false, 300)).toBe(false);
    expect(g.update(true, 400)).toBe(false);
    expect(g.update(false, 500)).toBe(false);
    expect(g.update(true, 100 + MIN_CUE_GAP_MS)).toBe(true);
  });
});

describe('passes handed over from the orbit', () => {
  it('issue: Align used heading ∓ 90° and ignored the exact line of sight a computed pass carries', () => {
    // Found in review, 2026-12-02: Plan showed 0 dB at the aim while Align showed 0.1° off boresight.
    const [p] = passesFrom([{ incidenceDeg: '30', headingDeg: '190', look: 'right', losAzimuthDeg: 100.3, source: 'orbital-elements' }]);
    expect(p.geometry.losAzimuthDeg).toBe(100.3);
    expect(aimForPass(p.geometry).reflectorAzimuthDeg).toBeCloseTo(100.3, 12);
  });
});
