/**
 * Merge a backup from another phone: pick → checked and described → "Merge" → the report (added, updated,
 * unchanged, newer here, conflicts listed one by one). Nothing is dropped: a version not applied is kept as a conflict.
 */
import { useState } from 'react';
import { mergeBackup, readBackup, useGlintmarkDb, type MergeReport } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { BACKUP_ACCEPT } from './fileNames.ts';
import { FilePicker } from './FilePicker.tsx';
import { describeBackup, mergeConflictLines, mergeRows, mergeSummary } from './reports.ts';
import { messageOf } from './uiErrors.ts';

type Step = { step: 'idle' } | { step: 'confirm'; fileName: string; file: File; description: string } | { step: 'working' };

function MergeReportView(props: { report: MergeReport }) {
  const rows = mergeRows(props.report);
  const conflicts = mergeConflictLines(props.report);
  return (
    <div data-testid="merge-report">
      <p className="gm-okt" role="status" data-testid="merge-summary">
        ✓ {mergeSummary(props.report)}
      </p>
      <ul className="gm-settings-list" aria-label="Merge by kind of record">
        {rows.map((r) => (
          <li key={r.table} data-testid={`merge-row-${r.table}`}>
            <strong>{r.heading}</strong>: {r.added} added · {r.updated} updated · {r.unchanged} unchanged · {r.localNewer} newer here · {r.conflicts}{' '}
            {r.conflicts === 1 ? 'conflict' : 'conflicts'}
          </li>
        ))}
      </ul>
      {conflicts.length ? (
        <>
          <p className="gm-warn">⚠ Conflicts (both versions are kept; review them under "Merge conflicts to review"):</p>
          <ul className="gm-settings-list" data-testid="merge-conflicts">
            {conflicts.map((c, i) => (
              <li key={i}>{c}</li>
            ))}
          </ul>
        </>
      ) : null}
    </div>
  );
}

export function MergePanel(props: { onChanged: () => void }) {
  const db = useGlintmarkDb();
  const crew = useStore(settings).crewName.trim();
  const [step, setStep] = useState<Step>({ step: 'idle' });
  const [report, setReport] = useState<MergeReport | null>(null);
  const [error, setError] = useState<string | null>(null);

  const pick = async (file: File) => {
    setReport(null);
    setError(null);
    setStep({ step: 'idle' });
    try {
      const { doc } = await readBackup(file, { checkReferences: false });
      setStep({ step: 'confirm', fileName: file.name, file, description: describeBackup(doc) });
    } catch (e) {
      setError(messageOf(e));
    }
  };

  const merge = async () => {
    if (step.step !== 'confirm') return;
    const { file } = step;
    setStep({ step: 'working' });
    try {
      setReport(await mergeBackup(db, file, { by: crew || 'Glintmark merge' }));
      props.onChanged();
    } catch (e) {
      setError(messageOf(e));
    }
    setStep({ step: 'idle' });
  };

  return (
    <div className="gm-card" style={{ marginTop: 8 }}>
      <h3>Merge a backup from another phone</h3>
      <p className="gm-note">Adds the other phone's records to this one and keeps the newer version of each; nothing is deleted.</p>
      <FilePicker label="Backup file from the other phone (.glintmark.zip or .json)" accept={BACKUP_ACCEPT} testId="merge-file" disabled={step.step === 'working'} onFile={(f) => void pick(f)} />
      {step.step === 'confirm' ? (
        <div className="gm-settings-confirm" data-testid="merge-confirm">
          <p>
            <strong>{step.fileName}</strong>: {step.description}
          </p>
          <div className="gm-settings-actions">
            <button type="button" className="gm-btn gm-primary" onClick={() => void merge()} data-testid="merge-go">
              Merge into this phone
            </button>
            <button type="button" className="gm-btn" onClick={() => setStep({ step: 'idle' })} data-testid="merge-cancel">
              Cancel
            </button>
          </div>
        </div>
      ) : null}
      {step.step === 'working' ? <p className="gm-note">Merging…</p> : null}
      {report ? <MergeReportView report={report} /> : null}
      {error ? (
        <p className="gm-error" role="alert" data-testid="merge-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}
