/**
 * Plausible ranges for the planner's numeric flags, checked where the value enters (Args.number), so an absurd
 * finite value (`--edge 1e308`) is refused with the flag's own name instead of printing Infinity.
 * Where a flag is a field of a stored record, the range is the record schema's (src/data/schema/ranges.ts), so the
 * planner and the phone accept the same values. The others are generous physical limits of our own choosing
 * (common practice, no source), wide enough for any real reflector, radar or site.
 */
import { RECORD_BOUNDS, type Bounds } from '../data/schema/ranges.ts';

export const FLAG_BOUNDS: Readonly<Record<string, Bounds>> = {
  edge: RECORD_BOUNDS.edgeM,
  incidence: RECORD_BOUNDS.incidenceDeg,
  'incidence-min': RECORD_BOUNDS.incidenceDeg,
  'incidence-max': RECORD_BOUNDS.incidenceDeg,
  wavelength: RECORD_BOUNDS.wavelengthM,
  tilt: RECORD_BOUNDS.tiltDeg,
  roll: RECORD_BOUNDS.rollDeg,
  lat: RECORD_BOUNDS.latDeg,
  heading: { min: -360, max: 720, unit: 'degrees' },
  'reflector-azimuth': { min: -360, max: 720, unit: 'degrees' },
  declination: { min: -180, max: 180, unit: 'degrees' },
  frequency: { min: 0, max: 1000, minOpen: true, unit: 'GHz' },
  'clutter-db': { min: -80, max: 40, unit: 'dB' },
  'scr-db': { min: -40, max: 100, unit: 'dB' },
  'rcs-dbsm': { min: -80, max: 120, unit: 'dBsm' },
  'cell-area': { min: 0, max: 1e8, minOpen: true, unit: 'm²' },
  'range-resolution': { min: 0, max: 10000, minOpen: true, unit: 'm' },
  'azimuth-resolution': { min: 0, max: 10000, minOpen: true, unit: 'm' },
  baseline: { min: 0, max: 100000, minOpen: true, unit: 'm' },
  'max-loss': { min: 0, max: 60, unit: 'dB' },
};
