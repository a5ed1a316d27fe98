/** Option readers shared by several planner commands. */
import { LOOK_SIDES, validatePassGeometry, type LookSide, type PassGeometry } from '../core/geometry/pointing.ts';
import { bandWavelengthM, wavelengthFromFrequencyM } from '../core/radar/bands.ts';
import { SHAPE_NAMES, type TrihedralShapeName } from '../core/radar/shapes.ts';
import { requireOneOf, requirePositive } from '../core/validate.ts';
import { Args, UsageError, parseNumber } from './args.ts';

/** Wavelength in metres from exactly one of --wavelength M, --frequency GHZ, --band NAME (or `fallback`). */
export function readWavelengthM(args: Args, fallbackBand?: string): number {
  const given = ['wavelength', 'frequency', 'band'].filter((n) => args.has(n));
  if (given.length > 1) throw new UsageError(`give only one of --wavelength, --frequency, --band (got ${given.map((g) => '--' + g).join(' and ')})`);
  const w = args.optNumber('wavelength');
  const f = args.optNumber('frequency');
  const b = args.optString('band');
  if (w !== undefined) return requirePositive('wavelength', w, 'm');
  if (f !== undefined) return wavelengthFromFrequencyM(requirePositive('frequency', f, 'GHz') * 1e9);
  if (b !== undefined) return bandWavelengthM(b);
  if (fallbackBand) return bandWavelengthM(fallbackBand);
  throw new UsageError('missing wavelength: give --wavelength M, --frequency GHZ or --band L|S|C|X|Ku');
}

export function readShape(args: Args, fallback?: TrihedralShapeName): TrihedralShapeName {
  const s = args.optString('shape') ?? fallback;
  if (s === undefined) throw new UsageError('missing --shape (triangular or square)');
  return requireOneOf('shape', s, SHAPE_NAMES);
}

export function readLook(args: Args): LookSide {
  return requireOneOf('look', args.optString('look') ?? 'right', LOOK_SIDES);
}

/** "INC,HEADING,LOOK" (LOOK optional, default right) → a validated pass geometry. */
function parseGeometrySpec(spec: string): PassGeometry {
  const parts = spec.split(',').map((p) => p.trim());
  if (parts.length < 2 || parts.length > 3) {
    throw new UsageError(`--geometry must be INCIDENCE,HEADING[,LOOK], e.g. 37.5,192.3,right; got "${spec}"`);
  }
  const incidenceDeg = parseNumber('--geometry incidence', parts[0]);
  const headingDeg = parseNumber('--geometry heading', parts[1]);
  const look = requireOneOf('--geometry look', parts[2] || 'right', LOOK_SIDES);
  return validatePassGeometry({ incidenceDeg, headingDeg, look });
}

export function readGeometries(args: Args): PassGeometry[] {
  const specs = args.strings('geometry');
  if (specs.length === 0) throw new UsageError('give at least one --geometry INCIDENCE,HEADING[,LOOK]');
  return specs.map(parseGeometrySpec);
}

/** "LAT,LON" in degrees. */
export function parseLatLon(label: string, s: string): { latDeg: number; lonDeg: number } {
  const parts = s.split(',');
  if (parts.length !== 2) throw new UsageError(`${label} must be LAT,LON in degrees, e.g. 52.1,-3.4; got "${s}"`);
  return { latDeg: parseNumber(`${label} latitude`, parts[0]), lonDeg: parseNumber(`${label} longitude`, parts[1]) };
}

/** JSON-safe number: ±Infinity/NaN become null (JSON cannot hold them). */
export const jsonNumber = (x: number): number | null => (Number.isFinite(x) ? x : null);

/** "A,B,C": three numbers, e.g. an ECEF position or an ENU offset. */
export function parseTriple(label: string, s: string, example: string): [number, number, number] {
  const parts = s.split(',');
  if (parts.length !== 3) throw new UsageError(`${label} must be three numbers separated by commas, e.g. ${example}; got "${s}"`);
  return [parseNumber(`${label} [1]`, parts[0]), parseNumber(`${label} [2]`, parts[1]), parseNumber(`${label} [3]`, parts[2])];
}
