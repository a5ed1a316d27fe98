/**
 * Sightline clearance: is the line of sight from the reflector to the satellite above every obstacle within the
 * reflector's beam?
 *
 * For a track with incidence θ at the site and azimuth α toward the satellite, the line of sight stands at
 * elevation ε_LOS = 90° − θ (CONVENTIONS.md: incidence from the local vertical). The obstacles that count are those
 * whose azimuth lies within α ± (½ · azimuth 3 dB beamwidth + alignment tolerance) — the sector the reflector's
 * main lobe covers when aimed within tolerance (the rule stated for Glintmark; the beamwidth comes from
 * ../reflector/beamwidth.ts). The deciding obstacle is the highest one in that sector; the margin is
 * ε_LOS − ε_obstacle: positive = *clear by* that many degrees, otherwise *blocked by* its magnitude.
 * With no obstacle recorded in the sector the level horizon (0°) decides, and the result says so.
 * Accuracy: that of the horizon (a phone sighting about ±1–2°, a DEM profile about 0.1° plus the grid's own height
 * errors) and of ε_LOS (a typed incidence to its stated digits).
 */
import { normalizeAzimuthDeg, wrapSignedDeg } from '../units.ts';
import { requireFinite, requireIncidenceDeg, requireInRange } from '../validate.ts';

export interface HorizonPoint {
  azimuthDeg: number;
  elevationDeg: number;
  /** What was sighted (tree, roof, ridge) or where it came from. */
  label?: string;
  distanceM?: number | null;
}

export interface ClearanceTrack {
  name: string;
  incidenceDeg: number;
  /** Azimuth from the site toward the satellite, degrees true. */
  azimuthToSatelliteDeg: number;
}

export interface ClearanceVerdict {
  name: string;
  losElevationDeg: number;
  azimuthToSatelliteDeg: number;
  /** Half-width of the sector searched, degrees. */
  sectorHalfWidthDeg: number;
  /** The deciding obstacle, or null when none lies in the sector (then the level horizon decides). */
  deciding: HorizonPoint | null;
  /** ε_LOS − ε_obstacle, degrees: positive clear, zero or negative blocked. */
  marginDeg: number;
  verdict: 'clear' | 'blocked';
  /** "clear by 12.3°" / "blocked by 4.1°". */
  text: string;
}

export function validateHorizon(points: readonly HorizonPoint[]): HorizonPoint[] {
  return points.map((p, i) => {
    requireFinite(`sighting ${i + 1} azimuth`, p.azimuthDeg);
    requireInRange(`sighting ${i + 1} elevation`, p.elevationDeg, { min: -90, max: 90, unit: '°' });
    return { ...p, azimuthDeg: normalizeAzimuthDeg(p.azimuthDeg) };
  });
}

export function clearanceForTracks(
  horizon: readonly HorizonPoint[],
  tracks: readonly ClearanceTrack[],
  halfBeamDeg: number,
  toleranceDeg: number,
): ClearanceVerdict[] {
  const pts = validateHorizon(horizon);
  requireInRange('half beamwidth', halfBeamDeg, { min: 0, max: 90, unit: '°' });
  requireInRange('alignment tolerance', toleranceDeg, { min: 0, max: 45, unit: '°' });
  const half = halfBeamDeg + toleranceDeg;
  return tracks.map((t) => {
    requireIncidenceDeg(`${t.name} incidence`, t.incidenceDeg);
    requireFinite(`${t.name} azimuth`, t.azimuthToSatelliteDeg);
    const los = 90 - t.incidenceDeg;
    let deciding: HorizonPoint | null = null;
    for (const p of pts) {
      if (Math.abs(wrapSignedDeg(p.azimuthDeg - t.azimuthToSatelliteDeg)) > half + 1e-9) continue;
      if (!deciding || p.elevationDeg > deciding.elevationDeg) deciding = p;
    }
    const obstacle = deciding ? deciding.elevationDeg : 0;
    const marginDeg = los - obstacle;
    const verdict = marginDeg > 0 ? 'clear' : 'blocked';
    const by = `${Math.abs(marginDeg).toFixed(1)}°`;
    const what = deciding ? `${deciding.label ? deciding.label + ' ' : ''}at azimuth ${deciding.azimuthDeg.toFixed(1)}°, elevation ${deciding.elevationDeg.toFixed(1)}°` : 'no obstacle in the beam; level horizon';
    return {
      name: t.name,
      losElevationDeg: los,
      azimuthToSatelliteDeg: normalizeAzimuthDeg(t.azimuthToSatelliteDeg),
      sectorHalfWidthDeg: half,
      deciding,
      marginDeg,
      verdict,
      text: `${verdict} by ${by} (${what})`,
    };
  });
}
