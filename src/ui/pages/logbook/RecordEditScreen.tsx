/**
 * The screen of a stored installation or inspection: header, deleted banner with Undo, restored draft, the form's
 * fields with Save and Delete, the refused-edit choices, photos and the record's history. The page supplies the
 * fields and the edit session (see useEditSession); each save writes a revision, delete is soft with Undo.
 */
import type { ReactNode } from 'react';
import { useReflectors, useSite } from '../../../data/index.ts';
import { DeletedBanner, DraftRestoredBanner, StaleEditChoices } from './banners.tsx';
import { BackLink, DemoBadge, ErrorNote, SaveButton, SavedNote } from './bits.tsx';
import { StoredPhotos } from './Photos.tsx';
import { RecordHistory } from './Timeline.tsx';
import type { EditSession } from './useEditSession.ts';
import { useToggleDeleted, type SoftDeleteRepo } from './useToggleDeleted.ts';

const NOUNS = {
  inspection: { table: 'inspections', title: 'Inspection' },
  installation: { table: 'installations', title: 'Installation' },
} as const;

export function RecordEditScreen<F>(props: {
  noun: keyof typeof NOUNS;
  rec: { id: string; siteId: string; reflectorId: string; rev: number; demo: boolean; deletedAtMs: number | null };
  /** When it happened, for the line under the title: "inspected 2026-06-15 10:00 UTC". */
  when: string;
  edit: EditSession<F>;
  /** Who the writes are recorded as. */
  by: string;
  repo: SoftDeleteRepo;
  /** The form's fields, shown while the record is not deleted. */
  fields: ReactNode;
  /** Shown between the notes and the photos. */
  children?: ReactNode;
}) {
  const { noun, rec, edit, by } = props;
  const { table, title } = NOUNS[noun];
  const site = useSite(rec.siteId);
  const reflectors = useReflectors(rec.siteId);
  const toggleDeleted = useToggleDeleted(props.repo, rec, by, title, edit);
  const deleted = rec.deletedAtMs !== null;
  const label = reflectors?.find((r) => r.id === rec.reflectorId)?.label ?? '…';

  return (
    <>
      <BackLink to={`/logbook/site/${rec.siteId}`}>{`Site ${site?.code ?? ''}`}</BackLink>
      <h1>
        {title} of reflector {label} <DemoBadge demo={rec.demo} />
      </h1>
      <p className="gm-note">
        Site {site?.code ?? '…'} · {props.when} · revision {rec.rev}
      </p>
      {deleted ? (
        <DeletedBanner testId={`${noun}-deleted`} onUndo={() => void toggleDeleted()}>
          <b>✕ This {noun} is deleted.</b> Undo restores it with its photos.
        </DeletedBanner>
      ) : null}
      <DraftRestoredBanner restoredAtMs={edit.draft.restoredAtMs} onDiscard={() => void edit.discard()} what="Unsaved edits" />
      {deleted ? null : (
        <>
          {props.fields}
          <div className="gm-lb-actions">
            <SaveButton busy={edit.busy} onSave={() => void edit.save()} testId={`save-${noun}`}>
              Save changes
            </SaveButton>
            <button type="button" className="gm-btn" onClick={() => void toggleDeleted()} data-testid={`delete-${noun}`}>
              Delete {noun}
            </button>
          </div>
        </>
      )}
      {edit.saved ? <SavedNote>{edit.saved}</SavedNote> : null}
      <ErrorNote message={edit.error} />
      {edit.stale ? <StaleEditChoices onApply={() => void edit.save('current')} onDiscard={() => void edit.discard()} /> : null}
      <ErrorNote message={edit.draft.error} testId="draft-error" />
      {props.children}
      <StoredPhotos owner={{ table, id: rec.id }} by={by} disabled={deleted} onWrite={edit.ownWrite} />
      <section className="gm-section" aria-labelledby="rh-h">
        <h2 id="rh-h">History of this record</h2>
        <RecordHistory table={table} id={rec.id} label={`this ${noun}`} />
      </section>
    </>
  );
}
