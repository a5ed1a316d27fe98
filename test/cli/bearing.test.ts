import { describe, expect, it } from 'vitest';
import vectors from '../fixtures/geodesy/geodesic_vectors.json';
import { expectUsageError, runCli } from './run.ts';

describe('glintmark bearing', () => {
  // Karney (2013), "Algorithms for geodesics", J. Geodesy 87:43-55: Table 2 (direct problem, solved here as the
  // inverse) and Table 4 (a nearly antipodal line), as copied in test/fixtures/geodesy/geodesic_vectors.json.
  // Tolerances follow the printed precision: Table 2's end point to 1e-11° (≈ 1 µm), Table 4 to 6 decimals / 10 µm.
  it('prints { azimuthDeg, distanceM } matching Karney (2013) Table 2: 10 000 km at 30° from 40° N', async () => {
    const t = vectors.karney_table2_direct;
    const r = await runCli(['bearing', '--from', `${t.lat1},${t.lon1}`, '--to', `${t.lat2},${t.lon2}`, '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, number>;
    expect(Object.keys(j).sort()).toEqual(['azimuthDeg', 'distanceM']);
    expect(Math.abs(j.azimuthDeg - t.azi1)).toBeLessThan(1e-8);
    expect(Math.abs(j.distanceM - t.s12_m)).toBeLessThan(1e-5);
  });

  it('matches Karney (2013) Table 4, a nearly antipodal line', async () => {
    const t = vectors.karney_table4_nearly_antipodal;
    const r = await runCli(['bearing', '--from', `${t.lat1},0`, '--to', `${t.lat2},${t.lon12}`, '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, number>;
    expect(Math.abs(j.azimuthDeg - t.azi1)).toBeLessThan(1e-6);
    expect(Math.abs(j.distanceM - t.s12_m)).toBeLessThan(1e-5);
  });

  it('prints a table with the back azimuth', async () => {
    const r = await runCli(['bearing', '--from', '52.61,0.27', '--to', '52.62,0.27']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/azimuth\s+0\.0000° true/);
    expect(r.stdout).toMatch(/back azimuth\s+180\.0000° true/);
  });

  it('bad input: missing, non-numeric, malformed pair, out of range, unknown option, coincident points', async () => {
    await expectUsageError(['bearing', '--from', '52,0'], /missing --to/);
    await expectUsageError(['bearing', '--from', '52,zero', '--to', '53,0'], /--from longitude must be a number/);
    await expectUsageError(['bearing', '--from', '52', '--to', '53,0'], /--from must be LAT,LON/);
    await expectUsageError(['bearing', '--from', '52,0', '--to', '93,0'], /--to latitude must be in \[-90, 90\]°/);
    await expectUsageError(['bearing', '--from', '52,0', '--to', '53,0', '--ellipsoid', 'GRS80'], /unknown option --ellipsoid/);
    await expectUsageError(['bearing', '--from', '52,0', '--to', '52,0'], /apart to define an azimuth/);
  });
});
