import { describe, expect, it } from 'vitest';
import { sunAzimuthRateDegPerMin, sunPosition } from '../../../src/core/sun/sunPosition.ts';
import spa from '../../fixtures/sun/spa_example.json';

const TOL_DEG = 0.01; // against the SPA worked example (SPA claims ±0.0003°; astronomy-engine ±1′ stated)
const ORACLE_TOL_DEG = 0.05; // against Meeus' low-accuracy sun (≈0.01° in longitude, no parallax, UT for TT)
const d2r = Math.PI / 180;
const r2d = 180 / Math.PI;
const sind = (x: number) => Math.sin(x * d2r);
const cosd = (x: number) => Math.cos(x * d2r);

/**
 * Independent oracle: the low-accuracy solar coordinates of Meeus, "Astronomical Algorithms", 2nd ed. (1998),
 * ch. 25 (eqs. 25.2–25.8, apparent longitude with the Ω term), mean obliquity eq. 22.2 corrected by 0.00256° cos Ω,
 * nutation in longitude from the low-accuracy terms of ch. 22, Greenwich sidereal time eq. 12.4 plus the equation
 * of the equinoxes, and the horizontal transformation eqs. 13.5–13.6. UT is used for TT (ΔT ≈ 69 s shifts the sun's
 * longitude by < 0.001°); parallax (≤ 0.0024°) and refraction are left out. Written here, not taken from the module.
 */
function meeusSun(latDeg: number, lonDeg: number, timeMs: number): { azimuthDeg: number; elevationDeg: number } {
  const jd = timeMs / 86_400_000 + 2_440_587.5;
  const T = (jd - 2_451_545) / 36_525;
  const L0 = 280.46646 + 36000.76983 * T + 0.0003032 * T * T;
  const M = 357.52911 + 35999.05029 * T - 0.0001537 * T * T;
  const C = (1.914602 - 0.004817 * T - 0.000014 * T * T) * sind(M) + (0.019993 - 0.000101 * T) * sind(2 * M) + 0.000289 * sind(3 * M);
  const omega = 125.04 - 1934.136 * T;
  const lambda = L0 + C - 0.00569 - 0.00478 * sind(omega);
  const eps0 = 23 + 26 / 60 + (21.448 - 46.815 * T - 0.00059 * T * T + 0.001813 * T ** 3) / 3600;
  const eps = eps0 + 0.00256 * cosd(omega);
  const ra = Math.atan2(cosd(eps) * sind(lambda), cosd(lambda)) * r2d;
  const dec = Math.asin(sind(eps) * sind(lambda)) * r2d;
  const Lm = 218.3165 + 481267.8813 * T; // moon's mean longitude
  const Ls = 280.4665 + 36000.7698 * T; // sun's mean longitude
  const dPsiDeg = (-17.2 * sind(omega) - 1.32 * sind(2 * Ls) - 0.23 * sind(2 * Lm) + 0.21 * sind(2 * omega)) / 3600;
  const gmst = 280.46061837 + 360.98564736629 * (jd - 2_451_545) + 0.000387933 * T * T - T ** 3 / 38_710_000;
  const H = gmst + dPsiDeg * cosd(eps) + lonDeg - ra;
  // Meeus eq. 13.5 measures azimuth from the south; add 180° for from-north.
  const azSouth = Math.atan2(sind(H), cosd(H) * sind(latDeg) - Math.tan(dec * d2r) * cosd(latDeg)) * r2d;
  const el = Math.asin(sind(latDeg) * sind(dec) + cosd(latDeg) * cosd(dec) * cosd(H)) * r2d;
  return { azimuthDeg: (((azSouth + 180) % 360) + 360) % 360, elevationDeg: el };
}

const unit = (azDeg: number, elDeg: number) => [sind(azDeg) * cosd(elDeg), cosd(azDeg) * cosd(elDeg), sind(elDeg)];
const separationDeg = (a: number[], b: number[]) =>
  Math.atan2(Math.hypot(a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]), a[0] * b[0] + a[1] * b[1] + a[2] * b[2]) * r2d;
const azDiffDeg = (a: number, b: number) => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

describe('sunPosition against the NREL SPA worked example (Reda & Andreas 2004; NREL/TP-560-34302 Table A5.1)', () => {
  const q = { latDeg: spa.inputs.lat_deg, lonDeg: spa.inputs.lon_deg, heightM: spa.inputs.elevation_m, timeMs: Date.parse(spa.inputs.utc) };

  it('azimuth 194.34024° within 0.01°', () => {
    expect(azDiffDeg(sunPosition(q).azimuthDeg, spa.outputs.topocentric_azimuth_deg_from_north_eastward)).toBeLessThan(TOL_DEG);
  });

  it('airless elevation against the SPA topocentric e0 = 39.872046° within 0.01°', () => {
    const p = sunPosition({ ...q, refraction: false });
    expect(Math.abs(p.elevationDeg - spa.intermediate.e0_deg)).toBeLessThan(TOL_DEG);
    expect(Math.abs(p.zenithDeg - (90 - spa.intermediate.e0_deg))).toBeLessThan(TOL_DEG);
  });

  it('refracted zenith against the published 50.11162° within 0.01°', () => {
    // The SPA refracts for 820 mbar and 11 °C (Δe = 0.016332°); astronomy-engine uses a standard atmosphere
    // (Saemundsson, ≈ 0.0202° here), so the refracted zenith sits ≈ 0.004° below the SPA's. Both inside 0.01°.
    const p = sunPosition(q);
    expect(Math.abs(p.zenithDeg - spa.outputs.topocentric_zenith_deg)).toBeLessThan(TOL_DEG);
    const airless = sunPosition({ ...q, refraction: false });
    expect(p.elevationDeg - airless.elevationDeg).toBeCloseTo(0.0202, 3);
  });
});

