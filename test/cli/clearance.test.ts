import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { closedFormDeg, geographicScene } from '../core/horizon/scenes.ts';
import { expectUsageError, runCli } from './run.ts';

const dir = mkdtempSync(join(tmpdir(), 'glintmark-clearance-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const put = (name: string, data: string | ArrayBuffer) => {
  const p = join(dir, name);
  writeFileSync(p, typeof data === 'string' ? data : Buffer.from(data));
  return p;
};
// Invented sweep: a 30° tree to the west-north-west and a 70° mast to the east.
const sweep = put('sweep.csv', 'azimuthDeg,elevationDeg,label\n282,30,ash tree\n95,70,mast\n180,5,fence\n');

type Verdicts = { tracks: { verdict: string; marginDeg: number; deciding: { label?: string } | null }[]; halfBeamwidthDeg: number };

describe('glintmark clearance', () => {
  it('from sightings: ascending (heading 10°, right: satellite at 280°) clear, descending (heading 190°, right: 100°) blocked', async () => {
    // incidence 38° → LOS 52°: vs ash tree 30° → clear by 22°; vs mast 70° → blocked by 18°.
    const r = await runCli(['clearance', '--sightings', sweep, '--geometry', '38,10,right', '--geometry', '38,190,right', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Verdicts;
    expect(j.halfBeamwidthDeg).toBeGreaterThan(10); // the triangular trihedral's azimuth lobe is tens of degrees wide
    expect(j.tracks[0].verdict).toBe('clear');
    expect(j.tracks[0].marginDeg).toBeCloseTo(22, 9);
    expect(j.tracks[0].deciding?.label).toBe('ash tree');
    expect(j.tracks[1].verdict).toBe('blocked');
    expect(j.tracks[1].marginDeg).toBeCloseTo(-18, 9);
  });
  it('from a DEM: the synthetic wall to the north blocks a near-grazing track looking north and not a steep one', async () => {
    const s = geographicScene();
    const dem = put('geo.tif', s.tiff);
    const wallDeg = closedFormDeg(60, 2, s.wallM); // ≈ 0.8°
    // Satellite due north: right-looking with heading 90° puts the satellite at heading − 90° = 0°.
    const r = await runCli(['clearance', '--dem', dem, '--lat', '45', '--lon', '3', '--height', '2', '--geometry', '89.5,90,right', '--geometry', '30,90,right', '--json']);
    const j = r.json() as Verdicts;
    expect(j.tracks[0].verdict).toBe('blocked');
    expect(Math.abs(j.tracks[0].marginDeg - (0.5 - wallDeg))).toBeLessThan(0.1);
    expect(j.tracks[1].verdict).toBe('clear');
  });
  it('prints the verdict table', async () => {
    const r = await runCli(['clearance', '--sightings', sweep, '--geometry', '38,190,right']);
    expect(r.stdout).toMatch(/blocked by 18\.0° \(mast/);
  });
  it('bad input', async () => {
    await expectUsageError(['clearance', '--geometry', '38,10'], /missing horizon/);
    await expectUsageError(['clearance', '--sightings', sweep], /at least one --geometry/);
    await expectUsageError(['clearance', '--sightings', put('bad.csv', 'az,el\n1,2\n'), '--geometry', '38,10'], /azimuthDeg and elevationDeg/);
    await expectUsageError(['clearance', '--sightings', put('bad2.csv', 'azimuthDeg,elevationDeg\n10,95\n'), '--geometry', '38,10'], /line 2 elevationDeg must be in/);
    await expectUsageError(['clearance', '--sightings', sweep, '--dem', 'x.tif', '--geometry', '38,10'], /not both/);
  });
});
