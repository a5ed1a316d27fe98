import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { circularAltitudeM, circularHeadingsDeg, circularOrbitGeometry, circularPeriodMin } from '../../../src/core/orbit/circular.ts';
import { findPasses } from '../../../src/core/orbit/passes.ts';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { wrapSignedDeg } from '../../../src/core/units.ts';
import { DEMO_REPEAT_DAYS, DEMO_TLE } from '../../../src/demo/elements.ts';

const TOL_CHECK_DEG = 1e-4; // the check values are printed to 4 decimals
const TOL_ROUND_TRIP_M = 1e-6;

describe('circular orbit headings', () => {
  it('reproduces the check value (REFERENCES.md §3, derived from Vallado\'s formulas): i = 98.18°, P = 98.7429 min, φ = 45°', () => {
    const h = circularHeadingsDeg(98.18, 45, 98.7429);
    expect(Math.abs(wrapSignedDeg(h.ascendingDeg - -14.3086))).toBeLessThan(TOL_CHECK_DEG);
    expect(Math.abs(h.ascendingDeg - 345.6914)).toBeLessThan(TOL_CHECK_DEG);
    expect(Math.abs(h.descendingDeg - 194.3086)).toBeLessThan(TOL_CHECK_DEG);
  });

  it('the period-based variant of circularOrbitGeometry tends to the check value as the incidence goes to 0', () => {
    // With the site under the track (γ → 0) the site-horizontal heading is the ground-track heading at φ = 45°.
    const g = circularOrbitGeometry({ periodMin: 98.7429, inclinationDeg: 98.18, latDeg: 45, incidenceDeg: 1e-6, look: 'right' });
    expect(Math.abs(g.ascending.headingDeg - 345.6914)).toBeLessThan(TOL_CHECK_DEG);
    expect(Math.abs(g.descending.headingDeg - 194.3086)).toBeLessThan(TOL_CHECK_DEG);
    expect(Math.abs(g.ascending.groundTrackHeadingDeg - 345.6914)).toBeLessThan(TOL_CHECK_DEG);
    expect(g.approximate).toBe(true);
    expect(g.note).toMatch(/circular orbit/);
  });

  it('at real incidences: ground-track heading at the sub-satellite latitude, site heading turned by meridian convergence', () => {
    const g = circularOrbitGeometry({ periodMin: 98.7429, inclinationDeg: 98.18, latDeg: 45, incidenceDeg: 40, look: 'right' });
    for (const [b, asc] of [[g.ascending, true], [g.descending, false]] as const) {
      const h = circularHeadingsDeg(98.18, b.subSatelliteLatDeg, 98.7429);
      expect(Math.abs(b.groundTrackHeadingDeg - (asc ? h.ascendingDeg : h.descendingDeg))).toBeLessThan(1e-9);
      // Right-looking on a sphere: the reflector faces exactly heading − 90° (heading on the site's horizontal).
      expect(Math.abs(wrapSignedDeg(b.reflectorAzimuthDeg - (b.headingDeg - 90)))).toBeLessThan(1e-9);
      // The sub-satellite point is west of a right-looking ascending pass' site, east of a descending one's; the
      // site heading is turned by a few degrees (convergence of meridians).
      const turnDeg = wrapSignedDeg(b.headingDeg - b.groundTrackHeadingDeg);
      expect(Math.abs(turnDeg)).toBeGreaterThan(2);
      expect(Math.abs(turnDeg)).toBeLessThan(6);
    }
  });

  it('ascending and descending are mirror images about east–west (the Earth-rotation term is common)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 180, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), (incDeg, frac) => {
        const reach = incDeg <= 90 ? incDeg : 180 - incDeg;
        const latDeg = frac * reach * 0.999;
        const h = circularHeadingsDeg(incDeg, latDeg, 98.7);
        expect(Math.abs(wrapSignedDeg(h.ascendingDeg + h.descendingDeg - 180))).toBeLessThan(1e-9);
      }),
    );
  });

  it('refuses latitudes the orbit does not reach', () => {
    expect(() => circularHeadingsDeg(98.18, 82, 98.7)).toThrow(/latDeg must be within ±81\.82/);
    expect(() => circularHeadingsDeg(45, -50, 98.7)).toThrow(/within ±45°/);
    expect(() => circularHeadingsDeg(90, 90, 98.7)).toThrow(RangeError);
  });
});

