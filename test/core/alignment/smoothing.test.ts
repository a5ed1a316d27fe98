import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  MIN_STEADY_SAMPLES,
  SteadinessTracker,
  captureAverage,
  circularMeanDeg,
  circularStdDeg,
  linearMean,
  linearStd,
  type OrientationSample,
} from '../../../src/core/alignment/smoothing.ts';
import { noise } from '../../helpers/random.ts';

const TOL_DEG = 1e-9; // closed-form cases: rounding only
const angleDiffDeg = (a: number, b: number) => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

describe('circular statistics (Mardia & Jupp, Directional Statistics, 2000, §2.2–2.3)', () => {
  it('averages across north: 359° and 1° → 0°; 350°, 10°, 0° → 0°', () => {
    expect(angleDiffDeg(circularMeanDeg([359, 1]), 0)).toBeLessThan(TOL_DEG);
    expect(angleDiffDeg(circularMeanDeg([350, 10, 0]), 0)).toBeLessThan(TOL_DEG);
    expect(circularMeanDeg([90])).toBeCloseTo(90, 12);
    expect(circularMeanDeg([-90])).toBeCloseTo(270, 12);
  });

  it('circular std of ±a is √(−2 ln cos a) (R̄ = cos a)', () => {
    const a = 3;
    expect(circularStdDeg([-a, a])).toBeCloseTo((Math.sqrt(-2 * Math.log(Math.cos((a * Math.PI) / 180))) * 180) / Math.PI, 10);
    expect(circularStdDeg([42, 42, 42])).toBeCloseTo(0, 6);
    expect(circularStdDeg([0, 180])).toBe(Infinity);
  });

  it('mean turns with the data: mean(θ + k) = mean(θ) + k (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -40, max: 40, noNaN: true }), { minLength: 1, maxLength: 30 }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        (vals, k) => {
          const m0 = circularMeanDeg(vals);
          const m1 = circularMeanDeg(vals.map((v) => v + k));
          expect(angleDiffDeg(m1, m0 + k)).toBeLessThan(1e-7);
        },
      ),
    );
  });

  it('for tightly grouped values the circular and linear statistics agree', () => {
    const rnd = noise(7);
    const vals = Array.from({ length: 500 }, () => 123 + 0.5 * rnd());
    expect(Math.abs(circularMeanDeg(vals) - linearMean(vals))).toBeLessThan(1e-4);
    expect(Math.abs(circularStdDeg(vals) - linearStd(vals))).toBeLessThan(1e-4);
  });

  it('linear mean and std (divisor n)', () => {
    expect(linearMean([1, 2, 3, 4])).toBe(2.5);
    expect(linearStd([1, 2, 3, 4])).toBeCloseTo(Math.sqrt(1.25), 14);
    expect(linearStd([5])).toBe(0);
  });

  it('rejects empty lists, non-finite values and cancelling directions', () => {
    expect(() => circularMeanDeg([])).toThrow(/empty/);
    expect(() => circularMeanDeg([1, NaN])).toThrow(/valuesDeg\[1\]/);
    expect(() => circularMeanDeg([0, 180])).toThrow(/no mean direction/);
    expect(() => linearMean([])).toThrow(RangeError);
    expect(() => linearStd([Infinity])).toThrow(/values\[0\]/);
  });
});

describe('captureAverage', () => {
  it('averages azimuth and roll circularly, tilt linearly, skipping missing azimuths', () => {
    const s: OrientationSample[] = [
      { timeMs: 0, azimuthDeg: 358, tiltDeg: 10, rollDeg: 179 },
      { timeMs: 1, azimuthDeg: null, tiltDeg: 11, rollDeg: -179 },
      { timeMs: 2, azimuthDeg: 2, tiltDeg: 12, rollDeg: 180 },
    ];
    const c = captureAverage(s);
    expect(angleDiffDeg(c.azimuthDeg!, 0)).toBeLessThan(TOL_DEG);
    expect(c.tiltDeg).toBeCloseTo(11, 12);
    expect(angleDiffDeg(c.rollDeg, 180)).toBeLessThan(TOL_DEG);
    expect(c.rollDeg).toBeGreaterThan(-180);
    expect(c.sampleCount).toBe(3);
    expect(c.azimuthSampleCount).toBe(2);
    expect(c.tiltStdDeg).toBeCloseTo(Math.sqrt(2 / 3), 12);
  });

  it('no compass at all → azimuth and its std are null', () => {
    const c = captureAverage([{ timeMs: 0, azimuthDeg: null, tiltDeg: 5, rollDeg: 0 }]);
    expect(c.azimuthDeg).toBeNull();
    expect(c.azimuthStdDeg).toBeNull();
  });

  it('rejects an empty capture', () => {
    expect(() => captureAverage([])).toThrow(/samples must hold at least one/);
  });
});

