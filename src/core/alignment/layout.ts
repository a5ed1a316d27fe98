/**
 * Setting out the target azimuth with a tape, from a reference line whose azimuth is known (a surveyed bearing
 * between two marks, or a vertical pin's shadow).
 *
 * Standing at the pivot and facing along the reference line (azimuth R), the target line (azimuth T) is reached by
 * turning τ = wrap(T − R) into (−180°, 180°], clockwise positive. A point at distance B along the target line is
 *   B·t̂ = B cos τ · r̂ + B sin τ · p̂,
 * where r̂ = (sin R, cos R) is the reference direction and p̂ = (cos R, −sin R) its right-hand perpendicular (east,
 * north components). So: go alongM = B cos τ along the reference line (negative = behind you), then offsetM =
 * B |sin τ| square to it, to the right for a clockwise turn (τ > 0) and to the left for an anticlockwise one.
 * Source: plane trigonometry (rotation of a 2-D vector); the method is ordinary offset set-out with a tape
 *   (common practice, no source).
 * Validity: a flat site, short baselines (tens of metres) where the curvature and convergence of meridians are
 * negligible (the meridian convergence over 100 m east–west is about 0.001° × tan(latitude)).
 */
import { normalizeAzimuthDeg, toRad, wrapSignedDeg } from '../units.ts';
import { requireFinite, requirePositive } from '../validate.ts';

export interface TapeLayout {
  /** Signed turn from the reference line to the target line, degrees, clockwise positive, (−180, 180]. */
  turnDeg: number;
  /** Distance along the reference line from the pivot, metres; negative = behind you (turn beyond ±90°). */
  alongM: number;
  /** Distance square to the reference line, metres, ≥ 0, on `side`. */
  offsetM: number;
  /** Which side of the reference line, facing along it; 'right' for a clockwise turn (and for τ = 0 or 180°). */
  side: 'left' | 'right';
}

/** Tape offsets that put a mark on the target line at `baselineM` from the pivot. See the file header. */
export function tapeLayout(referenceAzimuthDeg: number, targetAzimuthDeg: number, baselineM: number): TapeLayout {
  requireFinite('referenceAzimuthDeg', referenceAzimuthDeg);
  requireFinite('targetAzimuthDeg', targetAzimuthDeg);
  requirePositive('baselineM', baselineM, 'm');
  const turnDeg = wrapSignedDeg(targetAzimuthDeg - referenceAzimuthDeg);
  const tau = toRad(turnDeg);
  // Exact zeros for the square turns keep the printed table free of 6e-17-style noise.
  const alongM = Math.abs(turnDeg) === 90 ? 0 : baselineM * Math.cos(tau);
  const offsetM = turnDeg === 0 || turnDeg === 180 ? 0 : baselineM * Math.abs(Math.sin(tau));
  return { turnDeg, alongM, offsetM, side: turnDeg < 0 ? 'left' : 'right' };
}

export interface ShadowLayout extends TapeLayout {
  /** Azimuth of the shadow of a vertical pin (sun azimuth + 180°), degrees true, [0, 360). */
  shadowAzimuthDeg: number;
  note: string;
}

export const SHADOW_NOTE =
  'The shadow turns with the sun, about 0.25° a minute and faster near noon when the sun is high: mark the tip ' +
  'of the shadow and read the sun azimuth for that same minute.';

/**
 * Tape layout from a vertical pin's shadow: the shadow points away from the sun, azimuth = sun azimuth + 180°,
 * and the shadow line (pin → shadow tip) is the reference line. The sun's azimuth comes from `sunPosition`.
 * Validity: a truly vertical pin (plumb it), a sharp shadow, and the sun azimuth for the minute the shadow was
 * marked: the azimuth moves about 0.25°/min on average and several times faster near noon when the sun is high
 * (`sunAzimuthRateDegPerMin` in sun/sunPosition.ts gives the rate for a site and time).
 */
export function shadowLayout(sunAzimuthDeg: number, targetAzimuthDeg: number, baselineM: number): ShadowLayout {
  requireFinite('sunAzimuthDeg', sunAzimuthDeg);
  const shadowAzimuthDeg = normalizeAzimuthDeg(sunAzimuthDeg + 180);
  return { ...tapeLayout(shadowAzimuthDeg, targetAzimuthDeg, baselineM), shadowAzimuthDeg, note: SHADOW_NOTE };
}
