import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { getMeta, siteRepo, validateBackup } from '../../../src/data/index.ts';
import { saveFullBackup } from '../../../src/ui/pages/settings/backupActions.ts';
import { BY, memorySaver, site, T0_MS, useTestDb } from './helpers.ts';

describe('saveFullBackup', () => {
  const db = useTestDb();

  it('writes the versioned document under its dated name, then records the time', async () => {
    await siteRepo.create(db(), site('MF-01'), BY);
    const { save, files } = memorySaver();
    const r = await saveFullBackup(db(), { save, nowMs: T0_MS, appVersion: '9.9.9' });
    expect(r).toEqual({ ok: true, value: expect.objectContaining({ fileName: 'glintmark-backup-20270702-1200Z.json', where: 'Documents/glintmark-backup-20270702-1200Z.json', atMs: T0_MS }) });
    expect(r.ok && r.value.counts).toMatchObject({ sites: 1, revisions: 1, elements: 0 });
    expect(files).toHaveLength(1);
    const doc = validateBackup(files[0].text);
    expect(doc).toMatchObject({ format: 'glintmark-backup', formatVersion: 1, exportedAtUtc: '2027-07-02T12:00:00.000Z', app: { version: '9.9.9', schemaVersion: 5 } });
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
