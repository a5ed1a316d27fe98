/**
 * Overpasses of a site by a side-looking radar satellite: the zero-Doppler instant and the geometry there.
 *
 * Zero Doppler = the instant the slant range to the site is smallest (Curlander & McDonough, "Synthetic Aperture
 *   Radar: Systems and Signal Processing", Wiley 1991, §1.2: a zero-Doppler processor places a target at the
 *   time its range is minimum). With ρ = r_sat − r_site (Earth-fixed) and v the Earth-fixed satellite velocity,
 *     f(t) = ρ·v = ½ d|ρ|²/dt,
 *   and a range minimum is a root of f where f goes from − to +.
 * Search: sample f every 1/10 of the orbital period (a root of f occurs once per revolution near the site, so a
 *   sign change cannot hide between samples), keep only brackets whose site lies at a cross-track angle the swath
 *   can reach (prefilter on data already computed), refine each bracket with Brent's method to ROOT_TOL_S.
 * Geometry at the root, in the site's east-north-up frame (up = ellipsoid normal):
 *   incidenceDeg = angle(up, ρ̂);  reflectorAzimuthDeg = atan2(ρ̂_E, ρ̂_N);  headingDeg = atan2(v_E, v_N);
 *   look side: the site is to the right of the velocity when (v × ρ)·up > 0 (ρ from site to satellite);
 *   groundTrackHeadingDeg: the same on the horizontal of the sub-satellite point (differs by meridian convergence);
 *   direction: ascending when the satellite's velocity has a northward component at its own position;
 *   baseTiltDeg = (90° − incidence) − atan(1/√2)  (see ../geometry/pointing.ts).
 * Validity: SGP4 accuracy (about 1 km a day from epoch); times are good to ROOT_TOL_S of the model's minimum.
 */
import { ecefToEnu, ecefToGeodetic, enuBasis, geodeticToEcefM, type EnuBasis, type GeodeticPosition } from '../geodesy/ecef.ts';
import { LOOK_SIDES, type LookSide } from '../geometry/pointing.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG, normalizeAzimuthDeg, toDeg, toRad } from '../units.ts';
import { requireFinite, requireIncidenceDeg, requireInRange, requireLatDeg, requireLonDeg, requireOneOf } from '../validate.ts';
import { cross, dot, norm, scale, sub, type Vec3 } from '../vec3.ts';
import { brentRoot } from './brent.ts';
import { orbitModelFromTle, propagateAt, type OrbitModel, type OrbitState, type PropagationCounter } from './propagate.ts';
import { tleAgeWarning, tleLabel, type TleSet } from './tle.ts';

export type PassDirection = 'ascending' | 'descending';

export interface Pass {
  /** Zero-Doppler instant, ms since 1970 UTC. */
  timeMs: number;
  /** The same instant, ISO 8601 UTC ("2026-12-01T05:43:12.345Z"). */
  timeUtc: string;
  direction: PassDirection;
  /** Angle between the ellipsoid normal at the site and the line of sight to the satellite, degrees. */
  incidenceDeg: number;
  /** Azimuth of the satellite's Earth-fixed velocity on the site's horizontal, degrees true, [0, 360). */
  headingDeg: number;
  /**
   * Azimuth of the same velocity on the horizontal of the sub-satellite point, degrees true, [0, 360): the
   * ground-track heading as orbit tables and image metadata usually give it. It differs from headingDeg by the
   * convergence of meridians between the two points, ≈ Δλ·sin φ: several degrees at mid and high latitudes.
   */
  groundTrackHeadingDeg: number;
  /** Side of the ground track the site is on (= the radar's look side for this pass). */
  look: LookSide;
  /** Azimuth of the line of sight site → satellite, degrees true, [0, 360): where the reflector must face. */
  reflectorAzimuthDeg: number;
  /** Base-plate tilt of a trihedral aimed at the satellite, degrees, open side raised positive. */
  baseTiltDeg: number;
  slantRangeKm: number;
  /** Satellite name, or its catalogue number when the set has no name. */
  satellite: string;
  catalogNumber: string;
}

export interface PassWindow {
  startMs: number;
  /** Length in days, (0, 366]. */
  days: number;
}

export interface PassOptions {
  /** Smallest incidence the radar uses, degrees (default 20). */
  incidenceMinDeg?: number;
  /** Largest incidence the radar uses, degrees (default 46). */
  incidenceMaxDeg?: number;
  /** Look side of the radar (default 'right'). */
  look?: LookSide;
}

export interface PassSearchResult {
  /** Passes in time order. */
  passes: Pass[];
  /** SGP4 evaluations used. */
  propagations: number;
  /** Stale elements, propagation failures: plain sentences for the user. */
  warnings: string[];
}

