/**
 * Universal Transverse Mercator on WGS84: forward (φ, λ → E, N) and inverse (E, N → φ, λ).
 *
 * Source: J. P. Snyder, "Map Projections — A Working Manual", USGS Professional Paper 1395, 1987,
 *   Transverse Mercator, ellipsoidal form: forward eqs. (8-9)–(8-10) with (3-21) for the meridian distance M and
 *   (8-12)–(8-15); inverse eqs. (8-17)–(8-25) with (3-24)–(3-26) for the footpoint latitude. UTM: k₀ = 0.9996,
 *   central meridian 6°·zone − 183°, false easting 500 000 m, false northing 0 (north) or 10 000 000 m (south).
 * Accuracy: against PROJ's `utm` (cs2cs 9.1.1, test/fixtures/horizon/proj-utm.txt) within 1 mm inside the zone and
 *   a few millimetres 3° outside it; Snyder's series lose accuracy beyond about 4° from the central meridian, so we
 *   refuse points more than 6° from it.
 */
import { WGS84_A_M, WGS84_F, toDeg, toRad } from '../units.ts';
import { requireFinite, requireInRange } from '../validate.ts';

const K0 = 0.9996;
const E2 = WGS84_F * (2 - WGS84_F);
const EP2 = E2 / (1 - E2);
const E4 = E2 * E2, E6 = E4 * E2;

export interface UtmZone {
  zone: number;
  south: boolean;
}

export const utmCentralMeridianDeg = (zone: number) => 6 * zone - 183;

/** Meridian distance from the equator, Snyder eq. (3-21). */
function meridianDistanceM(phi: number): number {
  return (
    WGS84_A_M *
    ((1 - E2 / 4 - (3 * E4) / 64 - (5 * E6) / 256) * phi -
      ((3 * E2) / 8 + (3 * E4) / 32 + (45 * E6) / 1024) * Math.sin(2 * phi) +
      ((15 * E4) / 256 + (45 * E6) / 1024) * Math.sin(4 * phi) -
      ((35 * E6) / 3072) * Math.sin(6 * phi))
  );
}

function requireZone(z: UtmZone): void {
  requireInRange('UTM zone', z.zone, { min: 1, max: 60 });
  if (!Number.isInteger(z.zone)) throw new RangeError(`UTM zone must be a whole number, got ${z.zone}`);
}

/** Geodetic (WGS84) → UTM easting and northing, m (Snyder 1987, eqs. 8-9, 8-10). */
export function utmForward(latDeg: number, lonDeg: number, z: UtmZone): { eastingM: number; northingM: number } {
  requireZone(z);
  requireInRange('latitude', latDeg, { min: -84, max: 84, unit: '°' });
  requireFinite('longitude', lonDeg);
  let dLon = lonDeg - utmCentralMeridianDeg(z.zone);
  dLon = ((((dLon + 180) % 360) + 360) % 360) - 180;
  if (Math.abs(dLon) > 6) throw new RangeError(`longitude ${lonDeg}° is ${Math.abs(dLon).toFixed(1)}° from the central meridian of UTM zone ${z.zone}; at most 6° is accepted`);
  const phi = toRad(latDeg);
  const s = Math.sin(phi), c = Math.cos(phi), t = Math.tan(phi);
  const n = WGS84_A_M / Math.sqrt(1 - E2 * s * s);
  const T = t * t, C = EP2 * c * c, A = toRad(dLon) * c;
  const x = K0 * n * (A + ((1 - T + C) * A ** 3) / 6 + ((5 - 18 * T + T * T + 72 * C - 58 * EP2) * A ** 5) / 120);
  const y =
    K0 *
    (meridianDistanceM(phi) +
      n * t * ((A * A) / 2 + ((5 - T + 9 * C + 4 * C * C) * A ** 4) / 24 + ((61 - 58 * T + T * T + 600 * C - 330 * EP2) * A ** 6) / 720));
  return { eastingM: x + 500_000, northingM: y + (z.south ? 10_000_000 : 0) };
}

/** UTM easting and northing (m) → geodetic WGS84 (Snyder 1987, eqs. 8-17 to 8-25). */
export function utmInverse(eastingM: number, northingM: number, z: UtmZone): { latDeg: number; lonDeg: number } {
  requireZone(z);
  requireInRange('easting', eastingM, { min: -500_000, max: 1_500_000, unit: 'm' });
  requireInRange('northing', northingM, { min: -10_000_000, max: 20_000_000, unit: 'm' });
  const x = eastingM - 500_000;
  const m = (northingM - (z.south ? 10_000_000 : 0)) / K0;
  const mu = m / (WGS84_A_M * (1 - E2 / 4 - (3 * E4) / 64 - (5 * E6) / 256));
  const r = Math.sqrt(1 - E2);
  const e1 = (1 - r) / (1 + r);
  const phi1 =
    mu +
    ((3 * e1) / 2 - (27 * e1 ** 3) / 32) * Math.sin(2 * mu) +
    ((21 * e1 * e1) / 16 - (55 * e1 ** 4) / 32) * Math.sin(4 * mu) +
    ((151 * e1 ** 3) / 96) * Math.sin(6 * mu) +
    ((1097 * e1 ** 4) / 512) * Math.sin(8 * mu);
  const s = Math.sin(phi1), c = Math.cos(phi1), t = Math.tan(phi1);
  const C1 = EP2 * c * c, T1 = t * t;
  const n1 = WGS84_A_M / Math.sqrt(1 - E2 * s * s);
  const r1 = (WGS84_A_M * (1 - E2)) / (1 - E2 * s * s) ** 1.5;
  const D = x / (n1 * K0);
  const phi =
    phi1 -
    ((n1 * t) / r1) *
      ((D * D) / 2 -
        ((5 + 3 * T1 + 10 * C1 - 4 * C1 * C1 - 9 * EP2) * D ** 4) / 24 +
        ((61 + 90 * T1 + 298 * C1 + 45 * T1 * T1 - 252 * EP2 - 3 * C1 * C1) * D ** 6) / 720);
  const lam = (D - ((1 + 2 * T1 + C1) * D ** 3) / 6 + ((5 - 2 * C1 + 28 * T1 - 3 * C1 * C1 + 8 * EP2 + 24 * T1 * T1) * D ** 5) / 120) / c;
  return { latDeg: toDeg(phi), lonDeg: utmCentralMeridianDeg(z.zone) + toDeg(lam) };
}
