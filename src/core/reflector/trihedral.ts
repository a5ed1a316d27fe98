/**
 * Trihedral corner reflector: description, peak radar cross section and the effective-aperture ratio A/a².
 *
 * Physical-optics model of the triple-bounce return (the only one that comes straight back for every direction
 * inside the corner). A ray entering the open side is reflected once by each of the three mutually perpendicular
 * panels and leaves antiparallel to its arrival, its crossing point with the plane normal to the line of sight
 * reflected through the projected apex. The effective aperture A is therefore the overlap of the projected
 * aperture P and its point reflection −P, and σ = 4π A² / λ² (aperture form of the RCS: Skolnik, "Introduction to
 * Radar Systems", McGraw-Hill, radar-cross-section chapter, edition and section from memory; Robertson 1947,
 * BSTJ 26:852–869, for the corner).
 *
 * Direction cosines c = (c₁, c₂, c₃) of the unit vector from the reflector toward the radar are taken against the
 * edges e₁, e₂, e₃ of CONVENTIONS.md ("Reflector frame"); `edgeCosinesFromBody` in ../geometry/orientation.ts
 * computes them. Lengths in metres; a = inner edge length (the edge shared by two panels).
 * Validity (all functions): optical region (a ≫ λ; see `checkOpticalRegion`), flat perfectly conducting panels,
 * exact 90° corners; single- and double-bounce terms and edge diffraction are left out.
 */
import { err, ok, type Result } from '../result.ts';
import { requireFinite, requireOneOf, requirePositive } from '../validate.ts';
import { squareOverlapAreaRatio } from './aperture.ts';

export type TrihedralShape = 'triangular' | 'square';
export const TRIHEDRAL_SHAPES: readonly TrihedralShape[] = ['triangular', 'square'];

export interface Reflector {
  shape: TrihedralShape;
  /** Inner edge length a, m (> 0). */
  edgeM: number;
  /** Radar wavelength λ, m (> 0). */
  wavelengthM: number;
}

/** Throws a RangeError naming the parameter, the value and the allowed range; returns `r` unchanged. */
export function validateReflector(r: Reflector): Reflector {
  requireOneOf('shape', r.shape, TRIHEDRAL_SHAPES);
  requirePositive('edgeM', r.edgeM, 'm');
  requirePositive('wavelengthM', r.wavelengthM, 'm');
  return r;
}

/**
 * A/a² on boresight, c = (1, 1, 1)/√3: triangular 1/√3 (the regular-hexagon overlap of the projected equilateral
 * aperture and its reflection, 2/3 of the triangle's area (√3/2) a²); square √3 (the whole regular hexagon that
 * the cube corner projects to, side a√(2/3)). Both follow from the peak formulas below through σ = 4π A²/λ².
 */
export function peakAreaRatio(shape: TrihedralShape): number {
  requireOneOf('shape', shape, TRIHEDRAL_SHAPES);
  return shape === 'triangular' ? 1 / Math.sqrt(3) : Math.sqrt(3);
}

/**
 * Peak (boresight) monostatic RCS, m²:
 *   triangular panels σ = 4π a⁴ / (3 λ²);  square panels σ = 12π a⁴ / λ².
 * Sources: Robertson, "Targets for Microwave Radar Navigation", Bell System Technical Journal 26:852–869, 1947;
 *   Ruck, Barrick, Stuart & Krichbaum, "Radar Cross Section Handbook", Plenum 1970, corner-reflector chapter;
 *   Knott, Shaeffer & Tuley, "Radar Cross Section", 2nd ed., Artech House 1993, table of simple shapes
 *   (chapter and table numbers from memory, not checked).
 * Check: a = 1 m, λ = 1 m, triangular → 4π/3 = 4.188790 m². Validity: as the file header.
 */
export function peakRcsM2(r: Reflector): number {
  validateReflector(r);
  const k = (Math.PI * r.edgeM ** 4) / r.wavelengthM ** 2;
  return r.shape === 'triangular' ? (4 * k) / 3 : 12 * k;
}

/** Edge lengths below this many wavelengths are outside the optical region the formulas assume. */
export const OPTICAL_REGION_MIN_EDGE_WAVELENGTHS = 10;

