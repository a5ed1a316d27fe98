import { describe, expect, it } from 'vitest';
import { deviceAnglesFromPlateOrientation } from '../../src/core/alignment/deviceOrientation.ts';
import { expectUsageError, runCli } from './run.ts';

const TOL_DEG = 1e-9;

describe('glintmark orient', () => {
  it('prints { reflectorAzimuthDeg, tiltDeg, rollDeg, azimuthReference: "magnetic" } without a declination', async () => {
    const r = await runCli(['orient', '--alpha', '30', '--beta', '10', '--gamma', '0', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, unknown>;
    expect(Object.keys(j).sort()).toEqual(['azimuthReference', 'reflectorAzimuthDeg', 'reflectorAzimuthMagDeg', 'rollDeg', 'tiltDeg']);
    expect(j.reflectorAzimuthMagDeg as number).toBeCloseTo(330, 9);
    expect(r.stderr).toMatch(/reflectorAzimuthDeg is MAGNETIC/);
    expect(j.reflectorAzimuthDeg as number).toBeCloseTo(330, 9); // alpha is anticlockwise: azimuth = 360 − alpha
    expect(j.tiltDeg as number).toBeCloseTo(10, 9);
    expect(j.rollDeg as number).toBeCloseTo(0, 9);
    expect(j.azimuthReference).toBe('magnetic');
  });

  it('adds --declination (east-positive) for a true azimuth, and round-trips a constructed plate pose', async () => {
    const plate = { azimuthDeg: 211.5, tiltDeg: 19.2, rollDeg: -3.1 }; // magnetic azimuth
    const a = deviceAnglesFromPlateOrientation(plate);
    const argv = ['orient', '--alpha', String(a.alphaDeg), '--beta', String(a.betaDeg), '--gamma', String(a.gammaDeg), '--declination', '-4.25', '--json'];
    const j = (await runCli(argv)).json() as Record<string, number | string>;
    expect(Math.abs((j.reflectorAzimuthDeg as number) - (211.5 - 4.25))).toBeLessThan(TOL_DEG);
    expect(Math.abs((j.tiltDeg as number) - 19.2)).toBeLessThan(TOL_DEG);
    expect(Math.abs((j.rollDeg as number) - -3.1)).toBeLessThan(TOL_DEG);
    expect(j.azimuthReference).toBe('true');
  });

  it('prints a readable table without --json', async () => {
    const r = await runCli(['orient', '--alpha', '0', '--beta', '0', '--gamma', '10']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/reflector azimuth\s+0\.00° magnetic/);
    expect(r.stdout).toMatch(/right-hand side lowered/); // gamma > 0 lowers the right-hand side
  });

  it('phone near vertical → exit 2 with the plain message', async () => {
    await expectUsageError(['orient', '--alpha', '0', '--beta', '80', '--gamma', '0'], /almost upright.*lay it flat on the base plate/);
  });

  it('bad input: missing, non-numeric, out of range, unknown option', async () => {
    await expectUsageError(['orient', '--alpha', '0', '--beta', '0'], /missing --gamma/);
    await expectUsageError(['orient', '--alpha', 'north', '--beta', '0', '--gamma', '0'], /--alpha must be a number/);
    await expectUsageError(['orient', '--alpha', '0', '--beta', '0', '--gamma', '95'], /--gamma must be in \[-90, 90\]°/);
    await expectUsageError(['orient', '--alpha', '0', '--beta', '0', '--gamma', '0', '--declination', '200'], /--declination/);
    await expectUsageError(['orient', '--alpha', '0', '--beta', '0', '--gamma', '0', '--heading', '3'], /unknown option --heading/);
  });
});
