import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { getMeta, readBackup, recordBackupSaved, siteRepo } from '../../../src/data/index.ts';
import { backupDue, localDayKey, maybeAutoBackup, newestChangeAtMs, NOT_BACKED_UP_MESSAGE } from '../../../src/ui/pages/settings/autoBackup.ts';
import { BY, memorySaver, site, T0_MS, useTestDb } from './helpers.ts';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;
/** Days as a UTC calendar, so the tests do not depend on the machine's time zone. */
const utcDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);

describe('when a backup is due', () => {
  it('follows the rule: not twice a day, only after changes, and never for an empty logbook', () => {
    const due = (last: number | undefined, newest: number | null, now: number) => backupDue(last, newest, now, utcDay);
    expect(due(T0_MS - HOUR_MS, T0_MS, T0_MS)).toEqual({ kind: 'not-needed', reason: 'backed-up-today' });
    expect(due(undefined, null, T0_MS)).toEqual({ kind: 'not-needed', reason: 'no-records' });
    expect(due(T0_MS - DAY_MS, T0_MS - DAY_MS, T0_MS)).toEqual({ kind: 'not-needed', reason: 'no-changes' });
    expect(due(T0_MS - DAY_MS, T0_MS - DAY_MS + 1, T0_MS)).toBe('due');
    expect(due(undefined, T0_MS, T0_MS)).toBe('due');
  });

  it('the local day key is the phone calendar date', () => {
    const d = new Date(2027, 6, 2, 23, 59);
    expect(localDayKey(d.getTime())).toBe('2027-07-02');
    expect(localDayKey(d.getTime() + 60_000)).toBe('2027-07-03');
  });
});

describe('maybeAutoBackup', () => {
  const db = useTestDb();
  const deps = (native: boolean, saver = memorySaver(), nowMs = T0_MS) => ({ native, save: saver.save, nowMs, dayKey: utcDay, appVersion: '0.1.0' });

  it('on a phone: writes one backup silently after a day with changes, then not again that day', async () => {
    await siteRepo.create(db(), site('MF-01'), { ...BY, nowMs: T0_MS - DAY_MS });
    const saver = memorySaver();
    const r = await maybeAutoBackup(db(), deps(true, saver));
    expect(r).toMatchObject({ kind: 'saved', backup: { fileName: 'glintmark-backup-20270702-1200Z.glintmark.zip', atMs: T0_MS } });
    expect(saver.files.map((f) => f.askPermission)).toEqual([false]);
    expect((await readBackup(saver.files[0].blob)).doc.tables.sites).toHaveLength(1);
    expect(await getMeta(db(), 'lastBackupAtMs')).toBe(T0_MS);
    await siteRepo.create(db(), site('MF-02'), { ...BY, nowMs: T0_MS + HOUR_MS });
    expect(await maybeAutoBackup(db(), deps(true, saver, T0_MS + 2 * HOUR_MS))).toEqual({ kind: 'not-needed', reason: 'backed-up-today' });
    // Next day: the change after the last backup makes one due again.
    expect((await maybeAutoBackup(db(), deps(true, saver, T0_MS + DAY_MS))).kind).toBe('saved');
    expect(saver.files).toHaveLength(2);
  });

  it('in a browser: never downloads by itself, asks the crew instead', async () => {
    await siteRepo.create(db(), site('MF-01'), { ...BY, nowMs: T0_MS });
    const saver = memorySaver();
    expect(await maybeAutoBackup(db(), deps(false, saver))).toEqual({ kind: 'download-needed', message: NOT_BACKED_UP_MESSAGE });
    expect(NOT_BACKED_UP_MESSAGE).toBe("Today's work is not backed up: download a backup");
    expect(saver.files).toEqual([]);
    expect(await getMeta(db(), 'lastBackupAtMs')).toBeUndefined();
  });

  it('nothing to do: no records, only demo records, or no change since the last backup', async () => {
    const saver = memorySaver();
    expect(await maybeAutoBackup(db(), deps(true, saver))).toEqual({ kind: 'not-needed', reason: 'no-records' });
    await siteRepo.create(db(), site('DEMO-1', { demo: true }), { ...BY, nowMs: T0_MS });
    expect(await maybeAutoBackup(db(), deps(true, saver))).toEqual({ kind: 'not-needed', reason: 'no-records' });
    await siteRepo.create(db(), site('MF-01'), { ...BY, nowMs: T0_MS - 2 * DAY_MS });
    await recordBackupSaved(db(), T0_MS - DAY_MS);
    expect(await maybeAutoBackup(db(), deps(true, saver))).toEqual({ kind: 'not-needed', reason: 'no-changes' });
    expect(saver.files).toEqual([]);
  });

  it('a failed write is reported and the last backup time stays', async () => {
    await siteRepo.create(db(), site('MF-01'), { ...BY, nowMs: T0_MS });
    const r = await maybeAutoBackup(db(), deps(true, memorySaver('disk full')));
    expect(r).toEqual({ kind: 'failed', message: 'The automatic backup failed: disk full' });
    expect(await getMeta(db(), 'lastBackupAtMs')).toBeUndefined();
  });

  it('the newest change counts history and conflicts, not demo records', async () => {
    const s = await siteRepo.create(db(), site('MF-01'), { ...BY, nowMs: T0_MS });
    await siteRepo.update(db(), s.id, { notes: 'later' }, { ...BY, nowMs: T0_MS + 5 });
    await siteRepo.create(db(), site('DEMO-1', { demo: true }), { ...BY, nowMs: T0_MS + 50 });
    const { exportBackup } = await import('../../../src/data/index.ts');
    const doc = await exportBackup(db(), { appVersion: '0.1.0' });
    expect(newestChangeAtMs(doc)).toBe(T0_MS + 5);
    doc.tables.conflicts.push({ id: crypto.randomUUID(), table: 'sites', recordId: s.id, reason: 'x', kept: 'local', other: {}, otherRevisions: [], detectedAtMs: T0_MS + 7, resolvedAtMs: T0_MS + 9 });
    expect(newestChangeAtMs(doc)).toBe(T0_MS + 9);
  });
});
