/**
 * Pass geometry → line of sight and reflector aim.
 *
 * Line of sight (site → satellite) in local ENU for incidence θᵢ (from the local vertical) and the
 * azimuth A of the direction to the satellite:  k = (sin A sin θᵢ, cos A sin θᵢ, cos θᵢ).
 * A right-looking radar sees the site on the right of its ground track, so the satellite lies 90° to the
 * left of the heading h as seen from the site: A = h − 90°; left-looking: A = h + 90°.
 * Source: standard side-looking SAR geometry (Curlander & McDonough, "Synthetic Aperture Radar: Systems and
 *   Signal Processing", Wiley 1991, §1.2 and Fig. 1.6); the heading/look-side rule is also in
 *   ../shared/REFERENCES.md §3. Heading is the azimuth of the Earth-fixed ground-track velocity.
 * Boresight elevation = 90° − θᵢ. Base tilt = (90° − θᵢ) − atan(1/√2), since a level trihedral's boresight
 * already stands 35.26° above its base plate (Robertson 1947, BSTJ 26:852).
 */
import { EARTH_MEAN_RADIUS_M, TRIHEDRAL_BORESIGHT_ELEVATION_DEG, normalizeAzimuthDeg, toDeg, toRad } from '../units.ts';
import { requireFinite, requireIncidenceDeg, requireInRange, requireOneOf, requirePositive } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';

export type LookSide = 'right' | 'left';
export const LOOK_SIDES: readonly LookSide[] = ['right', 'left'];

export interface PassGeometry {
  /** Incidence angle at the site, from the local vertical (ellipsoid normal), degrees, (0, 90). */
  incidenceDeg: number;
  /** Azimuth of the satellite's Earth-fixed ground-track velocity, degrees clockwise from true north. */
  headingDeg: number;
  look: LookSide;
  /**
   * Azimuth from the site to the satellite, degrees true, when known exactly (a pass computed from orbital
   * elements). It overrides heading ∓ 90°, which is exact only on a flat Earth: at zero Doppler the satellite's
   * velocity has a vertical component in the site's frame, and on the demo orbit heading − 90° misses the true
   * line-of-sight azimuth by up to 0.3° (measured, test/core/orbit). Typed geometries leave it out.
   */
  losAzimuthDeg?: number;
}

export interface Aim {
  /** Unit vector from the site toward the satellite, ENU. */
  losEnu: Vec3;
  /** Azimuth the reflector must face (toward the satellite), degrees true, [0, 360). */
  reflectorAzimuthDeg: number;
  /** Elevation of the line of sight = required boresight elevation, degrees. */
  boresightElevationDeg: number;
  /** Base-plate tilt, degrees; positive = open side raised. */
  baseTiltDeg: number;
}

export function validatePassGeometry(g: PassGeometry): PassGeometry {
  requireIncidenceDeg('incidenceDeg', g.incidenceDeg);
  requireFinite('headingDeg', g.headingDeg);
  requireOneOf('look', g.look, LOOK_SIDES);
  if (g.losAzimuthDeg !== undefined) requireFinite('losAzimuthDeg', g.losAzimuthDeg);
  return g;
}

/** Azimuth from the site toward the satellite, degrees true, [0, 360). */
export function azimuthToSatelliteDeg(headingDeg: number, look: LookSide): number {
  requireFinite('headingDeg', headingDeg);
  requireOneOf('look', look, LOOK_SIDES);
  return normalizeAzimuthDeg(look === 'right' ? headingDeg - 90 : headingDeg + 90);
}

/** Unit line of sight site → satellite in ENU from azimuth and elevation (degrees). */
export function losFromAzEl(azimuthDeg: number, elevationDeg: number): Vec3 {
  requireFinite('azimuthDeg', azimuthDeg);
  requireInRange('elevationDeg', elevationDeg, { min: -90, max: 90, unit: '°' });
  const A = toRad(azimuthDeg);
  const e = toRad(elevationDeg);
  return [Math.sin(A) * Math.cos(e), Math.cos(A) * Math.cos(e), Math.sin(e)];
}

