import { describe, it, expect } from 'vitest';
import { ecfToLookAngles, eciToEcf, eciToGeodetic, geodeticToEcf, gstime, propagate, twoline2satrec } from 'satellite.js';
import { findPasses, type Pass } from '../../../src/core/orbit/passes.ts';
import { parseTle, type TleSet } from '../../../src/core/orbit/tle.ts';
import { tleEpochMs } from '../../../src/core/orbit/tleFields.ts';
import { wrapSignedDeg } from '../../../src/core/units.ts';
import { DEMO_TLE } from '../../../src/demo/elements.ts';

/**
 * Oracle: an independent brute-force search written here with satellite.js only (its propagate, gstime,
 * eciToEcf, geodeticToEcf and ecfToLookAngles; none of our geometry code). It scans the slant range every
 * 10 s for local minima, steps every 1 s around each, takes the smallest sample and refines it with a parabola
 * through the three samples of range² around it. Incidence = 90° − elevation and the reflector azimuth are
 * satellite.js's look angles at that instant; heading and direction come from finite differences of the
 * satellite.js Earth-fixed position and geodetic latitude.
 */
// Measured agreement: time < 0.1 ms, incidence < 1.1e-6°, reflector azimuth < 6e-4° (the oracle's Date has 1 ms
// steps and the azimuth turns ~0.8°/s), heading < 3e-5°. The plan asked for 0.5 s and 0.01°; we hold time to 10 ms.
const TOL_TIME_S = 0.01;
const TOL_ANGLE_DEG = 0.01;
/** Passes this close to an incidence bound may fall on either side of it in the two methods. */
const BOUNDARY_MARGIN_DEG = 0.02;
const INC_MIN_DEG = 20;
const INC_MAX_DEG = 46;
const DAYS = 4;
const START_MS = Date.UTC(2026, 11, 1);

const demo = parseTle(DEMO_TLE).sets[0];
const satrec = twoline2satrec(demo.line1, demo.line2);

// Invented places: Marrowby Fen (mid-latitude), Hollin Skerry (high Arctic), Tamsel Flats (near the equator).
const SITES = [
  { name: 'Marrowby Fen', latDeg: 52.3, lonDeg: 5.1, heightM: 10, startMs: START_MS },
  { name: 'Hollin Skerry', latDeg: 78.2, lonDeg: 15.6, heightM: 20, startMs: START_MS },
  // Near the equator the tracks are far apart: this window holds one ascending and one descending pass.
  { name: 'Tamsel Flats', latDeg: -3.0, lonDeg: -60.0, heightM: 50, startMs: START_MS + 5 * 86_400_000 },
];

const rad = (deg: number) => (deg * Math.PI) / 180;
const deg = (r: number) => (r * 180) / Math.PI;

function satEcfKm(tMs: number) {
  const d = new Date(Math.round(tMs));
  const pv = propagate(satrec, d);
  if (!pv) throw new Error('oracle propagation failed');
  return { ecf: eciToEcf(pv.position, gstime(d)), geo: eciToGeodetic(pv.position, gstime(d)) };
}

interface OraclePass {
  timeMs: number;
  incidenceDeg: number;
  reflectorAzimuthDeg: number;
  headingDeg: number;
  direction: 'ascending' | 'descending';
  right: boolean;
}

