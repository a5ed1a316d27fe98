import { describe, expect, it } from 'vitest';
import { expectUsageError, runCli } from './run.ts';

describe('glintmark bearing', () => {
  it('prints { azimuthDeg, distanceM }: Wellington → Salamanca (GeographicLib example; Karney 2013 method)', async () => {
    const r = await runCli(['bearing', '--from', '-41.32,174.81', '--to', '40.96,-5.50', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, number>;
    expect(Object.keys(j).sort()).toEqual(['azimuthDeg', 'distanceM']);
    expect(Math.abs(j.azimuthDeg - 161.067669986)).toBeLessThan(1e-9);
    expect(Math.abs(j.distanceM - 19_959_679.267354)).toBeLessThan(1e-6);
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
