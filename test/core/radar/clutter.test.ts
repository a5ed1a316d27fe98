import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bandPreset, bandWavelengthM, wavelengthFromFrequencyM } from '../../../src/core/radar/bands.ts';
import {
  edgeForScrM,
  losPrecisionMm,
  phaseStdRad,
  resolutionCellAreaM2,
  scrDb,
  slantRangeResolutionM,
} from '../../../src/core/radar/clutter.ts';
import { toDb } from '../../../src/core/units.ts';

describe('wavelength', () => {
  it('λ = c/f with c exact (SI Brochure, 9th ed., BIPM 2019)', () => {
    expect(wavelengthFromFrequencyM(299_792_458)).toBe(1);
    expect(wavelengthFromFrequencyM(5.405e9)).toBeCloseTo(0.0554658, 7);
  });
  it('band presets sit inside their IEEE Std 521-2019 limits', () => {
    for (const n of ['L', 'S', 'C', 'X', 'Ku']) {
      const b = bandPreset(n);
      expect(b.centreGhz).toBeGreaterThan(b.minGhz);
      expect(b.centreGhz).toBeLessThan(b.maxGhz);
    }
    expect(bandPreset('ku').name).toBe('Ku');
    expect(bandWavelengthM('C')).toBeCloseTo(0.05547, 5);
  });
  it('rejects unknown bands and non-positive frequencies', () => {
    expect(() => bandPreset('Q')).toThrow(/band must be one of L, S, C, X, Ku, got "Q"/);
    expect(() => wavelengthFromFrequencyM(0)).toThrow(/frequency must be greater than 0 Hz, got 0/);
    expect(() => wavelengthFromFrequencyM(Number.NaN)).toThrow(/frequency must be a finite number/);
  });
});

describe('resolution cell and SCR', () => {
  it('chirp resolution c/2B: 100 MHz → 1.49896 m (Curlander & McDonough 1991, eq. 3.2.7)', () => {
    expect(slantRangeResolutionM(100e6)).toBeCloseTo(1.498962, 6);
  });
  it('cell area = δr·δaz/sin θ: 3 m × 20 m at 30° → 120 m² (worked by hand)', () => {
    expect(resolutionCellAreaM2(3, 20, 30)).toBeCloseTo(120, 10);
  });
  it('SCR = RCS − σ⁰ − 10log A', () => {
    // 30 dBsm reflector, σ⁰ = −10 dB, A = 100 m² → clutter 10 dBsm → SCR 20 dB.
    expect(scrDb(30, -10, 100)).toBeCloseTo(20, 12);
  });
});

describe('precision from SCR', () => {
  // Garthwaite 2017, Remote Sensing 9(7):648, eq. 4 (σ_φ = 1/√(2 SCR)); check values [derived] in REFERENCES.md §2.
  it('20 dB → 0.07071 rad (approximation); 10 dB → 0.2236 rad', () => {
    expect(phaseStdRad(20)).toBeCloseTo(0.0707107, 6);
    expect(phaseStdRad(10)).toBeCloseTo(0.2236068, 6);
  });
  it('SCR 20 dB at λ = 5.5466 cm gives LOS precision 0.3121 mm (REFERENCES.md §2, derived check)', () => {
    // σ_d = λ/(4π)·σ_φ with σ_φ = 0.07071 rad from the approximation; the exact single-look σ_φ (0.07089 rad) would give 0.3129 mm.
    expect(losPrecisionMm(phaseStdRad(20), 0.055466)).toBeCloseTo(0.3121, 4);
  });
});

describe('edge for a target SCR', () => {
  it('inverts the peak formula (property, both shapes)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('triangular' as const, 'square' as const),
        fc.double({ min: 0.01, max: 0.3, noNaN: true }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: -25, max: 0, noNaN: true }),
        fc.double({ min: 1, max: 1000, noNaN: true }),
        (shape, lam, scr, s0, area) => {
          const a = edgeForScrM(shape, lam, scr, s0, area);
          const k = shape === 'triangular' ? 4 * Math.PI / 3 : 12 * Math.PI;
          const rcs = (k * a ** 4) / lam ** 2;
          expect(Math.abs(scrDb(toDb(rcs), s0, area) - scr)).toBeLessThan(1e-9);
        },
      ),
    );
  });
  it('rejects an unknown shape and bad areas', () => {
    expect(() => edgeForScrM('round' as never, 0.05, 20, -10, 100)).toThrow(/shape must be one of triangular, square/);
    expect(() => edgeForScrM('triangular', 0.05, 20, -10, 0)).toThrow(/cellArea must be greater than 0/);
  });
});
