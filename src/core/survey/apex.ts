/**
 * Apex reduction: from a surveyed mark (or antenna reference point) to the reflector's apex, the phase centre of
 * the triple bounce, as geodetic and Earth-centred coordinates, with every step kept for the record.
 *
 *   1. Mark: geodetic (φ, λ, h) → ECEF X_m (NIMA TR8350.2 eq. 4-14, ../geodesy/ecef.ts).
 *   2. Offset in local east-north-up, d_ENU: given directly, or from body-frame offsets d_B = (right, forward, up)
 *      (body axes as in ../CONVENTIONS.md) through the measured orientation (azimuth, tilt, roll):
 *      d_ENU = x·r̂ + y·f̂ + z·û with the axes of ../geometry/orientation.ts (intrinsic Z(−A)·X(t)·Y(ρ)).
 *   3. ENU → ECEF at the mark: d_ECEF = e·ê + n·n̂ + u·û (ê, n̂, û at the mark's geodetic latitude and longitude;
 *      Hofmann-Wellenhof, Lichtenegger & Wasle, "GNSS", 2008, eq. 10.7).
 *   4. Apex X_a = X_m + d_ECEF, then ECEF → geodetic (Heikkinen 1982 / Zhu 1994).
 * Exact vector algebra: the only approximation is the local frame at the mark rather than at the apex, which is
 *   none at all in ECEF (step 4 is exact). Accuracy is that of the inputs: an orientation error δ (rad) moves the
 *   apex by about δ·|d| (1° on a 0.5 m lever arm ≈ 9 mm); a mark error passes through unchanged.
 * Heights are ellipsoidal (WGS84, as everywhere in the core); a GNSS solution in an ITRF frame uses GRS80, which
 *   differs from WGS84 by under 0.1 mm in height (../frames/ellipsoid.ts).
 */
import { ecefToGeodetic, enuBasis, geodeticToEcefM, type GeodeticPosition } from '../geodesy/ecef.ts';
import { reflectorAxesEnu, type ReflectorOrientation } from '../geometry/orientation.ts';
import { requireFinite, requireInRange } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';

/** Largest offset accepted, m: a lever arm longer than this is a typing error, not a reflector mount. */
export const APEX_MAX_OFFSET_M = 100;

export type ApexOffset =
  | { kind: 'enu'; enuM: Vec3 }
  | { kind: 'body'; bodyM: Vec3; orientation: ReflectorOrientation };

export interface ApexReduction {
  apexLatDeg: number;
  apexLonDeg: number;
  apexHeightEllM: number;
  apexXyzM: Vec3;
  steps: {
    markXyzM: Vec3;
    /** Body offset (right, forward, up) when given that way, m. */
    offsetBodyM?: Vec3;
    offsetEnuM: Vec3;
    offsetEcefM: Vec3;
  };
}

function requireOffset(name: string, v: Vec3): Vec3 {
  v.forEach((x, i) => requireFinite(`${name}[${i}]`, x));
  const len = Math.hypot(v[0], v[1], v[2]);
  if (len > APEX_MAX_OFFSET_M) throw new RangeError(`${name} is ${len.toFixed(2)} m long; offsets up to ${APEX_MAX_OFFSET_M} m are accepted`);
  return v;
}

/** Body (right, forward, up) offset → ENU through the reflector's orientation. */
export function bodyOffsetToEnuM(bodyM: Vec3, o: ReflectorOrientation): Vec3 {
  requireOffset('body offset', bodyM);
  const ax = reflectorAxesEnu(o);
  const [x, y, z] = bodyM;
  return [0, 1, 2].map((i) => x * ax.right[i] + y * ax.forward[i] + z * ax.up[i]) as unknown as Vec3;
}

export function reduceToApex(mark: GeodeticPosition, offset: ApexOffset): ApexReduction {
  requireInRange('mark height', mark.heightM, { min: -1000, max: 10_000, unit: 'm' });
  const markXyzM = geodeticToEcefM(mark);
  const offsetEnuM = offset.kind === 'enu' ? requireOffset('ENU offset', offset.enuM) : bodyOffsetToEnuM(offset.bodyM, offset.orientation);
  const b = enuBasis(mark.latDeg, mark.lonDeg);
  const [e, n, u] = offsetEnuM;
  const offsetEcefM = [0, 1, 2].map((i) => e * b.east[i] + n * b.north[i] + u * b.up[i]) as unknown as Vec3;
  const apexXyzM: Vec3 = [markXyzM[0] + offsetEcefM[0], markXyzM[1] + offsetEcefM[1], markXyzM[2] + offsetEcefM[2]];
  const g = ecefToGeodetic(apexXyzM);
  return {
    apexLatDeg: g.latDeg,
    apexLonDeg: g.lonDeg,
    apexHeightEllM: g.heightM,
    apexXyzM,
    steps: { markXyzM, ...(offset.kind === 'body' ? { offsetBodyM: offset.bodyM } : {}), offsetEnuM, offsetEcefM },
  };
}
