import { describe, expect, it } from 'vitest';
import { findPasses } from '../../../src/core/orbit/passes.ts';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';
import { nextPassOver, siteNextPasses } from '../../../src/ui/pages/logbook/nextPass.ts';

const SITE = { latDeg: 52.5538, lonDeg: 0.3714, heightEllM: 45 }; // invented demo site MF-02
const NOW_MS = Date.UTC(2026, 11, 2, 6);
const POS = { latDeg: SITE.latDeg, lonDeg: SITE.lonDeg, heightM: SITE.heightEllM };
const A = parseTle(DEMO_TLE).sets[0];
const B = parseTle(DEMO_TLE_B).sets[0];

describe('next pass over a logbook site', () => {
  it('is the earliest pass of any stored satellite after now', () => {
    const sets = [A, B];
    const p = nextPassOver(sets, SITE, NOW_MS);
    const each = sets.map((s) => findPasses(s, POS, { startMs: NOW_MS, days: 14 }).passes[0].timeMs);
    expect(p?.timeMs).toBe(Math.min(...each));
    expect(p!.timeMs).toBeGreaterThanOrEqual(NOW_MS);
  });
  it('is null with no element sets', () => {
    expect(nextPassOver([], SITE, NOW_MS)).toBeNull();
  });
});

describe('the next pass that matters', () => {
  // The two tracks of GLINT-A over the site, found by an independent search over the whole default range.
  const all = findPasses(A, POS, { startMs: NOW_MS, days: 14 }).passes;
  const asc = all.find((p) => p.direction === 'ascending')!;
  const desc = all.find((p) => p.direction === 'descending')!;
  const reflectors = [
    { id: 'rd', label: 'MF-02-D', deletedAtMs: null },
    { id: 'ra', label: 'MF-02-A', deletedAtMs: null },
  ];
  const geometries = [
    { reflectorId: 'rd', incidenceDeg: desc.incidenceDeg, direction: 'descending' as const, satellite: A.name, look: desc.look, deletedAtMs: null },
    { reflectorId: 'ra', incidenceDeg: asc.incidenceDeg, direction: 'ascending' as const, satellite: A.name, look: asc.look, deletedAtMs: null },
  ];

  it('gives each served track its own next pass, marked with its reflector', () => {
    const r = siteNextPasses([{ ...A, demo: true }], { ...SITE, demo: true }, geometries, reflectors, NOW_MS);
    expect(r.failures).toEqual([]);
    const byLabel = Object.fromEntries(r.served.map((s) => [s.reflectorLabel, s.pass]));
    expect(byLabel['MF-02-D']?.direction).toBe('descending');
    expect(byLabel['MF-02-D']?.timeMs).toBeCloseTo(desc.timeMs, -3);
    expect(byLabel['MF-02-A']?.direction).toBe('ascending');
    expect(byLabel['MF-02-A']?.timeMs).toBeCloseTo(asc.timeMs, -3);
  });

  it('never lets the invented demo satellite serve a real site', () => {
    const r = siteNextPasses([{ ...A, demo: true }], { ...SITE, demo: false }, geometries, reflectors, NOW_MS);
    expect(r.usable).toBe(0);
    expect(r.demoSkipped).toBe(1);
    expect(r.served.every((s) => s.pass === null)).toBe(true);
  });

  it('names the set that failed and what failed, and still uses the others', () => {
    const broken = { ...B, demo: true, line1: 'not an element line', line2: 'not an element line' };
    const r = siteNextPasses([broken, { ...A, demo: true }], { ...SITE, demo: true }, [], reflectors, NOW_MS);
    expect(r.any?.timeMs).toBe(Math.min(asc.timeMs, desc.timeMs));
    expect(r.failures.length).toBe(1);
    expect(r.failures[0]).toMatch(/^GLINT-B: SGP4 could not read/);
  });
});
