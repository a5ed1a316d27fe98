import { describe, expect, it } from 'vitest';
import { angleExample, parseMethodTolerance, parseTolerance, tiltBiasText, toleranceText } from '../../../src/ui/pages/settings/preferencesView.ts';

describe('preferences view', () => {
  it('shows the values of each tolerance preset', () => {
    const custom = { azimuthDeg: 1, tiltDeg: 0.25, rollDeg: 3 };
    // Preset values: src/core/alignment/guidance.ts TOLERANCE_PRESETS (common practice, no source).
    expect(toleranceText({ tolerancePreset: 'calibration', customToleranceDeg: custom })).toBe('azimuth ±0.50°, tilt ±0.50°, roll ±1.00°');
    expect(toleranceText({ tolerancePreset: 'monitoring', customToleranceDeg: custom })).toBe('azimuth ±2.00°, tilt ±1.00°, roll ±2.00°');
    expect(toleranceText({ tolerancePreset: 'custom', customToleranceDeg: custom })).toBe('azimuth ±1.00°, tilt ±0.25°, roll ±3.00°');
  });

  it('checks typed tolerances and names the range', () => {
    expect(parseTolerance('Azimuth tolerance', '0,5')).toEqual({ value: 0.5 });
    expect(parseTolerance('Azimuth tolerance', '25').error).toMatch(/Azimuth tolerance.*25/);
    expect(parseTolerance('Azimuth tolerance', '').error).toBe('Azimuth tolerance is empty');
    expect(parseMethodTolerance('Disagreement', '3')).toEqual({ value: 3 });
    expect(parseMethodTolerance('Disagreement', '0').error).toMatch(/Disagreement/);
    expect(parseMethodTolerance('Disagreement', 'abc').error).toBe('Disagreement must be a number, got "abc"');
  });

  it('tilt bias: not measured, measured with its time, signed', () => {
    expect(tiltBiasText({ tiltBiasDeg: 0, tiltBiasMeasuredAtMs: null })).toBe('Not measured: no tilt bias is applied.');
    expect(tiltBiasText({ tiltBiasDeg: 0.123, tiltBiasMeasuredAtMs: Date.UTC(2027, 6, 2, 6, 30) })).toBe('+0.12°, measured 2027-07-02 06:30 UTC; subtracted from every tilt reading.');
    expect(tiltBiasText({ tiltBiasDeg: -0.4, tiltBiasMeasuredAtMs: null })).toBe('-0.40° (time of measurement unknown).');
  });

  it('shows an example angle in each format', () => {
    expect(angleExample('decimal')).toBe('52.4123°');
    expect(angleExample('dm')).toBe('52° 24.740′');
  });
});
