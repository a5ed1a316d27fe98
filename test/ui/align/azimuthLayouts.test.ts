import { describe, expect, it } from 'vitest';
import { referenceLayoutView, sunLayoutView } from '../../../src/ui/pages/align/azimuthLayouts.ts';

const TOL_M = 1e-9;
/** An invented site ("Marrowby Fen"). */
const SITE = { latDeg: 52.61, lonDeg: 0.31, heightEllM: 45, label: 'site MF-1' };

describe('sunLayoutView', () => {
  it('lays out from the shadow at mid-morning and says when it was computed', () => {
    const t = Date.UTC(2026, 5, 15, 8, 0, 0);
    const r = sunLayoutView(SITE, t, 100, '10');
    expect(r.error).toBeNull();
    const v = r.view!;
    expect(v.computedAtMs).toBe(t);
    // The shadow points away from the sun; a June morning sun in the east-south-east (from memory: roughly 100–130°).
    expect(v.layout.shadowAzimuthDeg).toBeCloseTo((v.sunAzimuthDeg + 180) % 360, 9);
    expect(v.sunAzimuthDeg).toBeGreaterThan(90);
    expect(v.sunAzimuthDeg).toBeLessThan(140);
    expect(Math.hypot(v.layout.alongM, v.layout.offsetM)).toBeCloseTo(10, 9);
    expect(v.steps.join(' ')).toMatch(/shadow/);
  });

  it('refuses at night and without a position', () => {
    expect(sunLayoutView(SITE, Date.UTC(2026, 0, 15, 0, 0, 0), 100, '10').error).toMatch(/below the horizon/);
    expect(sunLayoutView(null, Date.UTC(2026, 5, 15, 8), 100, '10').error).toMatch(/position/);
    expect(sunLayoutView(SITE, Date.UTC(2026, 5, 15, 8), 100, '0.5').error).toMatch(/Baseline must be in \[1, 200\] m, got 0.5/);
  });
});

describe('referenceLayoutView', () => {
  it('turns from a reference due east toward a target 10° clockwise of it', () => {
    // A second point 0.01° of longitude east on the equator: the geodesic azimuth there is exactly 90°.
    const r = referenceLayoutView({ fromLat: '0', fromLon: '10', toLat: '0', toLon: '10.01' }, 100, '20');
    const v = r.view!;
    expect(v.bearingDeg).toBeCloseTo(90, 9);
    expect(v.layout.turnDeg).toBeCloseTo(10, 9);
    expect(v.layout.side).toBe('right');
    expect(Math.abs(v.layout.alongM - 20 * Math.cos((10 * Math.PI) / 180))).toBeLessThan(TOL_M);
    expect(Math.abs(v.layout.offsetM - 20 * Math.sin((10 * Math.PI) / 180))).toBeLessThan(TOL_M);
    expect(v.steps.join(' ')).toMatch(/RIGHT/);
  });

  it('warns when the reference point is close, and reports coincident points in place', () => {
    const near = referenceLayoutView({ fromLat: '52.61', fromLon: '0.31', toLat: '52.6101', toLon: '0.31' }, 100, '10');
    expect(near.view!.steps[0]).toMatch(/only 11\.\d m away/);
    const same = referenceLayoutView({ fromLat: '52.61', fromLon: '0.31', toLat: '52.61', toLon: '0.31' }, 100, '10');
    expect(same.view).toBeNull();
    expect(same.errors.points).toMatch(/at least 0.001 m apart/);
  });

  it('marks bad typed coordinates in place', () => {
    const r = referenceLayoutView({ fromLat: '95', fromLon: '0', toLat: '', toLon: 'x' }, 100, '10');
    expect(r.view).toBeNull();
    expect(r.errors.fromLat).toMatch(/Pivot latitude must be in \[-90, 90\]°, got 95/);
    expect(r.errors.toLat).toMatch(/empty/);
    expect(r.errors.toLon).toMatch(/must be a number/);
  });
});

describe('tape layouts in feet', () => {
  it('takes the baseline in feet and gives the tape offsets in feet (1 ft = 0.3048 m exactly)', () => {
    const m = referenceLayoutView({ fromLat: '0', fromLon: '10', toLat: '0', toLon: '10.01' }, 100, '10');
    const ft = referenceLayoutView({ fromLat: '0', fromLon: '10', toLat: '0', toLon: '10.01' }, 100, String(10 / 0.3048), 'ft');
    expect(ft.view?.layout.alongM).toBeCloseTo(m.view!.layout.alongM, 9);
    expect(ft.view?.steps.join(' ')).toContain(`${(Math.abs(m.view!.layout.offsetM) / 0.3048).toFixed(2)} ft`);
    expect(referenceLayoutView({ fromLat: '0', fromLon: '10', toLat: '0', toLon: '10.01' }, 100, '1', 'ft').errors.baseline).toMatch(/Baseline must be in \[3.3, 656.2\] ft, got 1/);
  });
});
