import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { closedFormDeg, geographicScene } from '../core/horizon/scenes.ts';
import { GEOKEY, writeTiff } from '../core/horizon/tiffWriter.ts';
import { expectUsageError, runCli } from './run.ts';

const dir = mkdtempSync(join(tmpdir(), 'glintmark-horizon-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const file = (name: string, bytes: ArrayBuffer | string) => {
  const p = join(dir, name);
  writeFileSync(p, typeof bytes === 'string' ? bytes : Buffer.from(bytes));
  return p;
};
const scene = geographicScene();
const geoTif = file('geo.tif', scene.tiff);
const small = (geoKeys: [number, number][], extra: object = {}) =>
  writeTiff({ width: 2, height: 2, values: new Float32Array(4), tiepoint: [0, 0, 0, 0, 0, 0], pixelScale: [1, 1, 0], geoKeys, ...extra });

describe('glintmark horizon', () => {
  it('--json prints { profile: [{ azimuthDeg, elevationDeg, distanceM }] } matching the closed-form wall', async () => {
    const r = await runCli(['horizon', '--dem', geoTif, '--lat', '45', '--lon', '3', '--height', '2', '--azimuth-from', '0', '--azimuth-to', '20', '--step', '10', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as { profile: { azimuthDeg: number; elevationDeg: number; distanceM: number }[] };
    expect(j.profile.map((p) => p.azimuthDeg)).toEqual([0, 10, 20]);
    for (const p of j.profile) {
      expect(Object.keys(p).sort()).toEqual(['azimuthDeg', 'distanceM', 'elevationDeg']);
      const d = scene.wallM / Math.cos((p.azimuthDeg * Math.PI) / 180);
      expect(Math.abs(p.elevationDeg - closedFormDeg(60, 2, d))).toBeLessThan(0.1);
    }
  });
  it('prints a table and says refraction is ignored', async () => {
    const r = await runCli(['horizon', '--dem', geoTif, '--lat', '45', '--lon', '3', '--height', '2', '--azimuth-from', '0', '--azimuth-to', '0']);
    expect(r.stdout).toMatch(/refraction ignored/);
    expect(r.stdout).toMatch(/^0\.0\s+0\.\d\d/m);
  });
  it('an unreadable file is a failed run (status 1), not a usage error', async () => {
    const r = await runCli(['horizon', '--dem', join(dir, 'none.tif'), '--lat', '45', '--lon', '3', '--height', '2']);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/cannot read --dem .*ENOENT/);
  });
  it('bad input: not a TIFF, no georeferencing, unsupported CRS, rotated grid, observer outside', async () => {
    await expectUsageError(['horizon', '--dem', file('text.tif', 'height,1\n'), '--lat', '45', '--lon', '3', '--height', '2'], /is not a readable TIFF/);
    await expectUsageError(['horizon', '--dem', file('merc.tif', small([[GEOKEY.GTModelType, 1], [GEOKEY.ProjectedCSType, 3857]])), '--lat', '0', '--lon', '0', '--height', '2'], /projected CRS EPSG:3857 is not supported/);
    await expectUsageError(['horizon', '--dem', file('nad.tif', small([[GEOKEY.GTModelType, 2], [GEOKEY.GeographicType, 4267]])), '--lat', '0', '--lon', '0', '--height', '2'], /geographic CRS EPSG:4267 is not supported/);
    await expectUsageError(['horizon', '--dem', file('rot.tif', small([[GEOKEY.GTModelType, 2], [GEOKEY.GeographicType, 4326]], { transformation: true })), '--lat', '0', '--lon', '0', '--height', '2'], /ModelTransformation/);
    await expectUsageError(['horizon', '--dem', geoTif, '--lat', '46', '--lon', '3', '--height', '2'], /outside the elevation grid/);
    await expectUsageError(['horizon', '--dem', geoTif, '--lat', '45', '--lon', '3'], /missing --height/);
    await expectUsageError(['horizon', '--dem', geoTif, '--lat', '45', '--lon', '3', '--height', '2', '--step', '0'], /--step must be in/);
  });
});
