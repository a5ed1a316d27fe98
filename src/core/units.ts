/**
 * Units, constants and angle helpers shared by the whole core.
 * Conventions are stated once in CONVENTIONS.md beside this file; every name carries its unit
 * (`incidenceDeg`, `slantRangeM`, `rcsDbsm`), because records and JSON keep nothing else.
 */

/** Speed of light in vacuum, m/s. Exact by definition (SI Brochure, 9th ed., BIPM 2019). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;

/** Mean Earth radius R₁ = (2a + b)/3 of WGS84, m (Moritz, "Geodetic Reference System 1980", J. Geodesy 74:128, 2000). */
export const EARTH_MEAN_RADIUS_M = 6_371_008.8;

/** WGS84 semi-major axis a, m, and flattening f (NIMA TR8350.2, 3rd ed., 2000, Table 3.1). */
export const WGS84_A_M = 6_378_137;
export const WGS84_F = 1 / 298.257223563;

/** Earth rotation rate, rad/s (NIMA TR8350.2, 3rd ed., 2000, Table 3.1). */
export const EARTH_ROTATION_RAD_PER_S = 7.292115e-5;

/** Trihedral boresight elevation above the base plate: atan(1/√2) = 35.2643896828°. */
export const TRIHEDRAL_BORESIGHT_ELEVATION_DEG = (Math.atan(Math.SQRT1_2) * 180) / Math.PI;

const DEG_PER_RAD = 180 / Math.PI;
const RAD_PER_DEG = Math.PI / 180;

export const toRad = (deg: number): number => deg * RAD_PER_DEG;
export const toDeg = (rad: number): number => rad * DEG_PER_RAD;

/** Azimuth into [0, 360). Keeps +0 for an input of −0 or 360. */
export function normalizeAzimuthDeg(azDeg: number): number {
  const r = azDeg % 360;
  const n = r < 0 ? r + 360 : r;
  return n === 360 || Object.is(n, -0) ? 0 : n;
}

/** Signed angle in (−180, 180]: the shortest turn, clockwise positive, for azimuth differences. */
export function wrapSignedDeg(deltaDeg: number): number {
  let r = deltaDeg % 360;
  if (r <= -180) r += 360;
  else if (r > 180) r -= 360;
  return Object.is(r, -0) ? 0 : r;
}

/** Linear power ratio to decibels: 10 log₁₀(x). */
export const toDb = (ratio: number): number => 10 * Math.log10(ratio);
/** Decibels to a linear power ratio. */
export const fromDb = (db: number): number => 10 ** (db / 10);
