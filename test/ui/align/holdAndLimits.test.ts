import { describe, expect, it } from 'vitest';
import { TOLERANCE_PRESETS } from '../../../src/core/alignment/guidance.ts';
import { lowSunWarning, LOW_SUN_ELEVATION_DEG } from '../../../src/ui/pages/align/azimuthLayouts.ts';
import { AUTO_CAPTURE_HOLD_MS, AutoCaptureGate, toleranceLimitsText } from '../../../src/ui/pages/align/computeAlign.ts';

describe('capture by a steady hold', () => {
  it('fires once after the hold time without a break, and counts down before', () => {
    const g = new AutoCaptureGate();
    expect(g.update(true, 0)).toEqual({ capture: false, holdLeftMs: AUTO_CAPTURE_HOLD_MS });
    expect(g.update(true, 1000)).toEqual({ capture: false, holdLeftMs: AUTO_CAPTURE_HOLD_MS - 1000 });
    expect(g.update(true, AUTO_CAPTURE_HOLD_MS).capture).toBe(true);
    // Still holding: no second capture.
    expect(g.update(true, AUTO_CAPTURE_HOLD_MS + 5000).capture).toBe(false);
  });

  it('starts the hold again after a break (leaving tolerance or losing steadiness)', () => {
    const g = new AutoCaptureGate();
    g.update(true, 0);
    g.update(true, AUTO_CAPTURE_HOLD_MS - 100);
    expect(g.update(false, AUTO_CAPTURE_HOLD_MS - 50)).toEqual({ capture: false, holdLeftMs: null });
    expect(g.update(true, AUTO_CAPTURE_HOLD_MS).capture).toBe(false);
    expect(g.update(true, 2 * AUTO_CAPTURE_HOLD_MS - 1).capture).toBe(false);
    expect(g.update(true, 2 * AUTO_CAPTURE_HOLD_MS).capture).toBe(true);
    // After a capture and a break, a new hold captures again.
    g.update(false, 3 * AUTO_CAPTURE_HOLD_MS);
    g.update(true, 4 * AUTO_CAPTURE_HOLD_MS);
    expect(g.update(true, 5 * AUTO_CAPTURE_HOLD_MS).capture).toBe(true);
  });
});

describe('tolerance limits in degrees', () => {
  it('words each preset with its three limits', () => {
    // The presets' values, written out here: calibration 0.5/0.5/1°, monitoring 2/1/2°.
    expect(toleranceLimitsText(TOLERANCE_PRESETS.calibration)).toBe('±0.5° azimuth, ±0.5° tilt, ±1° roll');
    expect(toleranceLimitsText(TOLERANCE_PRESETS.monitoring)).toBe('±2° azimuth, ±1° tilt, ±2° roll');
    expect(toleranceLimitsText({ azimuthDeg: 0.25, tiltDeg: 0.125, rollDeg: 3 })).toBe('±0.25° azimuth, ±0.13° tilt, ±3° roll');
  });
});

describe('sun-shadow at a low sun', () => {
  it('warns below the threshold, with the elevation and the shadow length, and points to another method', () => {
    expect(LOW_SUN_ELEVATION_DEG).toBe(10);
    const w = lowSunWarning(4.2);
    expect(w).toMatch(/4\.2° above the horizon/);
    // Shadow length ratio 1 / tan 4.2° = 13.6 (independent: cot 4.2° = cos/sin = 0.99731 / 0.07324).
    expect(w).toMatch(/about 14 times/);
    expect(w).toMatch(/reference bearing/);
    expect(lowSunWarning(9.99)).not.toBeNull();
    expect(lowSunWarning(10)).toBeNull();
    expect(lowSunWarning(35)).toBeNull();
  });
});
