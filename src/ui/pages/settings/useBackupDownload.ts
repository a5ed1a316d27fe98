/**
 * The "back up now" action shared by the Backup section and the reminder banner. When the browser can only start
 * a download (no save dialog), the backup counts as saved once the crew confirms the download finished.
 */
import { useState } from 'react';
import { useGlintmarkDb } from '../../../data/index.ts';
import { saveBackupArchive } from '../../../sensors/backupFile.ts';
import { confirmBackupSaved, saveFullBackup, type SavedBackup } from './backupActions.ts';
import { formatCounts } from './reports.ts';

export interface BackupDownload {
  busy: boolean;
  message: string | null;
  error: string | null;
  /** A download the crew has still to confirm as finished. */
  pending: SavedBackup | null;
  run: () => Promise<boolean>;
  confirm: () => Promise<void>;
}

const savedMessage = (b: SavedBackup) =>
  `Backup saved to ${b.where}: ${formatCounts(b.counts)}. Copy it off this phone (computer, cloud, another phone).`;

export function useBackupDownload(onSaved?: () => void): BackupDownload {
  const db = useGlintmarkDb();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState<SavedBackup | null>(null);
  const run = async () => {
    setBusy(true);
    setError(null);
    setMessage(null);
    setPending(null);
    const r = await saveFullBackup(db, { save: saveBackupArchive });
    setBusy(false);
    if (!r.ok) {
      setError(r.error.message);
      return false;
    }
    if (!r.value.recorded) {
      setPending(r.value);
      return false;
    }
    setMessage(savedMessage(r.value));
    onSaved?.();
    return true;
  };
  const confirm = async () => {
    if (!pending) return;
    const r = await confirmBackupSaved(db, pending.atMs);
    if (!r.ok) {
      setError(r.error.message);
      return;
    }
    setPending(null);
    setMessage(savedMessage(pending));
    onSaved?.();
  };
  return { busy, message, error, pending, run, confirm };
}
