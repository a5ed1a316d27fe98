/**
 * How far to trust a phone position fix, in words for the crew. Pure: no platform access.
 * Thresholds (common practice, no source): a horizontal accuracy of 5 m or better is good for siting a reflector
 * and reading the declination; 100 m or worse is poor (a network or Wi-Fi position, not GNSS); a fix older than
 * 30 s may no longer be where the crew stands.
 */
import type { Fix } from './types.ts';

export const GOOD_ACCURACY_M = 5;
export const POOR_ACCURACY_M = 100;
export const STALE_AFTER_S = 30;

export interface FixAssessment {
  level: 'good' | 'fair' | 'poor';
  /** Age of the fix at `nowMs`, seconds (negative if the phone clock is behind the fix time). */
  ageS: number;
  stale: boolean;
  message: string;
}

/** Level from the horizontal accuracy; a stale fix is never called good. */
export function assessFix(fix: Fix, nowMs: number): FixAssessment {
  const acc = fix.horizontalAccuracyM;
  const ageS = (nowMs - fix.timeMs) / 1000;
  const stale = !(ageS <= STALE_AFTER_S);
  let level: FixAssessment['level'] = !(acc < POOR_ACCURACY_M) ? 'poor' : acc <= GOOD_ACCURACY_M ? 'good' : 'fair';
  const accText = Number.isFinite(acc) ? `\u00b1${acc < 10 ? acc.toFixed(1) : acc.toFixed(0)} m` : 'unknown accuracy';
  const parts = [
    level === 'good'
      ? `Position good (${accText}).`
      : level === 'fair'
        ? `Position fair (${accText}): fine for the declination; for the site record, wait in the open for a better fix.`
        : `Position poor (${accText}): probably not from satellites. Move into the open and wait, or type the coordinates.`,
  ];
  if (stale) {
    if (level === 'good') level = 'fair';
    parts.push(Number.isFinite(ageS) ? `This fix is ${Math.round(ageS)} s old: take a new one if you have moved.` : 'The time of this fix is unknown: take a new one.');
  }
  return { level, ageS, stale, message: parts.join(' ') };
}
