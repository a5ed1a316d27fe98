/**
 * Cross-checking azimuths set out by different methods (sun shadow, a surveyed reference bearing, the phone's
 * compass). Agreement is judged on the largest pairwise difference, wrapped to (−180°, 180°].
 *
 * The compass is the weak one: phone magnetometers are typically off by 1–3° just after calibration, more later,
 * and by 13–25° near steel (Allmendinger, Siron & Scott 2017, J. Structural Geology 102:98–112). So when the compass disagrees with an independent method, the compass is
 * blamed; when two independent methods disagree, the set-out itself is suspect.
 */
import { wrapSignedDeg } from '../units.ts';
import { requireFinite, requireOneOf, requirePositive } from '../validate.ts';

export type AzimuthMethod = 'sun-shadow' | 'reference-bearing' | 'compass';
export const AZIMUTH_METHODS: readonly AzimuthMethod[] = ['sun-shadow', 'reference-bearing', 'compass'];

export interface AzimuthReading {
  method: AzimuthMethod;
  /** True azimuth found by that method, degrees (compass readings already corrected for declination). */
  azimuthDeg: number;
}

export interface MethodComparison {
  /** Largest pairwise difference ≤ tolerance. */
  agree: boolean;
  /** Largest pairwise difference, degrees, ≥ 0. */
  maxDisagreementDeg: number;
  message: string;
  /**
   * The compass has been checked against an independent method and agrees within tolerance. False when it
   * disagrees, and also when there is nothing independent to check it against (unverified).
   */
  compassTrusted: boolean;
}

const LABEL: Record<AzimuthMethod, string> = {
  'sun-shadow': 'sun shadow',
  'reference-bearing': 'reference bearing',
  compass: 'compass',
};
const deg = (x: number) => `${x.toFixed(1)}°`;

/** Compare azimuth readings from several methods. Empty list, unknown method or non-finite azimuth throw RangeError. */
export function compareAzimuthMethods(readings: readonly AzimuthReading[], toleranceDeg: number): MethodComparison {
  requirePositive('toleranceDeg', toleranceDeg, '°');
  if (readings.length === 0) throw new RangeError('readings must hold at least one azimuth, got an empty list');
  readings.forEach((r, i) => {
    requireOneOf(`readings[${i}].method`, r.method, AZIMUTH_METHODS);
    requireFinite(`readings[${i}].azimuthDeg`, r.azimuthDeg);
  });
  const diff = (a: AzimuthReading, b: AzimuthReading) => Math.abs(wrapSignedDeg(a.azimuthDeg - b.azimuthDeg));
  let maxDisagreementDeg = 0;
  for (let i = 0; i < readings.length; i++) {
    for (let j = i + 1; j < readings.length; j++) maxDisagreementDeg = Math.max(maxDisagreementDeg, diff(readings[i], readings[j]));
  }
  const agree = maxDisagreementDeg <= toleranceDeg;
  const compass = readings.filter((r) => r.method === 'compass');
  const independent = readings.filter((r) => r.method !== 'compass');

  // Worst compass-vs-independent pair, and worst pair among the independent methods.
  let worstCompass: { d: number; other: AzimuthReading } | null = null;
  for (const c of compass) for (const o of independent) {
    const d = diff(c, o);
    if (!worstCompass || d > worstCompass.d) worstCompass = { d, other: o };
  }
  let worstIndependent: { d: number; a: AzimuthReading; b: AzimuthReading } | null = null;
  for (let i = 0; i < independent.length; i++) {
    for (let j = i + 1; j < independent.length; j++) {
      const d = diff(independent[i], independent[j]);
      if (!worstIndependent || d > worstIndependent.d) worstIndependent = { d, a: independent[i], b: independent[j] };
    }
  }
  const compassTrusted = worstCompass !== null && worstCompass.d <= toleranceDeg;
  const tolText = `tolerance ${deg(toleranceDeg)}`;

  const parts: string[] = [];
  if (readings.length === 1) {
    parts.push(`Only one reading (${LABEL[readings[0].method]}): nothing to compare it with; check with a second method.`);
  } else if (agree) {
    parts.push(`All ${readings.length} readings agree within ${deg(maxDisagreementDeg)} (${tolText}).`);
  }
  if (worstIndependent && worstIndependent.d > toleranceDeg) {
    parts.push(
      `The ${LABEL[worstIndependent.a.method]} and ${LABEL[worstIndependent.b.method]} readings differ by ` +
        `${deg(worstIndependent.d)} (${tolText}): recheck the set-out (shadow time, pin plumb, reference marks).`,
    );
  }
  if (worstCompass && worstCompass.d > toleranceDeg) {
    parts.push(
      `The compass reads ${deg(worstCompass.d)} away from the ${LABEL[worstCompass.other.method]} (${tolText}). ` +
        'A disturbed compass (nearby steel, a vehicle, rebar, the reflector itself) is the usual cause: ' +
        'set the azimuth by the independent method, not the compass.',
    );
  } else if (compass.length > 0 && independent.length === 0 && readings.length > 1) {
    parts.push(
      `Only compass readings (spread ${deg(maxDisagreementDeg)}): a local disturbance shifts them all alike, ` +
        'so check the compass with the sun shadow or a reference bearing.',
    );
  }
  if (!agree && parts.length === 0) {
    parts.push(`The readings differ by up to ${deg(maxDisagreementDeg)} (${tolText}).`);
  }
  return { agree, maxDisagreementDeg, message: parts.join(' '), compassTrusted };
}
