/**
 * Capturing the alignment for the logbook, and the azimuth-method cross-check that guards it.
 * A compass azimuth is refused when an independent method (sun shadow, reference bearing) disagrees with it beyond
 * the crew's method tolerance, or when the measured field says the compass is disturbed: the crew must then set the
 * azimuth by another method or re-measure.
 */
import { magneticToTrueAzimuthDeg } from '../../../core/alignment/deviceOrientation.ts';
import { compareAzimuthMethods, type AzimuthReading, type MethodComparison } from '../../../core/alignment/methodCheck.ts';
import { applyTiltBias } from '../../../core/alignment/reversal.ts';
import type { CapturedOrientation } from '../../../core/alignment/smoothing.ts';
import type { Reflector } from '../../../core/reflector/trihedral.ts';
import { requireFinite, requireInRange } from '../../../core/validate.ts';
import { parseField } from '../../components/fields.tsx';
import type { Capture } from '../../state/workflow.ts';
import { passLosses, type DeclinationView, type PassItem } from './computeAlign.ts';

export type CaptureMethod = Capture['method'];

export const METHOD_LABEL: Record<CaptureMethod, string> = {
  compass: 'Compass (with declination)',
  'sun-shadow': 'Sun and shadow',
  'reference-bearing': 'Reference bearing',
  'other-instrument': 'Other instrument (typed)',
};

/** Short names for the method buttons. */
export const METHOD_SHORT: Record<CaptureMethod, string> = {
  compass: 'Compass',
  'sun-shadow': 'Sun shadow',
  'reference-bearing': 'Reference',
  'other-instrument': 'Other instrument',
};

export interface MethodCheckView {
  comparison: MethodComparison | null;
  /** The compass may not set the stored azimuth. */
  compassBlocked: boolean;
  message: string | null;
}

/** Cross-check the azimuth readings the crew recorded; block the compass when it failed a check. */
export function methodCheck(readings: readonly AzimuthReading[], toleranceDeg: number, fieldDisturbed: boolean): MethodCheckView {
  let comparison: MethodComparison | null = null;
  let message: string | null = null;
  try {
    comparison = readings.length ? compareAzimuthMethods(readings, toleranceDeg) : null;
    message = comparison?.message ?? null;
  } catch (e) {
    message = e instanceof Error ? e.message : String(e);
  }
  const hasCompass = readings.some((r) => r.method === 'compass');
  const hasIndependent = readings.some((r) => r.method !== 'compass');
  const failedCheck = comparison !== null && hasCompass && hasIndependent && !comparison.compassTrusted;
  const compassBlocked = failedCheck || fieldDisturbed;
  if (fieldDisturbed) message = [message, 'The measured field says the compass is disturbed: it cannot set the stored azimuth.'].filter(Boolean).join(' ');
  return { comparison, compassBlocked, message };
}

export interface CaptureRequest {
  method: Exclude<CaptureMethod, 'other-instrument'>;
  window: CapturedOrientation | null;
  steady: boolean;
  declination: DeclinationView;
  tiltBiasDeg: number;
  /** Azimuths set out by the independent methods and recorded by the crew (the plate laid on each line). */
  independent: readonly AzimuthReading[];
  methodToleranceDeg: number;
  /** The measured field strength says the compass is disturbed. */
  fieldDisturbed: boolean;
  reflector: Reflector;
  passes: readonly PassItem[];
  atMs: number;
}

export type CaptureOutcome = { ok: true; capture: Capture; check: MethodCheckView } | { ok: false; message: string; check: MethodCheckView | null };

const worstLoss = (reflector: Reflector, o: { azimuthDeg: number; tiltDeg: number; rollDeg: number }, passes: readonly PassItem[]) => {
  const l = passLosses(reflector, o, passes);
  return l.length ? Math.max(...l.map((x) => x.lossDb)) : null;
};

/** The compass azimuth (true) of a capture window, when there is one and a declination to correct it. */
export function compassTrueAzimuthDeg(window: CapturedOrientation | null, decl: DeclinationView): number | null {
  return window && window.azimuthDeg !== null && decl.ok ? magneticToTrueAzimuthDeg(window.azimuthDeg, decl.declinationDeg) : null;
}