function bruteForce(site: (typeof SITES)[number]): OraclePass[] {
  const obs = { latitude: rad(site.latDeg), longitude: rad(site.lonDeg), height: site.heightM / 1000 };
  const s = geodeticToEcf(obs);
  const range2 = (tMs: number) => {
    const p = satEcfKm(tMs).ecf;
    return (p.x - s.x) ** 2 + (p.y - s.y) ** 2 + (p.z - s.z) ** 2;
  };
  const coarseMs = 10_000;
  const n = (DAYS * 86_400_000) / coarseMs;
  const r = Array.from({ length: n + 1 }, (_, k) => range2(site.startMs + k * coarseMs));
  const out: OraclePass[] = [];
  for (let k = 1; k < n; k++) {
    if (!(r[k] < r[k - 1] && r[k] <= r[k + 1])) continue;
    const t0 = site.startMs + k * coarseMs;
    let best = -12;
    const fine = new Map<number, number>();
    for (let j = -12; j <= 12; j++) {
      fine.set(j, range2(t0 + j * 1000));
      if ((fine.get(j) as number) < (fine.get(best) as number)) best = j;
    }
    const ym = range2(t0 + (best - 1) * 1000), y0 = range2(t0 + best * 1000), yp = range2(t0 + (best + 1) * 1000);
    const tMs = t0 + (best + (0.5 * (ym - yp)) / (ym - 2 * y0 + yp)) * 1000;
    const look = ecfToLookAngles(obs, satEcfKm(tMs).ecf);
    // Earth-fixed velocity and latitude rate by central differences over ±0.5 s.
    const a = satEcfKm(tMs - 500), b = satEcfKm(tMs + 500);
    const v = [b.ecf.x - a.ecf.x, b.ecf.y - a.ecf.y, b.ecf.z - a.ecf.z];
    const [sp, cp, sl, cl] = [Math.sin(obs.latitude), Math.cos(obs.latitude), Math.sin(obs.longitude), Math.cos(obs.longitude)];
    const vE = -sl * v[0] + cl * v[1];
    const vN = -sp * cl * v[0] - sp * sl * v[1] + cp * v[2];
    const headingDeg = (deg(Math.atan2(vE, vN)) + 360) % 360;
    const reflectorAzimuthDeg = deg(look.azimuth) % 360;
    out.push({
      timeMs: tMs,
      incidenceDeg: 90 - deg(look.elevation),
      reflectorAzimuthDeg,
      headingDeg,
      direction: b.geo.latitude > a.geo.latitude ? 'ascending' : 'descending',
      // A right-looking radar has the satellite 90° to the left of the heading, seen from the site.
      right: wrapSignedDeg(reflectorAzimuthDeg - headingDeg) < 0,
    });
  }
  return out;
}

const nearBound = (incDeg: number) => Math.abs(incDeg - INC_MIN_DEG) < BOUNDARY_MARGIN_DEG || Math.abs(incDeg - INC_MAX_DEG) < BOUNDARY_MARGIN_DEG;
const inWindowInterior = (startMs: number) => (tMs: number) => tMs > startMs + 60_000 && tMs < startMs + DAYS * 86_400_000 - 60_000;

describe.each(SITES)('findPasses against a 1-second brute-force search at $name', (site) => {
  const oracle = bruteForce(site).filter((p) => p.right && p.incidenceDeg >= INC_MIN_DEG && p.incidenceDeg <= INC_MAX_DEG);
  const found = findPasses(demo, site, { startMs: site.startMs, days: DAYS });
  const interior = inWindowInterior(site.startMs);

  it('finds the same passes (none missed by the prefilter, none extra)', () => {
    const a = oracle.filter((p) => !nearBound(p.incidenceDeg) && interior(p.timeMs)).map((p) => Math.round(p.timeMs / 60_000));
    const b = found.passes.filter((p) => !nearBound(p.incidenceDeg) && interior(p.timeMs)).map((p) => Math.round(p.timeMs / 60_000));
    expect(b).toEqual(a);
    expect(a.length).toBeGreaterThanOrEqual(2);
  });

  it(`agrees on time within ${TOL_TIME_S} s and on incidence, reflector azimuth and heading within ${TOL_ANGLE_DEG}°`, () => {
    for (const o of oracle) {
      const p = found.passes.find((q) => Math.abs(q.timeMs - o.timeMs) < 60_000) as Pass | undefined;
      if (!p) {
        expect(nearBound(o.incidenceDeg) || !interior(o.timeMs)).toBe(true);
        continue;
      }
      expect(Math.abs(p.timeMs - o.timeMs) / 1000).toBeLessThan(TOL_TIME_S);
      expect(Math.abs(p.incidenceDeg - o.incidenceDeg)).toBeLessThan(TOL_ANGLE_DEG);
      expect(Math.abs(wrapSignedDeg(p.reflectorAzimuthDeg - o.reflectorAzimuthDeg))).toBeLessThan(TOL_ANGLE_DEG);
      expect(Math.abs(wrapSignedDeg(p.headingDeg - o.headingDeg))).toBeLessThan(TOL_ANGLE_DEG);
      expect(p.direction).toBe(o.direction);
      expect(p.look).toBe('right');
    }
  });

  it('reports consistent derived fields', () => {
    for (const p of found.passes) {
      expect(p.timeUtc).toBe(new Date(Math.round(p.timeMs)).toISOString());
      expect(p.baseTiltDeg).toBeCloseTo(90 - p.incidenceDeg - 35.2643896828, 9);
      expect(p.satellite).toBe('GLINT-A');
      expect(p.catalogNumber).toBe('99001');
      // Zero Doppler: the line of sight is square to the velocity, so the reflector faces heading − 90° up to
      // the tilt of the satellite's horizontal against the site's (a few tenths of a degree).
      expect(Math.abs(wrapSignedDeg(p.reflectorAzimuthDeg - (p.headingDeg - 90)))).toBeLessThan(0.5);
    }
    expect(found.warnings).toEqual([]);
  });
});

