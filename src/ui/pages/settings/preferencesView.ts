/** What the Preferences section shows beside the controls, and how it checks typed values. */
import { TOLERANCE_PRESETS } from '../../../core/alignment/guidance.ts';
import { requireInRange } from '../../../core/validate.ts';
import { fmtDeg } from '../../format.ts';
import type { Settings } from '../../state/settings.ts';
import { parseField, type Parsed } from '../../components/fields.tsx';
import { utcMinute } from './reports.ts';

/** Range accepted for an alignment tolerance, degrees (the Align screen's custom tolerance uses the same). */
export const TOLERANCE_RANGE_DEG = { min: 0.05, max: 20 } as const;
/** Range accepted for the azimuth-method disagreement tolerance, degrees. */
export const METHOD_TOLERANCE_RANGE_DEG = { min: 0.1, max: 30 } as const;

export const parseTolerance = (label: string, text: string): Parsed =>
  parseField(label, text, (n, v) => requireInRange(n, v, { ...TOLERANCE_RANGE_DEG, unit: '°' }));

export const parseMethodTolerance = (label: string, text: string): Parsed =>
  parseField(label, text, (n, v) => requireInRange(n, v, { ...METHOD_TOLERANCE_RANGE_DEG, unit: '°' }));

/** "azimuth ±0.5°, tilt ±0.5°, roll ±1.0°" for the chosen preset (custom: the stored custom values). */
export function toleranceText(s: Pick<Settings, 'tolerancePreset' | 'customToleranceDeg'>): string {
  const t = s.tolerancePreset === 'custom' ? s.customToleranceDeg : TOLERANCE_PRESETS[s.tolerancePreset];
  return `azimuth ±${fmtDeg(t.azimuthDeg, 2)}, tilt ±${fmtDeg(t.tiltDeg, 2)}, roll ±${fmtDeg(t.rollDeg, 2)}`;
}

/** The phone's tilt bias from the reversal routine, with when it was measured. */
export function tiltBiasText(s: Pick<Settings, 'tiltBiasDeg' | 'tiltBiasMeasuredAtMs'>): string {
  if (s.tiltBiasMeasuredAtMs === null) {
    return s.tiltBiasDeg === 0 ? 'Not measured: no tilt bias is applied.' : `${signedDeg(s.tiltBiasDeg)} (time of measurement unknown).`;
  }
  return `${signedDeg(s.tiltBiasDeg)}, measured ${utcMinute(s.tiltBiasMeasuredAtMs)}; subtracted from every tilt reading.`;
}

const signedDeg = (x: number) => (x > 0 ? `+${fmtDeg(x, 2)}` : fmtDeg(x, 2));

/** An example angle in the chosen format, so the crew sees what each choice means. */
export const angleExample = (style: Settings['angleFormat']): string => fmtDeg(52.41234, style === 'dm' ? 3 : 4, style);
