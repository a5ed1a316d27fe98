/** The site fields (new site, edit site, site from the plan): position typed or from the phone's GNSS. */
import { NumberField, Segmented } from '../../components/fields.tsx';
import { TextInput } from './inputs.tsx';
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
  const fromGps = async () => {
    const fix = await gps.get();
    if (fix) props.setForm(siteFormWithFix(form, fix));
  };
  const sourceOptions = form.positionSource === 'imported' ? [...SOURCES, { value: 'imported' as const, label: 'Imported' }] : SOURCES;
  return (
    <>
      <div className="gm-row">
        <TextInput label="Site code" value={form.code} onChange={(v) => set({ code: v })} error={errors.code} testId="site-code" hint="Short and unique, e.g. MF-01" />
        <TextInput label="Site name" value={form.name} onChange={(v) => set({ name: v })} error={errors.name} testId="site-name" />
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
        <NumberField label="Latitude" unit="° N+" value={form.latDeg} onChange={(v) => set({ latDeg: v })} error={errors.latDeg} testId="site-lat" />
        <NumberField label="Longitude" unit="° E+" value={form.lonDeg} onChange={(v) => set({ lonDeg: v })} error={errors.lonDeg} testId="site-lon" />
        <NumberField label="Ellipsoidal height" unit="m" value={form.heightEllM} onChange={(v) => set({ heightEllM: v })} error={errors.heightEllM} testId="site-height" />
        <NumberField label="Horizontal accuracy" unit="m, empty = unknown" value={form.accuracyM} onChange={(v) => set({ accuracyM: v })} error={errors.accuracyM} testId="site-accuracy" />
      </div>
      <div className="gm-lb-seg-wrap">
        <Segmented label="Position source" value={form.positionSource} options={sourceOptions} onChange={(v) => set({ positionSource: v })} testId="site-source" />
      </div>
      <div className="gm-row">
        <TextInput label="Reference frame" value={form.referenceFrame} onChange={(v) => set({ referenceFrame: v })} error={errors.referenceFrame} testId="site-frame" hint="e.g. WGS84, ITRF2020" />
        <NumberField label="Frame epoch" unit="decimal year, optional" value={form.frameEpoch} onChange={(v) => set({ frameEpoch: v })} error={errors.frameEpoch} testId="site-epoch" />
      </div>
      <TextInput label="Notes (access, landmarks, hazards)" value={form.notes} onChange={(v) => set({ notes: v })} error={errors.notes} testId="site-notes" multiline />
    </>
  );
}
