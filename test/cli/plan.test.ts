import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/core/text/csv.ts';
import { runCli } from './run.ts';

const dir = mkdtempSync(join(tmpdir(), 'glintmark-plan-'));
const file = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};
const GOOD = file('sites.csv', 'code,latitude,longitude,height_m\nMF01,52.1,4.3,-2.5\n"MF,02",52.2,4.4,1\n');
const BASE = ['--shape', 'triangular', '--edge', '1.2', '--wavelength', '0.0555'];

describe('glintmark plan', () => {
  it('writes a CSV row per site and geometry with the aim and predicted RCS', async () => {
    const r = await runCli(['plan', '--sites', GOOD, '--geometry', '40,190,right', '--geometry', '35,350,right', ...BASE]);
    expect(r.code).toBe(0);
    const rows = parseCsv(r.stdout).map((x) => x.fields);
    expect(rows[0]).toContain('reflector_azimuth_deg');
    expect(rows).toHaveLength(1 + 2 * 2);
    const h = rows[0];
    const az = (i: number) => Number(rows[i][h.indexOf('reflector_azimuth_deg')]);
    expect(az(1)).toBeCloseTo(100, 3);
    expect(az(2)).toBeCloseTo(260, 3);
    expect(rows[3][0]).toBe('MF,02');
    expect(Number(rows[1][h.indexOf('loss_db')])).toBeCloseTo(0, 3);
  });
  it('--one-reflector aims one compromise for all geometries (JSON)', async () => {
    const r = await runCli(['plan', '--sites', GOOD, '--geometry', '38,190,right', '--geometry', '42,192,right', ...BASE, '--one-reflector', '--json']);
    const j = r.json() as { siteCode: string; reflectorAzimuthDeg: number; lossDb: number }[];
    expect(j).toHaveLength(4);
    expect(j[0].reflectorAzimuthDeg).toBeCloseTo(j[1].reflectorAzimuthDeg, 9);
    expect(Math.max(...j.map((x) => x.lossDb))).toBeLessThan(1);
  });
  it('--one-reflector warns when no single aim serves the geometries (ascending + descending)', async () => {
    const r = await runCli(['plan', '--sites', GOOD, '--geometry', '37,192.3,right', '--geometry', '41,347.9,right', ...BASE, '--one-reflector', '--json']);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/warning: .*one reflector per pass direction/);
  });
  it('names an --out file it cannot write, with status 2', async () => {
    const r = await runCli(['plan', '--sites', GOOD, '--geometry', '40,190', ...BASE, '--out', join(dir, 'no-such-dir', 'plan.csv')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/cannot write --out .*plan\.csv: ENOENT/);
  });
  it('writes --out only when every row is good', async () => {
    const out = join(dir, 'out.csv');
    expect((await runCli(['plan', '--sites', GOOD, '--geometry', '40,190', ...BASE, '--out', out])).code).toBe(0);
    expect(readFileSync(out, 'utf8')).toMatch(/^site_code,/);
    const bad = file('bad.csv', 'code,latitude,longitude,height_m\nA,52,4,0\nB,95,4,0\n');
    const out2 = join(dir, 'out2.csv');
    const r = await runCli(['plan', '--sites', bad, '--geometry', '40,190', ...BASE, '--out', out2]);
    expect(r.code).toBe(2);
    expect(existsSync(out2)).toBe(false);
  });
  it.each([
    ['missing column', 'code,latitude,longitude\nA,1,2\n', /line 1: missing column height_m/],
    ['latitude out of range', 'code,latitude,longitude,height_m\nA,52,4,0\nB,95,4,0\n', /line 3: latitude 95 is out of range \[-90, 90\]°; nothing was written/],
    ['not a number', 'code,latitude,longitude,height_m\nA,north,4,0\n', /line 2: latitude must be a number, got "north"/],
    ['duplicate code', 'code,latitude,longitude,height_m\nA,1,4,0\nA,2,4,0\n', /line 3: site code "A" is already used on line 2/],
    ['unclosed quote', 'code,latitude,longitude,height_m\n"A,1,4,0\n', /a quoted field is never closed/],
    ['empty', '', /is empty/],
    ['several problems', 'code,latitude,longitude,height_m\n,1,4,0\nB,200,4,0\n', /line 2: the site code is empty \(and 1 more problem\)/],
  ])('reports a bad sites file (%s) with its line and writes nothing', async (_name, text, msg) => {
    const r = await runCli(['plan', '--sites', file('x.csv', text), '--geometry', '40,190', ...BASE]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(msg);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
  it.each([
    [['--geometry', '40'], /--geometry must be INCIDENCE,HEADING\[,LOOK\]/],
    [['--geometry', '40,abc'], /--geometry heading must be a number/],
    [['--geometry', '0,190'], /incidenceDeg must be in/],
    [[], /give at least one --geometry/],
  ])('rejects bad geometry %#', async (geo, msg) => {
    const r = await runCli(['plan', '--sites', GOOD, ...geo, ...BASE]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(msg);
  });
  it('names a missing sites file plainly', async () => {
    const r = await runCli(['plan', '--sites', join(dir, 'nope.csv'), '--geometry', '40,190', ...BASE]);
    expect(r.code).toBe(1); // the work failed (README: exit statuses)
    expect(r.stderr).toMatch(/cannot read --sites file ".*nope\.csv": no such file/);
  });
});
