/** The figures of an installation: planned and measured orientation, azimuth method, declination, loss, GPS fix, time, crew. */
import { AZIMUTH_METHODS } from '../../../data/index.ts';
import { NumberField, Segmented } from '../../components/fields.tsx';
import { TextInput } from './inputs.tsx';
import type { InstallationErrors, InstallationForm } from './installationForm.ts';
import { useGpsFix } from './useGpsFix.ts';
import { isoSecondsUtc, METHOD_WORDS } from './words.ts';

export function InstallationFieldset(props: { form: InstallationForm; set: (patch: Partial<InstallationForm>) => void; errors: InstallationErrors }) {
  const { form, set, errors } = props;
  const gps = useGpsFix();
  const fromGps = async () => {
    const fix = await gps.get();
    if (fix) set({ fixLatDeg: fix.latDeg.toFixed(7), fixLonDeg: fix.lonDeg.toFixed(7), fixAccuracyM: fix.horizontalAccuracyM.toFixed(1), fixAt: isoSecondsUtc(fix.timeMs) });
  };
  const n = (k: keyof InstallationForm, label: string, unit: string, testId: string) => (
    <NumberField label={label} unit={unit} value={form[k] as string} onChange={(v) => set({ [k]: v })} error={errors[k]} testId={testId} />
  );
  return (
    <>
      <fieldset className="gm-lb-fieldset">
        <legend>Measured orientation</legend>
        <div className="gm-row">
          {n('measuredAzimuthDeg', 'Azimuth', '° true', 'inst-az')}
          {n('measuredTiltDeg', 'Base tilt', '°, open side up +', 'inst-tilt')}
          {n('measuredRollDeg', 'Roll', '°, right side up +', 'inst-roll')}
        </div>
        <div className="gm-lb-seg-wrap">
          <Segmented
            label="How the azimuth was set"
            value={form.azimuthMethod}
            options={AZIMUTH_METHODS.map((m) => ({ value: m, label: METHOD_WORDS[m] }))}
            onChange={(v) => set({ azimuthMethod: v })}
            testId="inst-method"
          />
        </div>
        <div className="gm-row">
          {n('declinationDeg', 'Magnetic declination', '°, east +; empty if none used', 'inst-decl')}
          <TextInput label="Declination model" value={form.declinationModel} onChange={(v) => set({ declinationModel: v })} error={errors.declinationModel} testId="inst-decl-model" hint="e.g. WMM2025" />
        </div>
      </fieldset>
      <fieldset className="gm-lb-fieldset">
        <legend>Plan</legend>
        <div className="gm-row">
          {n('plannedAzimuthDeg', 'Planned azimuth', '° true', 'inst-planned-az')}
          {n('plannedTiltDeg', 'Planned tilt', '°', 'inst-planned-tilt')}
          {n('predictedLossDb', 'Predicted loss below peak', 'dB, optional', 'inst-loss')}
        </div>
      </fieldset>
      <fieldset className="gm-lb-fieldset">
        <legend>GPS fix at the reflector (optional)</legend>
        <button type="button" className="gm-btn" onClick={() => void fromGps()} disabled={gps.busy} data-testid="inst-fix-gps">
          {gps.busy ? 'Reading position…' : 'Record GPS fix'}
        </button>
        {gps.error ? (
          <p className="gm-warn" role="alert">
            {gps.error}
          </p>
        ) : null}
        {gps.quality ? <p className={gps.quality.level === 'good' ? 'gm-okt' : 'gm-warn'}>{gps.quality.message}</p> : null}
        <div className="gm-row">
          {n('fixLatDeg', 'Latitude', '° N+', 'inst-fix-lat')}
          {n('fixLonDeg', 'Longitude', '° E+', 'inst-fix-lon')}
          {n('fixAccuracyM', 'Accuracy', 'm', 'inst-fix-acc')}
        </div>
        <TextInput label="Fix time (UTC)" value={form.fixAt} onChange={(v) => set({ fixAt: v })} error={errors.fixAt} testId="inst-fix-at" />
      </fieldset>
      <TextInput label="Installed at (UTC)" value={form.installedAt} onChange={(v) => set({ installedAt: v })} error={errors.installedAt} testId="inst-installed-at" hint="e.g. 2026-06-15T10:00Z" />
      <TextInput label="Crew (names, separated by commas)" value={form.crew} onChange={(v) => set({ crew: v })} error={errors.crew} testId="inst-crew" />
      <TextInput label="Notes" value={form.notes} onChange={(v) => set({ notes: v })} error={errors.notes} testId="inst-notes" multiline />
    </>
  );
}
