/**
 * Restore a full backup: pick the file → it is checked and described (nothing written) → "Restore" → if the phone
 * already holds records, a second explicit confirmation shows how many would be replaced → restore with replace.
 * Every failure shows the data layer's plain message; a refused or failed restore changes nothing.
 */
import { useState } from 'react';
import { readBackup, restoreBackup, useGlintmarkDb } from '../../../data/index.ts';
import { BACKUP_ACCEPT } from './fileNames.ts';
import { FilePicker } from './FilePicker.tsx';
import { describeBackup, restoreSummary } from './reports.ts';
import { messageOf } from './uiErrors.ts';

type Step =
  | { step: 'idle' }
  | { step: 'confirm'; fileName: string; file: File; description: string }
  | { step: 'confirm-replace'; fileName: string; file: File; description: string; warning: string }
  | { step: 'working' };

export function RestorePanel(props: { onChanged: () => void }) {
  const db = useGlintmarkDb();
  const [step, setStep] = useState<Step>({ step: 'idle' });
  const [message, setMessage] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  const pick = async (file: File) => {
    setMessage(null);
    setError(null);
    setStep({ step: 'idle' });
    try {
      // Checked in full (every checksum and hash) before anything is offered; the file itself goes to restoreBackup.
      const { doc } = await readBackup(file);
      setStep({ step: 'confirm', fileName: file.name, file, description: describeBackup(doc) });
    } catch (e) {
      setError(messageOf(e));
    }
  };

  const restore = async (replace: boolean) => {
    if (step.step !== 'confirm' && step.step !== 'confirm-replace') return;
    const current = step;
    setStep({ step: 'working' });
    try {
      const counts = await restoreBackup(db, current.file, { replace });
      setStep({ step: 'idle' });
      setMessage(restoreSummary(counts));
      props.onChanged();
    } catch (e) {
      if (!replace && e instanceof Error && e.name === 'BackupError' && (e as { kind?: string }).kind === 'would-replace') {
        setStep({ ...current, step: 'confirm-replace', warning: e.message });
      } else {
        setStep({ step: 'idle' });
        setError(messageOf(e));
      }
    }
  };

  const cancel = () => {
    setStep({ step: 'idle' });
    setMessage('Restore cancelled; nothing was changed.');
  };

  return (
    <div className="gm-card" style={{ marginTop: 8 }}>
      <h3>Restore from backup</h3>
      <p className="gm-note">Replaces the logbook on this phone with a backup file. To combine two phones' work, use merge below.</p>
      <FilePicker label="Backup file to restore (.glintmark.zip, or .json from an older version)" accept={BACKUP_ACCEPT} testId="restore-file" disabled={step.step === 'working'} onFile={(f) => void pick(f)} />
      {step.step === 'confirm' || step.step === 'confirm-replace' ? (
        <div className="gm-settings-confirm" data-testid="restore-confirm">
          <p>
            <strong>{step.fileName}</strong>: {step.description}
          </p>
          {step.step === 'confirm-replace' ? (
            <>
              <p className="gm-warn" data-testid="restore-replace-warning">
                ⚠ {step.warning}
              </p>
              <div className="gm-settings-actions">
                <button type="button" className="gm-btn gm-primary" onClick={() => void restore(true)} data-testid="restore-replace">
                  Replace everything on this phone
                </button>
                <button type="button" className="gm-btn" onClick={cancel} data-testid="restore-cancel">
                  Cancel
                </button>
              </div>
            </>
          ) : (
            <div className="gm-settings-actions">
              <button type="button" className="gm-btn gm-primary" onClick={() => void restore(false)} data-testid="restore-go">
                Restore this backup
              </button>
              <button type="button" className="gm-btn" onClick={cancel} data-testid="restore-cancel">
                Cancel
              </button>
            </div>
          )}
        </div>
      ) : null}
      {step.step === 'working' ? <p className="gm-note">Restoring…</p> : null}
      {message ? (
        <p className="gm-okt" role="status" data-testid="restore-message">
          {message}
        </p>
      ) : null}
      {error ? (
        <p className="gm-error" role="alert" data-testid="restore-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}
