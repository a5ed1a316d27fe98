/**
 * Automatic backup after each day's work. When the records changed since the last saved backup and that backup is
 * from an earlier day (the phone's calendar day), a phone (native) silently writes a full backup to Documents; a
 * browser never downloads by itself (a download needs the crew's tap), so the crew is told instead:
 * "Today's work is not backed up: download a backup".
 *
 * "Changed" means a record, photo, element set or history entry newer than the last backup, or a merge conflict
 * found or resolved since; demo records do not count. A merge that brought only rows older than the last backup is not counted as a change;
 * the next edit is. The check reads the records without photo bytes; the archive is written only when a backup is due.
 */
import { exportBackupRecords, getMeta, type BackupDocument, type GlintmarkDb } from '../../../data/index.ts';
import { isNativeFiles, saveBackupArchive } from '../../../sensors/backupFile.ts';
import { APP_VERSION } from './appInfo.ts';
import { saveFullBackup, type BackupSaveDeps, type SavedBackup } from './backupActions.ts';

export const NOT_BACKED_UP_MESSAGE = "Today's work is not backed up: download a backup";

export type AutoBackupOutcome =
  | { kind: 'not-needed'; reason: 'backed-up-today' | 'no-records' | 'no-changes' }
  | { kind: 'saved'; backup: SavedBackup }
  | { kind: 'download-needed'; message: string }
  | { kind: 'failed'; message: string };

export interface AutoBackupDeps {
  /** True on a phone build: the backup is written without asking. */
  native: boolean;
  save: BackupSaveDeps['save'];
  nowMs: number;
  /** The calendar day of an instant as the crew counts days (default: the phone's local date, "YYYY-MM-DD"). */
  dayKey: (atMs: number) => string;
  appVersion: string;
}

const pad = (n: number) => String(n).padStart(2, '0');

/** The phone's local calendar date of an instant, "YYYY-MM-DD". */
export function localDayKey(atMs: number): string {
  const d = new Date(atMs);
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/**
 * The latest change to the crew's work in a backup document, or null when it holds none. Demo records (and their
 * history) are not work and are left out, so loading the demo does not ask for a backup.
 */
export function newestChangeAtMs(doc: BackupDocument): number | null {
  const t = doc.tables;
  const demoIds = new Set<string>();
  const times: number[] = [];
  for (const rows of [t.sites, t.reflectors, t.geometries, t.installations, t.inspections, t.elements]) {
    for (const r of rows) {
      if (r.demo) demoIds.add(r.id);
      else times.push(r.updatedAtMs);
    }
  }
  for (const p of t.photos) {
    if (demoIds.has(p.ownerId)) demoIds.add(p.id);
    else times.push(p.updatedAtMs);
  }
  for (const r of t.revisions) if (!demoIds.has(r.recordId)) times.push(r.atMs);
  for (const c of t.conflicts) if (!demoIds.has(c.recordId)) times.push(c.resolvedAtMs ?? c.detectedAtMs, c.detectedAtMs);
  return times.length ? Math.max(...times) : null;
}

/** Whether a backup is due: the pure rule, given the last backup time, the newest change and today. */
export function backupDue(lastBackupAtMs: number | undefined, newestAtMs: number | null, nowMs: number, dayKey: (ms: number) => string): AutoBackupOutcome | 'due' {
  if (lastBackupAtMs !== undefined && dayKey(lastBackupAtMs) === dayKey(nowMs)) return { kind: 'not-needed', reason: 'backed-up-today' };
  if (newestAtMs === null) return { kind: 'not-needed', reason: 'no-records' };
  if (lastBackupAtMs !== undefined && newestAtMs <= lastBackupAtMs) return { kind: 'not-needed', reason: 'no-changes' };
  return 'due';
}

let running: Promise<AutoBackupOutcome> | null = null;

/** Check and, when due, back up (native) or ask for a download (web). Never rejects; at most one run at a time. */
export function maybeAutoBackup(db: GlintmarkDb, deps: Partial<AutoBackupDeps> = {}): Promise<AutoBackupOutcome> {
  running ??= run(db, deps).finally(() => {
    running = null;
  });
  return running;
}

async function run(db: GlintmarkDb, o: Partial<AutoBackupDeps>): Promise<AutoBackupOutcome> {
  const nowMs = o.nowMs ?? Date.now();
  const dayKey = o.dayKey ?? localDayKey;
  try {
    const last = await getMeta<number>(db, 'lastBackupAtMs');
    if (last !== undefined && dayKey(last) === dayKey(nowMs)) return { kind: 'not-needed', reason: 'backed-up-today' };
    const doc = await exportBackupRecords(db, { appVersion: o.appVersion ?? APP_VERSION, nowMs });
    const due = backupDue(last, newestChangeAtMs(doc), nowMs, dayKey);
    if (due !== 'due') return due;
    if (!(o.native ?? isNativeFiles())) return { kind: 'download-needed', message: NOT_BACKED_UP_MESSAGE };
    const saved = await saveFullBackup(db, { save: o.save ?? saveBackupArchive, nowMs, appVersion: o.appVersion ?? APP_VERSION, askPermission: false });
    return saved.ok ? { kind: 'saved', backup: saved.value } : { kind: 'failed', message: `The automatic backup failed: ${saved.error.message}` };
  } catch (e) {
    return { kind: 'failed', message: `The automatic backup check failed: ${e instanceof Error ? e.message : String(e)}` };
  }
}
