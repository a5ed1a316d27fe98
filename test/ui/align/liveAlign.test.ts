import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { deviceAnglesFromPlateOrientation } from '../../../src/core/alignment/deviceOrientation.ts';
import { DEFAULT_STEADINESS } from '../../../src/core/alignment/smoothing.ts';
import { HOLD_STEP_MS, LiveAlignment } from '../../../src/ui/pages/align/liveAlign.ts';
import type { OrientationReading } from '../../../src/sensors/index.ts';
import { noise } from '../../helpers/random.ts';

const TOL_DEG = 1e-6;
const SENSOR_PERIOD_MS = 16; // ~60 Hz, as phones send
/** Amplitude of the hand shake in the "not steady" case, degrees (well above the 0.2° tilt threshold). */
const SHAKE_DEG = 1;

const angleDiffDeg = (a: number, b: number) => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

/** A reading a phone on a plate with this (magnetic) orientation would send. */
function reading(o: { azimuthDeg: number; tiltDeg: number; rollDeg: number }, timeMs: number, absolute = true): OrientationReading {
  const a = deviceAnglesFromPlateOrientation(o);
  return { alphaDeg: a.alphaDeg, betaDeg: a.betaDeg, gammaDeg: a.gammaDeg, absolute, source: absolute ? 'deviceorientationabsolute' : 'relative', timeMs };
}

describe('LiveAlignment', () => {
  it('gives back the plate orientation the readings came from (sweep, independent of the UI)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 359.9, noNaN: true }), fc.double({ min: -60, max: 60, noNaN: true }), fc.double({ min: -60, max: 60, noNaN: true }), (az, tilt, roll) => {
        const live = new LiveAlignment();
        for (let t = 0; t < 1000; t += SENSOR_PERIOD_MS) live.push(reading({ azimuthDeg: az, tiltDeg: tilt, rollDeg: roll }, t));
        const m = live.snapshot(1000).measured!;
        return angleDiffDeg(m.azimuthMagDeg!, az) < TOL_DEG && Math.abs(m.tiltDeg - tilt) < TOL_DEG && Math.abs(m.rollDeg - roll) < TOL_DEG;
      }),
      { numRuns: 60 },
    );
  });

  it('averages azimuth across north as a circle (359.8° and 0.2° → 0°)', () => {
    const live = new LiveAlignment();
    for (let i = 0; i < 60; i++) live.push(reading({ azimuthDeg: i % 2 ? 359.8 : 0.2, tiltDeg: 10, rollDeg: 0 }, i * SENSOR_PERIOD_MS));
    const az = live.snapshot(60 * SENSOR_PERIOD_MS).measured!.azimuthMagDeg!;
    expect(angleDiffDeg(az, 0)).toBeLessThan(1e-3);
  });

  it('has no azimuth from relative readings, but keeps tilt and roll', () => {
    const live = new LiveAlignment();
    for (let t = 0; t < 500; t += SENSOR_PERIOD_MS) live.push(reading({ azimuthDeg: 40, tiltDeg: 12, rollDeg: -3 }, t, false));
    const s = live.snapshot(500);
    expect(s.absolute).toBe(false);
    expect(s.measured!.azimuthMagDeg).toBeNull();
    expect(s.measured!.tiltDeg).toBeCloseTo(12, 6);
  });

  it('says "cannot measure" while the phone stands near vertical, and forgets earlier values', () => {
    const live = new LiveAlignment();
    live.push(reading({ azimuthDeg: 10, tiltDeg: 10, rollDeg: 0 }, 0));
    live.push({ alphaDeg: 0, betaDeg: 85, gammaDeg: 0, absolute: true, source: 'deviceorientationabsolute', timeMs: 16 });
    const s = live.snapshot(20);
    expect(s.nearVertical).toMatch(/upright/);
    expect(s.measured).toBeNull();
  });

  it('holds the last reading through silence (events come only on change), so a still phone becomes steady', () => {
    const live = new LiveAlignment();
    live.push(reading({ azimuthDeg: 10, tiltDeg: 10, rollDeg: 0 }, 0));
    let s = live.snapshot(0);
    for (let t = 0; t <= 3500; t += HOLD_STEP_MS) s = live.snapshot(t);
    expect(s.measured!.tiltDeg).toBeCloseTo(10, 9);
    expect(s.steadiness.steady).toBe(true);
    expect(s.lastReadingAgeS).toBeCloseTo(3.5, 9);
    expect(s.readingCount).toBe(1);
  });

  it('becomes steady after 3 s of still readings, and not with a shaking phone', () => {
    const still = new LiveAlignment();
    const shaky = new LiveAlignment();
    const rnd = noise(7);
    for (let t = 0; t <= 3200; t += SENSOR_PERIOD_MS) {
      still.push(reading({ azimuthDeg: 100, tiltDeg: 15, rollDeg: 0 }, t));
      shaky.push(reading({ azimuthDeg: 100, tiltDeg: 15 + SHAKE_DEG * rnd(), rollDeg: 0 }, t));
    }
    expect(still.snapshot(3200).steadiness.steady).toBe(true);
    expect(shaky.snapshot(3200).steadiness.steady).toBe(false);
    expect(still.captureWindow()!.tiltDeg).toBeCloseTo(15, 6);
  });

  it('keeps memory bounded over hours of readings', () => {
    const live = new LiveAlignment();
    const HOURS_OF_READINGS = 2 * 3600 * (1000 / SENSOR_PERIOD_MS); // two hours at 60 Hz
    const r = reading({ azimuthDeg: 100, tiltDeg: 15, rollDeg: 0 }, 0);
    for (let i = 0; i < HOURS_OF_READINGS; i++) live.push({ ...r, timeMs: i * SENSOR_PERIOD_MS });
    expect(live.captureWindow()!.sampleCount).toBeLessThanOrEqual(DEFAULT_STEADINESS.capacity);
    expect(live.snapshot(HOURS_OF_READINGS * SENSOR_PERIOD_MS).readingCount).toBe(HOURS_OF_READINGS);
  });
});
