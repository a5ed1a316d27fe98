import { Directory, Encoding } from '@capacitor/filesystem';
import { describe, expect, it } from 'vitest';
import { createFileSaver, type FileSaverDeps } from '../../src/sensors/backupFile.ts';

/** Platform stubs that record every call. */
function stub(o: { native: boolean; perm?: string; writeFails?: string; downloadFails?: string }) {
  const calls: unknown[][] = [];
  const deps: FileSaverDeps = {
    native: o.native,
    writeFile: async (w) => {
      calls.push(['writeFile', w]);
      if (o.writeFails) throw new Error(o.writeFails);
      return { uri: `file:///docs/${w.path}` };
    },
    checkPermissions: async () => {
      calls.push(['checkPermissions']);
      return { publicStorage: o.perm ?? 'granted' };
    },
    requestPermissions: async () => {
      calls.push(['requestPermissions']);
      return { publicStorage: 'granted' };
    },
    download: (name, blob) => {
      calls.push(['download', name, blob.type, blob.size]);
      if (o.downloadFails) throw new Error(o.downloadFails);
    },
  };
  return { saver: createFileSaver(deps), calls };
}

const NAME = 'glintmark-backup-20270702-1200Z.json';

describe('saveBackupFile', () => {
  it('on a phone writes UTF-8 text to Documents and says where', async () => {
    const { saver, calls } = stub({ native: true });
    const r = await saver.saveBackupFile(NAME, '{"format":"glintmark-backup"}');
    expect(r).toEqual({ ok: true, value: { where: `Documents/${NAME}` } });
    expect(calls).toEqual([
      ['checkPermissions'],
      ['writeFile', { path: NAME, data: '{"format":"glintmark-backup"}', directory: Directory.Documents, encoding: Encoding.UTF8, recursive: true }],
    ]);
  });

  it('asks for the storage permission when needed, except for silent saves', async () => {
    const asked = stub({ native: true, perm: 'prompt' });
    await asked.saver.saveBackupFile(NAME, '{}');
    expect(asked.calls.map((c) => c[0])).toEqual(['checkPermissions', 'requestPermissions', 'writeFile']);
    const silent = stub({ native: true, perm: 'prompt' });
    await silent.saver.saveBackupFile(NAME, '{}', { askPermission: false });
    expect(silent.calls.map((c) => c[0])).toEqual(['checkPermissions', 'writeFile']);
  });

  it('returns a plain message when the write fails', async () => {
    const { saver } = stub({ native: true, writeFails: 'No space left on device' });
    const r = await saver.saveBackupFile(NAME, '{}');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toBe("The file could not be written to the Documents folder: No space left on device. Check the phone's free space and storage permission for Glintmark.");
  });

  it('in a browser offers a download with the JSON type, never touching the file system', async () => {
    const { saver, calls } = stub({ native: false });
    const r = await saver.saveBackupFile(NAME, '{"a":1}');
    expect(r).toEqual({ ok: true, value: { where: `your browser's downloads (${NAME})` } });
    expect(calls).toEqual([['download', NAME, 'application/json', 7]]);
    const failing = stub({ native: false, downloadFails: 'blocked' });
    expect(await failing.saver.saveTextFile('sites.csv', 'a', 'text/csv')).toEqual({ ok: false, error: { message: 'The browser did not save the file: blocked' } });
  });

  it('refuses a file name with folders or odd characters', async () => {
    const { saver, calls } = stub({ native: true });
    for (const bad of ['../x.json', 'a/b.json', '', '.hidden', 'x y.json']) {
      const r = await saver.saveTextFile(bad, '{}', 'application/json');
      expect(r.ok, bad).toBe(false);
    }
    expect(calls).toEqual([]);
  });
});

describe('saveArchiveFile', () => {
  const ZIP = 'glintmark-backup-20270702-1200Z.glintmark.zip';
  // 7 MB of bytes 0..250 repeating: three native pieces (3 MiB, 3 MiB, the rest).
  const bytes = new Uint8Array(7_000_000).map((_, i) => i % 251);
  const produce = async () => new Blob([bytes], { type: 'application/zip' });

  it('on a phone writes the archive to Documents in base64 pieces that join to the exact bytes', async () => {
    const calls: unknown[][] = [];
    const appended: string[] = [];
    const s2 = createFileSaver({
      native: true,
      writeFile: async (w) => {
        calls.push(['writeFile', w.path, w.encoding]);
        appended.push(w.data);
        return { uri: '' };
      },
      appendFile: async (a) => {
        calls.push(['appendFile', a.path]);
        appended.push(a.data);
      },
      checkPermissions: async () => ({ publicStorage: 'granted' }),
      requestPermissions: async () => ({ publicStorage: 'granted' }),
      download: () => undefined,
    });
    const r = await s2.saveArchiveFile(ZIP, produce);
    expect(r).toEqual({ ok: true, value: { where: `Documents/${ZIP}`, written: true } });
    expect(calls).toEqual([['writeFile', ZIP, undefined], ['appendFile', ZIP], ['appendFile', ZIP]]);
    const joined = Buffer.concat(appended.map((a) => Buffer.from(a, 'base64')));
    expect(Buffer.compare(joined, Buffer.from(bytes))).toBe(0);
  });

  it('in a browser with a save dialog: written once the write resolves; a cancelled dialog saves nothing', async () => {
    const got: number[] = [];
    const base = { native: false, writeFile: async () => ({ uri: '' }), checkPermissions: async () => ({ publicStorage: 'granted' }), requestPermissions: async () => ({ publicStorage: 'granted' }), download: () => undefined };
    const withDialog = createFileSaver({ ...base, pickSaveFile: async () => ({ write: async (b: Blob) => void got.push(b.size) }) });
    expect(await withDialog.saveArchiveFile(ZIP, produce)).toEqual({ ok: true, value: { where: `the file you chose (${ZIP})`, written: true } });
    expect(got).toEqual([7_000_000]);
    const cancelled = createFileSaver({ ...base, pickSaveFile: async () => null });
    expect(await cancelled.saveArchiveFile(ZIP, produce)).toEqual({ ok: false, error: { message: 'No file was chosen, so the backup was not saved.' } });
  });

  it('in a browser without a save dialog: a download, not yet known to be written', async () => {
    const { saver, calls } = stub({ native: false });
    expect(await saver.saveArchiveFile(ZIP, produce)).toEqual({ ok: true, value: { where: `your browser's downloads (${ZIP})`, written: false } });
    expect(calls).toEqual([['download', ZIP, 'application/zip', 7_000_000]]);
  });
});