describe('SteadinessTracker', () => {
  const steadySample = (timeMs: number, rnd: () => number): OrientationSample => ({
    timeMs,
    azimuthDeg: 359.9 + 0.2 * rnd(),
    tiltDeg: 12 + 0.05 * rnd(),
    rollDeg: 0.05 * rnd(),
  });

  it('reports steady only once the readings have stayed quiet for the whole window', () => {
    const t = new SteadinessTracker({ windowS: 3 });
    const rnd = noise(1);
    for (let ms = 0; ms < 2900; ms += 20) t.push(steadySample(ms, rnd));
    expect(t.status().steady).toBe(false); // 2.88 s < 3 s
    for (let ms = 2900; ms <= 3200; ms += 20) t.push(steadySample(ms, rnd));
    const st = t.status();
    expect(st.steady).toBe(true);
    expect(st.spanS).toBeGreaterThanOrEqual(3);
    expect(st.std.tiltDeg).toBeLessThan(0.05);
  });

  it('a jolt makes it unsteady until a full quiet window has passed again', () => {
    const t = new SteadinessTracker({ windowS: 2 });
    const rnd = noise(2);
    let ms = 0;
    for (; ms < 3000; ms += 20) t.push(steadySample(ms, rnd));
    expect(t.status().steady).toBe(true);
    t.push({ timeMs: ms, azimuthDeg: 5, tiltDeg: 14, rollDeg: 1 });
    expect(t.status().steady).toBe(false);
    for (ms += 20; ms < 4900; ms += 20) t.push(steadySample(ms, rnd));
    expect(t.status().steady).toBe(false);
    for (; ms < 5200; ms += 20) t.push(steadySample(ms, rnd));
    expect(t.status().steady).toBe(true);
  });

  it('judges tilt and roll alone when there is no compass', () => {
    const t = new SteadinessTracker({ windowS: 1 });
    for (let ms = 0; ms <= 1500; ms += 50) t.push({ timeMs: ms, azimuthDeg: null, tiltDeg: 8, rollDeg: -1 });
    const st = t.status();
    expect(st.steady).toBe(true);
    expect(st.std.azimuthDeg).toBeNull();
  });

  it('memory stays bounded over hours of readings at a high rate, and a full window still fits', () => {
    const t = new SteadinessTracker({ windowS: 3, capacity: 64 });
    const rnd = noise(3);
    for (let ms = 0; ms < 3 * 3600 * 1000; ms += 5) {
      t.push(steadySample(ms, rnd));
      if (ms % 600_000 === 0) expect(t.samples().length).toBeLessThanOrEqual(64);
    }
    const st = t.status();
    expect(st.sampleCount).toBeLessThanOrEqual(64);
    expect(st.sampleCount).toBeGreaterThanOrEqual(MIN_STEADY_SAMPLES);
    expect(st.steady).toBe(true);
  });

  it('restarts when the clock steps back or the readings stop for longer than the window', () => {
    const t = new SteadinessTracker({ windowS: 1 });
    for (let ms = 0; ms <= 1200; ms += 50) t.push({ timeMs: ms, azimuthDeg: 10, tiltDeg: 0, rollDeg: 0 });
    expect(t.status().steady).toBe(true);
    t.push({ timeMs: 500, azimuthDeg: 10, tiltDeg: 0, rollDeg: 0 });
    expect(t.status().sampleCount).toBe(1);
    t.push({ timeMs: 60_000, azimuthDeg: 10, tiltDeg: 0, rollDeg: 0 });
    expect(t.status()).toMatchObject({ steady: false, sampleCount: 1, spanS: 0 });
  });

  it('never throws on readings whose directions cancel: just not steady', () => {
    const t = new SteadinessTracker({ windowS: 1 });
    for (let ms = 0; ms <= 1500; ms += 50) t.push({ timeMs: ms, azimuthDeg: (ms / 50) % 2 ? 0 : 180, tiltDeg: 0, rollDeg: (ms / 50) % 2 ? 0 : 180 });
    const st = t.status();
    expect(st.steady).toBe(false);
    expect(st.std.rollDeg).toBeGreaterThan(90);
    // An exactly cancelling capture has no mean roll: captureAverage says so rather than inventing one.
    expect(() => captureAverage([{ timeMs: 0, azimuthDeg: 1, tiltDeg: 0, rollDeg: 0 }, { timeMs: 1, azimuthDeg: 1, tiltDeg: 0, rollDeg: 180 }])).toThrow(
      /no mean direction/,
    );
  });

  it('needs a few samples: two readings a window apart are not "steady"', () => {
    const t = new SteadinessTracker({ windowS: 1 });
    t.push({ timeMs: 0, azimuthDeg: 10, tiltDeg: 0, rollDeg: 0 });
    t.push({ timeMs: 1000, azimuthDeg: 10, tiltDeg: 0, rollDeg: 0 });
    expect(t.status().steady).toBe(false);
  });

  it('rejects bad options and non-finite readings', () => {
    expect(() => new SteadinessTracker({ windowS: 0 })).toThrow(/windowS must be greater than 0/);
    expect(() => new SteadinessTracker({ capacity: 2 })).toThrow(/capacity must be in \[8, 100000\]/);
    expect(() => new SteadinessTracker({ capacity: 10.5 })).toThrow(/whole number/);
    const t = new SteadinessTracker();
    expect(() => t.push({ timeMs: 0, azimuthDeg: NaN, tiltDeg: 0, rollDeg: 0 })).toThrow(/azimuthDeg/);
    expect(() => t.push({ timeMs: NaN, azimuthDeg: 0, tiltDeg: 0, rollDeg: 0 })).toThrow(/timeMs/);
  });
});
