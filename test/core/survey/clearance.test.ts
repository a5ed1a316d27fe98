import { describe, expect, it } from 'vitest';
import { clearanceForTracks } from '../../../src/core/survey/clearance.ts';

// Invented sweeps with answers worked by hand: LOS elevation = 90° − incidence; sector = azimuth ± (half beam + tolerance).
const sweep = [
  { azimuthDeg: 95, elevationDeg: 12, label: 'oak' },
  { azimuthDeg: 110, elevationDeg: 61, label: 'mast' },
  { azimuthDeg: 270, elevationDeg: 20, label: 'barn roof' },
  { azimuthDeg: 290, elevationDeg: 8, label: 'hedge' },
  { azimuthDeg: 355, elevationDeg: 30, label: 'poplar' },
];

describe('clearance', () => {
  it('ascending track at 280°, incidence 40° (LOS 50°): barn at 20° decides → clear by 30.0°', () => {
    const [v] = clearanceForTracks(sweep, [{ name: 'asc', incidenceDeg: 40, azimuthToSatelliteDeg: 280 }], 20, 2);
    expect(v.losElevationDeg).toBe(50);
    expect(v.deciding?.label).toBe('barn roof');
    expect(v.marginDeg).toBeCloseTo(30, 12);
    expect(v.text).toMatch(/^clear by 30\.0° \(barn roof/);
  });
  it('descending track at 100°, incidence 35° (LOS 55°): the mast at 61° (10° off, inside ±22°) → blocked by 6.0°', () => {
    const [v] = clearanceForTracks(sweep, [{ name: 'desc', incidenceDeg: 35, azimuthToSatelliteDeg: 100 }], 20, 2);
    expect(v.verdict).toBe('blocked');
    expect(v.deciding?.label).toBe('mast');
    expect(v.marginDeg).toBeCloseTo(-6, 12);
    expect(v.text).toMatch(/^blocked by 6\.0°/);
  });
  it('the sector wraps through north, and an obstacle just outside it does not count', () => {
    // Azimuth 10°, ±(5 + 1)°: poplar at 355° is 15° off → outside; nothing inside → level horizon, clear by 45°.
    const [a] = clearanceForTracks(sweep, [{ name: 'a', incidenceDeg: 45, azimuthToSatelliteDeg: 10 }], 5, 1);
    expect(a.deciding).toBeNull();
    expect(a.marginDeg).toBeCloseTo(45, 12);
    // Azimuth 5°, ±(10 + 0)°: poplar 10° off → inside, 30° vs LOS 30° → margin 0 → blocked (grazing counts as blocked).
    const [b] = clearanceForTracks(sweep, [{ name: 'b', incidenceDeg: 60, azimuthToSatelliteDeg: 5 }], 10, 0);
    expect(b.deciding?.label).toBe('poplar');
    expect(b.verdict).toBe('blocked');
  });
  it('refuses bad sightings and angles', () => {
    expect(() => clearanceForTracks([{ azimuthDeg: 10, elevationDeg: 95 }], [], 10, 0)).toThrow(/sighting 1 elevation/);
    expect(() => clearanceForTracks([], [{ name: 't', incidenceDeg: 95, azimuthToSatelliteDeg: 0 }], 10, 0)).toThrow(/t incidence/);
  });
});
