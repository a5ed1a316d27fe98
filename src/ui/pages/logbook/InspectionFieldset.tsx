/** The inspection checklist (big OK / Issue / Not checked buttons), re-measured orientation, time, crew, notes. */
import { CHECKLIST_ITEMS, CHECK_STATES } from '../../../data/index.ts';
import { NumberField, Segmented } from '../../components/fields.tsx';
import { fmtNum } from '../../format.ts';
import type { Capture } from '../../state/workflow.ts';
import { TextInput } from './inputs.tsx';
import { applyCaptureToInspection, type InspectionErrors, type InspectionForm } from './inspectionForm.ts';
import { CHECK_WORDS, CHECKLIST_LABELS, fmtUtc } from './words.ts';

const CHECK_OPTIONS = CHECK_STATES.map((s) => ({ value: s, label: CHECK_WORDS[s] }));

export function InspectionFieldset(props: { form: InspectionForm; set: (patch: Partial<InspectionForm>) => void; errors: InspectionErrors; capture: Capture | null }) {
  const { form, set, errors, capture } = props;
  const n = (k: 'azimuthDeg' | 'tiltDeg' | 'rollDeg', label: string, unit: string, testId: string) => (
    <NumberField label={label} unit={unit} value={form[k]} onChange={(v) => set({ [k]: v })} error={errors[k]} testId={testId} />
  );
  return (
    <>
      <fieldset className="gm-lb-fieldset" data-testid="checklist">
        <legend>Checklist</legend>
        {CHECKLIST_ITEMS.map((item) => (
          <div key={item} className="gm-lb-check">
            <Segmented
              label={CHECKLIST_LABELS[item]}
              value={form.checklist[item]}
              options={CHECK_OPTIONS}
              onChange={(v) => set({ checklist: { ...form.checklist, [item]: v } })}
              testId={`check-${item}`}
            />
          </div>
        ))}
      </fieldset>
      <fieldset className="gm-lb-fieldset">
        <legend>Re-measured orientation (optional)</legend>
        {capture ? (
          <p>
            <button type="button" className="gm-btn" onClick={() => set(applyCaptureToInspection(form, capture))} data-testid="use-capture">
              Use the Align capture of {fmtUtc(capture.atMs)}: azimuth {fmtNum(capture.azimuthDeg, 1)}°, tilt {fmtNum(capture.tiltDeg, 1)}°
            </button>
          </p>
        ) : (
          <p className="gm-note">Measure on the Align tab and come back, or type the readings. Leave all three empty if not re-measured.</p>
        )}
        <div className="gm-row">
          {n('azimuthDeg', 'Azimuth', '° true', 'insp-az')}
          {n('tiltDeg', 'Base tilt', '°', 'insp-tilt')}
          {n('rollDeg', 'Roll', '°', 'insp-roll')}
        </div>
      </fieldset>
      <TextInput label="Inspected at (UTC)" value={form.inspectedAt} onChange={(v) => set({ inspectedAt: v })} error={errors.inspectedAt} testId="insp-at" hint="e.g. 2026-06-15T10:00Z" />
      <TextInput label="Crew (names, separated by commas)" value={form.crew} onChange={(v) => set({ crew: v })} error={errors.crew} testId="insp-crew" />
      <TextInput label="Notes" value={form.notes} onChange={(v) => set({ notes: v })} error={errors.notes} testId="insp-notes" multiline />
    </>
  );
}
