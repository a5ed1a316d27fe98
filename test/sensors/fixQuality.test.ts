import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assessFix, GOOD_ACCURACY_M, POOR_ACCURACY_M, STALE_AFTER_S } from '../../src/sensors/fixQuality.ts';
import type { Fix } from '../../src/sensors/types.ts';

const T0_MS = 1_750_000_000_000;
const fix = (acc: number, timeMs = T0_MS): Fix => ({ latDeg: 50, lonDeg: 5, heightEllM: 100, horizontalAccuracyM: acc, timeMs });

describe('assessFix (thresholds: common practice, no source)', () => {
  it('grades by horizontal accuracy at the 5 m and 100 m boundaries', () => {
    expect(assessFix(fix(GOOD_ACCURACY_M), T0_MS).level).toBe('good');
    expect(assessFix(fix(5.01), T0_MS).level).toBe('fair');
    expect(assessFix(fix(99.9), T0_MS).level).toBe('fair');
    expect(assessFix(fix(POOR_ACCURACY_M), T0_MS).level).toBe('poor');
    expect(assessFix(fix(Infinity), T0_MS).level).toBe('poor');
    expect(assessFix(fix(NaN), T0_MS).level).toBe('poor');
  });

  it('warns about a fix older than 30 s and never calls it good', () => {
    const a = assessFix(fix(3), T0_MS + (STALE_AFTER_S + 1) * 1000);
    expect(a.stale).toBe(true);
    expect(a.level).toBe('fair');
    expect(a.ageS).toBe(STALE_AFTER_S + 1);
    expect(a.message).toMatch(/31 s old/);
    expect(assessFix(fix(3), T0_MS + STALE_AFTER_S * 1000).stale).toBe(false);
  });

  it('level never improves as accuracy gets worse (property)', () => {
    const rank = { good: 0, fair: 1, poor: 2 } as const;
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e4, noNaN: true }), fc.double({ min: 0, max: 1e4, noNaN: true }), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        return rank[assessFix(fix(lo), T0_MS).level] <= rank[assessFix(fix(hi), T0_MS).level];
      }),
    );
  });
});
