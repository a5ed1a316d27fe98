import { describe, expect, it } from 'vitest';
import { fmtDistanceM, fmtLastVisit, fmtUtc, isoSecondsUtc, parseCrew, writtenBy } from '../../../src/ui/pages/logbook/words.ts';
import { T0_MS } from './helpers.ts';

const DAY_MS = 86_400_000;

describe('logbook words', () => {
  it('shows instants in UTC with the zone named', () => {
    expect(fmtUtc(T0_MS)).toBe('2027-07-02 12:00 UTC');
    expect(fmtUtc(null)).toBe('—');
    expect(isoSecondsUtc(T0_MS + 12_345)).toBe('2027-07-02T12:00:12Z');
  });
  it('says how long ago the last visit was, against the given now', () => {
    expect(fmtLastVisit(null, T0_MS)).toBe('never visited');
    expect(fmtLastVisit(T0_MS - 3600_000, T0_MS)).toBe('today (2027-07-02)');
    expect(fmtLastVisit(T0_MS - DAY_MS, T0_MS)).toBe('yesterday (2027-07-01)');
    expect(fmtLastVisit(T0_MS - 3 * DAY_MS, T0_MS)).toBe('3 days ago (2027-06-29)');
  });
  it('gives distances in m below 1 km and km above', () => {
    expect(fmtDistanceM(null)).toBe('—');
    expect(fmtDistanceM(849.6)).toBe('850 m');
    expect(fmtDistanceM(12_345)).toBe('12.3 km');
    expect(fmtDistanceM(240_400)).toBe('240 km');
  });
  it('splits a typed crew list on commas and semicolons and drops blanks', () => {
    expect(parseCrew(' Ann Lee, Bo ;; Cy ,')).toEqual(['Ann Lee', 'Bo', 'Cy']);
    expect(parseCrew('')).toEqual([]);
  });
  it('records writes by the Settings crew name, else the first crew member, else a placeholder', () => {
    expect(writtenBy('  Dee ', ['Ann'])).toBe('Dee');
    expect(writtenBy('', ['Ann', 'Bo'])).toBe('Ann');
    expect(writtenBy('', [])).toBe('crew (name not set)');
    expect(writtenBy('x'.repeat(100)).length).toBe(80);
  });
});
