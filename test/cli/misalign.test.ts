import { describe, expect, it } from 'vitest';
import { aimForPass } from '../../src/core/geometry/pointing.ts';
import { misalignment } from '../../src/core/reflector/misalignment.ts';
import { expectUsageError, runCli } from './run.ts';

type Obj = Record<string, unknown>;
const PASS = ['--incidence', '40', '--heading', '190'];
const REFL = ['--edge', '0.9', '--wavelength', '0.0555'];

describe('glintmark misalign', () => {
  it('prints { offBoresightDeg, rcsM2, rcsDbsm, lossDb } equal to the core (defaults: right look, roll 0, triangular)', async () => {
    const r = await runCli(['misalign', ...PASS, '--reflector-azimuth', '103', '--tilt', '12', ...REFL, '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Obj;
    const m = misalignment(
      { shape: 'triangular', edgeM: 0.9, wavelengthM: 0.0555 },
      { azimuthDeg: 103, tiltDeg: 12, rollDeg: 0 },
      { incidenceDeg: 40, headingDeg: 190, look: 'right' },
    );
    expect(j).toMatchObject({ offBoresightDeg: m.offBoresightDeg, rcsM2: m.rcsM2, rcsDbsm: m.rcsDbsm, lossDb: m.lossDb, outsideCorner: false });
  });

  it('the exact aim (azimuth 100°, tilt 14.7356°) loses nothing', async () => {
    const a = aimForPass({ incidenceDeg: 40, headingDeg: 190, look: 'right' });
    const argv = ['misalign', ...PASS, '--look', 'right', '--reflector-azimuth', String(a.reflectorAzimuthDeg), '--tilt', String(a.baseTiltDeg), '--roll', '0', '--shape', 'square', ...REFL, '--json'];
    const j = (await runCli(argv)).json() as Obj;
    expect(j.offBoresightDeg as number).toBeLessThan(1e-6);
    expect(j.lossDb as number).toBeLessThan(1e-9);
  });

  it('a reflector facing away reports outsideCorner with null dB fields', async () => {
    const j = (await runCli(['misalign', ...PASS, '--look', 'left', '--reflector-azimuth', '100', '--tilt', '15', ...REFL, '--json'])).json() as Obj;
    expect(j).toMatchObject({ rcsM2: 0, rcsDbsm: null, lossDb: null, outsideCorner: true });
  });

  it('prints a readable table without --json', async () => {
    const r = await runCli(['misalign', ...PASS, '--reflector-azimuth', '103', '--tilt', '12', '--roll', '2', ...REFL]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/off boresight\s+\d+\.\d+°/);
    expect(r.stdout).toMatch(/loss below peak\s+\d+\.\d+ dB/);
  });

  it.each([
    [['misalign', ...PASS, '--tilt', '12', ...REFL], /missing --reflector-azimuth/],
    [['misalign', ...PASS, '--reflector-azimuth', '100', '--tilt', '12', '--wavelength', '0.05'], /missing --edge/],
    [['misalign', ...PASS, '--reflector-azimuth', '1e', '--tilt', '12', ...REFL], /--reflector-azimuth must be a number, got "1e"/],
    [['misalign', ...PASS, '--reflector-azimuth', '100', '--tilt', '95', ...REFL], /--tilt must be in \[-90, 90\] degrees, got 95/],
    [['misalign', ...PASS, '--reflector-azimuth', '100', '--tilt', '10', '--roll', '-200', ...REFL], /--roll must be in \(-180, 180\] degrees, got -200/],
    [['misalign', '--incidence', '90', '--heading', '190', '--reflector-azimuth', '100', '--tilt', '10', ...REFL], /--incidence must be in \(0, 90\) degrees, got 90/],
    [['misalign', ...PASS, '--look', 'down', '--reflector-azimuth', '100', '--tilt', '10', ...REFL], /look must be one of right, left/],
    [['misalign', ...PASS, '--reflector-azimuth', '100', '--tilt', '10', '--shape', 'hex', ...REFL], /shape must be one of triangular, square, got "hex"/],
    [['misalign', ...PASS, '--reflector-azimuth', '100', '--tilt', '10', ...REFL, '--yaw', '3'], /unknown option --yaw/],
  ])('rejects bad input %#', async (argv, msg) => expectUsageError(argv, msg));
});
