import { describe, expect, it } from 'vitest';
import { aimForPass } from '../../../src/core/geometry/pointing.ts';
import { circularOrbitGeometry } from '../../../src/core/orbit/circular.ts';
import { computeCircular, geometryFromCircular, type CircularForm } from '../../../src/ui/pages/passes/circularForm.ts';

const TOL_DEG = 1e-9;
const FORM: CircularForm = { altitudeKm: '693', inclinationDeg: '98.18', latDeg: '45', angleKind: 'incidence', angleDeg: '37', look: 'right' };

describe('circular-orbit approximation panel', () => {
  it('passes the typed values to the core in metres and keeps the approximate mark', () => {
    const r = computeCircular(FORM);
    expect(r.error).toBeNull();
    const direct = circularOrbitGeometry({ altitudeM: 693_000, inclinationDeg: 98.18, latDeg: 45, incidenceDeg: 37, look: 'right' });
    expect(r.geometry?.ascending.headingDeg).toBeCloseTo(direct.ascending.headingDeg, 12);
    expect(r.geometry?.descending.headingDeg).toBeCloseTo(direct.descending.headingDeg, 12);
    expect(r.geometry?.approximate).toBe(true);
  });
  it('reads a look angle when the crew knows that instead', () => {
    const r = computeCircular({ ...FORM, angleKind: 'look', angleDeg: '30' });
    const direct = circularOrbitGeometry({ altitudeM: 693_000, inclinationDeg: 98.18, latDeg: 45, lookDeg: 30, look: 'right' });
    expect(r.geometry?.ascending.incidenceDeg).toBeCloseTo(direct.ascending.incidenceDeg, 12);
  });
  it('marks each bad field, and shows the model’s own refusal in words', () => {
    const r = computeCircular({ ...FORM, altitudeKm: '50', inclinationDeg: 'x', latDeg: '', angleDeg: '95' });
    expect(r.geometry).toBeNull();
    expect(r.errors.altitudeKm).toMatch(/Altitude must be in \[150, 2000\] km, got 50/);
    expect(r.errors.inclinationDeg).toMatch(/must be a number/);
    expect(r.errors.latDeg).toMatch(/empty/);
    expect(r.errors.angleDeg).toMatch(/Incidence must be in \(0, 90\)°/);
    const unreachable = computeCircular({ ...FORM, inclinationDeg: '45', latDeg: '60' });
    expect(unreachable.geometry).toBeNull();
    expect(unreachable.error).toMatch(/latDeg must be within ±45°/);
  });
  it('hands a geometry to the Plan screen labelled APPROXIMATE whose aim matches the approximation', () => {
    const geo = computeCircular(FORM).geometry!;
    for (const dir of ['ascending', 'descending'] as const) {
      const g = geometryFromCircular(geo, dir, 'right', 98.18);
      expect(g.source).toBe('circular-approximation');
      expect(g.direction).toBe(dir);
      expect(g.label).toMatch(/^APPROXIMATE circular orbit 693 km, 98.18° inclination/);
      const aim = aimForPass({ incidenceDeg: Number(g.incidenceDeg), headingDeg: Number(g.headingDeg), look: 'right' });
      // toFixed(2) on the heading: the aim moves by at most 0.005°.
      expect(Math.abs(aim.reflectorAzimuthDeg - geo[dir].reflectorAzimuthDeg)).toBeLessThanOrEqual(0.005 + TOL_DEG);
    }
  });
});
