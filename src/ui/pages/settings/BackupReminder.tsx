/**
 * Automatic backup after each day's work (autoBackup.ts), shown as a banner. On a phone the backup is written
 * silently and only a failure is shown; in a browser the crew is asked to download one (a download needs a tap).
 * Place it once near the top of a screen; it checks when it mounts and again whenever `refreshKey` changes
 * (pass a counter bumped after backups, restores, merges and imports).
 */
import { useEffect, useRef, useState } from 'react';
import { useGlintmarkDb } from '../../../data/index.ts';
import { maybeAutoBackup, type AutoBackupOutcome } from './autoBackup.ts';
import { DownloadConfirm } from './DownloadConfirm.tsx';
import { useBackupDownload } from './useBackupDownload.ts';

export function BackupReminder(props: { onSaved?: () => void; refreshKey?: number }) {
  const db = useGlintmarkDb();
  const [outcome, setOutcome] = useState<AutoBackupOutcome | null>(null);
  const download = useBackupDownload(props.onSaved);
  const onSaved = useRef(props.onSaved);
  useEffect(() => {
    onSaved.current = props.onSaved;
  }, [props.onSaved]);

  useEffect(() => {
    let live = true;
    void maybeAutoBackup(db).then((o) => {
      if (!live) return;
      setOutcome(o);
      if (o.kind === 'saved') onSaved.current?.();
    });
    return () => {
      live = false;
    };
  }, [db, props.refreshKey]);

  if (download.message) {
    return (
      <p className="gm-okt" role="status" data-testid="backup-reminder-done">
        ✓ {download.message}
      </p>
    );
  }
  if (!outcome || outcome.kind === 'not-needed') return null;
  if (outcome.kind === 'saved') {
    return (
      <p className="gm-note" data-testid="auto-backup-saved">
        Automatic backup saved to {outcome.backup.where}.
      </p>
    );
  }
  return (
    <div className="gm-settings-banner" role="status" data-testid="backup-reminder">
      <p>⚠ {outcome.message}</p>
      <button type="button" className="gm-btn gm-primary" disabled={download.busy} onClick={() => void download.run()} data-testid="backup-reminder-download">
        Download a backup
      </button>
      <DownloadConfirm download={download} testId="backup-reminder-confirm" />
      {download.error ? (
        <p className="gm-error" role="alert">
          {download.error}
        </p>
      ) : null}
    </div>
  );
}
