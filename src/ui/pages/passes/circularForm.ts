/**
 * The "no elements at hand" panel: a circular-orbit approximation of the ascending and descending geometry
 * (core circularOrbitGeometry), checked field by field, and its hand-over to the Plan screen marked approximate.
 */
import type { LookSide } from '../../../core/geometry/pointing.ts';
import { circularOrbitGeometry, type CircularOrbitGeometry } from '../../../core/orbit/circular.ts';
import type { PassDirection } from '../../../core/orbit/passes.ts';
import { requireIncidenceDeg, requireInRange, requireLatDeg } from '../../../core/validate.ts';
import { parseField } from '../../components/fields.tsx';
import type { GeometryInput } from '../../state/workflow.ts';

export interface CircularForm {
  altitudeKm: string;
  inclinationDeg: string;
  latDeg: string;
  /** Which angle the crew knows: incidence at the ground or look angle at the satellite. */
  angleKind: 'incidence' | 'look';
  angleDeg: string;
  look: LookSide;
}

export interface CircularResult {
  errors: Partial<Record<'altitudeKm' | 'inclinationDeg' | 'latDeg' | 'angleDeg', string>>;
  /** A combination the model rejects (orbit never reaches the latitude, look past the horizon). */
  error: string | null;
  geometry: CircularOrbitGeometry | null;
  /** The inclination as read, degrees (null until the form is valid). */
  inclinationDeg: number | null;
}

/** Low Earth orbits only: below ~150 km nothing stays up, above 2000 km is not a SAR orbit this model is for. */
const ALTITUDE_RANGE_KM = { min: 150, max: 2000, unit: 'km' };

export function computeCircular(f: CircularForm): CircularResult {
  const alt = parseField('Altitude', f.altitudeKm, (n, v) => requireInRange(n, v, ALTITUDE_RANGE_KM));
  const inc = parseField('Inclination', f.inclinationDeg, (n, v) => requireInRange(n, v, { min: 0, max: 180, unit: '°' }));
  const lat = parseField('Site latitude', f.latDeg, requireLatDeg);
  const ang =
    f.angleKind === 'incidence'
      ? parseField('Incidence', f.angleDeg, requireIncidenceDeg)
      : parseField('Look angle', f.angleDeg, (n, v) => requireInRange(n, v, { min: 0, max: 90, maxInclusive: false, unit: '°' }));
  const errors = { altitudeKm: alt.error, inclinationDeg: inc.error, latDeg: lat.error, angleDeg: ang.error };
  if (alt.value === undefined || inc.value === undefined || lat.value === undefined || ang.value === undefined) {
    return { errors, error: null, geometry: null, inclinationDeg: null };
  }
  try {
    const geometry = circularOrbitGeometry({
      altitudeM: alt.value * 1000,
      inclinationDeg: inc.value,
      latDeg: lat.value,
      ...(f.angleKind === 'incidence' ? { incidenceDeg: ang.value } : { lookDeg: ang.value }),
      look: f.look,
    });
    return { errors, error: null, geometry, inclinationDeg: inc.value };
  } catch (e) {
    return { errors, error: e instanceof Error ? e.message : String(e), geometry: null, inclinationDeg: null };
  }
}

/** Plan geometry for one direction of the approximation, labelled APPROXIMATE so nobody mistakes it for a pass. */
export function geometryFromCircular(g: CircularOrbitGeometry, direction: PassDirection, look: LookSide, inclinationDeg: number): GeometryInput {
  const p = g[direction];
  return {
    incidenceDeg: String(p.incidenceDeg.toFixed(2)),
    headingDeg: String(p.headingDeg.toFixed(2)),
    look,
    losAzimuthDeg: p.reflectorAzimuthDeg,
    label: `APPROXIMATE circular orbit ${(g.altitudeM / 1000).toFixed(0)} km, ${inclinationDeg}° inclination, ${direction} ${p.incidenceDeg.toFixed(1)}°`,
    direction,
    source: 'circular-approximation',
  };
}
