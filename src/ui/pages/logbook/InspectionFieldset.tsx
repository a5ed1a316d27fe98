/** The inspection checklist (big OK / Issue / Not checked buttons), re-measured orientation, time, crew, notes. */
import { CHECKLIST_ITEMS, CHECK_STATES } from '../../../data/index.ts';
import { Segmented } from '../../components/fields.tsx';
import { fmtNum } from '../../format.ts';
import type { Capture } from '../../state/workflow.ts';
import { formFields } from './inputs.tsx';
import { applyCaptureToInspection, type InspectionErrors, type InspectionForm } from './inspectionForm.ts';
import { CHECK_WORDS, CHECKLIST_LABELS, fmtUtc } from './words.ts';

const CHECK_OPTIONS = CHECK_STATES.map((s) => ({ value: s, label: CHECK_WORDS[s] }));

export function InspectionFieldset(props: { form: InspectionForm; set: (patch: Partial<InspectionForm>) => void; errors: InspectionErrors; capture: Capture | null }) {
  const { form, set, errors, capture } = props;
  const f = formFields(form, set, errors);
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
          {f.num('azimuthDeg', 'Azimuth', '° true', 'insp-az')}
          {f.num('tiltDeg', 'Base tilt', '°', 'insp-tilt')}
          {f.num('rollDeg', 'Roll', '°', 'insp-roll')}
        </div>
      </fieldset>
      {f.text('inspectedAt', 'Inspected at (UTC)', 'insp-at', { hint: 'e.g. 2026-06-15T10:00Z' })}
      {f.text('crew', 'Crew (names, separated by commas)', 'insp-crew')}
      {f.text('notes', 'Notes', 'insp-notes', { multiline: true })}
    </>
  );
}
