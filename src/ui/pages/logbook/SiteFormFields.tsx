/** The site fields (new site, edit site, site from the plan): position typed or from the phone's GNSS. */
import { Segmented } from '../../components/fields.tsx';
import { formFields } from './inputs.tsx';
import { editSiteForm, siteFormWithFix, type SiteForm } from './siteForm.ts';
import { useGpsFix } from './useGpsFix.ts';
import type { FieldErrors } from './parse.ts';

const SOURCES = [
  { value: 'typed', label: 'Typed' },
  { value: 'gnss-phone', label: 'Phone GNSS' },
  { value: 'gnss-survey', label: 'Survey GNSS' },
] as const;

export function SiteFormFields(props: { form: SiteForm; setForm: (f: SiteForm) => void; errors: FieldErrors<keyof SiteForm> }) {
  const { form, errors } = props;
  const gps = useGpsFix();
  const set = (patch: Partial<SiteForm>) => props.setForm(editSiteForm(form, patch));
  const f = formFields(form, set, errors);
  const fromGps = async () => {
    const fix = await gps.get();
    if (fix) props.setForm(siteFormWithFix(form, fix));
  };
  const sourceOptions = form.positionSource === 'imported' ? [...SOURCES, { value: 'imported' as const, label: 'Imported' }] : SOURCES;
  return (
    <>
      <div className="gm-row">
        {f.text('code', 'Site code', 'site-code', { hint: 'Short and unique, e.g. MF-01' })}
        {f.text('name', 'Site name', 'site-name')}
      </div>
      <div className="gm-lb-actions">
        <button type="button" className="gm-btn" onClick={() => void fromGps()} disabled={gps.busy} data-testid="site-gps">
          {gps.busy ? 'Reading position…' : 'Position from GPS'}
        </button>
      </div>
      {gps.error ? (
        <p className="gm-warn" role="alert" data-testid="site-gps-error">
          {gps.error}
        </p>
      ) : null}
      {gps.quality ? (
        <p className={gps.quality.level === 'good' ? 'gm-okt' : 'gm-warn'} data-testid="site-gps-quality">
          {gps.quality.message}
        </p>
      ) : null}
      <div className="gm-row">
        {f.num('latDeg', 'Latitude', '° N+', 'site-lat')}
        {f.num('lonDeg', 'Longitude', '° E+', 'site-lon')}
        {f.num('heightEllM', 'Ellipsoidal height', 'm', 'site-height')}
        {f.num('accuracyM', 'Horizontal accuracy', 'm, empty = unknown', 'site-accuracy')}
      </div>
      <div className="gm-lb-seg-wrap">
        <Segmented label="Position source" value={form.positionSource} options={sourceOptions} onChange={(v) => set({ positionSource: v })} testId="site-source" />
      </div>
      <div className="gm-row">
        {f.text('referenceFrame', 'Reference frame', 'site-frame', { hint: 'e.g. WGS84, ITRF2020' })}
        {f.num('frameEpoch', 'Frame epoch', 'decimal year, optional', 'site-epoch')}
      </div>
      {f.text('notes', 'Notes (access, landmarks, hazards)', 'site-notes', { multiline: true })}
    </>
  );
}
