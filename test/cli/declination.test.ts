import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { expectUsageError, runCli } from './run.ts';

describe('glintmark declination', () => {
  // WMM2025 report Table 6 (Chulliat et al. 2025, "The US/UK World Magnetic Model for 2025-2030: Technical Report",
  // doi:10.25923/prbc-s316), copied in test/fixtures/magnetic/WMM2025_report_table6.txt. Angles are printed to 0.01°
  // and F to 0.1 nT, so half a unit of the last digit plus float slack.
  const TABLE_TOL_DEG = 0.0051;
  const TABLE_TOL_NT = 0.051;
  const rows = readFileSync(new URL('../fixtures/magnetic/WMM2025_report_table6.txt', import.meta.url), 'utf8')
    .split('\n')
    .filter((l) => l.trim() && !l.startsWith('#'))
    .map((l) => l.trim().split(/\s+/).map(Number))
    .map((v) => ({ year: v[0], hKm: v[1], lat: v[2], lon: v[3], F: v[8], I: v[9], D: v[10] }));
  // 2025.0 is 2025-01-01T00:00Z and 2027.5 is 2027-07-02T12:00Z (both non-leap years).
  const dateOf = (year: number) => (year === 2025 ? '2025-01-01T00:00:00Z' : '2027-07-02T12:00:00Z');

  it('has the 12 rows of Table 6 to check against', () => {
    expect(rows).toHaveLength(12);
    expect(new Set(rows.map((r) => r.year))).toEqual(new Set([2025, 2027.5]));
  });

  it.each(rows.map((r, i) => [i + 1, r] as const))('prints { declinationDeg, inclinationDeg, totalIntensityNt, model } matching Table 6 row %i', async (_i, row) => {
    const r = await runCli(['declination', '--lat', String(row.lat), '--lon', String(row.lon), '--height', String(row.hKm * 1000), '--date', dateOf(row.year), '--json']);
    expect(r.code).toBe(0);
    const j = r.json() as Record<string, unknown>;
    expect(Object.keys(j).sort()).toEqual(['declinationDeg', 'inclinationDeg', 'model', 'totalIntensityNt']);
    expect(j.model).toBe('WMM2025');
    expect(Math.abs((j.declinationDeg as number) - row.D)).toBeLessThan(TABLE_TOL_DEG);
    expect(Math.abs((j.inclinationDeg as number) - row.I)).toBeLessThan(TABLE_TOL_DEG);
    expect(Math.abs((j.totalIntensityNt as number) - row.F)).toBeLessThan(TABLE_TOL_NT);
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
    await expectUsageError(['declination', '--lat', '95', '--lon', '10', '--date', '2027-01-01'], /--lat must be in \[-90, 90\] degrees/);
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', '2027-01-01', '--year', '2027'], /unknown option --year/);
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', 'July 2 2027'], /--date must be an ISO 8601/);
    await expectUsageError(['declination', '--lat', '10', '--lon', '10', '--date', '2027-02-29'], /not a real date/);
  });
});
