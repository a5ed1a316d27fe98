/** Backup: download a full backup, restore one, merge another phone's. */
import { MergePanel } from './MergePanel.tsx';
import { RestorePanel } from './RestorePanel.tsx';
import { DownloadConfirm } from './DownloadConfirm.tsx';
import { useBackupDownload } from './useBackupDownload.ts';

export function BackupSection(props: { onChanged: () => void }) {
  const download = useBackupDownload(props.onChanged);
  return (
    <section className="gm-section" aria-labelledby="backup-h">
      <h2 id="backup-h">Backup</h2>
      <p className="gm-note">
        One file (a .glintmark.zip archive) holds every site, reflector, installation, inspection, photo, history entry and element set, with
        a manifest of counts and checksums. Keep a copy off this phone.
      </p>
      <button type="button" className="gm-btn gm-primary" disabled={download.busy} onClick={() => void download.run()} data-testid="download-backup">
        Back up now
      </button>
      {download.busy ? <p className="gm-note">Preparing the backup…</p> : null}
      <DownloadConfirm download={download} testId="backup-confirm" />
      {download.message ? (
        <p className="gm-okt" role="status" data-testid="backup-message">
          ✓ {download.message}
        </p>
      ) : null}
      {download.error ? (
        <p className="gm-error" role="alert" data-testid="backup-error">
          {download.error}
        </p>
      ) : null}
      <RestorePanel onChanged={props.onChanged} />
      <MergePanel onChanged={props.onChanged} />
    </section>
  );
}
