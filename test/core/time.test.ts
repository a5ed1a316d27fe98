import { describe, it, expect } from 'vitest';
import { parseIsoUtcMs } from '../../src/core/time.ts';

describe('parseIsoUtcMs', () => {
  it.each([
    ['2026-12-01', Date.UTC(2026, 11, 1)],
    ['2026-12-01T06:30Z', Date.UTC(2026, 11, 1, 6, 30)],
    ['2026-12-01T06:30:15Z', Date.UTC(2026, 11, 1, 6, 30, 15)],
    ['2026-12-01T06:30:15.25Z', Date.UTC(2026, 11, 1, 6, 30, 15, 250)],
    ['2026-12-01T08:30+02:00', Date.UTC(2026, 11, 1, 6, 30)],
    ['2026-12-01T00:30-01:30', Date.UTC(2026, 11, 1, 2, 0)],
    ['2028-02-29', Date.UTC(2028, 1, 29)],
    [' 2026-12-01 ', Date.UTC(2026, 11, 1)],
  ])('reads %s', (text, ms) => {
    expect(parseIsoUtcMs(text)).toBe(ms);
  });

  it.each(['yesterday', 'Dec 1 2026', '2026-12-1', '2026/12/01', '20261201', '', '2026-12-01T06:30:00.Z', '2026-12-01 06:30Z'])(
    'rejects the loose form %j',
    (text) => {
      expect(() => parseIsoUtcMs(text, '--start')).toThrow(/--start must be an ISO 8601 date or time/);
    },
  );

  it('rejects a time without a zone', () => {
    expect(() => parseIsoUtcMs('2026-12-01T06:30', '--start')).toThrow(/no time zone; add Z for UTC/);
  });

  it.each(['2026-02-29', '2026-13-01', '2026-04-31', '2026-12-01T24:00Z', '2026-12-01T06:60Z', '2026-12-31T23:59:60Z'])(
    'rejects the impossible date %s',
    (text) => {
      expect(() => parseIsoUtcMs(text)).toThrow(/not a real date and time/);
    },
  );

  it('rejects an impossible offset', () => {
    expect(() => parseIsoUtcMs('2026-12-01T06:30+24:00')).toThrow(/impossible offset/);
  });
});

describe('parseIsoUtcMs: calendar and zone checks', () => {
  it('reads offsets with fractions and leap days', () => {
    expect(parseIsoUtcMs('2027-07-02T14:30:15.25+02:30')).toBe(Date.UTC(2027, 6, 2, 12, 0, 15, 250));
    expect(parseIsoUtcMs('2028-02-29T00:00:00-05:00')).toBe(Date.UTC(2028, 1, 29, 5));
  });
  it('rejects what Date.parse would guess at, naming the option', () => {
    for (const s of ['2027-02-30', '2027-13-01', '2027-07-02T24:00Z', '2027-07-02T12:60Z', '2027-07-02T12:00:60Z', '2027-07-02T12:00', '2027-7-2', '02/07/2027', '2027-07-02T12:00+25:00', '', 'now']) {
      expect(() => parseIsoUtcMs(s, '--t'), s).toThrow(/--t/);
    }
  });
  it('can require a time of day', () => {
    expect(() => parseIsoUtcMs('2027-07-02', '--time', { requireTime: true })).toThrow(/--time needs a time of day/);
  });
});
