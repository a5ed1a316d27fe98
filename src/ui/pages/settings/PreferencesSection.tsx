/** The crew's preferences on this phone (src/ui/state/settings.ts): theme, units, tolerances, crew name, tilt bias. */
import { useState } from 'react';
import { NumberField, Segmented, TextField } from '../../components/fields.tsx';
import { settings, type Settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { angleExample, parseMethodTolerance, parseTolerance, tiltBiasText, toleranceText } from './preferencesView.ts';

const THEMES = [
  { value: 'outdoor', label: 'Outdoor (bright)' },
  { value: 'dark', label: 'Dark' },
] as const;
const ANGLES = [
  { value: 'decimal', label: 'Decimal °' },
  { value: 'dm', label: 'Deg + min' },
] as const;
const LENGTHS = [
  { value: 'm', label: 'Metres' },
  { value: 'ft', label: 'Feet' },
] as const;
const PRESETS = [
  { value: 'calibration', label: 'Calibration' },
  { value: 'monitoring', label: 'Monitoring' },
  { value: 'custom', label: 'Custom' },
] as const;

function CustomTolerance(props: { s: Settings }) {
  const c = props.s.customToleranceDeg;
  const [text, setText] = useState({ az: String(c.azimuthDeg), tilt: String(c.tiltDeg), roll: String(c.rollDeg) });
  const pa = parseTolerance('Azimuth tolerance', text.az);
  const pt = parseTolerance('Tilt tolerance', text.tilt);
  const pr = parseTolerance('Roll tolerance', text.roll);
  const change = (patch: Partial<typeof text>) => {
    const next = { ...text, ...patch };
    setText(next);
    const a = parseTolerance('a', next.az).value;
    const t = parseTolerance('t', next.tilt).value;
    const r = parseTolerance('r', next.roll).value;
    if (a !== undefined && t !== undefined && r !== undefined) settings.set({ customToleranceDeg: { azimuthDeg: a, tiltDeg: t, rollDeg: r } });
  };
  return (
    <div className="gm-row">
      <NumberField label="Azimuth ±" unit="°" value={text.az} onChange={(v) => change({ az: v })} error={pa.error} testId="tol-azimuth" />
      <NumberField label="Tilt ±" unit="°" value={text.tilt} onChange={(v) => change({ tilt: v })} error={pt.error} testId="tol-tilt" />
      <NumberField label="Roll ±" unit="°" value={text.roll} onChange={(v) => change({ roll: v })} error={pr.error} testId="tol-roll" />
    </div>
  );
}

export function PreferencesSection() {
  const s = useStore(settings);
  const [method, setMethod] = useState(String(s.methodToleranceDeg));
  const pm = parseMethodTolerance('Method disagreement', method);
  const changeMethod = (v: string) => {
    setMethod(v);
    const x = parseMethodTolerance('m', v).value;
    if (x !== undefined) settings.set({ methodToleranceDeg: x });
  };
  return (
    <section className="gm-section gm-settings-prefs" aria-labelledby="prefs-h">
      <h2 id="prefs-h">Preferences</h2>
      <p className="gm-note">Kept on this phone only; not part of the logbook backup.</p>
      <Segmented label="Theme" value={s.theme} options={THEMES} onChange={(v) => settings.set({ theme: v })} testId="theme" />
      <Segmented label="Angles" value={s.angleFormat} options={ANGLES} onChange={(v) => settings.set({ angleFormat: v })} testId="angle-format" />
      <p className="gm-note" data-testid="angle-example">Shown as {angleExample(s.angleFormat)}</p>
      <Segmented label="Lengths" value={s.lengthUnit} options={LENGTHS} onChange={(v) => settings.set({ lengthUnit: v })} testId="length-unit" />
      <Segmented label="Alignment tolerance" value={s.tolerancePreset} options={PRESETS} onChange={(v) => settings.set({ tolerancePreset: v })} testId="tolerance" />
      <p className="gm-note" data-testid="tolerance-values">Hold within {toleranceText(s)}.</p>
      {s.tolerancePreset === 'custom' ? <CustomTolerance s={s} /> : null}
      <NumberField
        label="Warn when azimuth methods disagree by more than"
        unit="°"
        value={method}
        onChange={changeMethod}
        error={pm.error}
        testId="method-tolerance"
        hint="Sun shadow, reference bearing and compass are compared on the Align screen."
      />
      <TextField label="Crew name (written into the logbook history)" value={s.crewName} onChange={(v) => settings.set({ crewName: v })} testId="crew-name" />
      <div className="gm-field">
        <span className="gm-label">Tilt bias of this phone</span>
        <p data-testid="tilt-bias">{tiltBiasText(s)}</p>
        <div>
          <button
            type="button"
            className="gm-btn"
            data-testid="reset-tilt-bias"
            disabled={s.tiltBiasDeg === 0 && s.tiltBiasMeasuredAtMs === null}
            onClick={() => settings.set({ tiltBiasDeg: 0, tiltBiasMeasuredAtMs: null })}
          >
            Reset tilt bias
          </button>
        </div>
        <p className="gm-note">Measure it again with the reversal check on the Align screen.</p>
      </div>
    </section>
  );
}
