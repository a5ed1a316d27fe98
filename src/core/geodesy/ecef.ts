/**
 * WGS84 geodetic ↔ Earth-centred Earth-fixed (ECEF) coordinates, and the local east-north-up (ENU) axes.
 *
 * Geodetic → ECEF (NIMA TR8350.2, 3rd ed., 2000, §4.1, eq. 4-14):
 *   N = a / √(1 − e² sin²φ)            (prime-vertical radius of curvature)
 *   X = (N + h) cos φ cos λ,  Y = (N + h) cos φ sin λ,  Z = (N(1 − e²) + h) sin φ
 * ECEF → geodetic: Heikkinen's closed form (M. Heikkinen, "Geschlossene Formeln zur Berechnung räumlicher
 *   geodätischer Koordinaten aus rechtwinkligen Koordinaten", Z. Vermess. 107:207–211, 1982), as written out
 *   by J. Zhu, "Conversion of Earth-centered Earth-fixed coordinates to geodetic coordinates",
 *   IEEE Trans. Aerospace and Electronic Systems 30(3):957–961, 1994, eqs. (1)–(13).
 *   Exact (no iteration); numerically sound outside about 40 km of the Earth's centre. We reject points
 *   closer than 1000 km to the centre rather than return a doubtful answer.
 * ENU axes at (φ, λ) (TR8350.2 conventions; e.g. Hofmann-Wellenhof, Lichtenegger & Wasle, "GNSS", 2008, eq. 10.7):
 *   east  = (−sin λ, cos λ, 0)
 *   north = (−sin φ cos λ, −sin φ sin λ, cos φ)
 *   up    = (cos φ cos λ, cos φ sin λ, sin φ)      — the ellipsoid normal, since φ is geodetic latitude.
 * Accuracy: the round trip geodetic → ECEF → geodetic agrees within 1e-9° and 1 mm (test/core/geodesy/ecef.test.ts).
 * Units: metres and degrees at the interface (see ../CONVENTIONS.md).
 */
import { WGS84_A_M, WGS84_F, toDeg, toRad } from '../units.ts';
import { requireFinite, requireLatDeg, requireLonDeg } from '../validate.ts';
import { norm, type Vec3 } from '../vec3.ts';

/** First eccentricity squared e² = f(2 − f) of WGS84 (TR8350.2 Table 3.3: 6.69437999014e-3). */
export const WGS84_E2 = WGS84_F * (2 - WGS84_F);
/** Semi-minor axis b = a(1 − f), m (TR8350.2 Table 3.3: 6 356 752.3142 m). */
export const WGS84_B_M = WGS84_A_M * (1 - WGS84_F);

/** A point given by WGS84 geodetic latitude, longitude and ellipsoidal height. */
export interface GeodeticPosition {
  latDeg: number;
  lonDeg: number;
  /** Height above the WGS84 ellipsoid, m. */
  heightM: number;
}

/** Local axes at a point, as unit vectors in ECEF. */
export interface EnuBasis {
  east: Vec3;
  north: Vec3;
  /** Ellipsoid normal (geodetic vertical). */
  up: Vec3;
}

/** Geodetic → ECEF, metres (TR8350.2 eq. 4-14). Longitudes up to 360° are accepted. */
export function geodeticToEcefM(p: GeodeticPosition): Vec3 {
  requireLatDeg('latDeg', p.latDeg);
  requireLonDeg('lonDeg', p.lonDeg);
  requireFinite('heightM', p.heightM);
  const phi = toRad(p.latDeg);
  const lam = toRad(p.lonDeg);
  const sPhi = Math.sin(phi);
  const cPhi = Math.cos(phi);
  const nM = WGS84_A_M / Math.sqrt(1 - WGS84_E2 * sPhi * sPhi);
  return [
    (nM + p.heightM) * cPhi * Math.cos(lam),
    (nM + p.heightM) * cPhi * Math.sin(lam),
    (nM * (1 - WGS84_E2) + p.heightM) * sPhi,
  ];
}

