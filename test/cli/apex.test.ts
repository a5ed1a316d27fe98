import { describe, expect, it } from 'vitest';
import { expectUsageError, runCli } from './run.ts';

describe('glintmark apex', () => {
  it('level plate: apex height = mark height + 0.85 m, contract fields present', async () => {
    const r = await runCli(['apex', '--mark', '52.61,0.27,31.4', '--offset-body', '0,0,0.85', '--azimuth', '100', '--tilt', '0', '--roll', '0', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as { apexLatDeg: number; apexLonDeg: number; apexHeightEllM: number; apexXyzM: number[]; steps: object };
    expect(j.apexHeightEllM).toBeCloseTo(32.25, 6);
    expect(j.apexLatDeg).toBeCloseTo(52.61, 11);
    expect(j.apexLonDeg).toBeCloseTo(0.27, 11);
    expect(j.apexXyzM).toHaveLength(3);
    expect(j.steps).toHaveProperty('offsetEnuM');
  });
  it('prints the steps as a table', async () => {
    const r = await runCli(['apex', '--mark', '52.61,0.27,31.4', '--offset-enu', '0.1,0,0.85']);
    expect(r.stdout).toMatch(/3 offset ENU\s+0\.1000, 0\.0000, 0\.8500 m/);
    expect(r.stdout).toMatch(/apex\s+52\.61/);
  });
  it('bad input', async () => {
    await expectUsageError(['apex', '--offset-enu', '0,0,1'], /missing --mark/);
    await expectUsageError(['apex', '--mark', '52,0', '--offset-enu', '0,0,1'], /--mark must be LAT,LON,H/);
    await expectUsageError(['apex', '--mark', '52,0,10'], /missing offset/);
    await expectUsageError(['apex', '--mark', '52,0,10', '--offset-enu', '0,0,1', '--offset-body', '0,0,1'], /not both/);
    await expectUsageError(['apex', '--mark', '52,0,10', '--offset-enu', '0,0,1', '--tilt', '3'], /--tilt belongs to --offset-body/);
    await expectUsageError(['apex', '--mark', '52,0,10', '--offset-body', '0,0,1', '--azimuth', '10', '--tilt', '0'], /missing --roll/);
    await expectUsageError(['apex', '--mark', '52,0,10', '--offset-body', '0,0,1', '--azimuth', '400', '--tilt', '0', '--roll', '0'], /--azimuth must be in \[0, 360\)/);
    await expectUsageError(['apex', '--mark', '95,0,10', '--offset-enu', '0,0,1'], /--mark latitude must be in/);
    await expectUsageError(['apex', '--mark', '52,0,10', '--offset-enu', '0,0,x'], /--offset-enu \[3\] must be a number/);
  });
});