export interface BelowOpticalRegion {
  kind: 'below-optical-region';
  edgeM: number;
  wavelengthM: number;
  /** a / λ, below OPTICAL_REGION_MIN_EDGE_WAVELENGTHS. */
  edgeWavelengths: number;
  message: string;
}

/**
 * Whether a ≥ 10 λ, our own margin for the physical-optics formulas (the sources assume a ≫ λ; the margin is
 * common practice, no source). Not an error: the numbers are still returned, the caller shows a warning.
 */
export function checkOpticalRegion(r: Reflector): Result<Reflector, BelowOpticalRegion> {
  validateReflector(r);
  const edgeWavelengths = r.edgeM / r.wavelengthM;
  if (edgeWavelengths >= OPTICAL_REGION_MIN_EDGE_WAVELENGTHS) return ok(r);
  return err({
    kind: 'below-optical-region',
    edgeM: r.edgeM,
    wavelengthM: r.wavelengthM,
    edgeWavelengths,
    message:
      `edge ${r.edgeM} m is only ${edgeWavelengths.toFixed(2)} wavelengths (λ = ${r.wavelengthM} m); ` +
      `the optical-region RCS formulas assume at least ${OPTICAL_REGION_MIN_EDGE_WAVELENGTHS} λ and overestimate below that`,
  });
}

const UNIT_NORM_TOL = 1e-6;
/** Cosines at or below this count as zero: a direction on a face (e.g. azimuth offset 45°) comes out of the
 * degree-to-radian conversion with a cosine of ±1e-16 instead of 0. */
const FACE_COSINE_TOL = 1e-12;

/**
 * Effective aperture over the squared edge, A/a², for direction cosines c against the edges e₁, e₂, e₃.
 * Triangular panels (closed form): sort c₁ ≤ c₂ ≤ c₃, s = c₁ + c₂ + c₃;
 *   A/a² = 4 c₁ c₂ / s if c₁ + c₂ ≤ c₃, else s − 2/s  (both equal 2 c₁ c₂ / c₃ on the boundary).
 *   Source: Doerry, "Reflectors for SAR Performance Testing", Sandia National Laboratories report, 2nd ed.
 *   (report number from memory: SAND2014-0882); Brock & Doerry, SAND2009-2993, 2009; derivation in
 *   Robertson 1947 and Bonkowski, Lubitz & Schensted, 1953.
 * Square panels: the exact overlap of the projected hexagon and its point reflection (./aperture.ts).
 * Any non-positive cosine (line of sight outside the corner's octant, or on a face: ≤ 1e-12) gives 0.
 * Throws a RangeError when a cosine is not finite or the three are not those of a unit vector (|Σc² − 1| > 1e-6).
 */
export function effectiveAreaRatio(shape: TrihedralShape, cosines: readonly [number, number, number]): number {
  requireOneOf('shape', shape, TRIHEDRAL_SHAPES);
  const [a, b, c] = cosines;
  requireFinite('cosines[0]', a);
  requireFinite('cosines[1]', b);
  requireFinite('cosines[2]', c);
  const n2 = a * a + b * b + c * c;
  if (Math.abs(n2 - 1) > UNIT_NORM_TOL) {
    throw new RangeError(`cosines must be the direction cosines of a unit vector (sum of squares 1 ± ${UNIT_NORM_TOL}), got sum ${n2}`);
  }
  if (!(a > FACE_COSINE_TOL && b > FACE_COSINE_TOL && c > FACE_COSINE_TOL)) return 0;
  const ratio = shape === 'triangular' ? triangularAreaRatio(a, b, c) : squareOverlapAreaRatio(a, b, c);
  // Rounding can put the boresight value one ulp above its maximum; the pattern never exceeds its peak.
  return Math.min(ratio, peakAreaRatio(shape));
}

function triangularAreaRatio(a: number, b: number, c: number): number {
  // Sort ascending without allocating: the hot loop of the planner calls this per sample.
  let c1 = a, c2 = b, c3 = c, t: number;
  if (c1 > c2) { t = c1; c1 = c2; c2 = t; }
  if (c2 > c3) { t = c2; c2 = c3; c3 = t; }
  if (c1 > c2) { t = c1; c1 = c2; c2 = t; }
  const s = c1 + c2 + c3;
  return c1 + c2 <= c3 ? (4 * c1 * c2) / s : s - 2 / s;
}
