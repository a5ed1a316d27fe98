import { describe, expect, it } from 'vitest';
import { estimateLine, formatBytes, lastBackupLine, persistenceLine } from '../../../src/ui/pages/settings/storageView.ts';

const T0_MS = Date.UTC(2027, 6, 2, 12, 0);
const DAY_MS = 86_400_000;

describe('storage lines', () => {
  it('persistence: each stored answer, and nothing stored', () => {
    expect(persistenceLine({ result: 'granted', atMs: T0_MS })).toEqual({ level: 'ok', text: "Storage is persistent: the phone will not clear Glintmark's records to free space (asked 2027-07-02 12:00 UTC)." });
    expect(persistenceLine({ result: 'denied', atMs: T0_MS }).level).toBe('warn');
    expect(persistenceLine({ result: 'denied' }).text).toMatch(/^Storage is not persistent: .* Make backups often\.$/);
    expect(persistenceLine({ result: 'unsupported', atMs: T0_MS }).level).toBe('warn');
    for (const nothing of [undefined, null, 'granted', { result: 'maybe' }]) expect(persistenceLine(nothing).text).toBe('Persistent storage has not been asked for yet.');
  });

  it('estimate: used of quota with a warning above the threshold, or no estimate', () => {
    expect(estimateLine({ usageBytes: 12_300_000, quotaBytes: 2_000_000_000, usedFraction: 0.00615, level: 'ok' })).toEqual({ level: 'ok', text: 'Using 12.3 MB of about 2.0 GB (0.6 %).' });
    expect(estimateLine({ usageBytes: 74_000, quotaBytes: 10_700_000_000, usedFraction: 6.9e-6, level: 'ok' }).text).toBe('Using 74 kB of about 10.7 GB (under 0.1 %).');
    const warn = estimateLine({ usageBytes: 850_000_000, quotaBytes: 1_000_000_000, usedFraction: 0.85, level: 'warn' });
    expect(warn.level).toBe('warn');
    expect(warn.text).toBe('Using 850.0 MB of about 1.0 GB (85.0 %). Storage is nearly full: make a backup, then remove photos you no longer need.');
    expect(estimateLine({ usageBytes: null, quotaBytes: null, usedFraction: null, level: 'unknown' }).text).toBe('This browser does not say how much storage is used.');
  });

  it('sizes with SI prefixes', () => {
    expect([0, 999, 1000, 999_499, 1_000_000, 2.5e9, -1, NaN].map(formatBytes)).toEqual(['0 bytes', '999 bytes', '1 kB', '999 kB', '1.0 MB', '2.5 GB', '—', '—']);
  });

  it('last backup: none, today, days ago (a week or more is a warning)', () => {
    expect(lastBackupLine(undefined, T0_MS)).toEqual({ level: 'warn', text: 'No backup has been saved from this phone yet.' });
    expect(lastBackupLine(T0_MS, T0_MS + 3_600_000).text).toBe('Last backup saved 2027-07-02 12:00 UTC (less than a day ago).');
    expect(lastBackupLine(T0_MS, T0_MS + DAY_MS).text).toMatch(/\(1 day ago\)/);
    expect(lastBackupLine(T0_MS, T0_MS + 6 * DAY_MS + 1).level).toBe('ok');
    expect(lastBackupLine(T0_MS, T0_MS + 7 * DAY_MS)).toEqual({ level: 'warn', text: 'Last backup saved 2027-07-02 12:00 UTC (7 days ago).' });
  });
});