describe('circularOrbitGeometry', () => {
  it('altitude ↔ period round trip (Kepler III)', () => {
    fc.assert(
      fc.property(fc.double({ min: 200_000, max: 40_000_000, noNaN: true }), (hM) => {
        expect(Math.abs(circularAltitudeM(circularPeriodMin(hM)) - hM)).toBeLessThan(TOL_ROUND_TRIP_M * Math.max(1, hM / 1e6));
      }),
    );
    // Worked by hand: a = ∛(μ T²/4π²) with T = 5924.574 s → 7076.70 km, minus 6378.137 km → 698.56 km.
    expect(circularAltitudeM(98.7429) / 1000).toBeCloseTo(698.56, 2);
  });

  it('incidence and look angle are converted consistently', () => {
    const a = circularOrbitGeometry({ altitudeM: 693_000, inclinationDeg: 98.18, latDeg: 45, lookDeg: 30, look: 'left' });
    // Check value (REFERENCES.md §3, derived): R = 6371.0088 km, H = 693 km, look 30° → incidence 33.6685°, 815.282 km.
    expect(a.ascending.incidenceDeg).toBeCloseTo(33.6685, 4);
    expect(a.ascending.slantRangeM / 1000).toBeCloseTo(815.282, 3);
    const b = circularOrbitGeometry({ altitudeM: 693_000, inclinationDeg: 98.18, latDeg: 45, incidenceDeg: a.ascending.incidenceDeg, look: 'left' });
    expect(b.descending.lookDeg).toBeCloseTo(30, 9);
    expect(Math.abs(wrapSignedDeg(b.ascending.reflectorAzimuthDeg - (b.ascending.headingDeg + 90)))).toBeLessThan(1e-9);
    expect(Math.abs(wrapSignedDeg(b.descending.reflectorAzimuthDeg - (b.descending.headingDeg + 90)))).toBeLessThan(1e-9);
  });

  it('asks for exactly one of altitude/period and incidence/look', () => {
    const base = { inclinationDeg: 98, latDeg: 10, look: 'right' as const };
    expect(() => circularOrbitGeometry({ ...base, incidenceDeg: 30 })).toThrow(/exactly one of altitudeM and periodMin/);
    expect(() => circularOrbitGeometry({ ...base, altitudeM: 7e5, periodMin: 98, incidenceDeg: 30 })).toThrow(/altitudeM and periodMin/);
    expect(() => circularOrbitGeometry({ ...base, altitudeM: 7e5 })).toThrow(/exactly one of incidenceDeg and lookDeg/);
    expect(() => circularOrbitGeometry({ ...base, altitudeM: -1, incidenceDeg: 30 })).toThrow(/altitudeM must be greater than 0/);
    expect(() => circularOrbitGeometry({ ...base, periodMin: 60, incidenceDeg: 30 })).toThrow(/shorter than an orbit at the Earth's surface/);
    expect(() => circularOrbitGeometry({ ...base, altitudeM: 7e5, incidenceDeg: 30, look: 'up' as 'left' })).toThrow(/look must be one of/);
  });
});

describe('circular approximation against SGP4 passes of the demo satellite', () => {
  // Loose check (within 1°): the circular model ignores J2, eccentricity and the ellipsoid. Measured: headings
  // within 0.14°, reflector azimuth within 0.5° (the ellipsoid tilts the site horizontal against the sphere).
  // (Comparing the SGP4 site heading with the bare formula at the site's latitude would be off by the convergence
  // of meridians — up to 12° at 65° — which is why circularOrbitGeometry solves for the sub-satellite point.)
  const TOL_HEADING_DEG = 1;
  const demo = parseTle(DEMO_TLE).sets[0];
  const periodMin = (DEMO_REPEAT_DAYS * 1440) / 175; // nodal period of the 12-day, 175-revolution repeat
  it.each([
    { latDeg: 52.3, lonDeg: 5.1 },
    { latDeg: -3, lonDeg: -60 },
    { latDeg: -35, lonDeg: 140 },
    { latDeg: 65, lonDeg: -20 },
  ])('heading and reflector azimuth at lat $latDeg', ({ latDeg, lonDeg }) => {
    const r = findPasses(demo, { latDeg, lonDeg, heightM: 0 }, { startMs: Date.UTC(2026, 11, 1), days: 12 });
    expect(r.passes.length).toBeGreaterThan(0);
    for (const p of r.passes) {
      const g = circularOrbitGeometry({ periodMin, inclinationDeg: 98.1838, latDeg, incidenceDeg: p.incidenceDeg, look: 'right' });
      const c = p.direction === 'ascending' ? g.ascending : g.descending;
      expect(Math.abs(wrapSignedDeg(p.headingDeg - c.headingDeg))).toBeLessThan(TOL_HEADING_DEG);
      expect(Math.abs(wrapSignedDeg(p.groundTrackHeadingDeg - c.groundTrackHeadingDeg))).toBeLessThan(TOL_HEADING_DEG);
      expect(Math.abs(wrapSignedDeg(p.reflectorAzimuthDeg - c.reflectorAzimuthDeg))).toBeLessThan(TOL_HEADING_DEG);
    }
  });
});
