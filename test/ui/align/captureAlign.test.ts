import { describe, expect, it } from 'vitest';
import type { CapturedOrientation } from '../../../src/core/alignment/smoothing.ts';
import { buildCapture, buildManualCapture, methodCheck, type CaptureRequest } from '../../../src/ui/pages/align/captureAlign.ts';
import { declinationAt, passesFrom, reflectorFrom } from '../../../src/ui/pages/align/computeAlign.ts';
import { DEFAULT_WORKFLOW, type Workflow } from '../../../src/ui/state/workflow.ts';

const TOL_DEG = 1e-9;
const SITE = { latDeg: 52.61, lonDeg: 0.31, heightEllM: 45, label: 'site MF-1' };
const T_MS = Date.UTC(2026, 5, 15, 10, 0, 0);
const DECL = declinationAt(SITE, T_MS);
const DECL_DEG = DECL.ok ? DECL.declinationDeg : NaN;
/** One typed pass geometry (the screen starts with none). */
const PLANNED: Workflow['geometries'] = [{ incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'typed' }];
const PASSES = passesFrom(PLANNED);
const REFLECTOR = reflectorFrom(DEFAULT_WORKFLOW);

/** A steady 3 s window whose compass (magnetic) azimuth makes `trueAz` once the declination is added. */
const windowFor = (trueAz: number, tiltDeg = 14.7, rollDeg = 0.1): CapturedOrientation => ({
  azimuthDeg: trueAz - DECL_DEG,
  tiltDeg,
  rollDeg,
  azimuthStdDeg: 0.2,
  tiltStdDeg: 0.05,
  rollStdDeg: 0.05,
  sampleCount: 120,
  azimuthSampleCount: 120,
});

const req = (over: Partial<CaptureRequest>): CaptureRequest => ({
  method: 'compass',
  window: windowFor(100),
  steady: true,
  declination: DECL,
  tiltBiasDeg: 0,
  independent: [],
  methodToleranceDeg: 3,
  fieldDisturbed: false,
  reflector: REFLECTOR,
  passes: PASSES,
  atMs: T_MS,
  ...over,
});

describe('buildCapture', () => {
  it('stores a compass azimuth corrected to true north, with the declination and model used', () => {
    const out = buildCapture(req({ tiltBiasDeg: 0.2 }));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(Math.abs(out.capture.azimuthDeg - 100)).toBeLessThan(1e-9);
    expect(out.capture).toMatchObject({ method: 'compass', declinationModel: 'WMM2025', samples: 120, atMs: T_MS });
    expect(Math.abs(out.capture.declinationDeg! - DECL_DEG)).toBeLessThan(TOL_DEG);
    expect(out.capture.tiltDeg).toBeCloseTo(14.5, 9);
    expect(out.capture.predictedLossDb).not.toBeNull();
  });

  it('refuses the compass as method of record when an independent method disagrees beyond tolerance', () => {
    const out = buildCapture(req({ independent: [{ method: 'sun-shadow', azimuthDeg: 105 }] }));
    expect(out.ok).toBe(false);
    expect(!out.ok && out.message).toMatch(/compass failed the cross-check/);
    expect(out.check?.compassBlocked).toBe(true);
    // …but the sun-shadow line may be stored, with tilt and roll from the phone.
    const sun = buildCapture(req({ method: 'sun-shadow', independent: [{ method: 'sun-shadow', azimuthDeg: 105 }] }));
    expect(sun.ok && sun.capture).toMatchObject({ method: 'sun-shadow', azimuthDeg: 105, declinationDeg: null });
    expect(sun.ok && sun.check.message).toMatch(/compass reads 5\.0° away/);
  });

  it('accepts the compass when an independent method agrees', () => {
    const out = buildCapture(req({ independent: [{ method: 'reference-bearing', azimuthDeg: 101 }] }));
    expect(out.ok && out.capture.method).toBe('compass');
    expect(out.ok && out.check.comparison?.compassTrusted).toBe(true);
  });

  it('refuses the compass when the measured field is disturbed', () => {
    const out = buildCapture(req({ fieldDisturbed: true }));
    expect(out.ok).toBe(false);
  });

  it('refuses without steady readings, without a recorded tape line, or without a declination', () => {
    expect(buildCapture(req({ steady: false })).ok).toBe(false);
    expect(buildCapture(req({ window: null })).ok).toBe(false);
    const noLine = buildCapture(req({ method: 'reference-bearing' }));
    expect(!noLine.ok && noLine.message).toMatch(/Plate is on this line/);
    const outside = buildCapture(req({ declination: declinationAt(SITE, Date.UTC(2031, 0, 1)) }));
    expect(!outside.ok && outside.message).toMatch(/No declination/);
  });
});

describe('methodCheck', () => {
  it('blocks the compass only after a failed check or a disturbed field', () => {
    expect(methodCheck([], 3, false)).toEqual({ comparison: null, compassBlocked: false, message: null });
    expect(methodCheck([{ method: 'compass', azimuthDeg: 10 }], 3, false).compassBlocked).toBe(false);
    expect(methodCheck([{ method: 'compass', azimuthDeg: 10 }, { method: 'sun-shadow', azimuthDeg: 14 }], 3, false).compassBlocked).toBe(true);
    expect(methodCheck([], 3, true).compassBlocked).toBe(true);
  });

  it('wraps across north (359° and 1° agree within 3°)', () => {
    const c = methodCheck([{ method: 'compass', azimuthDeg: 359 }, { method: 'sun-shadow', azimuthDeg: 1 }], 3, false);
    expect(c.compassBlocked).toBe(false);
    expect(c.comparison!.maxDisagreementDeg).toBeCloseTo(2, 9);
  });
});

describe('buildManualCapture', () => {
  it('stores typed readings as method "other-instrument"', () => {
    const out = buildManualCapture({ azimuthDeg: '100.5', tiltDeg: '14,7', rollDeg: '0' }, REFLECTOR, PASSES, T_MS);
    expect(out.capture).toMatchObject({ azimuthDeg: 100.5, tiltDeg: 14.7, rollDeg: 0, method: 'other-instrument', declinationDeg: null, samples: 1 });
  });

  it('names the field, the value and the range when a typed value is bad', () => {
    const out = buildManualCapture({ azimuthDeg: '360', tiltDeg: 'abc', rollDeg: '' }, REFLECTOR, PASSES, T_MS);
    expect(out.capture).toBeNull();
    expect(out.errors.azimuthDeg).toMatch(/Azimuth must be in \[0, 360\)°, got 360/);
    expect(out.errors.tiltDeg).toMatch(/Tilt must be a number/);
    expect(out.errors.rollDeg).toMatch(/Roll is empty/);
  });
});
