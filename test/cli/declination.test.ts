import { describe, expect, it } from 'vitest';
import { declination } from '../../src/core/magnetic/declination.ts';
import { expectUsageError, runCli } from './run.ts';

describe('glintmark declination', () => {
  it('prints { declinationDeg, inclinationDeg, totalIntensityNt, model } equal to the core', async () => {
    const r = await runCli(['declination', '--lat', '-80', '--lon', '240', '--height', '100000', '--date', '2027-07-02T12:00:00Z', '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, unknown>;
    expect(Object.keys(j).sort()).toEqual(['declinationDeg', 'inclinationDeg', 'model', 'totalIntensityNt']);
    const c = declination({ latDeg: -80, lonDeg: 240, heightM: 100_000, timeMs: Date.UTC(2027, 6, 2, 12) });
    if (!c.ok) throw new Error('expected ok');
    expect(j.declinationDeg).toBe(c.value.declinationDeg);
    expect(j.inclinationDeg).toBe(c.value.inclinationDeg);
    expect(j.totalIntensityNt).toBe(c.value.totalIntensityNt);
    expect(j.model).toBe('WMM2025');
    // WMM2025 report Table 6 (Chulliat et al. 2025): 2027.5, 100 km, 80° S, 120° W → D 67.93°, I −72.10°.
    expect(j.declinationDeg as number).toBeCloseTo(67.93, 2);
    expect(j.inclinationDeg as number).toBeCloseTo(-72.1, 2);
  });

  it('accepts a bare date (midnight UTC) and prints a table with E/W', async () => {
    const r = await runCli(['declination', '--lat', '80', '--lon', '0', '--date', '2025-01-01']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/declination\s+1\.28° E/); // Table 6, row 1: D = 1.28°
  });

  it('outside 2025–2030 → exit 2 with a clear message', async () => {
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', '2030-01-01'], /valid from 2025-01-01 to 2030-01-01/);
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', '2024-12-31T23:59:59Z'], /WMM2025/);
  });

  it('bad input: missing, non-numeric, out of range, unknown option, garbage or impossible dates', async () => {
    await expectUsageError(['declination', '--lat', '10', '--date', '2027-01-01'], /missing --lon/);
    await expectUsageError(['declination', '--lat', 'ten', '--lon', '10', '--date', '2027-01-01'], /--lat must be a number/);
    await expectUsageError(['declination', '--lat', '95', '--lon', '10', '--date', '2027-01-01'], /--lat must be in \[-90, 90\]°/);
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', '2027-01-01', '--year', '2027'], /unknown option --year/);
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', 'July 2 2027'], /--date must be an ISO 8601/);
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', '2027-02-29'], /not a real date/);
  });
});
