/** Add or edit a reflector: label, shape, inner edge, construction, apex and antenna offset (units in every label). */
import { useState } from 'react';
import { reflectorRepo, useGlintmarkDb, withReopen, type ReflectorRecord } from '../../../data/index.ts';
import { Segmented } from '../../components/fields.tsx';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { ApplyToCurrentButton } from './banners.tsx';
import { ErrorNote, SaveButton, SavedNote } from './bits.tsx';
import { formFields, shownErrors } from './inputs.tsx';
import { parseReflectorForm, reflectorFormFromRecord, type ReflectorForm } from './reflectorForm.ts';
import { changedFields, withoutMeta } from './siteForm.ts';
import { useSaveState } from './useSaveState.ts';
import { writtenBy } from './words.ts';

export function ReflectorEditor(props: {
  siteId: string;
  existing?: ReflectorRecord;
  initial: ReflectorForm;
  onSaved: (r: ReflectorRecord) => void;
  onCancel: () => void;
}) {
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const [form, setForm] = useState<ReflectorForm>(props.existing ? reflectorFormFromRecord(props.existing) : props.initial);
  const [tried, setTried] = useState(false);
  const { busy, error, setError, stale, run } = useSaveState();
  const [saved, setSaved] = useState(false);
  // The version the edit started from (see SiteEditor): changed fields only, onto that rev.
  const [base] = useState(() => (props.existing ? { rev: props.existing.rev, fields: withoutMeta(props.existing) } : null));
  const parsed = parseReflectorForm(form, props.siteId);
  const errors = shownErrors(parsed.errors, form, tried);
  const set = (patch: Partial<ReflectorForm>) => {
    setForm((f) => ({ ...f, ...patch }));
    setSaved(false);
  };

  const save = async (onto?: 'current') => {
    setTried(true);
    if (!parsed.fields) {
      setError('Check the marked fields.');
      return;
    }
    const fields = parsed.fields;
    setError(null);
    await run(async () => {
      const by = writtenBy(st.crewName);
      const ex = props.existing;
      const rec =
        ex && base
          ? await withReopen(db, () =>
              reflectorRepo.update(db, ex.id, changedFields(base.fields, fields), { by, expectedRev: onto === 'current' ? ex.rev : base.rev }),
            )
          : await withReopen(db, () => reflectorRepo.create(db, fields, { by }));
      setSaved(true);
      props.onSaved(rec);
    });
  };

  const f = formFields(form, set, errors);
  return (
    <section className="gm-card" aria-label={props.existing ? `Edit reflector ${props.existing.label}` : 'New reflector'} data-testid="reflector-form">
      <h3>{props.existing ? `Edit reflector ${props.existing.label}` : 'New reflector'}</h3>
      <div className="gm-row">
        {f.text('label', 'Label', 'refl-label')}
        <Segmented label="Shape" value={form.shape} options={[{ value: 'triangular', label: 'Triangular' }, { value: 'square', label: 'Square' }]} onChange={(v) => set({ shape: v })} testId="refl-shape" />
        {f.num('edgeM', 'Inner edge', 'm', 'refl-edge')}
        {f.num('apexHeightAboveMarkM', 'Apex height above the mark', 'm', 'refl-apex-above-mark')}
      </div>
      <fieldset className="gm-lb-fieldset">
        <legend>Construction</legend>
        <div className="gm-row">
          <Segmented label="Panels" value={form.panels} options={[{ value: 'solid', label: 'Solid' }, { value: 'mesh', label: 'Mesh' }]} onChange={(v) => set({ panels: v })} testId="refl-panels" />
          {form.panels === 'mesh' ? f.num('meshOpeningMm', 'Mesh opening', 'mm', 'refl-mesh') : null}
        </div>
        {f.text('drainage', 'Drainage', 'refl-drainage', { hint: 'e.g. three 20 mm holes at the apex' })}
        {f.text('foundation', 'Foundation', 'refl-foundation', { hint: 'e.g. concrete pillar 0.6 m deep' })}
      </fieldset>
      <fieldset className="gm-lb-fieldset">
        <legend>Surveyed apex position (optional)</legend>
        <div className="gm-row">
          {f.num('apexLatDeg', 'Apex latitude', '° N+', 'refl-apex-lat')}
          {f.num('apexLonDeg', 'Apex longitude', '° E+', 'refl-apex-lon')}
          {f.num('apexHeightEllM', 'Apex ellipsoidal height', 'm', 'refl-apex-h')}
        </div>
      </fieldset>
      <fieldset className="gm-lb-fieldset">
        <legend>GNSS antenna reference point offset from the apex (optional)</legend>
        <div className="gm-row">
          {f.num('arpEastM', 'East', 'm', 'refl-arp-e')}
          {f.num('arpNorthM', 'North', 'm', 'refl-arp-n')}
          {f.num('arpUpM', 'Up', 'm', 'refl-arp-u')}
        </div>
      </fieldset>
      {f.text('notes', 'Notes', 'refl-notes', { multiline: true })}
      <div className="gm-lb-actions">
        <SaveButton busy={busy} onSave={() => void save()} testId="save-reflector">
          Save reflector
        </SaveButton>
        <button type="button" className="gm-btn" onClick={props.onCancel} data-testid="cancel-reflector">
          Cancel
        </button>
      </div>
      <ErrorNote message={error} />
      {stale ? <ApplyToCurrentButton onClick={() => void save('current')} /> : null}
      {saved ? <SavedNote /> : null}
    </section>
  );
}

