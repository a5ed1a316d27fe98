/**
 * A stored installation: edit it (each save writes a revision, refused if the record changed meanwhile), add or
 * remove photos, see its history, delete it softly with Undo. Unsaved edits are kept as a draft.
 */
import { installationRepo, useGlintmarkDb, useInstallation, useReflectors, useSite, withReopen, type InstallationRecord } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { BackLink, DemoBadge, ErrorNote, SavedNote } from './bits.tsx';
import { saveErrorMessage } from './errorWords.ts';
import { shownErrors } from './inputs.tsx';
import { InstallationFieldset } from './InstallationFieldset.tsx';
import { installationFormFromRecord, isInstallationForm, parseInstallationForm, type InstallationCoreFields, type InstallationForm } from './installationForm.ts';
import { StoredPhotos } from './Photos.tsx';
import { withoutMeta } from './siteForm.ts';
import { RecordHistory } from './Timeline.tsx';
import { useEditSession } from './useEditSession.ts';
import { fmtUtc, writtenBy } from './words.ts';

function EditForm(props: { rec: InstallationRecord }) {
  const { rec } = props;
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const site = useSite(rec.siteId);
  const reflectors = useReflectors(rec.siteId);
  const edit = useEditSession({
    draftKey: `installation-edit:${rec.id}`,
    rec,
    toForm: installationFormFromRecord,
    isForm: isInstallationForm,
    parse: (f: InstallationForm) => parseInstallationForm(f).fields,
    current: (r): InstallationCoreFields => withoutMeta(r),
    write: (patch, expectedRev) => installationRepo.update(db, rec.id, patch, { by, expectedRev }),
  });
  const { form, update, saved, setSaved, error, setError } = edit;
  const parsed = parseInstallationForm(form);
  const deleted = rec.deletedAtMs !== null;
  const errors = shownErrors(parsed.errors, form, true);
  const by = writtenBy(st.crewName, parsed.fields?.crew ?? rec.crew);
  const label = reflectors?.find((r) => r.id === rec.reflectorId)?.label ?? '…';

  const toggleDeleted = async () => {
    setError(null);
    setSaved(null);
    try {
      const ctx = { by, expectedRev: rec.rev };
      const next = await withReopen(db, () => (deleted ? installationRepo.undelete(db, rec.id, ctx) : installationRepo.softDelete(db, rec.id, ctx)));
      edit.rebase(next.rev);
      setSaved(deleted ? 'Installation restored on this device' : 'Installation deleted on this device');
    } catch (e) {
      setError(saveErrorMessage(e, false));
    }
  };

  return (
    <>
      <BackLink to={`/logbook/site/${rec.siteId}`}>{`Site ${site?.code ?? ''}`}</BackLink>
      <h1>
        Installation of reflector {label} <DemoBadge demo={rec.demo} />
      </h1>
      <p className="gm-note">
        Site {site?.code ?? '…'} · installed {fmtUtc(rec.installedAtMs)} · revision {rec.rev}
      </p>
      {deleted ? (
        <div className="gm-lb-deleted" role="status" data-testid="installation-deleted">
          <p>
            <b>✕ This installation is deleted.</b> Undo restores it with its photos.
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
          <InstallationFieldset form={form} set={update} errors={errors} />
          <div className="gm-lb-actions">
            <button type="button" className="gm-btn gm-primary" onClick={() => void edit.save()} disabled={edit.busy} data-testid="save-installation">
              {edit.busy ? 'Saving…' : 'Save changes'}
            </button>
            <button type="button" className="gm-btn" onClick={() => void toggleDeleted()} data-testid="delete-installation">
              Delete installation
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
      <p className="gm-note">
        Serves {rec.geometryIds.length} planned geometr{rec.geometryIds.length === 1 ? 'y' : 'ies'} of the site (listed on the site screen).
      </p>
      <StoredPhotos owner={{ table: 'installations', id: rec.id }} by={by} disabled={deleted} onWrite={edit.ownWrite} />
      <section className="gm-section" aria-labelledby="rh-h">
        <h2 id="rh-h">History of this record</h2>
        <RecordHistory table="installations" id={rec.id} label="this installation" />
      </section>
    </>
  );
}

export function EditInstallation(props: { id: string }) {
  const rec = useInstallation(props.id);
  if (rec === undefined) return <p>Loading…</p>;
  if (rec === null)
    return (
      <>
        <BackLink to="/logbook">Logbook</BackLink>
        <p className="gm-warn" data-testid="installation-missing">
          This installation is not stored on this device.
        </p>
      </>
    );
  return <EditForm rec={rec} />;
}