/** Azimuth (degrees true, [0, 360)) and elevation (degrees) of an ENU vector. */
export function azElFromEnu(v: Vec3): { azimuthDeg: number; elevationDeg: number } {
  v.forEach((x, i) => requireFinite(`v[${i}]`, x));
  return {
    azimuthDeg: normalizeAzimuthDeg(toDeg(Math.atan2(v[0], v[1]))),
    elevationDeg: toDeg(Math.atan2(v[2], Math.hypot(v[0], v[1]))),
  };
}

/** Aim for a pass: line of sight, reflector azimuth, boresight elevation and base tilt. */
export function aimForPass(g: PassGeometry): Aim {
  validatePassGeometry(g);
  const reflectorAzimuthDeg =
    g.losAzimuthDeg !== undefined ? normalizeAzimuthDeg(g.losAzimuthDeg) : azimuthToSatelliteDeg(g.headingDeg, g.look);
  const boresightElevationDeg = 90 - g.incidenceDeg;
  return {
    losEnu: losFromAzEl(reflectorAzimuthDeg, boresightElevationDeg),
    reflectorAzimuthDeg,
    boresightElevationDeg,
    baseTiltDeg: boresightElevationDeg - TRIHEDRAL_BORESIGHT_ELEVATION_DEG,
  };
}

/**
 * Look angle at the satellite ↔ incidence at the ground, spherical Earth of radius R, orbit height H:
 *   sin θᵢ = ((R + H)/R) · sin θₗ ;  slant range ρ = R sin(θᵢ − θₗ) / sin θₗ  (law of sines, Earth-centre angle θᵢ − θₗ).
 * Source: Curlander & McDonough 1991, eq. 1.2.2 and Fig. 1.6 (textbook SAR geometry); REFERENCES.md §3.
 * Check (derived, R = 6371.0088 km, H = 693 km): look 30° → incidence 33.6685°, slant range 815.282 km.
 * Validity: spherical Earth, flat site at sea level; errors of a few tenths of a degree against an ellipsoid.
 */
export function incidenceFromLookDeg(lookDeg: number, orbitHeightM: number, earthRadiusM = EARTH_MEAN_RADIUS_M): number {
  requireInRange('lookDeg', lookDeg, { min: 0, max: 90, minInclusive: true, maxInclusive: false, unit: '°' });
  requirePositive('orbitHeightM', orbitHeightM, 'm');
  requirePositive('earthRadiusM', earthRadiusM, 'm');
  const s = ((earthRadiusM + orbitHeightM) / earthRadiusM) * Math.sin(toRad(lookDeg));
  if (s >= 1) {
    throw new RangeError(`lookDeg ${lookDeg}° looks past the horizon for an orbit ${orbitHeightM} m high`);
  }
  return toDeg(Math.asin(s));
}

/** Inverse of incidenceFromLookDeg: sin θₗ = R/(R + H) · sin θᵢ. */
export function lookFromIncidenceDeg(incidenceDeg: number, orbitHeightM: number, earthRadiusM = EARTH_MEAN_RADIUS_M): number {
  requireIncidenceDeg('incidenceDeg', incidenceDeg);
  requirePositive('orbitHeightM', orbitHeightM, 'm');
  requirePositive('earthRadiusM', earthRadiusM, 'm');
  return toDeg(Math.asin((earthRadiusM / (earthRadiusM + orbitHeightM)) * Math.sin(toRad(incidenceDeg))));
}

/** Slant range, m, for a look angle (spherical Earth, law of sines). */
export function slantRangeFromLookM(lookDeg: number, orbitHeightM: number, earthRadiusM = EARTH_MEAN_RADIUS_M): number {
  const incDeg = incidenceFromLookDeg(lookDeg, orbitHeightM, earthRadiusM);
  if (lookDeg === 0) return orbitHeightM;
  return (earthRadiusM * Math.sin(toRad(incDeg - lookDeg))) / Math.sin(toRad(lookDeg));
}
