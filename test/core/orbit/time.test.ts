import { describe, it, expect } from 'vitest';
import { parseIsoUtcMs } from '../../../src/core/orbit/time.ts';

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
