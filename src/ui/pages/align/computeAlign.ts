/**
 * Everything the Align screen shows, from plain inputs, in pure functions (testable without a DOM or sensors).
 * All maths is the core's (guidance, declination, misalignment, smoothing); this file only wires it and words it.
 */
import { magneticToTrueAzimuthDeg } from '../../../core/alignment/deviceOrientation.ts';
import { guidance, toleranceLossDb, TOLERANCE_PRESETS, type AlignmentTolerance, type Guidance, type ToleranceLoss } from '../../../core/alignment/guidance.ts';
import { applyTiltBias } from '../../../core/alignment/reversal.ts';
import type { ReflectorOrientation } from '../../../core/geometry/orientation.ts';
import type { PassGeometry } from '../../../core/geometry/pointing.ts';
import { declination } from '../../../core/magnetic/declination.ts';
import { bandWavelengthM } from '../../../core/radar/bands.ts';
import { misalignment } from '../../../core/reflector/misalignment.ts';
import type { Reflector } from '../../../core/reflector/trihedral.ts';
import { normalizeAzimuthDeg, wrapSignedDeg } from '../../../core/units.ts';
import { requireIncidenceDeg, requireInRange } from '../../../core/validate.ts';
import { parseField } from '../../components/fields.tsx';
import type { Settings } from '../../state/settings.ts';
import type { Workflow } from '../../state/workflow.ts';
import type { LiveSnapshot } from './liveAlign.ts';

export type AlignTarget = ReflectorOrientation;

export interface PassItem {
  label: string;
  geometry: PassGeometry;
}

/** The tolerance in force: a preset, or the crew's custom values. */
export function toleranceFor(s: Pick<Settings, 'tolerancePreset' | 'customToleranceDeg'>): AlignmentTolerance {
  return s.tolerancePreset === 'custom' ? s.customToleranceDeg : TOLERANCE_PRESETS[s.tolerancePreset];
}

/** The planned passes that parse (the Plan screen marks the others). */
export function passesFrom(geometries: Workflow['geometries']): PassItem[] {
  const out: PassItem[] = [];
  geometries.forEach((g, i) => {
    const inc = parseField('Incidence', g.incidenceDeg, requireIncidenceDeg);
    const hdg = parseField('Heading', g.headingDeg, (n, v) => requireInRange(n, v, { min: -360, max: 360, unit: '°' }));
    if (inc.value !== undefined && hdg.value !== undefined) {
      out.push({ label: g.label ?? `Pass ${i + 1}`, geometry: { incidenceDeg: inc.value, headingDeg: hdg.value, look: g.look, ...(g.losAzimuthDeg !== undefined ? { losAzimuthDeg: g.losAzimuthDeg } : {}) } });
    }
  });
  return out;
}

/**
 * The reflector for loss figures. Loss in dB depends on the shape only (pattern.ts: σ/σ_peak = (A/A_peak)²), so a
 * nominal edge and wavelength stand in when the Plan screen's are missing or custom.
 */
export function reflectorFrom(wf: Pick<Workflow, 'shape' | 'edgeM' | 'band'>): Reflector {
  const edge = Number(wf.edgeM);
  let wavelengthM = 0.055;
  try {
    wavelengthM = bandWavelengthM(wf.band);
  } catch {
    /* custom band: nominal wavelength, which does not change the loss */
  }
  return { shape: wf.shape, edgeM: Number.isFinite(edge) && edge >= 0.05 && edge <= 10 ? edge : 1, wavelengthM };
}

export interface PositionInput {
  latDeg: number;
  lonDeg: number;
  heightEllM: number | null;
  /** Where it came from, in words ("site M-04", "phone GNSS ±4 m", "typed"). */
  label: string;
}

export type DeclinationView =
  | { ok: true; declinationDeg: number; model: string; totalIntensityNt: number; text: string }
  | { ok: false; message: string };

/** E/W wording of a declination, e.g. "2.3° E". */
export const declinationText = (d: number) => `${Math.abs(d).toFixed(1)}° ${d >= 0 ? 'E' : 'W'}`;

