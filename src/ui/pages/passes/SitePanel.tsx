/** Where the reflector stands: the workflow's site, a phone GNSS fix, or typed coordinates checked in place. */
import { useState } from 'react';
import { assessFix, sensors, type FixAssessment } from '../../../sensors/index.ts';
import { NumberField } from '../../components/fields.tsx';
import { fmtDeg, fmtLength, fmtNum } from '../../format.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import type { SiteInput } from '../../state/workflow.ts';
import { workflow } from '../../state/workflow.ts';
import { parseSiteForm, type SiteForm } from './computePasses.ts';

const GPS_TIMEOUT_MS = 20_000;

const formFrom = (s: SiteInput | null): SiteForm =>
  s ? { latDeg: String(s.latDeg), lonDeg: String(s.lonDeg), heightM: String(s.heightEllM) } : { latDeg: '', lonDeg: '', heightM: '0' };

const SOURCE_WORDS: Record<SiteInput['source'], string> = { 'gnss-phone': 'phone GNSS', typed: 'typed', logbook: 'logbook' };

export function SitePanel(props: { site: SiteInput | null }) {
  const { angleFormat, lengthUnit } = useStore(settings);
  const [form, setForm] = useState<SiteForm>(() => formFrom(props.site));
  const [busy, setBusy] = useState(false);
  const [gpsError, setGpsError] = useState<string | null>(null);
  const [quality, setQuality] = useState<FixAssessment | null>(null);
  const [heightNote, setHeightNote] = useState<string | null>(null);
  const parsed = parseSiteForm(form);

  // Another screen (the logbook) may set the site: show its coordinates in the fields (adjusted while rendering,
  // the way React documents for state that follows a prop).
  const [shownSite, setShownSite] = useState(props.site);
  if (props.site !== shownSite) {
    setShownSite(props.site);
    if (props.site && props.site.source !== 'typed') setForm(formFrom(props.site));
  }

  const readGps = async () => {
    setBusy(true);
    setGpsError(null);
    try {
      const r = await sensors.geolocation.currentFix({ timeoutMs: GPS_TIMEOUT_MS, maxAgeMs: 0 });
      if (!r.ok) {
        setGpsError(r.error.message);
        return;
      }
      const fix = r.value;
      setQuality(assessFix(fix, Date.now()));
      const heightEllM = fix.heightEllM ?? 0;
      setHeightNote(
        fix.heightEllM === null
          ? 'The phone gave no ellipsoidal height, so 0 m is used; type the height if you know it (each 100 m moves the incidence by under 0.01°).'
          : null,
      );
      setForm({ latDeg: fix.latDeg.toFixed(6), lonDeg: fix.lonDeg.toFixed(6), heightM: heightEllM.toFixed(1) });
      workflow.set({ site: { latDeg: fix.latDeg, lonDeg: fix.lonDeg, heightEllM, accuracyM: fix.horizontalAccuracyM, source: 'gnss-phone' } });
    } catch (e) {
      setGpsError(`The position could not be read: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      setBusy(false);
    }
  };

  const useTyped = () => {
    if (!parsed.site) return;
    setGpsError(null);
    setQuality(null);
    setHeightNote(null);
    workflow.set({ site: { ...parsed.site, source: 'typed' } });
  };

  const s = props.site;
  return (
    <section className="gm-section" aria-labelledby="site-h">
      <h2 id="site-h">Site</h2>
      {s ? (
        <p className="gm-okt" data-testid="passes-site">
          {s.code ? `${s.code} ` : ''}
          {fmtDeg(s.latDeg, 5, angleFormat)}, {fmtDeg(s.lonDeg, 5, angleFormat)}, height {fmtLength(s.heightEllM, lengthUnit, 1)} ({SOURCE_WORDS[s.source]}
          {s.accuracyM !== undefined ? `, ±${fmtNum(s.accuracyM, s.accuracyM < 10 ? 1 : 0)} m` : ''})
        </p>
      ) : (
        <p className="gm-warn" data-testid="passes-site">No site yet: use the phone’s position or type the coordinates.</p>
      )}
      <button type="button" className="gm-btn gm-primary" onClick={() => void readGps()} disabled={busy} data-testid="use-gps">
        {busy ? 'Reading position…' : 'Use GPS'}
      </button>
      {gpsError ? (
        <p className="gm-error" role="alert" data-testid="gps-error">
          {gpsError}
        </p>
      ) : null}
      {quality ? (
        <p className={quality.level === 'good' ? 'gm-okt' : 'gm-warn'} data-testid="gps-quality">
          {quality.level === 'poor' ? 'Warning: ' : ''}
          {quality.message}
        </p>
      ) : null}
      {heightNote ? <p className="gm-note">{heightNote}</p> : null}
      <div className="gm-row">
        <NumberField label="Latitude" unit="° N" value={form.latDeg} onChange={(v) => setForm({ ...form, latDeg: v })} error={parsed.errors.latDeg} testId="site-lat" />
        <NumberField label="Longitude" unit="° E" value={form.lonDeg} onChange={(v) => setForm({ ...form, lonDeg: v })} error={parsed.errors.lonDeg} testId="site-lon" />
        <NumberField label="Height" unit="m, ellipsoidal" value={form.heightM} onChange={(v) => setForm({ ...form, heightM: v })} error={parsed.errors.heightM} testId="site-height" />
      </div>
      <button type="button" className="gm-btn" onClick={useTyped} disabled={!parsed.site} data-testid="set-site">
        Use typed coordinates
      </button>
    </section>
  );
}
