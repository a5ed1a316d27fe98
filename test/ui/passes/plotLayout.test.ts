import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { losFromAzEl } from '../../../src/core/geometry/pointing.ts';
import { beamwidth3dB } from '../../../src/core/reflector/beamwidth.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG, toDeg, wrapSignedDeg } from '../../../src/core/units.ts';
import { MS_PER_DAY } from '../../../src/ui/pages/passes/computePasses.ts';
import { beamOutline, boresightDirection, skyPoint, TIMELINE_LABEL_PX, timelineLayout, trackDirection, trianglePoints, type AzEl } from '../../../src/ui/pages/passes/plotLayout.ts';

const TOL_PX = 1e-9;
const TOL_DEG = 1e-6;
const FRAME = { cx: 100, cy: 100, radiusPx: 90 };

/** Angle between two directions, degrees (independent of the code under test: dot product of unit vectors). */
const angleBetweenDeg = (a: AzEl, b: AzEl) => {
  const u = losFromAzEl(a.azimuthDeg, a.elevationDeg), v = losFromAzEl(b.azimuthDeg, b.elevationDeg);
  return toDeg(Math.acos(Math.min(1, u[0] * v[0] + u[1] * v[1] + u[2] * v[2])));
};

describe('sky plot projection', () => {
  it('puts the zenith at the centre and north, east, south on the rim at top, right, bottom', () => {
    expect(skyPoint({ azimuthDeg: 123, elevationDeg: 90 }, FRAME)).toEqual({ x: 100, y: 100 });
    const n = skyPoint({ azimuthDeg: 0, elevationDeg: 0 }, FRAME);
    const e = skyPoint({ azimuthDeg: 90, elevationDeg: 0 }, FRAME);
    const s = skyPoint({ azimuthDeg: 180, elevationDeg: 0 }, FRAME);
    expect(n.x).toBeCloseTo(100, 9);
    expect(n.y).toBeCloseTo(10, 9);
    expect(e.x).toBeCloseTo(190, 9);
    expect(e.y).toBeCloseTo(100, 9);
    expect(s.y).toBeCloseTo(190, 9);
  });
  it('radius is proportional to zenith angle and the bearing is the azimuth, for every direction', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 359.999, noNaN: true }), fc.double({ min: 0, max: 90, noNaN: true }), (az, el) => {
        const p = skyPoint({ azimuthDeg: az, elevationDeg: el }, FRAME);
        const dx = p.x - FRAME.cx, dy = FRAME.cy - p.y;
        expect(Math.abs(Math.hypot(dx, dy) - (FRAME.radiusPx * (90 - el)) / 90)).toBeLessThanOrEqual(TOL_PX * 100);
        if (el < 89.999) expect(Math.abs(wrapSignedDeg(toDeg(Math.atan2(dx, dy)) - az))).toBeLessThanOrEqual(1e-6);
      }),
    );
  });
  it('places a track at its reflector azimuth and elevation 90° − incidence', () => {
    expect(trackDirection({ reflectorAzimuthDeg: 101.8, incidenceDeg: 29.3 })).toEqual({ azimuthDeg: 101.8, elevationDeg: 90 - 29.3 });
  });
});

