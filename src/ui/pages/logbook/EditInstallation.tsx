/**
 * A stored installation: edit it (each save writes a revision, refused if the record changed meanwhile), add or
 * remove photos, see its history, delete it softly with Undo. Unsaved edits are kept as a draft.
 */
import { useState } from 'react';
import { installationRepo, useGlintmarkDb, useInstallation, useReflectors, useSite, withReopen, type InstallationRecord } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { BackLink, DemoBadge, ErrorNote, SavedNote } from './bits.tsx';
import { saveErrorMessage } from './errorWords.ts';
import { shownErrors } from './inputs.tsx';
import { InstallationFieldset } from './InstallationFieldset.tsx';
import { installationFormFromRecord, isInstallationForm, parseInstallationForm, type InstallationCoreFields, type InstallationForm } from './installationForm.ts';
import { StoredPhotos } from './Photos.tsx';
import { changedFields, withoutMeta } from './siteForm.ts';
import { RecordHistory } from './Timeline.tsx';
import { useFormDraft } from './useFormDraft.ts';
import { fmtUtc, writtenBy } from './words.ts';

interface EditDraft {
  baseRev: number;
  form: InstallationForm;
}
const isEditDraft = (v: unknown): v is EditDraft =>
  typeof v === 'object' && v !== null && typeof (v as EditDraft).baseRev === 'number' && isInstallationForm((v as EditDraft).form);

function EditForm(props: { rec: InstallationRecord }) {
  const { rec } = props;
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const site = useSite(rec.siteId);
  const reflectors = useReflectors(rec.siteId);
  const [form, setForm] = useState<InstallationForm>(() => installationFormFromRecord(rec));
  const [baseRev, setBaseRev] = useState(rec.rev);
  const [saved, setSaved] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const draft = useFormDraft(`installation-edit:${rec.id}`, isEditDraft, (d) => {
    setForm(d.form);
    setBaseRev(d.baseRev);
  });
  const parsed = parseInstallationForm(form);
  const errors = shownErrors(parsed.errors, form, true);
  const deleted = rec.deletedAtMs !== null;
  const by = writtenBy(st.crewName, parsed.fields?.crew ?? rec.crew);
  const label = reflectors?.find((r) => r.id === rec.reflectorId)?.label ?? '…';

  const update = (patch: Partial<InstallationForm>) => {
    const next = { ...form, ...patch };
    setForm(next);
    setSaved(null);
    setError(null);
    draft.save({ baseRev, form: next });
  };
  const discard = async () => {
    await draft.clear();
    setForm(installationFormFromRecord(rec));
    setBaseRev(rec.rev);
  };
  const save = async () => {
    setError(null);
    setSaved(null);
    if (!parsed.fields) {
      setError('Nothing saved: check the marked fields.');
      return;
    }
    const patch = changedFields<InstallationCoreFields>(withoutMeta(rec), parsed.fields);
    if (Object.keys(patch).length === 0) {
      setSaved('No changes to save: the record on this device is the same.');
      return;
    }
    setBusy(true);
    try {
      const next = await withReopen(db, () => installationRepo.update(db, rec.id, patch, { by, expectedRev: baseRev }));
      await draft.clear();
      setBaseRev(next.rev);
      setForm(installationFormFromRecord(next));
      setSaved('Saved on this device');
    } catch (e) {
      setError(saveErrorMessage(e));
    } finally {
      setBusy(false);
    }
  };
  const toggleDeleted = async () => {
    setError(null);
    setSaved(null);
    try {
      const ctx = { by, expectedRev: rec.rev };
      const next = await withReopen(db, () => (deleted ? installationRepo.undelete(db, rec.id, ctx) : installationRepo.softDelete(db, rec.id, ctx)));
      setBaseRev(next.rev);
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
      {draft.restoredAtMs !== null ? (
        <div className="gm-card" role="status" data-testid="draft-restored">
          <p>Unsaved edits restored from {fmtUtc(draft.restoredAtMs)}.</p>
          <button type="button" className="gm-btn" onClick={() => void discard()} data-testid="discard-draft">
            Discard draft
          </button>
        </div>
      ) : null}
      {deleted ? null : (
        <>
          <InstallationFieldset form={form} set={update} errors={errors} />
          <div className="gm-lb-actions">
            <button type="button" className="gm-btn gm-primary" onClick={() => void save()} disabled={busy} data-testid="save-installation">
              {busy ? 'Saving…' : 'Save changes'}
            </button>
            <button type="button" className="gm-btn" onClick={() => void toggleDeleted()} data-testid="delete-installation">
              Delete installation
            </button>
          </div>
        </>
      )}
      {saved ? <SavedNote>{saved}</SavedNote> : null}
      <ErrorNote message={error} />
      <p className="gm-note">
        Serves {rec.geometryIds.length} planned geometr{rec.geometryIds.length === 1 ? 'y' : 'ies'} of the site (listed on the site screen).
      </p>
      <StoredPhotos owner={{ table: 'installations', id: rec.id }} by={by} disabled={deleted} onWrite={() => setBaseRev((r) => r + 1)} />
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
