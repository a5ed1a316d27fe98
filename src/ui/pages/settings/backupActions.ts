/**
 * Saving a full backup: write the backup archive (a save dialog or a download in a browser, Documents on a phone),
 * and only once the file is known to be written remember the time (recordBackupSaved), so "last backup" never
 * claims a file that failed. A plain browser download cannot be watched: then the crew confirms it finished
 * (confirmBackupSaved) before the time is recorded.
 */
import { err, ok, type Result } from '../../../core/result.ts';
import { recordBackupSaved, writeBackupArchive, type ArchiveManifest, type GlintmarkDb, type TableCounts } from '../../../data/index.ts';
import type { SaveArchiveResult, SaveOptions } from '../../../sensors/backupFile.ts';
import { APP_VERSION } from './appInfo.ts';
import { backupFileName } from './fileNames.ts';

export interface BackupSaveDeps {
  save: (name: string, produce: () => Promise<Blob>, opts?: SaveOptions) => Promise<SaveArchiveResult>;
  nowMs?: number;
  appVersion?: string;
  /** Passed to save: false for silent automatic backups. */
  askPermission?: boolean;
}

export interface SavedBackup {
  fileName: string;
  where: string;
  atMs: number;
  counts: TableCounts;
  /** True when "last backup" was recorded; false when the crew must first confirm that the download finished. */
  recorded: boolean;
}

const errorText = (e: unknown) => (e instanceof Error ? e.message : String(e));

/** Export, save, record. Never rejects: every failure comes back as a plain message; "last backup" is then unchanged. */
export async function saveFullBackup(db: GlintmarkDb, deps: BackupSaveDeps): Promise<Result<SavedBackup, { message: string }>> {
  const atMs = deps.nowMs ?? Date.now();
  const fileName = backupFileName(atMs);
  let manifest: ArchiveManifest | null = null;
  let exportError: unknown = null;
  const produce = async () => {
    try {
      const a = await writeBackupArchive(db, { appVersion: deps.appVersion ?? APP_VERSION, nowMs: atMs });
      manifest = a.manifest;
      return a.blob;
    } catch (e) {
      exportError = e;
      throw e;
    }
  };
  let saved: SaveArchiveResult;
  try {
    saved = await deps.save(fileName, produce, { askPermission: deps.askPermission });
  } catch (e) {
    saved = err({ message: `The backup file could not be written: ${errorText(e)}` });
  }
  if (exportError !== null) return err({ message: `The backup could not be made: ${errorText(exportError)}` });
  if (!saved.ok) return err({ message: saved.error.message });
  const counts = (manifest as ArchiveManifest | null)?.counts as TableCounts;
  if (!saved.value.written) return ok({ fileName, where: saved.value.where, atMs, counts, recorded: false });
  try {
    await recordBackupSaved(db, atMs);
  } catch (e) {
    return err({ message: `The backup file was saved (${saved.value.where}), but its time could not be noted on this phone: ${errorText(e)}` });
  }
  return ok({ fileName, where: saved.value.where, atMs, counts, recorded: true });
}

/** The crew confirmed that the browser finished the download made at `atMs`: now it counts as the last backup. */
export async function confirmBackupSaved(db: GlintmarkDb, atMs: number): Promise<Result<true, { message: string }>> {
  try {
    await recordBackupSaved(db, atMs);
    return ok(true);
  } catch (e) {
    return err({ message: `The backup's time could not be noted on this phone: ${errorText(e)}` });
  }
}
