/**
 * Site time. Expected zones and offsets are facts of the IANA time zone database (tzdata), written out here:
 * Europe/London is UTC+0 in winter and UTC+1 (BST) from the last Sunday of March to the last Sunday of October;
 * America/Los_Angeles is UTC−8 in winter; Asia/Kolkata is UTC+5:30 all year; Australia/Adelaide is UTC+10:30 in
 * January (daylight time). The zone of a place is where it is: Cambridge (UK), Los Angeles, Mumbai, Adelaide.
 */
import { describe, expect, it } from 'vitest';
import { fmtSiteTime, fmtUtcAndSite, offsetName, parseSiteLocalMs, siteDay, siteMinuteText, siteTimeZone, zoneOffsetMin } from '../../src/ui/siteTime.ts';

describe('site time zone from coordinates', () => {
  it('finds the zone of known places offline', () => {
    expect(siteTimeZone(52.2, 0.12)).toBe('Europe/London');
    expect(siteTimeZone(34.05, -118.25)).toBe('America/Los_Angeles');
    expect(siteTimeZone(19.07, 72.88)).toBe('Asia/Kolkata');
    expect(siteTimeZone(-34.93, 138.6)).toBe('Australia/Adelaide');
    expect(siteTimeZone(Number.NaN, 0)).toBeNull();
    expect(siteTimeZone(95, 0)).toBeNull();
  });
});

describe('formatting and typing in the site zone', () => {
  const winter = Date.UTC(2026, 11, 3, 5, 43); // 2026-12-03 05:43 UTC
  const summer = Date.UTC(2026, 5, 15, 10, 0);
  it('offsets follow tzdata', () => {
    expect(zoneOffsetMin(winter, 'Europe/London')).toBe(0);
    expect(zoneOffsetMin(summer, 'Europe/London')).toBe(60);
    expect(zoneOffsetMin(winter, 'America/Los_Angeles')).toBe(-480);
    expect(zoneOffsetMin(winter, 'Asia/Kolkata')).toBe(330);
    expect(zoneOffsetMin(Date.UTC(2027, 0, 10), 'Australia/Adelaide')).toBe(630);
    expect(offsetName(330)).toBe('GMT+5:30');
    expect(offsetName(-480)).toBe('GMT−8');
  });
  it('writes the instant with the zone named, UTC first', () => {
    expect(fmtSiteTime(summer, 'Europe/London')).toBe('Mon 2026-06-15 11:00 Europe/London (GMT+1)');
    expect(fmtUtcAndSite(winter, 'Asia/Kolkata')).toBe('2026-12-03 05:43 UTC · 2026-12-03 11:13 Asia/Kolkata (GMT+5:30)');
    expect(fmtUtcAndSite(winter, null)).toBe('2026-12-03 05:43 UTC');
  });
  it('groups by the site’s day, not UTC’s', () => {
    // 2026-12-03 05:43 UTC is still 2 December in Los Angeles (21:43).
    expect(siteDay(winter, 'America/Los_Angeles')).toBe('2026-12-02');
    expect(siteDay(winter, 'Europe/London')).toBe('2026-12-03');
  });
  it('reads a typed site time back to the same instant, across a summer-time change', () => {
    expect(parseSiteLocalMs('2026-06-15T11:00', 'Europe/London')).toBe(summer);
    expect(parseSiteLocalMs('2026-12-02T21:43', 'America/Los_Angeles')).toBe(winter);
    // 2026-03-29 is the UK change day: 00:30 is GMT, 03:00 is BST.
    expect(parseSiteLocalMs('2026-03-29T00:30', 'Europe/London')).toBe(Date.UTC(2026, 2, 29, 0, 30));
    expect(parseSiteLocalMs('2026-03-29T03:00', 'Europe/London')).toBe(Date.UTC(2026, 2, 29, 2, 0));
    expect(siteMinuteText(winter, 'Asia/Kolkata')).toBe('2026-12-03T11:13');
    expect(() => parseSiteLocalMs('2026-02-30T10:00', 'Europe/London')).toThrow(/not a real date/);
    expect(() => parseSiteLocalMs('tomorrow', 'Europe/London')).toThrow(RangeError);
  });
});
