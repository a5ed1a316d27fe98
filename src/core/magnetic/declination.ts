/**
 * Magnetic declination and field strength from the World Magnetic Model 2025 (WMM2025).
 *
 * Model: Chulliat et al. (2025), "The US/UK World Magnetic Model for 2025-2030: Technical Report", NOAA NCEI,
 *   doi:10.25923/prbc-s316. Coefficients and the spherical-harmonic synthesis come from the npm package
 *   `geomagnetism` 0.2.0 (WMM-2025 coefficient file, full precision); this module only chooses the time.
 * Validity: 2025-01-01T00:00Z (2025.0) up to 2030-01-01T00:00Z (2030.0), heights from 1 km below to 850 km above
 *   the WGS84 ellipsoid (the report; from memory). Outside those dates the model is not defined and an
 *   `outside-model-dates` error is returned: a newer model (or the next release of this app) is needed.
 * Stated accuracy: the report gives a global RMS declination error of about 0.3–0.5° from unmodelled crustal and
 *   external fields (from memory); locally, near magnetic rocks or steel, errors of several degrees occur.
 *
 * Time: the model's Gauss coefficients are linear in the decimal year y, g(y) = g(2025.0) + (y − 2025.0)·ġ
 *   (the report's time-dependence equation), and the field components X, Y, Z are linear in the coefficients
 *   (the report's spherical-harmonic synthesis), so X, Y, Z are exactly linear in y. They are evaluated at 2025.0
 *   and 2029.0 (dates the package accepts and maps to those decimal years exactly) and interpolated to y. This keeps the package's own date window (2024-11-13 to 2029-11-13) and
 *   its 365-day year out of the result, and gives the full 2025.0–2030.0 window.
 * Decimal year: y = Y + (t − start of Y)/(length of Y), leap years counted, continuous in time; e.g.
 *   2027.5 = 2027-07-02T12:00Z (2027 has 365 days, half of which is 182.5 days).
 * Elements: D = atan2(Y, X) (east-positive), I = atan2(Z, H) (down-positive), H = √(X² + Y²), F = √(H² + Z²)
 *   (the report's derived elements).
 */
import geomagnetism from 'geomagnetism';
import { err, ok, type Result } from '../result.ts';
import { toDeg } from '../units.ts';
import { requireFinite, requireInRange, requireLatDeg, requireLonDeg, requirePositive } from '../validate.ts';

export interface DeclinationQuery {
  latDeg: number;
  /** [−180, 360]; east-positive. */
  lonDeg: number;
  /** Height above the WGS84 ellipsoid, metres. */
  heightM: number;
  /** UTC instant, ms since 1970-01-01T00:00Z. */
  timeMs: number;
}

export interface MagneticField {
  /** Declination, degrees, east-positive: true azimuth = magnetic azimuth + declination. */
  declinationDeg: number;
  /** Inclination (dip), degrees, positive down. */
  inclinationDeg: number;
  totalIntensityNt: number;
  horizontalIntensityNt: number;
  model: 'WMM2025';
}

export interface OutsideModelDatesError {
  kind: 'outside-model-dates';
  message: string;
}

/** WMM2025 validity: [2025-01-01T00:00Z, 2030-01-01T00:00Z). */
export const WMM2025_START_MS = Date.UTC(2025, 0, 1);
export const WMM2025_END_MS = Date.UTC(2030, 0, 1);

/** Continuous decimal year, leap years counted: Y + (t − Jan 1 of Y)/(Jan 1 of Y+1 − Jan 1 of Y). */
export function decimalYearFromTimeMs(timeMs: number): number {
  requireFinite('timeMs', timeMs);
  const y = new Date(timeMs).getUTCFullYear();
  const start = Date.UTC(y, 0, 1);
  return y + (timeMs - start) / (Date.UTC(y + 1, 0, 1) - start);
}

/** Anchors: the package maps these instants to exactly 2025.0 and 2029.0 (whole years, zero fraction). */
const ANCHOR_YEARS = [2025, 2029] as const;
let anchorModels: ReturnType<typeof geomagnetism.model>[] | null = null;

