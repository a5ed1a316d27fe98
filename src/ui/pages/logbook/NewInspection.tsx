/** Record an inspection of one reflector: checklist, optional re-measurement, photos; drafted on every change. */
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { reflectorRepo, useGlintmarkDb, useSite, type InspectionRecord, type ReflectorRecord } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { workflow } from '../../state/workflow.ts';
import { DraftRestoredBanner, PhotoErrors, WhenStored } from './banners.tsx';
import { BackLink, ErrorNote, SaveButton, SavedNote } from './bits.tsx';
import { shownErrors } from './inputs.tsx';
import { InspectionFieldset } from './InspectionFieldset.tsx';
import { checklistSummary, isInspectionForm, newInspectionForm, parseInspectionForm, type InspectionForm } from './inspectionForm.ts';
import { PendingPhotos } from './Photos.tsx';
import { createInspection, pendingPhotos, type SaveOutcome } from './saveRecords.ts';
import { useFormDraft } from './useFormDraft.ts';
import { useSaveState } from './useSaveState.ts';
import { CHECKLIST_LABELS, fmtUtc, writtenBy } from './words.ts';

function Form(props: { reflector: ReflectorRecord }) {
  const r = props.reflector;
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const wf = useStore(workflow);
  const site = useSite(r.siteId);
  const [form, setForm] = useState<InspectionForm>(() => newInspectionForm({ siteId: r.siteId, reflectorId: r.id, crewName: st.crewName, nowMs: Date.now() }));
  const [tried, setTried] = useState(false);
  const { busy, error, setError, run } = useSaveState();
  const [photos, setPhotos] = useState<Partial<Record<string, File>>>({});
  const [saved, setSaved] = useState<SaveOutcome<InspectionRecord> | null>(null);
  const draft = useFormDraft(`inspection-form:${r.id}`, isInspectionForm, (v) => setForm(v));
  const parsed = parseInspectionForm(form);
  const errors = shownErrors(parsed.errors, form, tried);

  const update = (patch: Partial<InspectionForm>) => {
    const next = { ...form, ...patch };
    setForm(next);
    setError(null);
    draft.save(next);
  };
  const discard = async () => {
    await draft.clear();
    setForm(newInspectionForm({ siteId: r.siteId, reflectorId: r.id, crewName: st.crewName, nowMs: Date.now() }));
  };
  const save = async () => {
    setTried(true);
    setError(null);
    if (!parsed.fields) {
      setError('Nothing saved yet: check the marked fields.');
      return;
    }
    const fields = parsed.fields;
    await run(async () => {
      const out = await createInspection(db, fields, pendingPhotos(photos), writtenBy(st.crewName, fields.crew));
      await draft.clear();
      setPhotos({});
      setSaved(out);
    });
  };

  const head = (
    <>
      <BackLink to={`/logbook/site/${r.siteId}`}>{`Site ${site?.code ?? ''}`}</BackLink>
      <h1>
        Inspect reflector {r.label} · site {site?.code ?? '…'}
      </h1>
    </>
  );
  if (saved)
    return (
      <>
        {head}
        <section className="gm-card" data-testid="inspection-saved">
          <SavedNote />
          <p>
            Inspection of {fmtUtc(saved.record.inspectedAtMs)}: {checklistSummary(saved.record.checklist, CHECKLIST_LABELS)}; {saved.record.photoIds.length} photo
            {saved.record.photoIds.length === 1 ? '' : 's'}.
          </p>
          <PhotoErrors errors={saved.photoErrors} />
          <div className="gm-lb-actions">
            <Link className="gm-btn gm-lb-linkbtn gm-primary" to={`/logbook/site/${r.siteId}`} data-testid="view-site">
              View site
            </Link>
            <Link className="gm-btn gm-lb-linkbtn" to={`/logbook/inspection/${saved.record.id}`} data-testid="open-inspection">
              Open this record
            </Link>
          </div>
        </section>
      </>
    );
  return (
    <>
      {head}
      <DraftRestoredBanner restoredAtMs={draft.restoredAtMs} onDiscard={() => void discard()} />
      <ErrorNote message={draft.error} testId="draft-error" />
      <InspectionFieldset form={form} set={update} errors={errors} capture={wf.capture} />
      <PendingPhotos files={photos} onChange={(role, f) => setPhotos((p) => ({ ...p, [role]: f }))} errors={{}} />
      <div className="gm-lb-actions">
        <SaveButton busy={busy} onSave={() => void save()} testId="save-inspection">
          Save inspection
        </SaveButton>
      </div>
      <ErrorNote message={error} />
    </>
  );
}

export function NewInspection(props: { reflectorId: string }) {
  const db = useGlintmarkDb();
  const [reflector, setReflector] = useState<ReflectorRecord | null | undefined>(undefined);
  useEffect(() => {
    let live = true;
    reflectorRepo
      .get(db, props.reflectorId)
      .then((r) => live && setReflector(r && r.deletedAtMs === null ? r : null))
      .catch(() => live && setReflector(null));
    return () => {
      live = false;
    };
  }, [db, props.reflectorId]);
  return (
    <WhenStored rec={reflector} back="Logbook" testId="reflector-missing" missing="This reflector is not (or no longer) stored on this device.">
      {(r) => <Form reflector={r} />}
    </WhenStored>
  );
}