describe('sunPosition: a year, daily, against an independent low-accuracy formula (Meeus 1998, ch. 25)', () => {
  // Invented sites: Marrowby Fen (mid-north), Kestrel Flats (southern), Tallow Cay (tropical; the sun passes overhead).
  const sites = [
    { name: 'Marrowby Fen', latDeg: 52.61, lonDeg: 0.27 },
    { name: 'Kestrel Flats', latDeg: -33.92, lonDeg: 18.42 },
    { name: 'Tallow Cay', latDeg: 12.3, lonDeg: -81.7 },
  ];

  it.each(sites)('$name: every day of 2026 at four times, direction within 0.05°', (site) => {
    let worstSepDeg = 0;
    let worstAzDeg = 0;
    for (let day = 0; day < 365; day++) {
      for (const hourUtc of [3, 9, 15, 21]) {
        const timeMs = Date.UTC(2026, 0, 1 + day, hourUtc, 17);
        const p = sunPosition({ latDeg: site.latDeg, lonDeg: site.lonDeg, timeMs, refraction: false });
        const o = meeusSun(site.latDeg, site.lonDeg, timeMs);
        worstSepDeg = Math.max(worstSepDeg, separationDeg(unit(p.azimuthDeg, p.elevationDeg), unit(o.azimuthDeg, o.elevationDeg)));
        // Azimuth alone is ill-conditioned near the zenith: compare it where the sun is below 80°.
        if (p.elevationDeg < 80) worstAzDeg = Math.max(worstAzDeg, azDiffDeg(p.azimuthDeg, o.azimuthDeg));
      }
    }
    expect(worstSepDeg).toBeLessThan(ORACLE_TOL_DEG);
    expect(worstAzDeg).toBeLessThan(ORACLE_TOL_DEG);
  });
});

describe('sunPosition: invariants and bad input', () => {
  it('azimuth in [0, 360), zenith = 90 − elevation, refraction only raises the sun; longitude 360-wrapped', () => {
    for (let h = 0; h < 24; h++) {
      const q = { latDeg: 52.61, lonDeg: 0.27, timeMs: Date.UTC(2027, 5, 21, h) };
      const p = sunPosition(q);
      const a = sunPosition({ ...q, refraction: false });
      expect(p.azimuthDeg).toBeGreaterThanOrEqual(0);
      expect(p.azimuthDeg).toBeLessThan(360);
      expect(p.zenithDeg).toBeCloseTo(90 - p.elevationDeg, 12);
      expect(p.elevationDeg).toBeGreaterThanOrEqual(a.elevationDeg);
      expect(p.azimuthDeg).toBeCloseTo(a.azimuthDeg, 9);
    }
    const west = sunPosition({ latDeg: 10, lonDeg: -100, timeMs: Date.UTC(2027, 0, 1, 18) });
    const east = sunPosition({ latDeg: 10, lonDeg: 260, timeMs: Date.UTC(2027, 0, 1, 18) });
    expect(east.azimuthDeg).toBeCloseTo(west.azimuthDeg, 9);
  });

  it('azimuth rate: clockwise in the northern mid-latitudes, faster near noon than in the morning', () => {
    const site = { latDeg: 52.61, lonDeg: 0.27 };
    const noon = sunAzimuthRateDegPerMin({ ...site, timeMs: Date.UTC(2027, 5, 21, 12) });
    const morning = sunAzimuthRateDegPerMin({ ...site, timeMs: Date.UTC(2027, 5, 21, 6) });
    expect(noon).toBeGreaterThan(0.25);
    expect(morning).toBeGreaterThan(0);
    expect(morning).toBeLessThan(noon);
    // Agrees with a plain 10-minute difference of azimuths.
    const t = Date.UTC(2027, 5, 21, 12);
    const a0 = sunPosition({ ...site, timeMs: t - 300_000 }).azimuthDeg;
    const a1 = sunPosition({ ...site, timeMs: t + 300_000 }).azimuthDeg;
    expect(Math.abs(noon - (a1 - a0) / 10)).toBeLessThan(0.01);
  });

  it('rejects bad input, naming it', () => {
    const q = { latDeg: 10, lonDeg: 10, timeMs: 0 };
    expect(() => sunPosition({ ...q, latDeg: 100 })).toThrow(/latDeg must be in \[-90, 90\]/);
    expect(() => sunPosition({ ...q, lonDeg: -181 })).toThrow(/lonDeg/);
    expect(() => sunPosition({ ...q, timeMs: NaN })).toThrow(/timeMs/);
    expect(() => sunPosition({ ...q, heightM: Infinity })).toThrow(/heightM/);
  });
});
