/**
 * No blank screen: a screen that fails to load (a missing script file after a deploy, no network) or throws while
 * rendering is replaced by a plain message with *Reload* and *Back up now*. Around each lazily loaded screen the
 * tab bar stays usable; around the whole app it is the last resort. Records and drafts are in the logbook database
 * and are not touched.
 */
import { Component, useState, type ReactNode } from 'react';
import { getAppDb } from '../../data/index.ts';

function BackupNow() {
  const [msg, setMsg] = useState<string | null>(null);
  const run = async () => {
    setMsg('Saving a backup…');
    try {
      const [{ saveFullBackup }, { saveBackupArchive }] = await Promise.all([import('../pages/settings/backupActions.ts'), import('../../sensors/backupFile.ts')]);
      const r = await saveFullBackup(getAppDb(), { save: saveBackupArchive });
      setMsg(r.ok ? `Backup saved to ${r.value.where}.` : r.error.message);
    } catch (e) {
      setMsg(`The backup could not be made here (${e instanceof Error ? e.message : String(e)}); reload and use Settings.`);
    }
  };
  return (
    <>
      <button type="button" className="gm-btn" onClick={() => void run()} data-testid="boundary-backup">
        Back up now
      </button>
      {msg ? <p data-testid="boundary-backup-message">{msg}</p> : null}
    </>
  );
}

const isLoadFailure = (e: unknown) => e instanceof Error && /dynamically imported module|Failed to fetch|Importing a module script failed|error loading/i.test(e.message);

interface State {
  error: unknown;
}

export class ErrorBoundary extends Component<{ children: ReactNode; where: 'screen' | 'app' }, State> {
  state: State = { error: null };

  static getDerivedStateFromError(error: unknown): State {
    return { error };
  }

  render() {
    const { error } = this.state;
    if (error === null) return this.props.children;
    const detail = error instanceof Error ? error.message : String(error);
    return (
      <div className="ion-padding gm-boundary" role="alert" data-testid={`boundary-${this.props.where}`}>
        <h2>{isLoadFailure(error) ? 'This screen could not be loaded.' : 'Something went wrong on this screen.'}</h2>
        <p>
          Your saved records and drafts are kept on this phone. Reload the app to try again
          {this.props.where === 'screen' ? ', or use the tabs below to carry on elsewhere' : ''}.
        </p>
        <p className="gm-note">Details: {detail}</p>
        <button type="button" className="gm-btn gm-primary" onClick={() => location.reload()} data-testid="boundary-reload">
          Reload
        </button>
        <BackupNow />
      </div>
    );
  }
}
