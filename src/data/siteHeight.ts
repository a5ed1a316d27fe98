/**
 * A site's height may be unknown (to be surveyed) or known only above mean sea level (a phone whose platform reports
 * sea-level altitude). Pure helpers for the consumers that need one number or one phrase.
 */
import type { SiteFields } from './types.ts';

type Heights = Pick<SiteFields, 'heightEllM' | 'heightMslM'>;

/**
 * The height to use where a height only shifts the geometry slightly (pass search, sun position, declination):
 * ellipsoidal if known, else the sea-level height, else 0 m. The geoid lies within about ±110 m of the ellipsoid
 * (EGM2008 undulations span −107 … +86 m, from memory), and 110 m of height moves the line of sight to a satellite
 * 800 km away by at most 110 m / 800 km ≈ 1.4e-4 rad ≈ 0.008° (our arithmetic); for an unknown height, a site up
 * to 1,000 m high is off by at most about 0.07°, well inside any alignment tolerance. Records keep the unknown.
 */
export function siteHeightForGeometryM(s: Heights): number {
  return s.heightEllM ?? s.heightMslM ?? 0;
}

/** Which height a site holds: 'ellipsoidal', 'sea-level' (ellipsoidal unknown) or 'unknown'. */
export function siteHeightKind(s: Heights): 'ellipsoidal' | 'sea-level' | 'unknown' {
  if (s.heightEllM !== null) return 'ellipsoidal';
  return s.heightMslM !== undefined && s.heightMslM !== null ? 'sea-level' : 'unknown';
}