/** Smallest distance from the Earth's centre accepted by ecefToGeodetic, m (our margin, see file header). */
export const ECEF_MIN_RADIUS_M = 1_000_000;

/**
 * ECEF (m) → geodetic, Heikkinen's closed form (Zhu 1994, eqs. 1–13). Longitude in [−180, 180).
 * At the poles (x = y = 0) longitude is returned as 0.
 */
export function ecefToGeodetic(ecefM: Vec3): GeodeticPosition {
  const [x, y, z] = ecefM;
  requireFinite('x', x);
  requireFinite('y', y);
  requireFinite('z', z);
  const rM = norm(ecefM);
  if (rM < ECEF_MIN_RADIUS_M) {
    throw new RangeError(`ECEF point must be at least ${ECEF_MIN_RADIUS_M} m from the Earth's centre, got ${rM} m`);
  }
  const a = WGS84_A_M;
  const b = WGS84_B_M;
  const e2 = WGS84_E2;
  const ep2 = (a * a - b * b) / (b * b);
  const p = Math.hypot(x, y);
  const F = 54 * b * b * z * z;
  const G = p * p + (1 - e2) * z * z - e2 * (a * a - b * b);
  const c = (e2 * e2 * F * p * p) / (G * G * G);
  const s = Math.cbrt(1 + c + Math.sqrt(c * c + 2 * c));
  const k = s + 1 / s + 1;
  const P = F / (3 * k * k * G * G);
  const Q = Math.sqrt(1 + 2 * e2 * e2 * P);
  const r0 = (-P * e2 * p) / (1 + Q) + Math.sqrt(Math.max(0, (a * a * (1 + 1 / Q)) / 2 - (P * (1 - e2) * z * z) / (Q * (1 + Q)) - (P * p * p) / 2));
  const pe = p - e2 * r0;
  const U = Math.hypot(pe, z);
  const V = Math.sqrt(pe * pe + (1 - e2) * z * z);
  const z0 = (b * b * z) / (a * V);
  const heightM = U * (1 - (b * b) / (a * V));
  const latDeg = toDeg(Math.atan2(z + ep2 * z0, p));
  const lonRaw = p === 0 ? 0 : toDeg(Math.atan2(y, x));
  const lonDeg = lonRaw >= 180 ? lonRaw - 360 : lonRaw;
  return { latDeg, lonDeg, heightM };
}

/** East, north and up unit vectors (ECEF components) at a geodetic latitude and longitude. */
export function enuBasis(latDeg: number, lonDeg: number): EnuBasis {
  requireLatDeg('latDeg', latDeg);
  requireLonDeg('lonDeg', lonDeg);
  const phi = toRad(latDeg);
  const lam = toRad(lonDeg);
  const sPhi = Math.sin(phi), cPhi = Math.cos(phi), sLam = Math.sin(lam), cLam = Math.cos(lam);
  return {
    east: [-sLam, cLam, 0],
    north: [-sPhi * cLam, -sPhi * sLam, cPhi],
    up: [cPhi * cLam, cPhi * sLam, sPhi],
  };
}

/** Components (east, north, up) of an ECEF vector in the given local basis. */
export function ecefToEnu(basis: EnuBasis, vEcef: Vec3): Vec3 {
  const d = (u: Vec3) => u[0] * vEcef[0] + u[1] * vEcef[1] + u[2] * vEcef[2];
  return [d(basis.east), d(basis.north), d(basis.up)];
}

/** ECEF vector from local (east, north, up) components. */
export function enuToEcef(basis: EnuBasis, vEnu: Vec3): Vec3 {
  const { east: e, north: n, up: u } = basis;
  return [
    e[0] * vEnu[0] + n[0] * vEnu[1] + u[0] * vEnu[2],
    e[1] * vEnu[0] + n[1] * vEnu[1] + u[1] * vEnu[2],
    e[2] * vEnu[0] + n[2] * vEnu[1] + u[2] * vEnu[2],
  ];
}
