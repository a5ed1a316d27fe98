/**
 * Saving a full backup: export every record table, write the file (a download in a browser, Documents on a
 * phone), and only then remember the time (recordBackupSaved), so "last backup" never claims a file that failed.
 */
import { err, ok, type Result } from '../../../core/result.ts';
import { backupToJson, exportBackup, recordBackupSaved, type BackupDocument, type GlintmarkDb, type TableCounts } from '../../../data/index.ts';
import type { SaveFileResult, SaveOptions } from '../../../sensors/backupFile.ts';
import { APP_VERSION } from './appInfo.ts';
import { backupFileName } from './fileNames.ts';
import { countsOf } from './reports.ts';

export interface BackupSaveDeps {
  save: (name: string, text: string, opts?: SaveOptions) => Promise<SaveFileResult>;
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
}

const errorText = (e: unknown) => (e instanceof Error ? e.message : String(e));

/** Export, save, record. Never rejects: every failure comes back as a plain message; "last backup" is then unchanged. */
export async function saveFullBackup(db: GlintmarkDb, deps: BackupSaveDeps): Promise<Result<SavedBackup, { message: string }>> {
  const atMs = deps.nowMs ?? Date.now();
  let doc: BackupDocument;
  try {
    doc = await exportBackup(db, { appVersion: deps.appVersion ?? APP_VERSION, nowMs: atMs });
  } catch (e) {
    return err({ message: `The backup could not be made: ${errorText(e)}` });
  }
  return saveBackupDocument(db, doc, { ...deps, nowMs: atMs });
}

/** Save an exported document and record the time; see saveFullBackup. */
export async function saveBackupDocument(db: GlintmarkDb, doc: BackupDocument, deps: BackupSaveDeps): Promise<Result<SavedBackup, { message: string }>> {
  const atMs = deps.nowMs ?? Date.now();
  const fileName = backupFileName(atMs);
  const saved = await deps.save(fileName, backupToJson(doc), { askPermission: deps.askPermission });
  if (!saved.ok) return err({ message: saved.error.message });
  try {
    await recordBackupSaved(db, atMs);
  } catch (e) {
    return err({ message: `The backup file was saved (${saved.value.where}), but its time could not be noted on this phone: ${errorText(e)}` });
  }
  return ok({ fileName, where: saved.value.where, atMs, counts: countsOf(doc) });
}
