/** A stored inspection: edit (a revision per save), photos, history, soft delete with Undo. */
import { inspectionRepo, useGlintmarkDb, useInspection, useReflectors, useSite, withReopen, type InspectionFields, type InspectionRecord } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { workflow } from '../../state/workflow.ts';
import { BackLink, DemoBadge, ErrorNote, SavedNote } from './bits.tsx';
import { saveErrorMessage } from './errorWords.ts';
import { shownErrors } from './inputs.tsx';
import { InspectionFieldset } from './InspectionFieldset.tsx';
import { inspectionFormFromRecord, isInspectionForm, parseInspectionForm, type InspectionForm } from './inspectionForm.ts';
import { StoredPhotos } from './Photos.tsx';
import { withoutMeta } from './siteForm.ts';
import { RecordHistory } from './Timeline.tsx';
import { useEditSession } from './useEditSession.ts';
import { fmtUtc, writtenBy } from './words.ts';

function EditForm(props: { rec: InspectionRecord }) {
  const { rec } = props;
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const wf = useStore(workflow);
  const site = useSite(rec.siteId);
  const reflectors = useReflectors(rec.siteId);
  const edit = useEditSession({
    draftKey: `inspection-edit:${rec.id}`,
    rec,
    toForm: inspectionFormFromRecord,
    isForm: isInspectionForm,
    parse: (f: InspectionForm) => parseInspectionForm(f).fields,
    current: (r): Omit<InspectionFields, 'photoIds'> => withoutMeta(r),
    write: (patch, expectedRev) => inspectionRepo.update(db, rec.id, patch, { by, expectedRev }),
  });
  const { form, update, saved, setSaved, error, setError } = edit;
  const parsed = parseInspectionForm(form);
  const deleted = rec.deletedAtMs !== null;
  const by = writtenBy(st.crewName, parsed.fields?.crew ?? rec.crew);
  const label = reflectors?.find((r) => r.id === rec.reflectorId)?.label ?? '…';

  const toggleDeleted = async () => {
    setError(null);
    setSaved(null);
    try {
      const ctx = { by, expectedRev: rec.rev };
      const next = await withReopen(db, () => (deleted ? inspectionRepo.undelete(db, rec.id, ctx) : inspectionRepo.softDelete(db, rec.id, ctx)));
      edit.rebase(next.rev);
      setSaved(deleted ? 'Inspection restored on this device' : 'Inspection deleted on this device');
    } catch (e) {
      setError(saveErrorMessage(e, false));
    }
  };

  return (
    <>
      <BackLink to={`/logbook/site/${rec.siteId}`}>{`Site ${site?.code ?? ''}`}</BackLink>
      <h1>
        Inspection of reflector {label} <DemoBadge demo={rec.demo} />
      </h1>
      <p className="gm-note">
        Site {site?.code ?? '…'} · inspected {fmtUtc(rec.inspectedAtMs)} · revision {rec.rev}
      </p>
      {deleted ? (
        <div className="gm-lb-deleted" role="status" data-testid="inspection-deleted">
          <p>
            <b>✕ This inspection is deleted.</b> Undo restores it with its photos.
          </p>
          <button type="button" className="gm-btn gm-primary" onClick={() => void toggleDeleted()} data-testid="undo-delete">
            Undo delete
          </button>
        </div>
      ) : null}
      {edit.draft.restoredAtMs !== null ? (
        <div className="gm-card" role="status" data-testid="draft-restored">
          <p>Unsaved edits restored from {fmtUtc(edit.draft.restoredAtMs)}.</p>
          <button type="button" className="gm-btn" onClick={() => void edit.discard()} data-testid="discard-draft">
            Discard draft
          </button>
        </div>
      ) : null}
      {deleted ? null : (
        <>
          <InspectionFieldset form={form} set={update} errors={shownErrors(parsed.errors, form, true)} capture={wf.capture} />
          <div className="gm-lb-actions">
            <button type="button" className="gm-btn gm-primary" onClick={() => void edit.save()} disabled={edit.busy} data-testid="save-inspection">
              {edit.busy ? 'Saving…' : 'Save changes'}
            </button>
            <button type="button" className="gm-btn" onClick={() => void toggleDeleted()} data-testid="delete-inspection">
              Delete inspection
            </button>
          </div>
        </>
      )}
      {saved ? <SavedNote>{saved}</SavedNote> : null}
      <ErrorNote message={error} />
      {edit.stale ? (
        <div className="gm-lb-actions">
          <button type="button" className="gm-btn gm-primary" onClick={() => void edit.save('current')} data-testid="apply-to-current">
            Apply my changes to the current version
          </button>
          <button type="button" className="gm-btn" onClick={() => void edit.discard()} data-testid="discard-mine">
            Discard my changes
          </button>
        </div>
      ) : null}
      <ErrorNote message={edit.draft.error} testId="draft-error" />
      <StoredPhotos owner={{ table: 'inspections', id: rec.id }} by={by} disabled={deleted} onWrite={edit.ownWrite} />
      <section className="gm-section" aria-labelledby="rh-h">
        <h2 id="rh-h">History of this record</h2>
        <RecordHistory table="inspections" id={rec.id} label="this inspection" />
      </section>
    </>
  );
}

export function EditInspection(props: { id: string }) {
  const rec = useInspection(props.id);
  if (rec === undefined) return <p>Loading…</p>;
  if (rec === null)
    return (
      <>
        <BackLink to="/logbook">Logbook</BackLink>
        <p className="gm-warn" data-testid="inspection-missing">
          This inspection is not stored on this device.
        </p>
      </>
    );
  return <EditForm rec={rec} />;
}
