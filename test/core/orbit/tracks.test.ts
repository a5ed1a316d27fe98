import { describe, it, expect } from 'vitest';
import { findPasses, type Pass } from '../../../src/core/orbit/passes.ts';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { groupTracks } from '../../../src/core/orbit/tracks.ts';
import { DEMO_REPEAT_DAYS, DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';

const DAY_MS = 86_400_000;
const T0 = Date.UTC(2026, 11, 1);

/** A synthetic pass; only the fields grouping reads matter. */
function pass(dayOffset: number, incidenceDeg: number, headingDeg: number, extra: Partial<Pass> = {}): Pass {
  const timeMs = T0 + dayOffset * DAY_MS;
  return {
    timeMs,
    timeUtc: new Date(timeMs).toISOString(),
    direction: 'ascending',
    incidenceDeg,
    headingDeg,
    groundTrackHeadingDeg: headingDeg,
    look: 'right',
    reflectorAzimuthDeg: (headingDeg + 270) % 360,
    baseTiltDeg: 90 - incidenceDeg - 35.2643896828,
    slantRangeKm: 800,
    satellite: 'GLINT-A',
    catalogNumber: '99001',
    ...extra,
  };
}

describe('groupTracks on synthetic passes', () => {
  it('groups by geometry, averages circularly across north, and sorts by next time', () => {
    const tracks = groupTracks([
      pass(12.0, 30.2, 0.4),
      pass(0.0, 30.0, 359.8),
      pass(24.0, 30.1, 0.1),
      pass(-1.0, 40.0, 350),
      pass(11.0, 40.1, 350.2),
    ]);
    expect(tracks.map((t) => t.passTimesUtc.length)).toEqual([2, 3]);
    const [a, b] = tracks;
    expect(a.nextTimeUtc).toBe(new Date(T0 - DAY_MS).toISOString());
    expect(a.repeatDays).toBeCloseTo(12, 9);
    expect(b.incidenceDeg).toBeCloseTo(30.1, 9);
    expect(Math.min(b.headingDeg, 360 - b.headingDeg)).toBeLessThan(0.2); // circular mean of 359.8, 0.4, 0.1 ≈ 0.1
    expect(b.headingDeg).toBeGreaterThanOrEqual(0);
    expect(b.headingDeg).toBeLessThan(360);
    expect(b.repeatDays).toBeCloseTo(12, 9);
    expect(b.baseTiltDeg).toBeCloseTo(90 - 30.1 - 35.2643896828, 9);
    expect(b.passTimesUtc).toEqual([0, 12, 24].map((d) => new Date(T0 + d * DAY_MS).toISOString()));
  });

  it('keeps directions, look sides and satellites apart, and gives unique ids', () => {
    const tracks = groupTracks([
      pass(0, 30, 10),
      pass(1, 30, 10, { direction: 'descending' }),
      pass(2, 30, 10, { look: 'left' }),
      pass(3, 30, 10, { satellite: 'GLINT-B', catalogNumber: '99002' }),
      pass(4, 31.5, 10),
    ]);
    expect(tracks).toHaveLength(5);
    expect(new Set(tracks.map((t) => t.id)).size).toBe(5);
    expect(tracks[0].id).toBe('99001-asc-R-30.0');
    expect(tracks.every((t) => t.repeatDays === null)).toBe(true);
  });

  it('respects the tolerances', () => {
    const ps = [pass(0, 30, 10), pass(12, 30.8, 10.8)];
    expect(groupTracks(ps)).toHaveLength(1);
    expect(groupTracks(ps, { incidenceDeg: 0.5 })).toHaveLength(2);
    expect(groupTracks(ps, { headingDeg: 0.5 })).toHaveLength(2);
    expect(() => groupTracks(ps, { incidenceDeg: 0 })).toThrow(/tol.incidenceDeg must be greater than 0/);
  });

  it('medians the gaps, so one missed pass does not double the repeat', () => {
    const t = groupTracks([pass(0, 30, 10), pass(12, 30, 10), pass(36, 30, 10), pass(48, 30, 10)]);
    expect(t[0].repeatDays).toBe(12);
  });

  it('returns [] for no passes', () => {
    expect(groupTracks([])).toEqual([]);
  });
});

describe('groupTracks on the demo satellites', () => {
  const [a] = parseTle(DEMO_TLE).sets;
  const [b] = parseTle(DEMO_TLE_B).sets;
  const site = { latDeg: 52.3, lonDeg: 5.1, heightM: 10 }; // Marrowby Fen (invented)
  const window = { startMs: T0, days: 40 };

  it(`finds the ${DEMO_REPEAT_DAYS}-day repeat cycle of GLINT-A`, () => {
    const tracks = groupTracks(findPasses(a, site, window).passes);
    expect(tracks.length).toBeGreaterThanOrEqual(4);
    for (const t of tracks) {
      expect(t.passTimesUtc.length).toBeGreaterThanOrEqual(3);
      // Exact repeat up to SGP4 drag and J2 drift: the times shift by about a second per cycle.
      expect(Math.abs((t.repeatDays as number) - DEMO_REPEAT_DAYS)).toBeLessThan(1e-4);
    }
  });

  it('GLINT-B forms tracks of its own with the same repeat, all sorted by next pass', () => {
    const tracks = groupTracks([...findPasses(a, site, window).passes, ...findPasses(b, site, window).passes]);
    const sats = new Set(tracks.map((t) => t.satellite));
    expect(sats).toEqual(new Set(['GLINT-A', 'GLINT-B']));
    for (const t of tracks) expect(Math.abs((t.repeatDays as number) - DEMO_REPEAT_DAYS)).toBeLessThan(1e-4);
    const next = tracks.map((t) => Date.parse(t.nextTimeUtc));
    expect([...next].sort((x, y) => x - y)).toEqual(next);
  });
});
