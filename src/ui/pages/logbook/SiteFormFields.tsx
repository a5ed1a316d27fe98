/** The site fields (new site, edit site, site from the plan): position typed or from the phone's GNSS. */
import { useState } from 'react';
import { Segmented } from '../../components/fields.tsx';
import type { Fix } from '../../../sensors/index.ts';
import { formFields } from './inputs.tsx';
import { editSiteForm, heightLabel, siteFormWithFix, type HeightRef, type SiteForm } from './siteForm.ts';
import { useGpsFix } from './useGpsFix.ts';
import type { FieldErrors } from './parse.ts';

const SOURCES = [
  { value: 'typed', label: 'Typed' },
  { value: 'gnss-phone', label: 'Phone GNSS' },
  { value: 'gnss-survey', label: 'Survey GNSS' },
] as const;

const HEIGHT_REFS: readonly { value: HeightRef; label: string }[] = [
  { value: 'ellipsoidal', label: 'Ellipsoidal' },
  { value: 'sea-level', label: 'Sea level' },
  { value: 'unknown', label: 'Unknown' },
];

/** What the phone's fix said about height, in words: which reference the platform reports, or that it gave none. */
export function fixHeightWords(fix: Fix): string {
  if (fix.heightEllM !== null) {
    return `Height from the phone: ${fix.heightEllM.toFixed(1)} m above the WGS84 ellipsoid (what this platform reports; phone heights are often 10–30 m off, so survey it for precise work).`;
  }
  if (fix.heightMslM != null) {
    return `Height from the phone: ${fix.heightMslM.toFixed(1)} m above mean sea level (this platform reports sea-level altitude, not ellipsoidal; kept as a sea-level height). Choose Unknown instead to have it surveyed.`;
  }
  return 'This fix has no altitude: the height is marked unknown, to be surveyed. Type it if you know it (ellipsoidal or above sea level).';
}

export function SiteFormFields(props: { form: SiteForm; setForm: (f: SiteForm) => void; errors: FieldErrors<keyof SiteForm> }) {
  const { form, errors } = props;
  const gps = useGpsFix();
  const set = (patch: Partial<SiteForm>) => props.setForm(editSiteForm(form, patch));
  const f = formFields(form, set, errors);
  const [heightNote, setHeightNote] = useState<string | null>(null);
  const fromGps = async () => {
    const fix = await gps.get();
    if (fix) {
      props.setForm(siteFormWithFix(form, fix));
      setHeightNote(fixHeightWords(fix));
    }
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
        {form.heightRef !== 'unknown' ? f.num('heightEllM', heightLabel(form.heightRef), 'm', 'site-height') : null}
        {f.num('accuracyM', 'Horizontal accuracy', 'm, empty = unknown', 'site-accuracy')}
      </div>
      <div className="gm-lb-seg-wrap">
        <Segmented
          label="Height reference"
          value={form.heightRef}
          options={HEIGHT_REFS}
          onChange={(v) => set({ heightRef: v, ...(v === 'unknown' ? { heightEllM: '' } : {}) })}
          testId="site-height-ref"
        />
      </div>
      {form.heightRef === 'unknown' ? (
        <p className="gm-note" data-testid="site-height-unknown">
          Height unknown, to be surveyed: the site is saved without one and shows “unknown”; pass, sun and declination computations use 0 m meanwhile (under 0.1° of difference for sites below 1,000 m).
        </p>
      ) : null}
      {heightNote ? (
        <p className="gm-note" data-testid="site-height-note">
          {heightNote}
        </p>
      ) : null}
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
