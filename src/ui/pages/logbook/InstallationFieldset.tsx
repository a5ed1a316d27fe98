/** The figures of an installation: planned and measured orientation, azimuth method, declination, loss, GPS fix, time, crew. */
import { AZIMUTH_METHODS } from '../../../data/index.ts';
import { Segmented } from '../../components/fields.tsx';
import { formFields } from './inputs.tsx';
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
  const f = formFields(form, set, errors);
  return (
    <>
      <fieldset className="gm-lb-fieldset">
        <legend>Measured orientation</legend>
        <div className="gm-row">
          {f.num('measuredAzimuthDeg', 'Azimuth', '° true', 'inst-az')}
          {f.num('measuredTiltDeg', 'Base tilt', '°, open side up +', 'inst-tilt')}
          {f.num('measuredRollDeg', 'Roll', '°, right side up +', 'inst-roll')}
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
          {f.num('declinationDeg', 'Magnetic declination', '°, east +; empty if none used', 'inst-decl')}
          {f.text('declinationModel', 'Declination model', 'inst-decl-model', { hint: 'e.g. WMM2025' })}
        </div>
      </fieldset>
      <fieldset className="gm-lb-fieldset">
        <legend>Plan</legend>
        <div className="gm-row">
          {f.num('plannedAzimuthDeg', 'Planned azimuth', '° true', 'inst-planned-az')}
          {f.num('plannedTiltDeg', 'Planned tilt', '°', 'inst-planned-tilt')}
          {f.num('predictedLossDb', 'Predicted loss below peak', 'dB, optional', 'inst-loss')}
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
          {f.num('fixLatDeg', 'Latitude', '° N+', 'inst-fix-lat')}
          {f.num('fixLonDeg', 'Longitude', '° E+', 'inst-fix-lon')}
          {f.num('fixAccuracyM', 'Accuracy', 'm', 'inst-fix-acc')}
        </div>
        {f.text('fixAt', 'Fix time (UTC)', 'inst-fix-at')}
      </fieldset>
      {f.text('installedAt', 'Installed at (UTC)', 'inst-installed-at', { hint: 'e.g. 2026-06-15T10:00Z' })}
      {f.text('crew', 'Crew (names, separated by commas)', 'inst-crew')}
      {f.text('notes', 'Notes', 'inst-notes', { multiline: true })}
    </>
  );
}
