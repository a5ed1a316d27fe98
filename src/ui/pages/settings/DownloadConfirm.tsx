/**
 * Shown after a browser download of a backup started: the page cannot see when the browser has written the file,
 * so "last backup" is recorded only when the crew says the download finished.
 */
import type { BackupDownload } from './useBackupDownload.ts';

export function DownloadConfirm(props: { download: BackupDownload; testId: string }) {
  const p = props.download.pending;
  if (!p) return null;
  return (
    <div className="gm-settings-confirm" role="status" data-testid={props.testId}>
      <p>
        Your browser is saving <strong>{p.fileName}</strong> to its downloads. When the download has finished, tap the button below; until then
        this backup does not count as saved.
      </p>
      <button type="button" className="gm-btn gm-primary" onClick={() => void props.download.confirm()} data-testid={`${props.testId}-done`}>
        The download has finished
      </button>
    </div>
  );
}