export const DEFAULT_INCIDENCE_MIN_DEG = 20;
export const DEFAULT_INCIDENCE_MAX_DEG = 46;
/** Samples per orbital period in the coarse scan. */
export const SAMPLES_PER_ORBIT = 10;
/** Root-finding tolerance on the zero-Doppler time, s (the heading-normal azimuth moves ~1°/s, so we go fine). */
export const ROOT_TOL_S = 1e-3;
/** Extra cross-track central angle allowed by the prefilter, degrees (covers ellipsoid and ground-track curvature). */
const PREFILTER_MARGIN_DEG = 2;
/** Site heights accepted, m (ellipsoidal): lowest dry land to highest summit with geoid undulation and a margin. */
const SITE_HEIGHT_RANGE_M = { min: -1000, max: 10_000, unit: 'm' };

const MS_PER_DAY = 86_400_000;

interface Site {
  ecefKm: Vec3;
  unit: Vec3;
  basis: EnuBasis;
}

/** Geometry of one satellite state as seen from the site. */
function geometryAt(state: OrbitState, site: Site) {
  const rho = sub(state.positionEcefKm, site.ecefKm);
  const v = state.velocityEcefKmPerS;
  const los = ecefToEnu(site.basis, rho);
  const vel = ecefToEnu(site.basis, v);
  const satGeo = ecefToGeodetic(scale(state.positionEcefKm, 1000));
  const velSub = ecefToEnu(enuBasis(satGeo.latDeg, satGeo.lonDeg), v);
  const incidenceDeg = toDeg(Math.atan2(Math.hypot(los[0], los[1]), los[2]));
  return {
    incidenceDeg,
    headingDeg: normalizeAzimuthDeg(toDeg(Math.atan2(vel[0], vel[1]))),
    groundTrackHeadingDeg: normalizeAzimuthDeg(toDeg(Math.atan2(velSub[0], velSub[1]))),
    reflectorAzimuthDeg: normalizeAzimuthDeg(toDeg(Math.atan2(los[0], los[1]))),
    look: (dot(cross(v, rho), site.basis.up) > 0 ? 'right' : 'left') as LookSide,
    direction: (velSub[1] >= 0 ? 'ascending' : 'descending') as PassDirection,
    slantRangeKm: norm(rho),
    baseTiltDeg: 90 - incidenceDeg - TRIHEDRAL_BORESIGHT_ELEVATION_DEG,
  };
}

/** f(t) = ρ·v, km²/s: negative while the satellite approaches the site. */
const rangeRate = (s: OrbitState, site: Site) => dot(sub(s.positionEcefKm, site.ecefKm), s.velocityEcefKmPerS);

/**
 * Earth-centre angle γ between the sub-satellite point and a site seen at incidence θ from an orbit of radius r:
 *   γ = θ − asin(R sin θ / r)   (law of sines in the Earth-centre/site/satellite triangle; Curlander &
 *   McDonough 1991, eq. 1.2.2). Spherical; used only for the prefilter.
 */
function centralAngleRad(incidenceDeg: number, siteRadiusKm: number, orbitRadiusKm: number): number {
  const t = toRad(incidenceDeg);
  return t - Math.asin(Math.min(1, (siteRadiusKm / orbitRadiusKm) * Math.sin(t)));
}

/**
 * Could the site be in the swath near this state? Signed angle of the site from the Earth-fixed orbit plane
 * (r × v points to the left of the track), compared with the central angles of the incidence limits.
 */
function inSwathPrefilter(s: OrbitState, site: Site, incMinDeg: number, incMaxDeg: number, look: LookSide): boolean {
  const h = cross(s.positionEcefKm, s.velocityEcefKmPerS);
  const sinBeta = dot(site.unit, h) / norm(h);
  const crossTrackRad = (look === 'right' ? -1 : 1) * Math.asin(sinBeta);
  const rSite = norm(site.ecefKm), rSat = norm(s.positionEcefKm);
  const m = toRad(PREFILTER_MARGIN_DEG);
  return crossTrackRad >= centralAngleRad(incMinDeg, rSite, rSat) - m && crossTrackRad <= centralAngleRad(incMaxDeg, rSite, rSat) + m;
}

function validate(site: GeodeticPosition, window: PassWindow, opts: PassOptions) {
  requireLatDeg('latDeg', site.latDeg);
  requireLonDeg('lonDeg', site.lonDeg);
  requireInRange('heightM', site.heightM, SITE_HEIGHT_RANGE_M);
  requireFinite('window.startMs', window.startMs);
  requireInRange('window.days', window.days, { min: 0, max: 366, minInclusive: false, unit: 'days' });
  const incMin = requireIncidenceDeg('incidenceMinDeg', opts.incidenceMinDeg ?? DEFAULT_INCIDENCE_MIN_DEG);
  const incMax = requireIncidenceDeg('incidenceMaxDeg', opts.incidenceMaxDeg ?? DEFAULT_INCIDENCE_MAX_DEG);
  if (!(incMin < incMax)) {
    throw new RangeError(`incidenceMinDeg must be less than incidenceMaxDeg, got ${incMin}° and ${incMax}°`);
  }
  const look = requireOneOf('look', opts.look ?? 'right', LOOK_SIDES);
  return { incMin, incMax, look };
}

