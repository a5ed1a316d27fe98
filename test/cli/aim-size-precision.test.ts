import { describe, expect, it } from 'vitest';
import { expectUsageError, runCli } from './run.ts';

type Obj = Record<string, number | string>;

describe('glintmark aim', () => {
  it('prints the aim and peak RCS as one JSON document', async () => {
    const r = await runCli(['aim', '--incidence', '40', '--heading', '190', '--look', 'right', '--shape', 'triangular', '--edge', '1', '--wavelength', '1', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Obj;
    expect(j.reflectorAzimuthDeg).toBeCloseTo(100, 10);
    expect(j.boresightElevationDeg).toBeCloseTo(50, 10);
    expect(j.baseTiltDeg).toBeCloseTo(14.7356103, 6);
    // Unit check from REFERENCES.md §1: a = 1 m, λ = 1 m triangular → 4π/3 m² (Robertson 1947 peak formula).
    expect(j.peakRcsM2).toBeCloseTo(4.18879, 5);
    expect(j.peakRcsDbsm).toBeCloseTo(10 * Math.log10(4.18879), 4);
    expect(j.wavelengthM).toBe(1);
  });
  it('accepts --frequency in GHz and --band, and prints a table without --json', async () => {
    const f = (await runCli(['aim', '--incidence', '30', '--heading', '10', '--frequency', '5.405', '--json'])).json() as Obj;
    expect(f.wavelengthM).toBeCloseTo(0.0554658, 6);
    const b = (await runCli(['aim', '--incidence', '30', '--heading', '10', '--band', 'X', '--json'])).json() as Obj;
    expect(b.wavelengthM).toBeCloseTo(299792458 / 9.65e9, 9);
    const t = await runCli(['aim', '--incidence', '30', '--heading', '10', '--look', 'left']);
    expect(t.code).toBe(0);
    expect(t.stdout).toMatch(/reflector azimuth \(true\)\s+100\.00°/);
  });
  it.each([
    [['aim', '--heading', '10'], /missing --incidence/],
    [['aim', '--incidence', 'abc', '--heading', '10'], /--incidence must be a number, got "abc"/],
    [['aim', '--incidence', '95', '--heading', '10'], /--incidence must be in \(0, 90\) degrees, got 95/],
    [['aim', '--incidence', '30', '--heading', '10', '--look', 'up'], /look must be one of right, left/],
    [['aim', '--incidence', '30', '--heading', '10', '--shape', 'round'], /shape must be one of triangular, square/],
    [['aim', '--incidence', '30', '--heading', '10', '--edge', '0'], /--edge must be in \(0, 20\] m/],
    [['aim', '--incidence', '30', '--heading', '10', '--band', 'Q'], /band must be one of L, S, C, X, Ku/],
    [['aim', '--incidence', '30', '--heading', '10', '--band', 'C', '--wavelength', '0.05'], /give only one of --wavelength, --frequency, --band/],
    [['aim', '--incidence', '30', '--heading', '10', '--tilt', '3'], /unknown option --tilt/],
    [['aim', '--incidence'], /--incidence needs a value/],
    [['nosuch'], /unknown command "nosuch"/],
  ])('rejects bad input %#', async (argv, msg) => expectUsageError(argv, msg));
});

describe('glintmark size', () => {
  it('finds the edge whose peak RCS gives the target SCR', async () => {
    const r = await runCli(['size', '--wavelength', '0.05', '--shape', 'triangular', '--clutter-db', '-10', '--scr-db', '20', '--cell-area', '100', '--json']);
    const j = r.json() as Obj;
    // σ needed = 10^(2) · 10^(−1) · 100 = 1000 m² → peak 30 dBsm; a = (3 λ² σ / 4π)^(1/4) (REFERENCES.md §2).
    expect(j.peakRcsDbsm).toBeCloseTo(30, 9);
    expect(j.edgeM).toBeCloseTo(((3 * 0.05 ** 2 * 1000) / (4 * Math.PI)) ** 0.25, 12);
    expect(j.cellAreaM2).toBe(100);
  });
  it('computes the cell from resolutions and incidence', async () => {
    const j = (await runCli(['size', '--wavelength', '0.05', '--shape', 'square', '--clutter-db', '-10', '--scr-db', '20', '--range-resolution', '3', '--azimuth-resolution', '20', '--incidence', '30', '--json'])).json() as Obj;
    expect(j.cellAreaM2).toBeCloseTo(120, 9);
  });
  it.each([
    [['size', '--wavelength', '0.05', '--shape', 'triangular', '--clutter-db', '-10', '--scr-db', '20'], /give --cell-area M2, or all of/],
    [['size', '--wavelength', '0.05', '--shape', 'triangular', '--clutter-db', '-10', '--scr-db', '20', '--cell-area', '100', '--incidence', '30'], /either --cell-area or the three/],
    [['size', '--wavelength', '0.05', '--shape', 'triangular', '--clutter-db', 'x', '--scr-db', '20', '--cell-area', '100'], /--clutter-db must be a number/],
    [['size', '--wavelength', '-1', '--shape', 'triangular', '--clutter-db', '-10', '--scr-db', '20', '--cell-area', '100'], /--wavelength must be in \(0, 10\] m/],
    [['size', '--wavelength', '0.05', '--shape', 'triangular', '--clutter-db', '-10', '--scr-db', '20', '--range-resolution', '3', '--azimuth-resolution', '20', '--incidence', '0'], /--incidence must be in/],
    [['size', '--wavelength', '0.05', '--clutter-db', '-10', '--scr-db', '20', '--cell-area', '100'], /missing --shape/],
  ])('rejects bad input %#', async (argv, msg) => expectUsageError(argv, msg));
});

describe('glintmark precision', () => {
  it('SCR, phase noise and LOS precision (Garthwaite 2017, eqs. 4–5)', async () => {
    const j = (await runCli(['precision', '--rcs-dbsm', '30', '--clutter-db', '-10', '--cell-area', '100', '--wavelength', '0.055466', '--json'])).json() as Obj;
    expect(j.scrDb).toBeCloseTo(20, 9);
    expect(j.phaseStdRad).toBeCloseTo(0.0707107, 6);
    expect(j.losStdMm).toBeCloseTo(0.3121, 4); // REFERENCES.md §2 worked check [derived]
    // Difference of two independent images with equal noise: variance adds, so √2 × 0.3121 mm.
    expect(j.losStdDiffMm).toBeCloseTo(0.3121 * 1.41421356, 4);
  });
  it('warns when SCR is too low for the approximation', async () => {
    const j = (await runCli(['precision', '--rcs-dbsm', '15', '--clutter-db', '-10', '--cell-area', '100', '--wavelength', '0.05', '--json'])).json() as Obj;
    expect(String(j.warning)).toMatch(/below 10 dB/);
  });
  it.each([
    [['precision', '--rcs-dbsm', '30', '--clutter-db', '-10', '--wavelength', '0.05'], /missing --cell-area/],
    [['precision', '--rcs-dbsm', 'NaN', '--clutter-db', '-10', '--cell-area', '100', '--wavelength', '0.05'], /--rcs-dbsm must be a number/],
    [['precision', '--rcs-dbsm', '30', '--clutter-db', '-10', '--cell-area', '-5', '--wavelength', '0.05'], /--cell-area must be in \(0, 100000000\] m²/],
    [['precision', '--rcs-dbsm', '30', '--clutter-db', '-10', '--cell-area', '100', '--wavelength', '0.05', '--extra', '1'], /unknown option --extra/],
  ])('rejects bad input %#', async (argv, msg) => expectUsageError(argv, msg));
});
