import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { getMeta, readBackup, siteRepo } from '../../../src/data/index.ts';
import { confirmBackupSaved, saveFullBackup } from '../../../src/ui/pages/settings/backupActions.ts';
import { BY, memorySaver, site, T0_MS, useTestDb } from './helpers.ts';

describe('saveFullBackup', () => {
  const db = useTestDb();

  it('writes the backup archive under its dated name, then records the time', async () => {
    await siteRepo.create(db(), site('MF-01'), BY);
    const { save, files } = memorySaver();
    const r = await saveFullBackup(db(), { save, nowMs: T0_MS, appVersion: '9.9.9' });
    const name = 'glintmark-backup-20270702-1200Z.glintmark.zip';
    expect(r).toEqual({ ok: true, value: expect.objectContaining({ fileName: name, where: `Documents/${name}`, atMs: T0_MS, recorded: true }) });
    expect(r.ok && r.value.counts).toMatchObject({ sites: 1, revisions: 1, elements: 0 });
    expect(files).toHaveLength(1);
    const read = await readBackup(files[0].blob);
    expect(read.layout).toBe('archive');
    expect(read.doc).toMatchObject({ format: 'glintmark-backup', formatVersion: 2, exportedAtUtc: '2027-07-02T12:00:00.000Z', app: { version: '9.9.9', schemaVersion: 6 } });
    expect(await getMeta(db(), 'lastBackupAtMs')).toBe(T0_MS);
  });

  it('after a browser download, records the time only once the crew confirms the download finished', async () => {
    await siteRepo.create(db(), site('MF-01'), BY);
    const { save } = memorySaver(undefined, { written: false });
    const r = await saveFullBackup(db(), { save, nowMs: T0_MS });
    expect(r.ok && r.value.recorded).toBe(false);
    expect(await getMeta(db(), 'lastBackupAtMs')).toBeUndefined();
    expect(await confirmBackupSaved(db(), T0_MS)).toEqual({ ok: true, value: true });
    expect(await getMeta(db(), 'lastBackupAtMs')).toBe(T0_MS);
  });

  it('when the file cannot be written, says why and leaves "last backup" as it was', async () => {
    const { save } = memorySaver('The file could not be written to the Documents folder: disk full.');
    const r = await saveFullBackup(db(), { save, nowMs: T0_MS });
    expect(r).toEqual({ ok: false, error: { message: 'The file could not be written to the Documents folder: disk full.' } });
    expect(await getMeta(db(), 'lastBackupAtMs')).toBeUndefined();
  });

  it('when the export fails (database closed), returns the message instead of throwing', async () => {
    db().close({ disableAutoOpen: true });
    const r = await saveFullBackup(db(), { save: memorySaver().save, nowMs: T0_MS });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.error.message).toMatch(/^The backup could not be made: /);
  });
});