describe('findPasses options and cost', () => {
  const site = SITES[0];

  it('left-looking finds passes with the site on the other side, facing heading + 90°', () => {
    const r = findPasses(demo, site, { startMs: START_MS, days: DAYS }, { look: 'left' });
    expect(r.passes.length).toBeGreaterThan(0);
    for (const p of r.passes) {
      expect(p.look).toBe('left');
      expect(Math.abs(wrapSignedDeg(p.reflectorAzimuthDeg - (p.headingDeg + 90)))).toBeLessThan(0.5);
    }
  });

  it('keeps only passes inside the incidence range', () => {
    const r = findPasses(demo, site, { startMs: START_MS, days: 24 }, { incidenceMinDeg: 30, incidenceMaxDeg: 35 });
    for (const p of r.passes) expect(p.incidenceDeg >= 30 && p.incidenceDeg <= 35).toBe(true);
  });

  it('uses at least 300× fewer SGP4 evaluations than 1-second stepping over 30 days', () => {
    const r = findPasses(demo, site, { startMs: START_MS, days: 30 });
    expect(r.propagations * 300).toBeLessThanOrEqual(30 * 86_400);
  });

  it('warns about stale elements', () => {
    const r = findPasses(demo, site, { startMs: START_MS + 60 * 86_400_000, days: 1 });
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatch(/^GLINT-A: elements are from 2026-11-28T12:00Z, 62\.5 days before/);
  });

  it('reports SGP4 failures as warnings, not throws', () => {
    // Vallado et al. 2006 verification sets (test/fixtures/orbit), cut to 69 characters: 33334 fails at
    // initialisation; 28872 decays about 50 minutes after its epoch.
    const fromVer = (l1: string, l2: string, name: string): TleSet => ({ name, catalogNumber: l1.slice(2, 7), line1: l1, line2: l2.slice(0, 69), epochMs: tleEpochMs(l1) });
    const bad = fromVer(
      '1 33334U 78066F   06174.85818871  .00000620  00000-0  10000-3 0  6809',
      '2 33334  68.4714 236.1303 5602877 123.7484 302.5767  0.00001000 67521      0.0      1440.0         1.00',
      'VER-33334',
    );
    const r1 = findPasses(bad, site, { startMs: bad.epochMs, days: 1 });
    expect(r1.passes).toEqual([]);
    expect(r1.warnings.join(' ')).toMatch(/VER-33334: perturbed eccentricity/);
    const decays = fromVer(
      '1 28872U 05037B   05333.02012661  .25992681  00000-0  24476-3 0  1534',
      '2 28872  96.4736 157.9986 0303955 244.0492 110.6523 16.46015938 10708      0.0        60.0          5.00',
      'VER-28872',
    );
    const r2 = findPasses(decays, site, { startMs: decays.epochMs, days: 1 });
    expect(r2.warnings.join(' ')).toMatch(/VER-28872: propagation stopped at 2005-11-29T0\d:\d\d:\d\d\.\d{3}Z: the satellite has decayed/);
  });

  it('rejects bad input with RangeErrors that name the parameter', () => {
    const w = { startMs: START_MS, days: 1 };
    expect(() => findPasses(demo, { ...site, latDeg: 95 }, w)).toThrow(/latDeg must be in \[-90, 90\]/);
    expect(() => findPasses(demo, { ...site, lonDeg: NaN }, w)).toThrow(/lonDeg/);
    expect(() => findPasses(demo, { ...site, heightM: 20_000 }, w)).toThrow(/heightM/);
    expect(() => findPasses(demo, site, { startMs: NaN, days: 1 })).toThrow(/window.startMs/);
    expect(() => findPasses(demo, site, { startMs: START_MS, days: 0 })).toThrow(/window.days must be in \(0, 366\]/);
    expect(() => findPasses(demo, site, { startMs: START_MS, days: 367 })).toThrow(/window.days/);
    expect(() => findPasses(demo, site, w, { incidenceMinDeg: 0 })).toThrow(/incidenceMinDeg must be in \(0, 90\)/);
    expect(() => findPasses(demo, site, w, { incidenceMaxDeg: 90 })).toThrow(/incidenceMaxDeg/);
    expect(() => findPasses(demo, site, w, { incidenceMinDeg: 40, incidenceMaxDeg: 30 })).toThrow(/must be less than incidenceMaxDeg/);
    expect(() => findPasses(demo, site, w, { look: 'up' as 'left' })).toThrow(/look must be one of right, left/);
  });
});
