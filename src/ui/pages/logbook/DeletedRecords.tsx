/**
 * Deleted records (all of them in Settings, or one site's on its page), each with Restore: the way back to a record
 * after its own page (and its Undo) is gone. Restoring a site or reflector brings back what was deleted with it.
 */
import { useState } from 'react';
import { Link } from 'react-router-dom';
import {
  inspectionRepo,
  installationRepo,
  reflectorRepo,
  siteRepo,
  useDeletedRecords,
  useGlintmarkDb,
  withReopen,
  type DeletedEntry,
} from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { ErrorNote, SavedNote } from './bits.tsx';
import { saveErrorMessage } from './errorWords.ts';
import type { SoftDeleteRepo } from './useToggleDeleted.ts';
import { fmtUtc, writtenBy } from './words.ts';

const REPOS: Record<DeletedEntry['table'], SoftDeleteRepo> = { sites: siteRepo, reflectors: reflectorRepo, installations: installationRepo, inspections: inspectionRepo };

export function DeletedRecords(props: { siteId?: string; title?: string }) {
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const entries = useDeletedRecords(props.siteId);
  const [saved, setSaved] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const restore = async (e: DeletedEntry) => {
    setSaved(null);
    setError(null);
    try {
      await withReopen(db, () => REPOS[e.table].undelete(db, e.id, { by: writtenBy(st.crewName) }));
      setSaved(`Restored ${e.label} on this device`);
    } catch (x) {
      setError(saveErrorMessage(x, false));
    }
  };
  const list = entries ?? [];
  return (
    <section className="gm-section" aria-labelledby={`deleted-h-${props.siteId ?? 'all'}`} data-testid="deleted-records">
      <h2 id={`deleted-h-${props.siteId ?? 'all'}`}>{props.title ?? 'Deleted records'} ({list.length})</h2>
      {saved ? <SavedNote testId="restored">{saved}</SavedNote> : null}
      <ErrorNote message={error} />
      {entries === undefined ? <p>Loading…</p> : list.length === 0 ? <p className="gm-note">Nothing deleted.</p> : null}
      <ul className="gm-lb-list">
        {list.map((e) => (
          <li key={`${e.table}-${e.id}`} className="gm-card" data-testid={`deleted-${e.table}-${e.id}`}>
            <p style={{ margin: '0 0 4px' }}>
              <b>{e.label}</b>
              <br />
              <span className="gm-lb-meta">deleted {fmtUtc(e.deletedAtMs)}</span>
            </p>
            {e.parentDeleted ? (
              <p className="gm-note">
                Deleted with its {e.table === 'reflectors' ? 'site' : 'site or reflector'}: restore that first, and this comes back with it.
              </p>
            ) : (
              <div className="gm-lb-actions">
                <button type="button" className="gm-btn" onClick={() => void restore(e)} data-testid="restore-deleted">
                  Restore
                </button>
                {e.table !== 'sites' ? null : (
                  <Link className="gm-btn gm-lb-linkbtn" to={`/logbook/site/${e.id}`}>
                    Open
                  </Link>
                )}
              </div>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
