/** Where the crew stands, for the declination and the sun: the planned site, a phone fix, or typed coordinates. */
import { useCallback, useEffect, useState } from 'react';
import { requireLatDeg, requireLonDeg } from '../../../core/validate.ts';
import { assessFix, sensors, type Fix } from '../../../sensors/index.ts';
import { NumberField, parseField } from '../../components/fields.tsx';
import { fmtDeg } from '../../format.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import type { Workflow } from '../../state/workflow.ts';
import { positionFrom, type PositionInput } from './computeAlign.ts';

/** How long to wait for a fix, and how old a cached one may be, ms. */
const FIX_TIMEOUT_MS = 20_000;
const FIX_MAX_AGE_MS = 10_000;

export interface PositionState {
  position: PositionInput | null;
  fix: Fix | null;
  fixMessage: string | null;
  busy: boolean;
  getFix: () => void;
  lat: string;
  lon: string;
  setLat: (v: string) => void;
  setLon: (v: string) => void;
  latError?: string;
  lonError?: string;
}

export function usePosition(site: Workflow['site']): PositionState {
  const [fix, setFix] = useState<Fix | null>(null);
  const [fixMessage, setFixMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(!site);
  const [lat, setLat] = useState('');
  const [lon, setLon] = useState('');

  const readFix = useCallback(
    () =>
      sensors.geolocation.currentFix({ timeoutMs: FIX_TIMEOUT_MS, maxAgeMs: FIX_MAX_AGE_MS }).then((r) => {
        setBusy(false);
        if (r.ok) {
          setFix(r.value);
          setFixMessage(assessFix(r.value, Date.now()).message);
        } else setFixMessage(r.error.message);
      }),
    [],
  );
  const getFix = useCallback(() => {
    setBusy(true);
    void readFix();
  }, [readFix]);

  // Without a planned site, ask the phone once when the screen opens (busy from the first render, see above).
  useEffect(() => {
    if (!site) void readFix();
  }, [site, readFix]);

  const pLat = parseField('Latitude', lat, requireLatDeg);
  const pLon = parseField('Longitude', lon, requireLonDeg);
  const typedAny = lat !== '' || lon !== '';
  return {
    position: positionFrom(site, fix, { latDeg: pLat.value, lonDeg: pLon.value }),
    fix,
    fixMessage,
    busy,
    getFix,
    lat,
    lon,
    setLat,
    setLon,
    latError: typedAny ? pLat.error : undefined,
    lonError: typedAny ? pLon.error : undefined,
  };
}

export function PositionCard(props: { p: PositionState; site: Workflow['site'] }) {
  const { angleFormat } = useStore(settings);
  const { p } = props;
  return (
    <section className="gm-section" aria-labelledby="pos-h">
      <h2 id="pos-h">Position (for declination and sun)</h2>
      <p data-testid="position">
        {p.position ? `Using ${p.position.label}: ${fmtDeg(p.position.latDeg, 5, angleFormat)}, ${fmtDeg(p.position.lonDeg, 5, angleFormat)}.` : 'No position yet.'}
      </p>
      {p.fixMessage ? (
        <p className="gm-note" data-testid="fix-message">
          {p.fixMessage}
        </p>
      ) : null}
      <button type="button" className="gm-btn" onClick={p.getFix} disabled={p.busy} data-testid="get-fix">
        {p.busy ? 'Getting a fix…' : 'Take a GPS fix'}
      </button>
      {!props.site && !p.fix ? (
        <div className="gm-row">
          <NumberField label="Latitude" unit="° N+" value={p.lat} onChange={p.setLat} error={p.latError} testId="typed-lat" />
          <NumberField label="Longitude" unit="° E+" value={p.lon} onChange={p.setLon} error={p.lonError} testId="typed-lon" />
        </div>
      ) : null}
    </section>
  );
}
