/** The "download a full backup" action shared by the Backup section and the reminder banner. */
import { useState } from 'react';
import { useGlintmarkDb } from '../../../data/index.ts';
import { saveBackupFile } from '../../../sensors/backupFile.ts';
import { saveFullBackup } from './backupActions.ts';
import { formatCounts } from './reports.ts';

export interface BackupDownload {
  busy: boolean;
  message: string | null;
  error: string | null;
  run: () => Promise<boolean>;
}

export function useBackupDownload(onSaved?: () => void): BackupDownload {
  const db = useGlintmarkDb();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const run = async () => {
    setBusy(true);
    setError(null);
    setMessage(null);
    const r = await saveFullBackup(db, { save: saveBackupFile });
    setBusy(false);
    if (!r.ok) {
      setError(r.error.message);
      return false;
    }
    setMessage(`Backup saved to ${r.value.where}: ${formatCounts(r.value.counts)}. Copy it off this phone (computer, cloud, another phone).`);
    onSaved?.();
    return true;
  };
  return { busy, message, error, run };
}