function anchors(): ReturnType<typeof geomagnetism.model>[] {
  anchorModels ??= ANCHOR_YEARS.map((y) => geomagnetism.model(new Date(Date.UTC(y, 0, 1))));
  return anchorModels;
}

/**
 * WMM2025 declination, inclination and intensities at a point and instant (see the file header for the model,
 * its time handling and its validity). Outside 2025-01-01 … 2030-01-01 returns `outside-model-dates`.
 */
export function declination(q: DeclinationQuery): Result<MagneticField, OutsideModelDatesError> {
  requireLatDeg('latDeg', q.latDeg);
  requireLonDeg('lonDeg', q.lonDeg);
  requireInRange('heightM', q.heightM, { min: -1000, max: 850_000, unit: 'm' });
  requireFinite('timeMs', q.timeMs);
  if (q.timeMs < WMM2025_START_MS || q.timeMs >= WMM2025_END_MS) {
    const when = new Date(q.timeMs).toISOString();
    return err({
      kind: 'outside-model-dates',
      message:
        `The magnetic model WMM2025 is valid from 2025-01-01 to 2030-01-01 (UTC); ${when} is outside it, ` +
        'so no declination can be given. Use a newer magnetic model, or set the azimuth by the sun shadow or a reference bearing.',
    });
  }
  const [m0, m1] = anchors();
  const p = [q.latDeg, q.lonDeg, q.heightM / 1000]; // the package takes kilometres above the ellipsoid
  const a = m0.point(p);
  const b = m1.point(p);
  const k = (decimalYearFromTimeMs(q.timeMs) - ANCHOR_YEARS[0]) / (ANCHOR_YEARS[1] - ANCHOR_YEARS[0]);
  const x = a.x + k * (b.x - a.x);
  const y = a.y + k * (b.y - a.y);
  const z = a.z + k * (b.z - a.z);
  const h = Math.hypot(x, y);
  return ok({
    declinationDeg: toDeg(Math.atan2(y, x)),
    inclinationDeg: toDeg(Math.atan2(z, h)),
    totalIntensityNt: Math.hypot(h, z),
    horizontalIntensityNt: h,
    model: 'WMM2025',
  });
}

export interface FieldDisturbance {
  /** measured / model total intensity. */
  ratio: number;
  disturbed: boolean;
  message: string;
}

/**
 * Whether the phone's measured total field |B| is far from the model's F, a sign that nearby steel or electronics
 * bend the field and the compass cannot be trusted: disturbed when |ratio − 1| > tolerancePct/100.
 * The 10 % default is common practice, no source (the undisturbed field varies ~1 % locally, phone magnetometer
 * scale errors are a few per cent).
 */
export function fieldDisturbance(measuredTotalNt: number, modelTotalNt: number, tolerancePct = 10): FieldDisturbance {
  requireInRange('measuredTotalNt', measuredTotalNt, { min: 0, max: 1e7, unit: 'nT' });
  requirePositive('modelTotalNt', modelTotalNt, 'nT');
  requireInRange('tolerancePct', tolerancePct, { min: 0, max: 100, minInclusive: false, unit: '%' });
  const ratio = measuredTotalNt / modelTotalNt;
  const pct = (ratio - 1) * 100;
  const disturbed = Math.abs(pct) > tolerancePct;
  const nt = (v: number) => `${Math.round(v)} nT`;
  const message = disturbed
    ? `The phone measures ${nt(measuredTotalNt)} where ${nt(modelTotalNt)} is expected (${pct > 0 ? '+' : ''}${pct.toFixed(0)} %): ` +
      'the compass is probably disturbed by nearby steel, a vehicle or electronics. Move away from them, ' +
      'recalibrate the compass, or set the azimuth by the sun shadow or a reference bearing.'
    : `The measured field (${nt(measuredTotalNt)}) is within ${tolerancePct} % of the expected ${nt(modelTotalNt)}.`;
  return { ratio, disturbed, message };
}