/**
 * Build the capture from ~3 s of steady phone readings; a plain refusal when something is missing. The compass
 * azimuth of the window is always cross-checked against the recorded independent readings, and a compass that
 * fails the check (or a disturbed field) cannot be the method of record.
 */
export function buildCapture(r: CaptureRequest): CaptureOutcome {
  if (!r.window || !r.steady) return { ok: false, message: 'Hold the phone still on the plate until the readings are steady (about 3 s), then capture.', check: null };
  const compassDeg = compassTrueAzimuthDeg(r.window, r.declination);
  const check = methodCheck(compassDeg === null ? r.independent : [...r.independent, { method: 'compass', azimuthDeg: compassDeg }], r.methodToleranceDeg, r.fieldDisturbed);
  let azimuthDeg: number;
  let azimuthStdDeg: number | undefined;
  let declinationDeg: number | null = null;
  let declinationModel: string | null = null;
  if (r.method === 'compass') {
    if (check.compassBlocked) {
      return { ok: false, check, message: 'The compass failed the cross-check, so it cannot set the stored azimuth: choose the sun shadow or reference bearing as the method, or re-measure away from steel and the vehicle.' };
    }
    if (r.window.azimuthDeg === null) return { ok: false, check, message: 'No compass azimuth: choose the method that set the azimuth.' };
    if (!r.declination.ok || compassDeg === null) return { ok: false, check, message: `No declination, so no true azimuth from the compass. ${r.declination.ok ? '' : r.declination.message}` };
    azimuthDeg = compassDeg;
    azimuthStdDeg = r.window.azimuthStdDeg ?? undefined;
    declinationDeg = r.declination.declinationDeg;
    declinationModel = r.declination.model;
  } else {
    const rec = [...r.independent].reverse().find((x) => x.method === r.method);
    if (!rec) {
      return { ok: false, check, message: 'Set the plate on the tape line and record it under this method first (button “Plate is on this line”).' };
    }
    azimuthDeg = rec.azimuthDeg;
  }
  let tiltDeg: number;
  try {
    tiltDeg = applyTiltBias(r.window.tiltDeg, r.tiltBiasDeg);
  } catch (e) {
    return { ok: false, check, message: e instanceof Error ? e.message : String(e) };
  }
  const o = { azimuthDeg, tiltDeg, rollDeg: r.window.rollDeg };
  return {
    ok: true,
    check,
    capture: {
      ...o,
      azimuthStdDeg,
      tiltStdDeg: r.window.tiltStdDeg,
      samples: r.window.sampleCount,
      method: r.method,
      declinationDeg,
      declinationModel,
      atMs: r.atMs,
      predictedLossDb: worstLoss(r.reflector, o, r.passes),
    },
  };
}

export interface ManualForm {
  azimuthDeg: string;
  tiltDeg: string;
  rollDeg: string;
}

export interface ManualOutcome {
  errors: { azimuthDeg?: string; tiltDeg?: string; rollDeg?: string };
  capture: Capture | null;
}

/** A capture from azimuth, tilt and roll measured with other instruments (one reading each, method 'other-instrument'). */
export function buildManualCapture(f: ManualForm, reflector: Reflector, passes: readonly PassItem[], atMs: number): ManualOutcome {
  const az = parseField('Azimuth', f.azimuthDeg, (n, v) => requireInRange(n, v, { min: 0, max: 360, maxInclusive: false, unit: '°' }));
  const tilt = parseField('Tilt', f.tiltDeg, (n, v) => requireInRange(n, v, { min: -90, max: 90, unit: '°' }));
  const roll = parseField('Roll', f.rollDeg, (n, v) => requireInRange(n, v, { min: -180, max: 180, unit: '°' }));
  const errors = { azimuthDeg: az.error, tiltDeg: tilt.error, rollDeg: roll.error };
  if (az.value === undefined || tilt.value === undefined || roll.value === undefined) return { errors, capture: null };
  const o = { azimuthDeg: requireFinite('azimuthDeg', az.value), tiltDeg: tilt.value, rollDeg: roll.value };
  return {
    errors,
    capture: { ...o, samples: 1, method: 'other-instrument', declinationDeg: null, declinationModel: null, atMs, predictedLossDb: worstLoss(reflector, o, passes) },
  };
}
