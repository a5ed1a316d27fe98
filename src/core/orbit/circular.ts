/**
 * Approximate pass geometry with no element set: a circular orbit over a spherical, rotating Earth.
 *
 * Mean motion from Kepler's third law, n = √(μ / a³), a = R_e + h (or n = 2π / P from a given period), with
 *   μ = 398 600.4418 km³/s² and R_e = 6378.137 km (NIMA TR8350.2, 3rd ed., 2000, Table 3.1 / 3.3).
 * Ground-track heading at latitude φ for inclination i (Vallado, "Fundamentals of Astrodynamics and
 *   Applications", 4th ed., 2013, spherical trigonometry of the orbit plane; shared REFERENCES.md §3):
 *     inertial azimuth α:  sin α = cos i / cos φ   (cos α ≥ 0 ascending, −cos α descending)
 *     Earth-fixed:         v_E ∝ n sin α − ω_E cos φ,   v_N ∝ ±n cos α,   heading = atan2(v_E, v_N)
 * Look angle ↔ incidence and slant range: spherical law of sines (../geometry/pointing.ts).
 * At zero Doppler the sub-satellite point is γ = incidence − look (Earth-centre angle) across the track from the
 *   site, so at a different latitude and longitude: the heading seen on the site's horizontal differs from the
 *   ground-track heading by the convergence of meridians, ≈ Δλ·sin φ (several degrees at mid latitudes, about
 *   12° at 65° and 45° incidence). circularOrbitGeometry solves for that point (branchGeometry below).
 * Validity: |cos i / cos φ| ≤ 1 (the orbit reaches the latitude); e ≈ 0. Against SGP4 passes of the demo
 *   satellite (test/core/orbit/circular.test.ts): headings within 0.14°, reflector azimuth within 0.5°.
 * Check value [derived, REFERENCES.md §3]: i = 98.18°, P = 98.7429 min, φ = 45° → ascending 345.6914°
 *   (−14.3086°), descending 194.3086° (−165.6914°).
 */
import { incidenceFromLookDeg, lookFromIncidenceDeg, LOOK_SIDES, slantRangeFromLookM, type LookSide } from '../geometry/pointing.ts';
import { EARTH_ROTATION_RAD_PER_S, WGS84_A_M, normalizeAzimuthDeg, toDeg, toRad } from '../units.ts';
import { requireInRange, requireLatDeg, requireOneOf, requirePositive } from '../validate.ts';
import { add, dot, scale, sub, type Vec3 } from '../vec3.ts';

/** Earth's gravitational parameter GM, m³/s² (TR8350.2 Table 3.1, GM including the atmosphere). */
export const EARTH_GM_M3_PER_S2 = 3.986004418e14;

export interface CircularOrbitInput {
  /** Orbit height above R_e = 6378.137 km, m. Give this or periodMin. */
  altitudeM?: number;
  /** Orbital period, minutes. Give this or altitudeM. */
  periodMin?: number;
  inclinationDeg: number;
  latDeg: number;
  /** Incidence at the site, degrees. Give this or lookDeg. */
  incidenceDeg?: number;
  /** Look (off-nadir) angle at the satellite, degrees. Give this or incidenceDeg. */
  lookDeg?: number;
  look: LookSide;
}

export interface CircularPassGeometry {
  incidenceDeg: number;
  /**
   * Azimuth of the satellite's Earth-fixed velocity on the SITE's horizontal, degrees true, [0, 360): the
   * convention of ../CONVENTIONS.md and of Pass.headingDeg. The reflector faces heading ∓ 90°.
   */
  headingDeg: number;
  /** Ground-track heading at the sub-satellite point (the formula at subSatelliteLatDeg), degrees true, [0, 360). */
  groundTrackHeadingDeg: number;
  /** Latitude of the sub-satellite point at zero Doppler, degrees (spherical). */
  subSatelliteLatDeg: number;
  lookDeg: number;
  slantRangeM: number;
  /** Azimuth from the site toward the satellite, degrees true, [0, 360). */
  reflectorAzimuthDeg: number;
}