describe('reflector beam on the sky plot', () => {
  it('boresight at roll 0 is the bisector azimuth, tilt + 35.26° (the brief’s formula)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 359.9, noNaN: true }), fc.double({ min: -30, max: 50, noNaN: true }), (az, tilt) => {
        const b = boresightDirection({ azimuthDeg: az, tiltDeg: tilt, rollDeg: 0 });
        expect(Math.abs(wrapSignedDeg(b.azimuthDeg - az))).toBeLessThanOrEqual(TOL_DEG);
        expect(Math.abs(b.elevationDeg - (tilt + TRIHEDRAL_BORESIGHT_ELEVATION_DEG))).toBeLessThanOrEqual(TOL_DEG);
      }),
    );
  });
  for (const shape of ['triangular', 'square'] as const) {
    it(`${shape}: the outline meets both −3 dB cuts and stays between the smallest and largest half-width`, () => {
      const bw = beamwidth3dB(shape);
      const half = [bw.elevationAboveDeg, bw.elevationBelowDeg, bw.azimuthFullDeg / 2];
      fc.assert(
        fc.property(fc.double({ min: 0, max: 359.9, noNaN: true }), fc.double({ min: -20, max: 20, noNaN: true }), fc.double({ min: -30, max: 30, noNaN: true }), (az, tilt, roll) => {
          const o = { azimuthDeg: az, tiltDeg: tilt, rollDeg: roll };
          const b = boresightDirection(o);
          const pts = beamOutline(o, bw, 8);
          expect(pts).toHaveLength(8);
          expect(angleBetweenDeg(pts[0], b)).toBeCloseTo(bw.elevationAboveDeg, 6);
          expect(angleBetweenDeg(pts[2], b)).toBeCloseTo(bw.azimuthFullDeg / 2, 6);
          expect(angleBetweenDeg(pts[4], b)).toBeCloseTo(bw.elevationBelowDeg, 6);
          for (const p of pts) {
            const a = angleBetweenDeg(p, b);
            expect(a).toBeGreaterThanOrEqual(Math.min(...half) - TOL_DEG);
            expect(a).toBeLessThanOrEqual(Math.max(...half) + TOL_DEG);
          }
        }),
        { numRuns: 50 },
      );
    });
  }
  it('at roll 0 the outline’s top and bottom lie in the bisector’s vertical plane; the right side is clockwise of it', () => {
    const bw = beamwidth3dB('triangular');
    const o = { azimuthDeg: 100, tiltDeg: 10, rollDeg: 0 };
    const pts = beamOutline(o, bw, 4);
    expect(pts[0].azimuthDeg).toBeCloseTo(100, 6);
    expect(pts[0].elevationDeg).toBeCloseTo(10 + TRIHEDRAL_BORESIGHT_ELEVATION_DEG + bw.elevationAboveDeg, 6);
    expect(pts[2].elevationDeg).toBeCloseTo(10 + TRIHEDRAL_BORESIGHT_ELEVATION_DEG - bw.elevationBelowDeg, 6);
    expect(wrapSignedDeg(pts[1].azimuthDeg - 100)).toBeGreaterThan(0);
    expect(wrapSignedDeg(pts[3].azimuthDeg - 100)).toBeLessThan(0);
  });
});

describe('timeline', () => {
  const start = Date.UTC(2026, 11, 1, 6);
  const pass = (dayOffset: number, direction: 'ascending' | 'descending') => ({ timeMs: start + dayOffset * MS_PER_DAY, direction, satellite: 'GLINT-A', incidenceDeg: 30 });
  it('spreads passes across the plot by time and separates directions by row, shape and letter', () => {
    const l = timelineLayout([pass(0, 'ascending'), pass(12, 'descending'), pass(23.999, 'ascending')], start, 24, { width: 360, height: 120 });
    expect(l.marks).toHaveLength(3);
    expect(l.marks[0].x).toBeCloseTo(l.plotLeft, 9);
    expect(l.marks[1].x).toBeCloseTo((l.plotLeft + l.plotRight) / 2, 9);
    expect(l.marks[0]).toMatchObject({ shape: 'up', letter: 'A', y: l.rows[0].y });
    expect(l.marks[1]).toMatchObject({ shape: 'down', letter: 'D', y: l.rows[1].y });
    expect(l.rows.map((r) => r.label)).toEqual(['Ascending ▲', 'Descending ▼']);
  });
  it('leaves out passes outside the window', () => {
    expect(timelineLayout([pass(-0.1, 'ascending'), pass(24, 'ascending')], start, 24).marks).toEqual([]);
  });
  it('ticks each UTC midnight and spaces the labels so they never collide', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 366 }), (days) => {
        const l = timelineLayout([], start, days);
        expect(l.ticks).toHaveLength(days);
        const xs = l.ticks.filter((t) => t.label).map((t) => t.x);
        expect(xs.length).toBeGreaterThan(0);
        for (let i = 1; i < xs.length; i++) expect(xs[i] - xs[i - 1]).toBeGreaterThanOrEqual(TIMELINE_LABEL_PX - 1e-9);
        for (const t of l.ticks) {
          expect(t.x).toBeGreaterThanOrEqual(l.plotLeft);
          expect(t.x).toBeLessThanOrEqual(l.plotRight);
        }
      }),
      { numRuns: 40 },
    );
    expect(timelineLayout([], start, 3).ticks.map((t) => t.label)).toEqual(['2 Dec', '3 Dec', '4 Dec']);
    expect(timelineLayout([], start, 24).ticks.filter((t) => t.label).map((t) => t.label)).toEqual(['2 Dec', '7 Dec', '12 Dec', '17 Dec', '22 Dec']);
  });
  it('draws triangles pointing the right way', () => {
    expect(trianglePoints(10, 10, 5, 'up')).toBe('10,5 5,15 15,15');
    expect(trianglePoints(10, 10, 5, 'down')).toBe('10,15 5,5 15,5');
  });
});
