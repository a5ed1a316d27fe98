/**
 * Bearing and distance between two points on the WGS84 ellipsoid (the inverse geodesic problem), for setting out
 * a reference line between two surveyed marks.
 *
 * Computed by geographiclib-geodesic 2.2.0, `Geodesic.WGS84.Inverse(lat1, lon1, lat2, lon2)`, which implements
 * Karney, "Algorithms for geodesics", J. Geodesy 87:43-55 (2013), doi:10.1007/s00190-012-0578-z: accurate to
 * about 15 nm in distance for any pair of points, nearly antipodal ones included (GeographicLib documentation);
 * the tests reproduce Karney's Tables 2-4.
 * Azimuths: azi1 is the geodesic's azimuth at `from`; azi2 its forward azimuth on arrival at `to`, so the bearing
 * from `to` back to `from` is azi2 + 180°. Both are returned in [0, 360). At a pole the azimuth is the limit
 * GeographicLib defines (approach along the given meridian).
 * Validity: any two distinct points; coincident points have no azimuth and throw RangeError.
 */
import geodesic from 'geographiclib-geodesic';
import { normalizeAzimuthDeg } from '../units.ts';
import { requireLatDeg, requireLonDeg } from '../validate.ts';

export interface LatLon {
  latDeg: number;
  /** [−180, 360]; east-positive. */
  lonDeg: number;
}

export interface GeodesicInverse {
  /** Azimuth of the geodesic at `from`, toward `to`, degrees true, [0, 360). */
  azimuthDeg: number;
  /** Azimuth at `to` pointing back toward `from` (azi2 + 180°), degrees true, [0, 360). */
  backAzimuthDeg: number;
  /** Length of the geodesic on the WGS84 ellipsoid, metres. */
  distanceM: number;
}

/** Below this separation the points count as coincident and have no azimuth, metres. */
export const MIN_SEPARATION_M = 1e-3;

/** Inverse geodesic problem on WGS84 (Karney 2013 via geographiclib-geodesic). See the file header. */
export function geodesicInverse(from: LatLon, to: LatLon): GeodesicInverse {
  requireLatDeg('from.latDeg', from.latDeg);
  requireLonDeg('from.lonDeg', from.lonDeg);
  requireLatDeg('to.latDeg', to.latDeg);
  requireLonDeg('to.lonDeg', to.lonDeg);
  const r = geodesic.Geodesic.WGS84.Inverse(from.latDeg, from.lonDeg, to.latDeg, to.lonDeg, geodesic.Geodesic.STANDARD);
  const { s12, azi1, azi2 } = r;
  if (s12 === undefined || azi1 === undefined || azi2 === undefined) {
    throw new RangeError('the geodesic library returned no distance or azimuth'); // not reached with STANDARD
  }
  if (s12 < MIN_SEPARATION_M) {
    throw new RangeError(
      `from and to must be at least ${MIN_SEPARATION_M} m apart to define an azimuth, got ${s12} m ` +
        `(from ${from.latDeg},${from.lonDeg} to ${to.latDeg},${to.lonDeg})`,
    );
  }
  return { azimuthDeg: normalizeAzimuthDeg(azi1), backAzimuthDeg: normalizeAzimuthDeg(azi2 + 180), distanceM: s12 };
}
