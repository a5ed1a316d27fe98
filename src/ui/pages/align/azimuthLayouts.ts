/**
 * Azimuth without the compass: tape offsets from a pin's shadow or from a reference bearing between two points,
 * worded as steps for the crew. The maths is the core's (sunPosition, geodesicInverse, shadowLayout, tapeLayout).
 */
import { shadowLayout, tapeLayout, type ShadowLayout, type TapeLayout } from '../../../core/alignment/layout.ts';
import { geodesicInverse } from '../../../core/geodesy/bearing.ts';
import { sunAzimuthRateDegPerMin, sunPosition } from '../../../core/sun/sunPosition.ts';
import { toDeg } from '../../../core/units.ts';
import { requireInRange, requireLatDeg, requireLonDeg } from '../../../core/validate.ts';
import { parseField, type Parsed } from '../../components/fields.tsx';
import { fmtLength, lengthToM, M_PER_FT, type LengthUnit } from '../../format.ts';
import type { PositionInput } from './computeAlign.ts';

/** A reference closer than this gets a warning, m; with a point error of POINT_ERROR_M, m (common practice, no source). */
const SHORT_REFERENCE_M = 20;
const POINT_ERROR_M = 0.1;

/** Steps for a tape layout, facing along a reference line named `facing`; tape lengths in the crew's unit. */
export function layoutSteps(l: TapeLayout, facing: string, unit: LengthUnit = 'm'): string[] {
  const m = (x: number) => fmtLength(Math.abs(x), unit);
  const turn = l.turnDeg === 0 ? 'the target line is the reference line itself' : `the target line is ${Math.abs(l.turnDeg).toFixed(1)}° ${l.turnDeg > 0 ? 'clockwise' : 'anticlockwise'} of it`;
  return [
    `Stand at the pivot facing ${facing}; ${turn}.`,
    `Run the tape ${m(l.alongM)} ${l.alongM < 0 ? 'BEHIND you (away from the way you face)' : 'along the line'}, then ${m(l.offsetM)} square to it, to the ${l.side.toUpperCase()}.`,
    'Mark that point: the line from the pivot to the mark is the target azimuth. Lay the plate’s bisector along it.',
  ];
}

/** The baseline as typed in the crew's unit, checked and returned in metres (1 to 200 m). */
export function baselineField(text: string, unit: LengthUnit = 'm'): Parsed {
  const limitFt = (x: number) => Number((x / M_PER_FT).toFixed(1));
  const p = parseField('Baseline', text, (n, v) =>
    unit === 'ft' ? requireInRange(n, v, { min: limitFt(1), max: limitFt(200), unit: 'ft' }) : requireInRange(n, v, { min: 1, max: 200, unit: 'm' }),
  );
  return p.value === undefined ? p : { value: lengthToM(p.value, unit) };
}

/**
 * Below this sun elevation the shadow method is advised against, degrees (common practice, no source). At 10° a pin's
 * shadow is already 5.7 times its height (1 / tan 10°), so its tip is faint and soft-edged, the ground under a long
 * shadow is rarely level (any slope across it moves the tip sideways), and the sun's azimuth moves fastest near the
 * horizon; atmospheric refraction, about 0.5° at the horizon, also grows as the sun sinks (it does not change the
 * azimuth, but it marks where the computed and seen sun begin to part).
 */
export const LOW_SUN_ELEVATION_DEG = 10;

/** The words for a low sun, or null when the sun is high enough for the shadow method. */
export function lowSunWarning(sunElevationDeg: number): string | null {
  if (sunElevationDeg >= LOW_SUN_ELEVATION_DEG) return null;
  const ratio = 1 / Math.tan((sunElevationDeg * Math.PI) / 180);
  return (
    `Low sun: ${sunElevationDeg.toFixed(1)}° above the horizon (under ${LOW_SUN_ELEVATION_DEG}°). Shadows are long and soft ` +
    `(about ${ratio.toFixed(0)} times the pin’s height), so the tip is hard to mark. Use a reference bearing instead, or wait for a higher sun.`
  );
}

export interface SunLayoutView {
  /** Set when the sun is low (see LOW_SUN_ELEVATION_DEG): the layout is still given, with this warning. */
  lowSun: string | null;
  sunAzimuthDeg: number;
  sunElevationDeg: number;
  rateDegPerMin: number;
  layout: ShadowLayout;
  computedAtMs: number;
  steps: string[];
}