export interface CircularOrbitGeometry {
  ascending: CircularPassGeometry;
  descending: CircularPassGeometry;
  altitudeM: number;
  periodMin: number;
  approximate: true;
  note: string;
}

/** Period (minutes) of a circular orbit `altitudeM` above R_e: P = 2π √(a³/μ). */
export function circularPeriodMin(altitudeM: number): number {
  requirePositive('altitudeM', altitudeM, 'm');
  const aM = WGS84_A_M + altitudeM;
  return (2 * Math.PI * Math.sqrt((aM * aM * aM) / EARTH_GM_M3_PER_S2)) / 60;
}

/** Height (m above R_e) of a circular orbit with period `periodMin`: a = (μ (P/2π)²)^(1/3). */
export function circularAltitudeM(periodMin: number): number {
  requirePositive('periodMin', periodMin, 'min');
  const pS = periodMin * 60;
  const aM = Math.cbrt(EARTH_GM_M3_PER_S2 * (pS / (2 * Math.PI)) ** 2);
  if (aM <= WGS84_A_M) throw new RangeError(`periodMin ${periodMin} min is shorter than an orbit at the Earth's surface (84.5 min)`);
  return aM - WGS84_A_M;
}

/**
 * Earth-fixed ground-track headings (ascending, descending) in degrees [0, 360) at latitude φ
 * (formula in the file header). Throws RangeError when the orbit does not reach the latitude.
 */
export function circularHeadingsDeg(inclinationDeg: number, latDeg: number, periodMin: number): { ascendingDeg: number; descendingDeg: number } {
  requireInRange('inclinationDeg', inclinationDeg, { min: 0, max: 180, unit: '°' });
  requireLatDeg('latDeg', latDeg);
  requirePositive('periodMin', periodMin, 'min');
  const reachDeg = inclinationDeg <= 90 ? inclinationDeg : 180 - inclinationDeg;
  const cosPhi = Math.cos(toRad(latDeg));
  const sinAlpha = Math.cos(toRad(inclinationDeg)) / cosPhi;
  if (!(cosPhi > 1e-12) || Math.abs(sinAlpha) > 1) {
    throw new RangeError(`latDeg must be within ±${reachDeg}° for an orbit inclined ${inclinationDeg}°, got ${latDeg}°`);
  }
  const cosAlpha = Math.sqrt(1 - sinAlpha * sinAlpha);
  const nRadPerS = (2 * Math.PI) / (periodMin * 60);
  const vE = nRadPerS * sinAlpha - EARTH_ROTATION_RAD_PER_S * cosPhi;
  const vN = nRadPerS * cosAlpha;
  return {
    ascendingDeg: normalizeAzimuthDeg(toDeg(Math.atan2(vE, vN))),
    descendingDeg: normalizeAzimuthDeg(toDeg(Math.atan2(vE, -vN))),
  };
}

/** Unit vector on the sphere at (φ, λ) and its east/north axes. */
function frame(latRad: number, lonRad: number) {
  const sp = Math.sin(latRad), cp = Math.cos(latRad), sl = Math.sin(lonRad), cl = Math.cos(lonRad);
  return { r: [cp * cl, cp * sl, sp] as Vec3, east: [-sl, cl, 0] as Vec3, north: [-sp * cl, -sp * sl, cp] as Vec3 };
}
const along = (f: { east: Vec3; north: Vec3 }, azRad: number): Vec3 => add(scale(f.east, Math.sin(azRad)), scale(f.north, Math.cos(azRad)));
const azimuthIn = (f: { east: Vec3; north: Vec3 }, v: Vec3) => normalizeAzimuthDeg(toDeg(Math.atan2(dot(v, f.east), dot(v, f.north))));

