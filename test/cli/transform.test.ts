import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { expectUsageError, runCli } from './run.ts';

/** Rows of one `## cct …` section of the PROJ fixture (see test/fixtures/frames/README.md). */
function projRows(cmd: string): number[][] {
  const text = readFileSync(new URL('../fixtures/frames/proj-output.txt', import.meta.url), 'utf8');
  const block = text.split('## ').find((b) => b.startsWith(cmd + '\n'));
  if (!block) throw new Error(`no fixture section ${cmd}`);
  return block.split('\n').slice(1).filter((l) => l.trim()).map((l) => l.trim().split(/\s+/).map(Number));
}

describe('glintmark transform', () => {
  it('ITRF2020 → ITRF2000 at 2030.25 agrees with PROJ cct to 10 µm, with the contract fields', async () => {
    const r = await runCli(['transform', '--from', 'ITRF2020', '--to', 'ITRF2000', '--epoch', '2030.25', '--xyz', '-1288000,-4720000,4080000', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, unknown>;
    for (const k of ['xM', 'yM', 'zM', 'latDeg', 'lonDeg', 'heightEllM', 'frame', 'epoch']) expect(j).toHaveProperty(k);
    const want = projRows('cct -d 6 +init=ITRF2020:ITRF2000')[2];
    expect(Math.abs((j.xM as number) - want[0])).toBeLessThan(1e-5);
    expect(Math.abs((j.yM as number) - want[1])).toBeLessThan(1e-5);
    expect(Math.abs((j.zM as number) - want[2])).toBeLessThan(1e-5);
    expect(j.frame).toBe('ITRF2000');
    expect(j.epoch).toBe(2030.25);
  });

  it('--plate EURA from 2015 to 2025.5 in ITRF2020 matches PROJ (ω × X plus origin rate bias)', async () => {
    const r = await runCli(['transform', '--from', 'ITRF2020', '--to', 'ITRF2020', '--epoch', '2015', '--to-epoch', '2025.5', '--plate', 'EURA', '--xyz', '4027894,307046,4919475', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as { xM: number; yM: number; zM: number; epoch: number };
    const want = projRows('cct -d 6 +init=ITRF2020:EURA_T +t_epoch=2015')[0];
    expect(Math.abs(j.xM - want[0])).toBeLessThan(1e-5);
    expect(Math.abs(j.yM - want[1])).toBeLessThan(1e-5);
    expect(Math.abs(j.zM - want[2])).toBeLessThan(1e-5);
    expect(j.epoch).toBe(2025.5);
  });

  it('a site velocity of 0,0,0.01 m/yr over 10 years raises the height by 0.1 m', async () => {
    const r = await runCli(['transform', '--from', 'ITRF2014', '--to', 'ITRF2014', '--epoch', '2010', '--to-epoch', '2020', '--velocity', '0,0,0.01', '--lat', '45', '--lon', '10', '--height', '50', '--json']);
    const j = r.json() as { heightEllM: number; latDeg: number };
    expect(j.heightEllM).toBeCloseTo(50.1, 6);
    expect(j.latDeg).toBeCloseTo(45, 10);
  });

  it('prints the steps as a table', async () => {
    const r = await runCli(['transform', '--from', 'itrf08', '--to', 'ITRF2005', '--epoch', '2020', '--lat', '52', '--lon', '5', '--height', '100']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/ITRF2008 → ITRF2020 \(ITRF2020 table, inverted\)/);
    expect(r.stdout).toMatch(/ITRF2020 → ITRF2005 \(ITRF2020 table\)/);
  });

  it('bad input: unknown frame, missing epoch, both position forms, epoch without motion, plate without model, bad triple', async () => {
    await expectUsageError(['transform', '--from', 'ITRF97', '--to', 'ITRF2020', '--epoch', '2020', '--xyz', '4027894,307046,4919475'], /--from must be one of ITRF2000, ITRF2005/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--xyz', '4027894,307046,4919475'], /missing --epoch/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--epoch', '2020', '--xyz', '4027894,307046,4919475', '--lat', '52'], /either --xyz/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--epoch', '2020', '--to-epoch', '2025', '--xyz', '4027894,307046,4919475'], /--to-epoch needs --velocity/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--epoch', '2020', '--plate', 'EURA', '--xyz', '4027894,307046,4919475'], /give --to-epoch/);
    await expectUsageError(['transform', '--from', 'ITRF2005', '--to', 'ITRF2020', '--epoch', '2020', '--to-epoch', '2025', '--plate', 'EURA', '--xyz', '4027894,307046,4919475'], /only ITRF2014 and ITRF2020/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--epoch', '2020', '--to-epoch', '2025', '--plate', 'ATLA', '--xyz', '4027894,307046,4919475'], /plate \(ITRF2014-PMM\) must be one of/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--epoch', '2020', '--xyz', '4027894,307046'], /--xyz must be three numbers/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--epoch', '2020', '--xyz', '1000,2000,3000'], /Earth-centred position/);
    await expectUsageError(['transform', '--from', 'ITRF2014', '--to', 'ITRF2020', '--epoch', '1900', '--xyz', '4027894,307046,4919475'], /--epoch must be in \[1980, 2100\]/);
  });
});
