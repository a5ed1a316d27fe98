import { describe, expect, it } from 'vitest';
import { findPasses } from '../../../src/core/orbit/passes.ts';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';
import { nextPassOver } from '../../../src/ui/pages/logbook/nextPass.ts';

const SITE = { latDeg: 52.5538, lonDeg: 0.3714, heightEllM: 45 }; // invented demo site MF-02
const NOW_MS = Date.UTC(2026, 11, 2, 6);

describe('next pass over a logbook site', () => {
  it('is the earliest pass of any stored satellite after now', () => {
    const sets = [...parseTle(DEMO_TLE).sets, ...parseTle(DEMO_TLE_B).sets];
    const p = nextPassOver(sets, SITE, NOW_MS);
    const each = sets.map((s) => findPasses(s, { latDeg: SITE.latDeg, lonDeg: SITE.lonDeg, heightM: SITE.heightEllM }, { startMs: NOW_MS, days: 14 }).passes[0].timeMs);
    expect(p?.timeMs).toBe(Math.min(...each));
    expect(p!.timeMs).toBeGreaterThanOrEqual(NOW_MS);
  });
  it('is null with no element sets', () => {
    expect(nextPassOver([], SITE, NOW_MS)).toBeNull();
  });
});
