/**
 * Ground clutter of one resolution cell, signal-to-clutter ratio (SCR), and the interferometric precision it allows.
 * SCR-based precision is a lower bound: atmosphere, orbit errors and motion of the monument add to it.
 */
import { SPEED_OF_LIGHT_M_PER_S, fromDb, toDb, toRad } from '../units.ts';
import { requireFinite, requireIncidenceDeg, requireInRange, requirePositive } from '../validate.ts';
import type { TrihedralShapeName } from './shapes.ts';
import { requireShape } from './shapes.ts';

/**
 * Slant-range resolution of a linear-FM chirp of bandwidth B: δr = c / (2B).
 * Source: Curlander & McDonough, "Synthetic Aperture Radar: Systems and Signal Processing", Wiley 1991, eq. 3.2.7
 * (unweighted; window weighting widens it by ~1.2, which the crew can type as a resolution directly).
 */
export function slantRangeResolutionM(bandwidthHz: number): number {
  requirePositive('bandwidth', bandwidthHz, 'Hz');
  return SPEED_OF_LIGHT_M_PER_S / (2 * bandwidthHz);
}

/** Ground-range resolution: δr_ground = δr_slant / sin θᵢ (Curlander & McDonough 1991, eq. 1.2.6). */
export function groundRangeResolutionM(slantRangeResolutionM: number, incidenceDeg: number): number {
  requirePositive('rangeResolution', slantRangeResolutionM, 'm');
  requireIncidenceDeg('incidenceDeg', incidenceDeg);
  return slantRangeResolutionM / Math.sin(toRad(incidenceDeg));
}

/**
 * Ground-projected resolution-cell area A = δr_slant · δaz / sin θᵢ, m²: the ground-range resolution
 * (Curlander & McDonough 1991, eq. 1.2.6) times the azimuth resolution; the cell used for SCR in
 * Garthwaite 2017, Remote Sensing 9(7):648, §2 (section from memory).
 */
export function resolutionCellAreaM2(slantRangeResolutionM: number, azimuthResolutionM: number, incidenceDeg: number): number {
  requirePositive('azimuthResolution', azimuthResolutionM, 'm');
  return groundRangeResolutionM(slantRangeResolutionM, incidenceDeg) * azimuthResolutionM;
}

/** Clutter RCS of one cell: σ_c = σ⁰ · A, with σ⁰ in dB (m²/m²) (definition of σ⁰ as RCS per unit ground area:
 * Ulaby, Moore & Fung, "Microwave Remote Sensing", Vol. II, 1982, §7-1 — chapter from memory). */
export function clutterRcsM2(clutterDb: number, cellAreaM2: number): number {
  requireFinite('clutterDb', clutterDb);
  requirePositive('cellArea', cellAreaM2, 'm²');
  return fromDb(clutterDb) * cellAreaM2;
}

/** SCR = σ_reflector / (σ⁰ · A), in dB (Garthwaite 2017, Remote Sensing 9(7):648, eq. 3 — equation number from memory). */
export function scrDb(rcsDbsm: number, clutterDb: number, cellAreaM2: number): number {
  requireFinite('rcsDbsm', rcsDbsm);
  return rcsDbsm - toDb(clutterRcsM2(clutterDb, cellAreaM2));
}

/**
 * Phase standard deviation of a point target in clutter, SCR ≫ 1: σ_φ ≈ 1/√(2·SCR) rad (SCR linear).
 * Source: Adam, Kampes & Eineder 2004 (from memory, via Garthwaite 2017, "On the Design of Radar Corner
 * Reflectors for Deformation Monitoring in Multi-Frequency InSAR", Remote Sensing 9(7):648, eq. 4,
 * doi:10.3390/rs9070648). Validity: SCR above about 10 dB; below that the approximation is optimistic.
 */
export function phaseStdRad(scrDbValue: number): number {
  requireFinite('scrDb', scrDbValue);
  return 1 / Math.sqrt(2 * fromDb(scrDbValue));
}

/** Line-of-sight displacement precision σ_d = λ/(4π) · σ_φ, in mm (Garthwaite 2017, eq. 5). */
export function losPrecisionMm(phaseStd: number, wavelengthM: number): number {
  requireInRange('phaseStdRad', phaseStd, { min: 0, max: Math.PI, unit: 'rad' });
  requirePositive('wavelength', wavelengthM, 'm');
  return ((wavelengthM / (4 * Math.PI)) * phaseStd) * 1000;
}

/**
 * Inner edge length for a target SCR, inverting the peak formulas σ = k·4π a⁴/λ² (k = 1/3 triangular, 3 square):
 *   a = (λ² · SCR · σ⁰ · A / (4π k))^(1/4)   (REFERENCES.md §2, from Robertson 1947's peak formula).
 */
export function edgeForScrM(shape: TrihedralShapeName, wavelengthM: number, targetScrDb: number, clutterDb: number, cellAreaM2: number): number {
  requireShape(shape);
  requirePositive('wavelength', wavelengthM, 'm');
  requireFinite('scrDb', targetScrDb);
  const sigmaNeededM2 = fromDb(targetScrDb) * clutterRcsM2(clutterDb, cellAreaM2);
  const k = shape === 'triangular' ? 1 / 3 : 3;
  return ((wavelengthM ** 2 * sigmaNeededM2) / (4 * Math.PI * k)) ** 0.25;
}
