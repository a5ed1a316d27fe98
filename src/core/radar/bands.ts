/**
 * Radar bands and wavelength.  λ = c / f  (c exact, SI 2019).
 * Band letters and limits: IEEE Std 521-2019, "IEEE Standard Letter Designations for Radar-Frequency Bands", Table 1.
 * The centre frequencies below are our own representative choices inside each IEEE band, close to where
 * spaceborne SAR operates (common practice, no source); a crew that knows its sensor's exact frequency should type it.
 */
import { SPEED_OF_LIGHT_M_PER_S } from '../units.ts';
import { requireOneOf, requirePositive } from '../validate.ts';

export type BandName = 'L' | 'S' | 'C' | 'X' | 'Ku';

export interface BandPreset {
  name: BandName;
  /** IEEE Std 521-2019 band limits, GHz. */
  minGhz: number;
  maxGhz: number;
  /** Representative centre frequency used by the preset, GHz. */
  centreGhz: number;
}

export const BAND_PRESETS: readonly BandPreset[] = [
  { name: 'L', minGhz: 1, maxGhz: 2, centreGhz: 1.27 },
  { name: 'S', minGhz: 2, maxGhz: 4, centreGhz: 3.2 },
  { name: 'C', minGhz: 4, maxGhz: 8, centreGhz: 5.405 },
  { name: 'X', minGhz: 8, maxGhz: 12, centreGhz: 9.65 },
  { name: 'Ku', minGhz: 12, maxGhz: 18, centreGhz: 13.5 },
];

export const BAND_NAMES: readonly BandName[] = BAND_PRESETS.map((b) => b.name);

/** Wavelength in metres for a frequency in Hz: λ = c / f. */
export function wavelengthFromFrequencyM(freqHz: number): number {
  requirePositive('frequency', freqHz, 'Hz');
  return SPEED_OF_LIGHT_M_PER_S / freqHz;
}

/** The preset for a band letter (case-insensitive: "c", "C", "ku", "KU"). */
export function bandPreset(name: string): BandPreset {
  const canonical = BAND_NAMES.find((n) => n.toLowerCase() === String(name).toLowerCase()) ?? name;
  const n = requireOneOf('band', canonical, BAND_NAMES);
  return BAND_PRESETS.find((b) => b.name === n)!;
}

/** Wavelength of a band preset's centre frequency, m. */
export const bandWavelengthM = (name: string): number => wavelengthFromFrequencyM(bandPreset(name).centreGhz * 1e9);
