/** One isolated fake-indexeddb database per test, deleted afterwards. */
import 'fake-indexeddb/auto';
import type { SaveArchiveResult } from '../../../src/sensors/backupFile.ts';

export { useTestDb } from '../../data/helpers.ts';

/** A file saver stub that keeps what it was given. */
export function memorySaver(fail?: string, o: { written?: boolean } = {}) {
  const files: { name: string; blob: Blob; askPermission: boolean | undefined }[] = [];
  const save = async (name: string, produce: () => Promise<Blob>, opts?: { askPermission?: boolean }): Promise<SaveArchiveResult> => {
    if (fail) return { ok: false, error: { message: fail } };
    files.push({ name, blob: await produce(), askPermission: opts?.askPermission });
    return { ok: true, value: { where: `Documents/${name}`, written: o.written ?? true } };
  };
  return { save, files };
}

/** 2027-07-02T12:00:00Z */
export const T0_MS = Date.UTC(2027, 6, 2, 12);
export const BY = { by: 'Ada Quill' };

export const site = (code: string, o: Record<string, unknown> = {}) => ({
  code,
  name: `Marrowby Fen ${code}`,
  latDeg: 52.4123,
  lonDeg: -1.2345,
  heightEllM: 61.2,
  positionSource: 'typed' as const,
  positionAccuracyM: null,
  referenceFrame: 'WGS84',
  frameEpoch: null,
  notes: '',
  demo: false,
  ...o,
});
