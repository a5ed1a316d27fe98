import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { elevationGridFromGeoTiff } from '../../../src/cli/dem.ts';
import { azimuthList, horizonFromGrid } from '../../../src/core/horizon/rayMarch.ts';
import { utmForward, utmInverse } from '../../../src/core/horizon/utm.ts';
import { closedFormDeg, geographicScene, R_M, utmScene } from './scenes.ts';

/** The tolerance for horizon angles against the closed form. */
const HORIZON_TOL_DEG = 0.1;
const H0_M = 2;

describe('UTM (Snyder 1987, USGS PP 1395, eqs. 8-9 to 8-25) against PROJ cs2cs 9.1.1', () => {
  const text = readFileSync(new URL('../../fixtures/horizon/proj-utm.txt', import.meta.url), 'utf8');
  const blocks = text.split('## ').filter(Boolean).map((b) => b.trim().split('\n').slice(1).map((l) => l.trim().split(/\s+/).map(Number)));
  const cases: [number, boolean, [number, number][], number[][]][] = [
    [31, false, [[3, 45], [3, 45.0718], [4.5, 52], [0.2, 40], [6, 60], [2, 0.5]], blocks[0]],
    [19, true, [[-70, -33], [-72.5, -10], [-68, -45]], blocks[1]],
  ];
  it('forward within 1 mm, inverse back within 1e-8°', () => {
    for (const [zone, south, pts, want] of cases)
      pts.forEach(([lon, lat], i) => {
        const p = utmForward(lat, lon, { zone, south });
        expect(Math.abs(p.eastingM - want[i][0])).toBeLessThan(1e-3);
        expect(Math.abs(p.northingM - want[i][1])).toBeLessThan(1e-3);
        const g = utmInverse(want[i][0], want[i][1], { zone, south });
        expect(Math.abs(g.latDeg - lat)).toBeLessThan(1e-8);
        expect(Math.abs(g.lonDeg - lon)).toBeLessThan(1e-8);
      });
  });
  it('refuses a point far outside its zone', () => {
    expect(() => utmForward(45, 20, { zone: 31, south: false })).toThrow(/central meridian/);
  });
});

describe('horizon by ray marching: synthetic grids with closed-form answers', () => {
  it('UTM grid: ridge to the north at several azimuths, wall to the south, horizon dip to the east', async () => {
    const s = utmScene();
    const grid = await elevationGridFromGeoTiff(s.tiff, 'utm.tif');
    expect(grid.crs).toEqual({ kind: 'utm', zone: 31, south: false });
    const at = (az: number) => horizonFromGrid(grid, { latDeg: 45, lonDeg: 3, heightM: H0_M, azimuthFromDeg: az, azimuthToDeg: az, azimuthStepDeg: 1, maxDistanceM: 12_000 })[0];
    for (const az of [0, 20, 340, 30]) {
      const d = s.ridgeM / Math.cos((az * Math.PI) / 180);
      const got = at(az);
      expect(Math.abs((got.elevationDeg as number) - closedFormDeg(80, H0_M, d))).toBeLessThan(HORIZON_TOL_DEG);
      expect(Math.abs((got.distanceM as number) - d)).toBeLessThan(30);
    }
    for (const az of [180, 160, 200]) {
      const d = s.wallM / Math.cos(((az - 180) * Math.PI) / 180);
      const got = at(az);
      expect(Math.abs((got.elevationDeg as number) - closedFormDeg(40, H0_M, d))).toBeLessThan(HORIZON_TOL_DEG);
      expect(Math.abs((got.distanceM as number) - d)).toBeLessThan(30);
    }
    // Due east the ground is flat to the grid's edge (6 km > √(2R·2 m) = 5.05 km): the dip of the horizon.
    expect(Math.abs((at(90).elevationDeg as number) - -(Math.sqrt((2 * H0_M) / R_M) * 180) / Math.PI)).toBeLessThan(0.005);
  });

  it('geographic grid: a wall at constant latitude, due north and 30° off', async () => {
    const s = geographicScene();
    const grid = await elevationGridFromGeoTiff(s.tiff, 'geo.tif');
    const p = horizonFromGrid(grid, { latDeg: 45, lonDeg: 3, heightM: H0_M, azimuthFromDeg: 330, azimuthToDeg: 30, azimuthStepDeg: 30 });
    expect(p.map((x) => x.azimuthDeg)).toEqual([330, 0, 30]);
    for (const x of p) {
      const d = s.wallM / Math.cos((x.azimuthDeg * Math.PI) / 180);
      expect(Math.abs((x.elevationDeg as number) - closedFormDeg(60, H0_M, d))).toBeLessThan(HORIZON_TOL_DEG);
    }
  });

  it('no-data cells are skipped, not taken as obstacles or as sea level', async () => {
    const s = geographicScene(-9999);
    const grid = await elevationGridFromGeoTiff(s.tiff, 'geo.tif');
    expect(grid.noDataValue).toBe(-9999);
    const [north] = horizonFromGrid(grid, { latDeg: 45, lonDeg: 3, heightM: H0_M, azimuthFromDeg: 0, azimuthToDeg: 0 });
    expect(Math.abs((north.elevationDeg as number) - closedFormDeg(60, H0_M, s.wallM))).toBeLessThan(HORIZON_TOL_DEG);
  });

  it('refuses an observer outside the grid', async () => {
    const grid = await elevationGridFromGeoTiff(geographicScene().tiff, 'geo.tif');
    expect(() => horizonFromGrid(grid, { latDeg: 46, lonDeg: 3, heightM: 0 })).toThrow(/outside the elevation grid/);
  });

  it('azimuth lists wrap through north and do not repeat a full circle', () => {
    expect(azimuthList(350, 10, 5)).toEqual([350, 355, 0, 5, 10]);
    expect(azimuthList(0, 360, 90)).toEqual([0, 90, 180, 270]);
  });
});
