import { describe, expect, it } from 'vitest';
import { bodyVector, oracleAreaRatio } from '../core/reflector/overlapOracle.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG } from '../../src/core/units.ts';
import { expectUsageError, runCli } from './run.ts';

type Obj = Record<string, unknown>;
const BASE = ['rcs', '--shape', 'square', '--edge', '0.6', '--wavelength', '0.0555'];

describe('glintmark rcs', () => {
  it('prints { rcsM2, rcsDbsm, lossDb } matching the independent aperture-overlap oracle', async () => {
    const r = await runCli([...BASE, '--elevation', '42', '--azimuth-offset', '-7.5', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Obj;
    // σ = 4π A²/λ² (Skolnik; REFERENCES.md §1) with A from the numerical overlap oracle (test/core/reflector/
    // overlapOracle.ts, no code shared with src/), scaled by a² = 0.36 m²; the oracle is good to ≈ 1e-3 dB.
    const ORACLE_TOL_DB = 0.01;
    const a2 = 0.6 ** 2, lambdaM = 0.0555;
    const areaM2 = a2 * oracleAreaRatio('square', bodyVector(42, -7.5));
    const peakAreaM2 = a2 * Math.sqrt(3); // Robertson 1947: square trihedral peak aperture √3 a²
    const expectedDbsm = 10 * Math.log10((4 * Math.PI * areaM2 ** 2) / lambdaM ** 2);
    expect(Math.abs((j.rcsDbsm as number) - expectedDbsm)).toBeLessThan(ORACLE_TOL_DB);
    expect(Math.abs((j.lossDb as number) - 20 * Math.log10(peakAreaM2 / areaM2))).toBeLessThan(ORACLE_TOL_DB);
    expect(Math.abs(10 * Math.log10(j.rcsM2 as number) - (j.rcsDbsm as number))).toBeLessThan(1e-9);
    expect(j.outsideCorner).toBe(false);
    expect(j.warnings).toEqual([]);
  });

  it('boresight of a 1 m / 1 m triangular gives the 4π/3 m² unit check and no loss', async () => {
    // Robertson 1947 peak formula; unit check value from ../shared/REFERENCES.md §1. Edge = λ: warns (a < 10 λ).
    const argv = ['rcs', '--shape', 'triangular', '--edge', '1', '--wavelength', '1', '--elevation', String(TRIHEDRAL_BORESIGHT_ELEVATION_DEG), '--azimuth-offset', '0', '--json'];
    const j = (await runCli(argv)).json() as Obj;
    expect(j.rcsM2 as number).toBeCloseTo(4.18879, 5);
    expect(j.lossDb as number).toBeLessThan(1e-9);
    expect(j.peakRcsM2 as number).toBeCloseTo((4 * Math.PI) / 3, 9); // σ = 4π a⁴/(3λ²), Robertson 1947
    expect((j.warnings as string[])[0]).toMatch(/wavelengths/);
  });

  it('outside the corner: rcsM2 0, rcsDbsm and lossDb null, outsideCorner true', async () => {
    const j = (await runCli([...BASE, '--elevation', '30', '--azimuth-offset', '60', '--json'])).json() as Obj;
    expect(j).toMatchObject({ rcsM2: 0, rcsDbsm: null, lossDb: null, outsideCorner: true });
  });

  it('prints a readable table without --json', async () => {
    const r = await runCli([...BASE, '--elevation', '42', '--azimuth-offset', '-7.5']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^RCS\s+\d+\.\d+ m² = \d+\.\d+ dBsm$/m);
    expect(r.stdout).toMatch(/loss below peak\s+\d+\.\d+ dB/);
    const o = await runCli([...BASE, '--elevation', '-5', '--azimuth-offset', '0']);
    expect(o.stdout).toMatch(/outside the corner/);
  });

  it.each([
    [['rcs', '--shape', 'square', '--edge', '0.6', '--elevation', '40', '--azimuth-offset', '0'], /missing wavelength/],
    [[...BASE, '--azimuth-offset', '0'], /missing --elevation/],
    [['rcs', '--edge', '0.6', '--wavelength', '0.05', '--elevation', '40', '--azimuth-offset', '0'], /missing --shape/],
    [[...BASE, '--elevation', 'forty', '--azimuth-offset', '0'], /--elevation must be a number, got "forty"/],
    [[...BASE, '--elevation', '95', '--azimuth-offset', '0'], /elevation must be in \[-90, 90\]°, got 95/],
    [[...BASE, '--elevation', '40', '--azimuth-offset', '181'], /azimuth-offset must be in \[-180, 180\]°, got 181/],
    [['rcs', '--shape', 'round', '--edge', '1', '--wavelength', '0.05', '--elevation', '40', '--azimuth-offset', '0'], /shape must be one of triangular, square, got "round"/],
    [['rcs', '--shape', 'square', '--edge', '0', '--wavelength', '0.05', '--elevation', '40', '--azimuth-offset', '0'], /--edge must be in \(0, 20\] m, got 0/],
    [[...BASE, '--elevation', '40', '--azimuth-offset', '0', '--tilt', '3'], /unknown option --tilt/],
    [[...BASE, '--elevation', '40', '--azimuth-offset', '0', '--elevation', '41'], /--elevation given 2 times/],
  ])('rejects bad input %#', async (argv, msg) => expectUsageError(argv, msg));
});
