/**
 * What an installed reflector returns to one pass: the RCS pattern of pattern.ts evaluated along the pass's line of
 * sight (aimForPass in ../geometry/pointing.ts: incidence, heading and look side → LOS in ENU).
 * Validity: as pattern.ts; the line of sight is that of a flat site (incidence from the local vertical).
 */
import type { ReflectorOrientation } from '../geometry/orientation.ts';
import { aimForPass, type PassGeometry } from '../geometry/pointing.ts';
import { rcsForOrientation } from './pattern.ts';
import type { Reflector } from './trihedral.ts';

export interface Misalignment {
  /** Angle between the reflector's boresight and the line of sight to the satellite, degrees. */
  offBoresightDeg: number;
  /** RCS toward the satellite, m² (0 when the satellite is outside the corner). */
  rcsM2: number;
  /** dBsm; −Infinity when the satellite is outside the corner. */
  rcsDbsm: number;
  /** Positive dB below the reflector's peak; +Infinity outside the corner. */
  lossDb: number;
}

/** RCS and loss of reflector `r`, oriented `o`, for pass geometry `g`. */
export function misalignment(r: Reflector, o: ReflectorOrientation, g: PassGeometry): Misalignment {
  const s = rcsForOrientation(r, o, aimForPass(g).losEnu);
  return { offBoresightDeg: s.offBoresightDeg, rcsM2: s.rcsM2, rcsDbsm: s.rcsDbsm, lossDb: s.lossDb };
}
