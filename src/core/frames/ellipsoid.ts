/**
 * Geodetic ↔ Earth-centred coordinates on the GRS80 ellipsoid, the ellipsoid the IERS recommends for expressing
 * ITRF Cartesian coordinates as latitude, longitude and height (IERS Conventions 2010, TN 36, §4.2.6).
 *
 * GRS80: a = 6 378 137 m, f = 1/298.257222101 (Moritz, "Geodetic Reference System 1980", Bulletin Géodésique 54,
 *   1980; J. Geodesy 74:128–133, 2000). WGS84 differs only in f (1/298.257223563): heights differ by < 0.1 mm and
 *   latitudes by < 2·10⁻⁹°, so either serves at field accuracy; we use GRS80 as the ITRF tables do.
 * Forward: X = (N + h) cos φ cos λ, Y = (N + h) cos φ sin λ, Z = (N(1 − e²) + h) sin φ, N = a/√(1 − e² sin²φ).
 * Inverse: Bowring's iteration (B. R. Bowring, "Transformation from spatial to geographical coordinates",
 *   Survey Review 23(181):323–327, 1976), iterated to convergence (3–4 passes reach 10⁻¹² rad on the Earth's surface).
 */
import { toDeg, toRad } from '../units.ts';
import { requireFinite, requireLatDeg, requireLonDeg } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';

export const GRS80_A_M = 6_378_137;
export const GRS80_F = 1 / 298.257222101;
const E2 = GRS80_F * (2 - GRS80_F);
const B_M = GRS80_A_M * (1 - GRS80_F);
const EP2 = E2 / (1 - E2);

export interface Grs80Position {
  latDeg: number;
  lonDeg: number;
  /** Height above the GRS80 ellipsoid, m. */
  heightEllM: number;
}

export function grs80ToEcefM(p: Grs80Position): Vec3 {
  requireLatDeg('latitude', p.latDeg);
  requireLonDeg('longitude', p.lonDeg);
  requireFinite('height', p.heightEllM);
  const phi = toRad(p.latDeg), lam = toRad(p.lonDeg);
  const s = Math.sin(phi), c = Math.cos(phi);
  const n = GRS80_A_M / Math.sqrt(1 - E2 * s * s);
  return [(n + p.heightEllM) * c * Math.cos(lam), (n + p.heightEllM) * c * Math.sin(lam), (n * (1 - E2) + p.heightEllM) * s];
}

/** ECEF (m) → GRS80 latitude, longitude [−180, 180) and height. Rejects points within 1000 km of the centre. */
export function ecefToGrs80(x: Vec3): Grs80Position {
  x.forEach((v, i) => requireFinite(`xyz[${i}]`, v));
  const p = Math.hypot(x[0], x[1]);
  if (Math.hypot(p, x[2]) < 1_000_000) throw new RangeError(`ECEF point must be at least 1000 km from the Earth's centre`);
  let beta = Math.atan2(x[2], (1 - GRS80_F) * p);
  let phi = 0;
  for (let i = 0; i < 8; i++) {
    const next = Math.atan2(x[2] + EP2 * B_M * Math.sin(beta) ** 3, p - E2 * GRS80_A_M * Math.cos(beta) ** 3);
    const done = Math.abs(next - phi) < 1e-14;
    phi = next;
    beta = Math.atan2((1 - GRS80_F) * Math.sin(phi), Math.cos(phi));
    if (done) break;
  }
  const s = Math.sin(phi);
  const n = GRS80_A_M / Math.sqrt(1 - E2 * s * s);
  // Height: robust at all latitudes (Bowring 1985 form h = p cos φ + z sin φ − a²/N).
  const h = p * Math.cos(phi) + x[2] * s - (GRS80_A_M * GRS80_A_M) / n;
  const lonRaw = p === 0 ? 0 : toDeg(Math.atan2(x[1], x[0]));
  return { latDeg: toDeg(phi), lonDeg: lonRaw >= 180 ? lonRaw - 360 : lonRaw, heightEllM: h };
}
