/**
 * Topocentric position of the sun (azimuth and elevation) for the shadow method of setting out an azimuth.
 *
 * Computed by astronomy-engine 2.1.19 (VSOP87-based, with precession, nutation, aberration, light time
 * and topocentric parallax; stated accuracy ±1 arcminute, ΔT from the Espenak–Meeus polynomials):
 * `Equator(Body.Sun, t, observer, ofdate = true, aberration = true)` then `Horizon(...)`.
 * Checked in the tests against the NREL Solar Position Algorithm worked example (Reda & Andreas 2004, Solar
 * Energy 76:577-589; NREL/TP-560-34302, Table A5.1) to 0.01°, and over a year against an independent low-accuracy
 * solar formula (Meeus, "Astronomical Algorithms", 2nd ed. 1998, ch. 25 and eq. 12.4).
 *
 * Refraction: with `refraction: true` (the default) the elevation is the apparent one, raised by the refraction
 * of a standard atmosphere (Saemundsson's formula, Meeus 1998 eq. 16.4, for 1010 hPa and 10 °C, as astronomy-engine
 * applies it); with `false` it is the airless (geometric) elevation. Azimuth is not affected by refraction, which is
 * why the shadow method needs only the azimuth. Real refraction depends on pressure and temperature: at 820 hPa and
 * 11 °C (the SPA example) it is 0.0163° at 40° elevation where the standard value is 0.0202°.
 * Height: astronomy-engine takes height above sea level; an ellipsoidal height is passed unchanged, since a geoid
 * separation of up to ~100 m moves the sun's direction by less than 1e-7°.
 * Validity: astronomy-engine covers several millennia around the present; ΔT beyond the 21st century is a guess.
 */
import { Body, Equator, Horizon, Observer } from 'astronomy-engine';
import { normalizeAzimuthDeg, wrapSignedDeg } from '../units.ts';
import { requireFinite, requireInRange, requireLatDeg, requireLonDeg } from '../validate.ts';

export interface SunQuery {
  latDeg: number;
  /** [−180, 360]; east-positive. */
  lonDeg: number;
  /** Height of the site, metres (ellipsoidal; see the file header). Default 0. */
  heightM?: number;
  /** UTC instant, ms since 1970-01-01T00:00Z. */
  timeMs: number;
  /** Apparent elevation including standard refraction (default true); false gives the airless elevation. */
  refraction?: boolean;
}

export interface SunPosition {
  /** Azimuth of the sun, degrees clockwise from true north, [0, 360). */
  azimuthDeg: number;
  /** Elevation above the horizontal, degrees (apparent unless refraction: false). */
  elevationDeg: number;
  /** 90° − elevationDeg. */
  zenithDeg: number;
}

/** Sun azimuth and elevation at a site and instant (topocentric). See the file header for the model and checks. */
export function sunPosition(q: SunQuery): SunPosition {
  requireLatDeg('latDeg', q.latDeg);
  requireLonDeg('lonDeg', q.lonDeg);
  const heightM = requireInRange('heightM', q.heightM ?? 0, { min: -500, max: 100_000, unit: 'm' });
  requireFinite('timeMs', q.timeMs);
  // astronomy-engine prefers longitudes in [−180, 180].
  const lonDeg = q.lonDeg >= 180 ? q.lonDeg - 360 : q.lonDeg;
  const observer = new Observer(q.latDeg, lonDeg, heightM);
  const date = new Date(q.timeMs);
  const eq = Equator(Body.Sun, date, observer, true, true);
  const hor = Horizon(date, observer, eq.ra, eq.dec, q.refraction === false ? undefined : 'normal');
  return { azimuthDeg: normalizeAzimuthDeg(hor.azimuth), elevationDeg: hor.altitude, zenithDeg: 90 - hor.altitude };
}

/**
 * How fast the sun's azimuth turns at a site and instant, degrees per minute, clockwise positive: the central
 * difference (A(t + 30 s) − A(t − 30 s)) / 1 min, wrapped. About 0.25°/min on average, several times that near
 * noon when the sun passes high; use it to say how soon a marked shadow line goes stale.
 */
export function sunAzimuthRateDegPerMin(q: Omit<SunQuery, 'refraction'>): number {
  requireFinite('timeMs', q.timeMs);
  const a0 = sunPosition({ ...q, timeMs: q.timeMs - 30_000 }).azimuthDeg;
  const a1 = sunPosition({ ...q, timeMs: q.timeMs + 30_000 }).azimuthDeg;
  return wrapSignedDeg(a1 - a0);
}
