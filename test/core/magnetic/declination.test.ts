import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import geomagnetism from 'geomagnetism';
import {
  WMM2025_END_MS,
  WMM2025_START_MS,
  declination,
  decimalYearFromTimeMs,
  fieldDisturbance,
} from '../../../src/core/magnetic/declination.ts';
import example from '../../fixtures/magnetic/WMM2025_numerical_example.json';

// Table 6 prints angles to 0.01° and components to 0.1 nT: half a unit of the last digit plus float slack.
const TABLE_TOL_DEG = 0.0051;
const TABLE_TOL_NT = 0.051;
// Tables 3a/3b are printed to ~1e-10 nT and ~1e-10 rad; the package reproduces them to ~1e-6 nT.
const EXAMPLE_TOL_NT = 1e-5;
const EXAMPLE_TOL_DEG = 1e-7;

const R2D = 180 / Math.PI;

/** Decimal year → instant, for the whole-and-half years used by the report (2025.0, 2027.5 are non-leap). */
function instantOfDecimalYear(y: number): number {
  const year = Math.floor(y);
  const start = Date.UTC(year, 0, 1);
  return start + (y - year) * (Date.UTC(year + 1, 0, 1) - start);
}

interface Row {
  year: number;
  hKm: number;
  lat: number;
  lon: number;
  H: number;
  F: number;
  I: number;
  D: number;
}
// Columns: year h_km lat lon X Y Z H F I D GV … (see the file header).
const table6: Row[] = readFileSync(new URL('../../fixtures/magnetic/WMM2025_report_table6.txt', import.meta.url), 'utf8')
  .split('\n')
  .filter((l) => l.trim() && !l.startsWith('#'))
  .map((l) => {
    const v = l.trim().split(/\s+/).map(Number);
    return { year: v[0], hKm: v[1], lat: v[2], lon: v[3], H: v[7], F: v[8], I: v[9], D: v[10] };
  });

function field(latDeg: number, lonDeg: number, heightM: number, timeMs: number) {
  const r = declination({ latDeg, lonDeg, heightM, timeMs });
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

describe('decimal year', () => {
  it('2027.5 = 2027-07-02T12:00Z; leap years counted (2028.5 = 2028-07-02T00:00Z)', () => {
    expect(decimalYearFromTimeMs(Date.UTC(2027, 6, 2, 12))).toBe(2027.5);
    expect(decimalYearFromTimeMs(Date.UTC(2028, 6, 2, 0))).toBe(2028.5);
    expect(decimalYearFromTimeMs(Date.UTC(2025, 0, 1))).toBe(2025);
    expect(instantOfDecimalYear(2027.5)).toBe(Date.parse('2027-07-02T12:00:00Z'));
  });
});

describe('declination: WMM2025 report (Chulliat et al. 2025, doi:10.25923/prbc-s316)', () => {
  it('has all 12 rows of Table 6', () => {
    expect(table6).toHaveLength(12);
  });

  it.each(table6.map((r, i) => [i + 1, r] as const))('Table 6 row %i: D, I, F, H within the table rounding', (_i, r) => {
    const f = field(r.lat, r.lon, r.hKm * 1000, instantOfDecimalYear(r.year));
    expect(Math.abs(f.declinationDeg - r.D)).toBeLessThan(TABLE_TOL_DEG);
    expect(Math.abs(f.inclinationDeg - r.I)).toBeLessThan(TABLE_TOL_DEG);
    expect(Math.abs(f.totalIntensityNt - r.F)).toBeLessThan(TABLE_TOL_NT);
    expect(Math.abs(f.horizontalIntensityNt - r.H)).toBeLessThan(TABLE_TOL_NT);
    expect(f.model).toBe('WMM2025');
  });

  it('Tables 3a/3b numerical example (2027.5, 100 km, 80° S, 120° W): H, F, D, I', () => {
    const t = instantOfDecimalYear(example.year);
    const f = field(example.lat_deg, example.lon_deg, example.height_km_above_WGS84_ellipsoid * 1000, t);
    expect(Math.abs(f.horizontalIntensityNt - example.h_nt)).toBeLessThan(EXAMPLE_TOL_NT);
    expect(Math.abs(f.totalIntensityNt - example.f_nt)).toBeLessThan(EXAMPLE_TOL_NT);
    expect(Math.abs(f.declinationDeg - example.d_rad * R2D)).toBeLessThan(EXAMPLE_TOL_DEG);
    expect(Math.abs(f.inclinationDeg - example.i_rad * R2D)).toBeLessThan(EXAMPLE_TOL_DEG);
  });

  it('covers the whole 2025.0–2030.0 window, including December 2029 where the package alone refuses', () => {
    const t = Date.parse('2029-12-15T00:00:00Z');
    expect(() => geomagnetism.model(new Date(t))).toThrow();
    const late = field(52.6, 0.3, 0, t);
    const earlier = field(52.6, 0.3, 0, Date.parse('2029-06-15T00:00:00Z'));
    // The declination drifts slowly (tenths of a degree a year at most here): close, but not equal.
    expect(Math.abs(late.declinationDeg - earlier.declinationDeg)).toBeLessThan(0.2);
    expect(late.declinationDeg).not.toBe(earlier.declinationDeg);
  });

  it('outside 2025-01-01 … 2030-01-01 returns outside-model-dates with a plain message', () => {
    for (const timeMs of [WMM2025_START_MS - 1, WMM2025_END_MS, Date.parse('2031-05-01T00:00:00Z')]) {
      const r = declination({ latDeg: 10, lonDeg: 20, heightM: 0, timeMs });
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      expect(r.error.kind).toBe('outside-model-dates');
      expect(r.error.message).toMatch(/valid from 2025-01-01 to 2030-01-01/);
    }
    expect(declination({ latDeg: 10, lonDeg: 20, heightM: 0, timeMs: WMM2025_START_MS }).ok).toBe(true);
  });

  it('rejects bad input, naming it', () => {
    const q = { latDeg: 10, lonDeg: 20, heightM: 0, timeMs: WMM2025_START_MS };
    expect(() => declination({ ...q, latDeg: 91 })).toThrow(/latDeg must be in \[-90, 90\]/);
    expect(() => declination({ ...q, lonDeg: NaN })).toThrow(/lonDeg/);
    expect(() => declination({ ...q, heightM: 1e7 })).toThrow(/heightM/);
    expect(() => declination({ ...q, timeMs: Infinity })).toThrow(/timeMs/);
  });
});

describe('fieldDisturbance', () => {
  it('within tolerance: not disturbed', () => {
    const d = fieldDisturbance(50_500, 50_000);
    expect(d.ratio).toBeCloseTo(1.01, 12);
    expect(d.disturbed).toBe(false);
  });

  it('far off (e.g. a vehicle nearby): disturbed, and the message names the likely cause and the way out', () => {
    const d = fieldDisturbance(62_000, 50_000);
    expect(d.disturbed).toBe(true);
    expect(d.message).toMatch(/\+24 %/);
    expect(d.message).toMatch(/disturbed/);
    expect(fieldDisturbance(40_000, 50_000).disturbed).toBe(true);
    expect(fieldDisturbance(54_000, 50_000, 5).disturbed).toBe(true);
  });

  it('rejects bad input', () => {
    expect(() => fieldDisturbance(-1, 50_000)).toThrow(/measuredTotalNt/);
    expect(() => fieldDisturbance(50_000, 0)).toThrow(/modelTotalNt must be greater than 0/);
    expect(() => fieldDisturbance(50_000, 50_000, 0)).toThrow(/tolerancePct/);
  });
});
