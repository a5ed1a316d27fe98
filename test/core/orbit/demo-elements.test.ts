import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { twoline2satrec } from 'satellite.js';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { DEMO_REPEAT_DAYS, DEMO_SATELLITE_B_NAME, DEMO_SATELLITE_NAME, DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';

describe('invented demo satellites', () => {
  it('parse cleanly with valid checksums', () => {
    const r = parseTle(DEMO_TLE + DEMO_TLE_B);
    expect(r.errors).toEqual([]);
    expect(r.sets.map((s) => s.name)).toEqual([DEMO_SATELLITE_NAME, DEMO_SATELLITE_B_NAME]);
    expect(new Date(r.sets[0].epochMs).toISOString()).toBe('2026-11-28T12:00:00.000Z');
  });

  it('the fixture file holds the same GLINT-A elements', () => {
    const file = readFileSync(new URL('../../fixtures/orbit/glint-a.tle', import.meta.url), 'utf8');
    expect(file).toBe(DEMO_TLE);
  });

  it('are sun-synchronous and repeat after 175 nodal revolutions in 12 days (SGP4 secular rates)', () => {
    // satrec.nodedot, mdot, argpdot: secular rates of node, mean anomaly and perigee, rad/min (Vallado et al. 2006).
    const lines = DEMO_TLE.trim().split('\n');
    const s = twoline2satrec(lines[1], lines[2]);
    const sunRateRadPerMin = (2 * Math.PI) / (365.2422 * 1440); // mean sun, one turn per tropical year
    expect(Math.abs(s.nodedot / sunRateRadPerMin - 1)).toBeLessThan(1e-5);
    // Nodal rate relative to Earth's node-relative rotation: 175 revolutions per 12 mean solar days.
    const revPerDay = ((s.mdot + s.argpdot) * 1440) / (2 * Math.PI);
    expect(Math.abs(revPerDay * DEMO_REPEAT_DAYS - 175)).toBeLessThan(1e-5);
  });
});
