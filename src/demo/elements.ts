/**
 * Invented demonstration satellites for the planner, tests and screenshots. Neither exists: the catalogue
 * numbers (99001, 99002) and international designators (2026-990A/B) were made up for Glintmark.
 *
 * GLINT-A: near-circular (e = 0.000115, ω = 90°, a frozen-orbit-like choice), about 693 km high,
 *   inclination 98.1838°, mean motion 14.59198740 rev/day, epoch 2026-11-28T12:00Z. The inclination and mean
 *   motion were tuned against satellite.js 7.1.0's SGP4 secular rates so that the node precesses 360° per
 *   365.2422 days (sun-synchronous) and the satellite makes 175 nodal revolutions in 12 days: an exact
 *   12-day repeat ground track (test/core/orbit/demo-elements.test.ts checks both rates).
 * GLINT-B: the same orbit with mean anomaly 180°, half a revolution behind — a 6-day combined revisit.
 * Checksums are valid; the same text is in test/fixtures/orbit/glint-a.tle.
 */

export const DEMO_SATELLITE_NAME = 'GLINT-A';
export const DEMO_SATELLITE_B_NAME = 'GLINT-B';

/** Repeat cycle the elements were tuned for, days. */
export const DEMO_REPEAT_DAYS = 12;

/** GLINT-A as a three-line element set (name line + two data lines), LF line ends. */
export const DEMO_TLE = [
  DEMO_SATELLITE_NAME,
  '1 99001U 26990A   26332.50000000  .00000050  00000-0  10000-4 0  9996',
  '2 99001  98.1838 333.0000 0001150  90.0000   0.0000 14.59198740    12',
  '',
].join('\n');

/** GLINT-B in the same form. */
export const DEMO_TLE_B = [
  DEMO_SATELLITE_B_NAME,
  '1 99002U 26990B   26332.50000000  .00000050  00000-0  10000-4 0  9997',
  '2 99002  98.1838 333.0000 0001150  90.0000 180.0000 14.59198740    12',
  '',
].join('\n');
