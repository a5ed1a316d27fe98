/** What the Storage section says: persistence, space used, last backup. Plain text with a level for styling. */
import type { PersistResult, StorageEstimate } from '../../../data/index.ts';
import { fmtNum } from '../../format.ts';
import { utcMinute } from './reports.ts';

export type Level = 'ok' | 'warn' | 'note';

export interface Line {
  text: string;
  level: Level;
}

/** The persistence answer as stored in meta 'persistence' ({result, atMs}); anything else reads as "not asked". */
export function persistenceLine(stored: unknown): Line {
  const s = (stored ?? {}) as { result?: PersistResult; atMs?: number };
  const when = typeof s.atMs === 'number' && Number.isFinite(s.atMs) ? ` (asked ${utcMinute(s.atMs)})` : '';
  switch (s.result) {
    case 'granted':
      return { level: 'ok', text: `Storage is persistent: the phone will not clear Glintmark's records to free space${when}.` };
    case 'denied':
      return { level: 'warn', text: `Storage is not persistent: the phone may clear Glintmark's records when space runs low${when}. Make backups often.` };
    case 'unsupported':
      return { level: 'warn', text: `This browser cannot keep storage persistent${when}. Make backups often.` };
    default:
      return { level: 'note', text: 'Persistent storage has not been asked for yet.' };
  }
}

/** "2.5 MB", "850 kB", "1.2 GB" (SI prefixes). */
export function formatBytes(bytes: number): string {
  if (!Number.isFinite(bytes) || bytes < 0) return '—';
  if (bytes < 1e3) return `${bytes} bytes`;
  if (bytes < 1e6) return `${fmtNum(bytes / 1e3, 0)} kB`;
  if (bytes < 1e9) return `${fmtNum(bytes / 1e6, 1)} MB`;
  return `${fmtNum(bytes / 1e9, 1)} GB`;
}

export function estimateLine(e: StorageEstimate): Line {
  if (e.level === 'unknown' || e.usageBytes === null || e.quotaBytes === null || e.usedFraction === null) {
    return { level: 'note', text: 'This browser does not say how much storage is used.' };
  }
  const percent = e.usedFraction < 0.001 ? 'under 0.1 %' : `${fmtNum(e.usedFraction * 100, 1)} %`;
  const used = `Using ${formatBytes(e.usageBytes)} of about ${formatBytes(e.quotaBytes)} (${percent}).`;
  return e.level === 'warn'
    ? { level: 'warn', text: `${used} Storage is nearly full: make a backup, then remove photos you no longer need.` }
    : { level: 'ok', text: used };
}

const DAY_MS = 86_400_000;

/** Last backup, with its age in whole days at `nowMs`. */
export function lastBackupLine(lastBackupAtMs: unknown, nowMs: number): Line {
  if (typeof lastBackupAtMs !== 'number' || !Number.isFinite(lastBackupAtMs)) return { level: 'warn', text: 'No backup has been saved from this phone yet.' };
  const days = Math.floor((nowMs - lastBackupAtMs) / DAY_MS);
  const age = days <= 0 ? 'less than a day ago' : days === 1 ? '1 day ago' : `${days} days ago`;
  return { level: days >= 7 ? 'warn' : 'ok', text: `Last backup saved ${utcMinute(lastBackupAtMs)} (${age}).` };
}
