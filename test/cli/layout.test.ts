import { describe, expect, it } from 'vitest';
import { expectUsageError, runCli } from './run.ts';

describe('glintmark layout', () => {
  it('prints { turnDeg, alongM, offsetM, side }: reference north, target 030°, 10 m', async () => {
    const r = await runCli(['layout', '--reference-azimuth', '0', '--target-azimuth', '30', '--baseline', '10', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, unknown>;
    expect(Object.keys(j).sort()).toEqual(['alongM', 'offsetM', 'side', 'turnDeg']);
    expect(j.turnDeg as number).toBeCloseTo(30, 12);
    expect(j.alongM as number).toBeCloseTo(10 * Math.cos(Math.PI / 6), 12);
    expect(j.offsetM as number).toBeCloseTo(5, 12);
    expect(j.side).toBe('right');
  });

  it('an anticlockwise turn past 90° reads "behind you … to the left" in the table', async () => {
    const r = await runCli(['layout', '--reference-azimuth', '10', '--target-azimuth', '250', '--baseline', '20']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/120\.00° anticlockwise/);
    expect(r.stdout).toMatch(/behind you/);
    expect(r.stdout).toMatch(/to the left/);
  });

  it('bad input: missing, non-numeric, out of range, unknown option', async () => {
    await expectUsageError(['layout', '--reference-azimuth', '0', '--target-azimuth', '30'], /missing --baseline/);
    await expectUsageError(['layout', '--reference-azimuth', 'N', '--target-azimuth', '30', '--baseline', '10'], /--reference-azimuth must be a number/);
    await expectUsageError(['layout', '--reference-azimuth', '0', '--target-azimuth', '30', '--baseline', '0'], /--baseline must be in \(0, 100000\] m/);
    await expectUsageError(['layout', '--reference-azimuth', '0', '--target-azimuth', '400', '--baseline', '10'], /--target-azimuth must be in \[-360, 360\]°/);
    await expectUsageError(['layout', '--reference-azimuth', '0', '--target-azimuth', '30', '--baseline', '10', '--units', 'ft'], /unknown option --units/);
  });
});