/**
 * Zero-Doppler passes of `set` over `site` in [window.startMs, window.startMs + days], with the site inside
 * [incidenceMinDeg, incidenceMaxDeg] on the radar's look side. Bad input throws RangeError; propagation
 * failures (decay, invalid elements) end the search and are reported in `warnings`.
 */
export function findPasses(set: TleSet, site: GeodeticPosition, window: PassWindow, opts: PassOptions = {}): PassSearchResult {
  const { incMin, incMax, look } = validate(site, window, opts);
  const endMs = window.startMs + window.days * MS_PER_DAY;
  const warnings: string[] = [];
  const age = tleAgeWarning(set, window.startMs, endMs);
  if (age) warnings.push(age);
  const counter: PropagationCounter = { count: 0 };
  const label = tleLabel(set);
  const model = orbitModelFromTle(set.line1, set.line2);
  if (!model.ok) return { passes: [], propagations: 0, warnings: [...warnings, `${label}: ${model.error.message}`] };

  const siteEcefKm = scale(geodeticToEcefM(site), 1e-3);
  const s: Site = { ecefKm: siteEcefKm, unit: scale(siteEcefKm, 1 / norm(siteEcefKm)), basis: enuBasis(site.latDeg, site.lonDeg) };
  const passes: Pass[] = [];
  const stepMs = (model.value.periodMin * 60_000) / SAMPLES_PER_ORBIT;
  const fail = (message: string, atMs?: number) =>
    warnings.push(`${label}: propagation stopped${atMs !== undefined ? ' at ' + new Date(atMs).toISOString() : ''}: ${message}`);

  let prev = propagateAt(model.value, window.startMs, counter);
  if (!prev.ok) {
    fail(prev.error.message, window.startMs);
    return { passes, propagations: counter.count, warnings };
  }
  let prevF = rangeRate(prev.value, s);
  for (let t = window.startMs; t < endMs; ) {
    const tNext = Math.min(t + stepMs, endMs);
    const cur = propagateAt(model.value, tNext, counter);
    if (!cur.ok) {
      fail(cur.error.message, tNext);
      break;
    }
    const curF = rangeRate(cur.value, s);
    if (prevF < 0 && curF >= 0) {
      const near = -prevF < curF ? prev.value : cur.value;
      if (inSwathPrefilter(near, s, incMin, incMax, look)) {
        const pass = refine(model.value, s, prev.value, prevF, cur.value, curF, counter);
        if (!pass.ok) {
          fail(pass.message);
          break;
        }
        const g = pass.geometry;
        if (g.look === look && g.incidenceDeg >= incMin && g.incidenceDeg <= incMax) {
          passes.push({
            timeMs: pass.timeMs,
            timeUtc: new Date(Math.round(pass.timeMs)).toISOString(),
            direction: g.direction,
            incidenceDeg: g.incidenceDeg,
            headingDeg: g.headingDeg,
            groundTrackHeadingDeg: g.groundTrackHeadingDeg,
            look: g.look,
            reflectorAzimuthDeg: g.reflectorAzimuthDeg,
            baseTiltDeg: g.baseTiltDeg,
            slantRangeKm: g.slantRangeKm,
            satellite: label,
            catalogNumber: set.catalogNumber,
          });
        }
      }
    }
    prev = cur;
    prevF = curF;
    t = tNext;
  }
  return { passes, propagations: counter.count, warnings };
}

type Refined =
  | { ok: true; timeMs: number; geometry: ReturnType<typeof geometryAt> }
  | { ok: false; message: string };

/** Brent refinement of a − → + bracket of f; time in seconds from the bracket start for precision. */
function refine(model: OrbitModel, site: Site, a: OrbitState, fa: number, b: OrbitState, fb: number, counter: PropagationCounter): Refined {
  const t0 = a.timeMs;
  const failure = { message: '' };
  const states = new Map<number, OrbitState>([[0, a], [(b.timeMs - t0) / 1000, b]]);
  const f = (xS: number): number => {
    const st = propagateAt(model, t0 + xS * 1000, counter);
    if (!st.ok) {
      failure.message = st.error.message;
      return NaN;
    }
    states.set(xS, st.value);
    return rangeRate(st.value, site);
  };
  const root = brentRoot(f, 0, (b.timeMs - t0) / 1000, ROOT_TOL_S, fa, fb);
  if (failure.message || !Number.isFinite(root.fx)) return { ok: false, message: failure.message || 'root finding failed' };
  const state = states.get(root.x);
  if (!state) return { ok: false, message: 'root finding lost its last state' };
  return { ok: true, timeMs: state.timeMs, geometry: geometryAt(state, site) };
}