/** Shadow layout for the sun at `timeMs`; a plain message when it cannot be done. */
export function sunLayoutView(pos: PositionInput | null, timeMs: number, targetAzimuthDeg: number, baselineText: string, unit: LengthUnit = 'm'): { view: SunLayoutView | null; error: string | null } {
  if (!pos) return { view: null, error: 'The sun’s direction needs the site position: take a GPS fix or type the coordinates.' };
  const b = baselineField(baselineText, unit);
  if (b.value === undefined) return { view: null, error: b.error ?? null };
  try {
    const sun = sunPosition({ latDeg: pos.latDeg, lonDeg: pos.lonDeg, heightM: pos.heightEllM ?? 0, timeMs });
    if (sun.elevationDeg <= 0) return { view: null, error: `The sun is below the horizon (${sun.elevationDeg.toFixed(1)}°): no shadow. Use a reference bearing.` };
    const layout = shadowLayout(sun.azimuthDeg, targetAzimuthDeg, b.value);
    const rate = sunAzimuthRateDegPerMin({ latDeg: pos.latDeg, lonDeg: pos.lonDeg, heightM: pos.heightEllM ?? 0, timeMs });
    return {
      view: {
        lowSun: lowSunWarning(sun.elevationDeg),
        sunAzimuthDeg: sun.azimuthDeg,
        sunElevationDeg: sun.elevationDeg,
        rateDegPerMin: rate,
        layout,
        computedAtMs: timeMs,
        steps: [
          'Plumb a thin pin at the pivot and mark the tip of its shadow now.',
          ...layoutSteps(layout, 'along the shadow, from the pin toward the shadow tip', unit),
        ],
      },
      error: null,
    };
  } catch (e) {
    return { view: null, error: e instanceof Error ? e.message : String(e) };
  }
}

export interface BearingForm {
  fromLat: string;
  fromLon: string;
  toLat: string;
  toLon: string;
}

export interface ReferenceLayoutView {
  bearingDeg: number;
  distanceM: number;
  layout: TapeLayout;
  steps: string[];
}

/** Reference line from the pivot (`from`) toward a landmark or second GNSS point (`to`), and its tape layout. */
export function referenceLayoutView(f: BearingForm, targetAzimuthDeg: number, baselineText: string, unit: LengthUnit = 'm'): { view: ReferenceLayoutView | null; errors: Partial<Record<keyof BearingForm | 'baseline' | 'points', string>> } {
  const fromLat = parseField('Pivot latitude', f.fromLat, requireLatDeg);
  const fromLon = parseField('Pivot longitude', f.fromLon, requireLonDeg);
  const toLat = parseField('Reference latitude', f.toLat, requireLatDeg);
  const toLon = parseField('Reference longitude', f.toLon, requireLonDeg);
  const b = baselineField(baselineText, unit);
  const errors: Partial<Record<keyof BearingForm | 'baseline' | 'points', string>> = {
    fromLat: fromLat.error, fromLon: fromLon.error, toLat: toLat.error, toLon: toLon.error, baseline: b.error,
  };
  if (fromLat.value === undefined || fromLon.value === undefined || toLat.value === undefined || toLon.value === undefined || b.value === undefined) return { view: null, errors };
  try {
    const g = geodesicInverse({ latDeg: fromLat.value, lonDeg: fromLon.value }, { latDeg: toLat.value, lonDeg: toLon.value });
    const layout = tapeLayout(g.azimuthDeg, targetAzimuthDeg, b.value);
    const steps = layoutSteps(layout, 'the reference point (sight along the line to it)', unit);
    if (g.distanceM < SHORT_REFERENCE_M) {
      const turnDeg = toDeg(Math.atan2(POINT_ERROR_M, g.distanceM));
      steps.unshift(`The reference point is only ${fmtLength(g.distanceM, unit, 1)} away: a ${fmtLength(POINT_ERROR_M, unit, 1)} error in either point turns the line by about ${turnDeg.toFixed(1)}°. A point farther away is better.`);
    }
    return { view: { bearingDeg: g.azimuthDeg, distanceM: g.distanceM, layout, steps }, errors };
  } catch (e) {
    return { view: null, errors: { ...errors, points: e instanceof Error ? e.message : String(e) } };
  }
}
