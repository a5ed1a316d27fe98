import { describe, expect, it } from 'vitest';
import { compromiseOrientation } from '../../src/core/reflector/compromise.ts';
import { expectUsageError, runCli } from './run.ts';

type Obj = Record<string, unknown>;
const REFL = ['--edge', '0.9', '--wavelength', '0.0555'];

describe('glintmark compromise', () => {
  it('prints the contract fields equal to the core result', async () => {
    const r = await runCli(['compromise', '--shape', 'square', ...REFL, '--geometry', '36,192,right', '--geometry', '44,188,right', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Obj;
    const c = compromiseOrientation({ shape: 'square', edgeM: 0.9, wavelengthM: 0.0555 }, [
      { incidenceDeg: 36, headingDeg: 192, look: 'right' },
      { incidenceDeg: 44, headingDeg: 188, look: 'right' },
    ]);
    expect(j).toMatchObject({
      reflectorAzimuthDeg: c.orientation.azimuthDeg,
      baseTiltDeg: c.orientation.tiltDeg,
      rollDeg: c.orientation.rollDeg,
      worstLossDb: c.worstLossDb,
      separateRecommended: false,
      message: c.message,
    });
    const per = j.perGeometry as Obj[];
    expect(per).toHaveLength(2);
    expect(per[0]).toMatchObject({ incidenceDeg: 36, headingDeg: 192, look: 'right', lossDb: c.perGeometry[0].lossDb });
    expect(per[1]).toMatchObject({ incidenceDeg: 44, headingDeg: 188, look: 'right', lossDb: c.perGeometry[1].lossDb });
  });

  it('one geometry: the exact aim (triangular by default)', async () => {
    const j = (await runCli(['compromise', ...REFL, '--geometry', '40,190,right', '--json'])).json() as Obj;
    expect(j.reflectorAzimuthDeg as number).toBeCloseTo(100, 9);
    expect(j.baseTiltDeg as number).toBeCloseTo(50 - 35.2643896828, 8);
    expect(j.rollDeg).toBe(0);
    expect(j.worstLossDb as number).toBeLessThan(1e-6);
    expect(j.shape).toBe('triangular');
  });

  it('ascending + descending: recommends separate reflectors; --max-loss raises the limit', async () => {
    const argv = ['compromise', ...REFL, '--geometry', '39,-14.3,right', '--geometry', '41,194.3,right', '--json'];
    const j = (await runCli(argv)).json() as Obj;
    expect(j.separateRecommended).toBe(true);
    expect(String(j.message)).toMatch(/one reflector per pass direction/);
    const k = (await runCli([...argv, '--max-loss', '40'])).json() as Obj;
    expect(k.separateRecommended).toBe(false);
  });

  it('prints a readable table without --json', async () => {
    const r = await runCli(['compromise', ...REFL, '--geometry', '36,192,right', '--geometry', '44,188,right']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/reflector azimuth \(true\)\s+\d+\.\d+°/);
    expect(r.stdout).toMatch(/^36\.00\s+192\.00\s+right/m);
    expect(r.stdout).toMatch(/one reflector serves all 2 passes/);
  });

  it.each([
    [['compromise', ...REFL], /give at least one --geometry/],
    [['compromise', '--wavelength', '0.05', '--geometry', '40,190,right'], /missing --edge/],
    [['compromise', ...REFL, '--geometry', '40;190;right'], /--geometry must be INCIDENCE,HEADING\[,LOOK\]/],
    [['compromise', ...REFL, '--geometry', '40,190,right,extra'], /--geometry must be INCIDENCE,HEADING\[,LOOK\]/],
    [['compromise', ...REFL, '--geometry', '40,east,right'], /--geometry heading must be a number, got "east"/],
    [['compromise', ...REFL, '--geometry', '40,190,up'], /--geometry look must be one of right, left/],
    [['compromise', ...REFL, '--geometry', '95,190,right'], /incidenceDeg must be in \(0, 90\)°, got 95/],
    [['compromise', ...REFL, '--geometry', '40,190,right', '--max-loss', 'lots'], /--max-loss must be a number/],
    [['compromise', ...REFL, '--geometry', '40,190,right', '--max-loss', '-1'], /--max-loss must be in \[0, 60\] dB, got -1/],
    [['compromise', '--shape', 'cone', ...REFL, '--geometry', '40,190,right'], /shape must be one of triangular, square, got "cone"/],
    [['compromise', ...REFL, '--geometry', '40,190,right', '--site', 'x'], /unknown option --site/],
  ])('rejects bad input %#', async (argv, msg) => expectUsageError(argv, msg));
});
