/**
 * Open merge conflicts: for each, the record, why, which version is in the logbook and the other version's fields.
 * To adopt the other version, edit the record in the Logbook; then mark the conflict resolved here. Both versions
 * stay stored either way.
 */
import { useState } from 'react';
import { resolveConflict, useGlintmarkDb, useOpenConflicts } from '../../../data/index.ts';
import { conflictView } from './conflictView.ts';
import { messageOf } from './uiErrors.ts';

export function ConflictsSection() {
  const db = useGlintmarkDb();
  const conflicts = useOpenConflicts();
  const [error, setError] = useState<string | null>(null);
  if (!conflicts || conflicts.length === 0) return null;
  const resolve = async (id: string) => {
    setError(null);
    try {
      await resolveConflict(db, id);
    } catch (e) {
      setError(messageOf(e));
    }
  };
  return (
    <section className="gm-section" aria-labelledby="conflicts-h" data-testid="conflicts">
      <h2 id="conflicts-h">Merge conflicts to review ({conflicts.length})</h2>
      <p className="gm-note">A record was changed on two phones. Nothing was lost: both versions are kept. Edit the record in the Logbook if the other version is right, then mark the conflict resolved.</p>
      {conflicts.map((c, i) => {
        const v = conflictView(c);
        return (
          <div key={c.id} className="gm-card" style={{ marginBottom: 8 }} data-testid={`conflict-${i}`}>
            <p>
              <strong>{v.title}</strong>
            </p>
            <p>{v.reason}</p>
            <p className="gm-note">
              {v.detected} {v.kept}
            </p>
            <details className="gm-settings-details">
              <summary>The other version</summary>
              <ul className="gm-settings-list">
                {v.otherFields.map((f, k) => (
                  <li key={k}>{f}</li>
                ))}
              </ul>
            </details>
            <button type="button" className="gm-btn" onClick={() => void resolve(c.id)} data-testid={`resolve-conflict-${i}`}>
              Mark resolved
            </button>
          </div>
        );
      })}
      {error ? (
        <p className="gm-error" role="alert">
          {error}
        </p>
      ) : null}
    </section>
  );
}