/**
 * Zero-Doppler geometry on a sphere for one branch. The site lies γ = incidence − look (Earth-centre angle) from the
 * sub-satellite point P, square to the ground track there (on its right for a right-looking radar). P's latitude
 * solves sin φ_S = sin φ_P cos γ + cos φ_P sin γ cos(h(φ_P) ± 90°) (spherical law of cosines; fixed-point
 * iteration). The velocity at P is horizontal and square to the plane of site and P, so it is horizontal at the
 * site too; its azimuth there is headingDeg, and the site → P direction gives the reflector azimuth.
 */
function branchGeometry(inclinationDeg: number, latDeg: number, periodMin: number, gammaRad: number, look: LookSide, ascending: boolean) {
  const side = look === 'right' ? 1 : -1;
  const latS = toRad(latDeg);
  let latP = latS;
  let hRad = 0;
  for (let k = 0; ; k++) {
    const h = circularHeadingsDeg(inclinationDeg, toDeg(latP), periodMin);
    hRad = toRad(ascending ? h.ascendingDeg : h.descendingDeg);
    const a = hRad + side * (Math.PI / 2);
    const latDest = Math.asin(Math.sin(latP) * Math.cos(gammaRad) + Math.cos(latP) * Math.sin(gammaRad) * Math.cos(a));
    const step = latDest - latS;
    latP -= step;
    if (Math.abs(step) < 1e-13) break;
    if (k > 200) throw new RangeError(`latDeg ${latDeg}° is too close to the orbit's highest latitude for this incidence`);
  }
  const P = frame(latP, 0);
  const u = along(P, hRad);
  const t = along(P, hRad + side * (Math.PI / 2));
  const s = add(scale(P.r, Math.cos(gammaRad)), scale(t, Math.sin(gammaRad)));
  const S = frame(Math.asin(s[2]), Math.atan2(s[1], s[0]));
  return {
    headingDeg: azimuthIn(S, u),
    groundTrackHeadingDeg: normalizeAzimuthDeg(toDeg(hRad)),
    subSatelliteLatDeg: toDeg(latP),
    reflectorAzimuthDeg: azimuthIn(S, sub(P.r, scale(s, dot(P.r, s)))),
  };
}

/** Approximate ascending and descending zero-Doppler geometry for a circular orbit (see file header). */
export function circularOrbitGeometry(input: CircularOrbitInput): CircularOrbitGeometry {
  const hasAlt = input.altitudeM !== undefined, hasPeriod = input.periodMin !== undefined;
  if (hasAlt === hasPeriod) throw new RangeError('give exactly one of altitudeM and periodMin');
  const hasInc = input.incidenceDeg !== undefined, hasLook = input.lookDeg !== undefined;
  if (hasInc === hasLook) throw new RangeError('give exactly one of incidenceDeg and lookDeg');
  const look = requireOneOf('look', input.look, LOOK_SIDES);
  const altitudeM = hasAlt ? requirePositive('altitudeM', input.altitudeM as number, 'm') : circularAltitudeM(input.periodMin as number);
  const periodMin = hasPeriod ? (input.periodMin as number) : circularPeriodMin(altitudeM);
  circularHeadingsDeg(input.inclinationDeg, input.latDeg, periodMin); // validates inclination, latitude and reach
  const lookDeg = hasLook ? (input.lookDeg as number) : lookFromIncidenceDeg(input.incidenceDeg as number, altitudeM);
  const incidenceDeg = hasInc ? (input.incidenceDeg as number) : incidenceFromLookDeg(lookDeg, altitudeM);
  const slantRangeM = slantRangeFromLookM(lookDeg, altitudeM);
  const gammaRad = toRad(incidenceDeg - lookDeg);
  const pass = (ascending: boolean): CircularPassGeometry => ({
    incidenceDeg,
    ...branchGeometry(input.inclinationDeg, input.latDeg, periodMin, gammaRad, look, ascending),
    lookDeg,
    slantRangeM,
  });
  return {
    ascending: pass(true),
    descending: pass(false),
    altitudeM,
    periodMin,
    approximate: true,
    note: 'circular orbit over a spherical rotating Earth: headings, reflector azimuth and incidence within about a degree; use an element set for pass times',
  };
}