/** WMM declination at the position and instant, worded; a plain message when it cannot be given. */
export function declinationAt(pos: PositionInput | null, timeMs: number): DeclinationView {
  if (!pos) return { ok: false, message: 'No position yet, so no declination: take a GPS fix or type the site coordinates.' };
  try {
    const r = declination({ latDeg: pos.latDeg, lonDeg: pos.lonDeg, heightM: pos.heightEllM ?? 0, timeMs });
    if (!r.ok) return { ok: false, message: r.error.message };
    const d = r.value.declinationDeg;
    const date = new Date(timeMs).toISOString().slice(0, 10);
    return {
      ok: true,
      declinationDeg: d,
      model: r.value.model,
      totalIntensityNt: r.value.totalIntensityNt,
      text: `Declination ${declinationText(d)} (${r.value.model}, ${date}, ${pos.label}): true = magnetic ${d >= 0 ? '+' : '−'} ${Math.abs(d).toFixed(1)}°.`,
    };
  } catch (e) {
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}

export interface PassLoss {
  label: string;
  lossDb: number;
  offBoresightDeg: number;
}

/** Predicted loss for each planned pass at an orientation; [] when the core rejects the inputs. */
export function passLosses(reflector: Reflector, o: ReflectorOrientation, passes: readonly PassItem[]): PassLoss[] {
  try {
    return passes.map((p) => {
      const m = misalignment(reflector, o, p.geometry);
      return { label: p.label, lossDb: m.lossDb, offBoresightDeg: m.offBoresightDeg };
    });
  } catch {
    return [];
  }
}

const worst = (l: readonly PassLoss[]) => (l.length ? Math.max(...l.map((x) => x.lossDb)) : null);

/**
 * What a tolerance costs: worst extra loss over the planned passes when the plate is off by the tolerance
 * (each axis alone, and all together), relative to the loss at the target itself. Null with a reason when it
 * cannot be worked out (no pass planned, or a pass leaves the corner).
 */
export function toleranceCost(reflector: Reflector, target: AlignTarget | null, tol: AlignmentTolerance, passes: readonly PassItem[]): { cost: ToleranceLoss | null; message: string | null } {
  if (!target) return { cost: null, message: null };
  if (!passes.length) return { cost: null, message: 'No planned pass: the loss this tolerance costs is unknown.' };
  try {
    const base = passLosses(reflector, target, passes);
    const cost = toleranceLossDb(tol, (e) => {
      const o = {
        azimuthDeg: normalizeAzimuthDeg(target.azimuthDeg + e.azimuthErrorDeg),
        tiltDeg: Math.max(-90, Math.min(90, target.tiltDeg + e.tiltErrorDeg)),
        rollDeg: wrapSignedDeg(target.rollDeg + e.rollErrorDeg),
      };
      const l = passLosses(reflector, o, passes);
      return Math.max(...l.map((x, i) => x.lossDb - base[i].lossDb));
    });
    return { cost, message: null };
  } catch (e) {
    return { cost: null, message: `The loss this tolerance costs cannot be worked out: ${e instanceof Error ? e.message : String(e)}` };
  }
}

export type AlignState = 'no-target' | 'waiting' | 'cannot-measure' | 'within' | 'tilt-roll-within' | 'adjust';

export interface AlignView {
  state: AlignState;
  statusText: string;
  /** Smoothed, bias-corrected plate orientation; azimuthTrueDeg null without compass or declination. */
  measured: { azimuthTrueDeg: number | null; azimuthMagDeg: number | null; tiltDeg: number; rollDeg: number } | null;
  /** Why no true azimuth is shown, when it is not. */
  azimuthNote: string | null;
  guidance: Guidance | null;
  losses: PassLoss[];
  worstLossDb: number | null;
  /** The loss figures assume the azimuth is on target (no compass azimuth). */
  azimuthAssumed: boolean;
  error: string | null;
}

export interface AlignInput {
  target: AlignTarget | null;
  live: LiveSnapshot;
  declination: DeclinationView;
  tiltBiasDeg: number;
  tol: AlignmentTolerance;
  reflector: Reflector;
  passes: readonly PassItem[];
}

const empty = (state: AlignState, statusText: string, extra: Partial<AlignView> = {}): AlignView => ({
  state, statusText, measured: null, azimuthNote: null, guidance: null, losses: [], worstLossDb: null, azimuthAssumed: false, error: null, ...extra,
});

/** One frame of the Align screen. Never throws: a core error comes back in `error`. */
export function computeAlign(i: AlignInput): AlignView {
  if (i.live.nearVertical) return empty('cannot-measure', 'Cannot measure: the phone is near vertical', { error: i.live.nearVertical });
  const m = i.live.measured;
  if (!m) return empty(i.target ? 'waiting' : 'no-target', i.target ? 'Waiting for orientation readings…' : 'Plan an aim first');
  try {
    const tiltDeg = applyTiltBias(m.tiltDeg, i.tiltBiasDeg);
    let azimuthTrueDeg: number | null = null;
    let azimuthNote: string | null = null;
    if (m.azimuthMagDeg === null) azimuthNote = 'Compass unavailable: azimuth not measured by the phone.';
    else if (!i.declination.ok) azimuthNote = `No true azimuth: ${i.declination.message}`;
    else azimuthTrueDeg = magneticToTrueAzimuthDeg(m.azimuthMagDeg, i.declination.declinationDeg);
    const measured = { azimuthTrueDeg, azimuthMagDeg: m.azimuthMagDeg, tiltDeg, rollDeg: m.rollDeg };
    if (!i.target) return empty('no-target', 'Plan an aim first', { measured, azimuthNote });

    const g = guidance(i.target, { azimuthDeg: azimuthTrueDeg, tiltDeg, rollDeg: m.rollDeg }, i.tol);
    const o = { azimuthDeg: azimuthTrueDeg ?? i.target.azimuthDeg, tiltDeg, rollDeg: m.rollDeg };
    const losses = passLosses(i.reflector, o, i.passes);
    let state: AlignState;
    let statusText: string;
    if (g.allWithin) {
      state = 'within';
      statusText = 'Within tolerance: hold still and capture';
    } else if (azimuthTrueDeg === null && g.tilt.within && g.roll.within) {
      state = 'tilt-roll-within';
      statusText = 'Tilt and roll within tolerance; set the azimuth by a tape line';
    } else {
      state = 'adjust';
      const out = [g.azimuth.errorDeg !== null && !g.azimuth.within ? 'azimuth' : null, g.tilt.within ? null : 'tilt', g.roll.within ? null : 'roll'].filter(Boolean);
      statusText = `Adjust: ${out.join(', ')} out of tolerance`;
    }
    return { state, statusText, measured, azimuthNote, guidance: g, losses, worstLossDb: worst(losses), azimuthAssumed: azimuthTrueDeg === null, error: null };
  } catch (e) {
    return empty('waiting', 'Cannot show guidance', { error: e instanceof Error ? e.message : String(e) });
  }
}

/** Shortest gap between two "within tolerance" cues, ms, so that a reading wavering at the edge does not chatter. */
export const MIN_CUE_GAP_MS = 3000;

/** Says when to cue: on entering a within state, at most once per MIN_CUE_GAP_MS. */
export class CueGate {
  private was = false;
  private lastCueMs = -Infinity;
  update(within: boolean, nowMs: number): boolean {
    const cue = within && !this.was && nowMs - this.lastCueMs >= MIN_CUE_GAP_MS;
    if (cue) this.lastCueMs = nowMs;
    this.was = within;
    return cue;
  }
}

/** How long the plate must stay within tolerance AND steady before an automatic capture, ms. */
export const AUTO_CAPTURE_HOLD_MS = 3000;

/**
 * Capture by a steady hold: says "capture now" once the plate has been within tolerance and steady without a break
 * for AUTO_CAPTURE_HOLD_MS, then stays quiet until the plate has left tolerance (or lost steadiness) and come back,
 * so one hold gives one capture. `holdLeftMs` is the countdown the screen shows (null when not holding).
 */
export class AutoCaptureGate {
  private sinceMs: number | null = null;
  private fired = false;
  update(holding: boolean, nowMs: number): { capture: boolean; holdLeftMs: number | null } {
    if (!holding) {
      this.sinceMs = null;
      this.fired = false;
      return { capture: false, holdLeftMs: null };
    }
    this.sinceMs ??= nowMs;
    if (this.fired) return { capture: false, holdLeftMs: null };
    const left = AUTO_CAPTURE_HOLD_MS - (nowMs - this.sinceMs);
    if (left <= 0) {
      this.fired = true;
      return { capture: true, holdLeftMs: 0 };
    }
    return { capture: false, holdLeftMs: left };
  }
}

/** "±2° azimuth, ±1° tilt, ±2° roll": a tolerance's limits in degrees, as the presets show them. */
export function toleranceLimitsText(t: AlignmentTolerance): string {
  const d = (x: number) => `\u00b1${Number(x.toFixed(2))}\u00b0`;
  return `${d(t.azimuthDeg)} azimuth, ${d(t.tiltDeg)} tilt, ${d(t.rollDeg)} roll`;
}

/** Position for the declination and the sun: the planned site first, then the phone's fix, then typed coordinates. */
export function positionFrom(
  site: Workflow['site'],
  fix: { latDeg: number; lonDeg: number; heightEllM: number | null; horizontalAccuracyM: number } | null,
  typed: { latDeg?: number; lonDeg?: number },
): PositionInput | null {
  if (site) return { latDeg: site.latDeg, lonDeg: site.lonDeg, heightEllM: site.heightEllM, label: site.code ? `site ${site.code}` : 'the planned site' };
  if (fix) return { ...fix, label: `phone GNSS \u00b1${fix.horizontalAccuracyM < 10 ? fix.horizontalAccuracyM.toFixed(1) : fix.horizontalAccuracyM.toFixed(0)} m` };
  if (typed.latDeg !== undefined && typed.lonDeg !== undefined) return { latDeg: typed.latDeg, lonDeg: typed.lonDeg, heightEllM: null, label: 'typed position' };
  return null;
}

/** A signed angle for display: "+1.2°", "−0.4°", and "±0.0°" for anything that rounds to zero. */
export function signedDeg(x: number, digits = 1): string {
  const text = Math.abs(x).toFixed(digits);
  const sign = Number(text) === 0 ? '\u00b1' : x > 0 ? '+' : '\u2212';
  return `${sign}${text}\u00b0`;
}
