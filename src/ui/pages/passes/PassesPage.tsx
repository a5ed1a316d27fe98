import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import { useEffect, useEffectEvent, useMemo, useRef, useState } from 'react';
import { useHistory } from 'react-router-dom';
import { NumberField, Segmented } from '../../components/fields.tsx';
import { useStore } from '../../state/store.ts';
import { workflow, type GeometryInput } from '../../state/workflow.ts';
import { CircularPanel } from './CircularPanel.tsx';
import { appendGeometry, computePasses, geometryFromTrack, parseWindowForm, trackLossesDb, utcMinuteText, type DisplayTrack, type PassesOutcome, type WindowForm } from './computePasses.ts';
import { ElementsPanel } from './ElementsPanel.tsx';
import { listElementSets, type StoredElementSet } from './elementsStore.ts';
import { PassTimeline } from './PassTimeline.tsx';
import { SitePanel } from './SitePanel.tsx';
import { SkyPlot } from './SkyPlot.tsx';
import { NextPassCountdown, TrackList } from './TrackList.tsx';
import './passes.css';

/** Wait this long after the last edit before searching again (a search takes tens of ms per set per month). */
const DEBOUNCE_MS = 600;

/** The current time, refreshed every `everyMs` (for the countdown and element ages). */
function useNow(everyMs: number): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const h = setInterval(() => setNow(Date.now()), everyMs);
    return () => clearInterval(h);
  }, [everyMs]);
  return now;
}

interface Computed {
  key: string;
  outcome: PassesOutcome;
  startMs: number;
  days: number;
}

export function PassesPage() {
  const wf = useStore(workflow);
  const history = useHistory();
  const nowMs = useNow(1000);
  const [sets, setSets] = useState<StoredElementSet[]>([]);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [form, setForm] = useState<WindowForm>(() => ({ startUtc: utcMinuteText(Date.now()), days: '24', incidenceMinDeg: '20', incidenceMaxDeg: '46', look: 'right' }));
  const [computed, setComputed] = useState<Computed | null>(null);
  const [computing, setComputing] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  useEffect(() => {
    listElementSets().then(setSets, (e: unknown) => setLoadError(`Stored element sets could not be read: ${e instanceof Error ? e.message : String(e)}`));
  }, []);

  const win = parseWindowForm(form);
  const site = wf.site;
  const key = JSON.stringify([win.query, site && [site.latDeg, site.lonDeg, site.heightEllM], sets.map((s) => s.line1 + s.line2)]);
  const ready = win.query !== null && site !== null && sets.length > 0;

  const run = () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    if (!win.query || !site || sets.length === 0) return;
    const q = win.query;
    const pos = { latDeg: site.latDeg, lonDeg: site.lonDeg, heightEllM: site.heightEllM };
    setComputing(true);
    // Let "Computing…" paint before the search holds the thread.
    timer.current = setTimeout(() => {
      timer.current = null;
      let outcome: PassesOutcome;
      try {
        outcome = computePasses(sets, pos, q);
      } catch (e) {
        outcome = { passes: [], tracks: [], warnings: [], errors: [e instanceof Error ? e.message : String(e)] };
      }
      setComputed({ key, outcome, startMs: q.startMs, days: q.days });
      setComputing(false);
    }, 20);
  };

  // Search again a moment after the inputs settle: `key` captures every input of run(), so it alone decides when;
  // the search itself reads the latest inputs when the wait is over.
  const searchIfStale = useEffectEvent(() => {
    if (computed?.key !== key) run();
  });
  useEffect(() => {
    if (!ready) return;
    const h = setTimeout(searchIfStale, DEBOUNCE_MS);
    return () => clearTimeout(h);
  }, [key, ready]);
  useEffect(() => () => { if (timer.current) clearTimeout(timer.current); }, []);

  const tracks = useMemo(() => computed?.outcome.tracks ?? [], [computed]);
  const losses = useMemo(() => trackLossesDb(tracks, wf.target, wf.shape), [tracks, wf.target, wf.shape]);
  const stale = computed !== null && computed.key !== key;

  const aim = (t: DisplayTrack) => {
    workflow.set({ geometries: [geometryFromTrack(t)] });
    history.push('/plan');
  };
  const add = (t: DisplayTrack) => {
    const next = appendGeometry(workflow.get().geometries, geometryFromTrack(t));
    workflow.set({ geometries: next });
    setNotice(`Added ${t.label} to the plan: it now serves ${next.length} geometr${next.length === 1 ? 'y' : 'ies'}.`);
  };
  const useApproximate = (g: GeometryInput) => {
    workflow.set({ geometries: [g] });
    history.push('/plan');
  };

  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Passes</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main className="gm-passes">
          <h1 className="gm-label">Upcoming radar passes</h1>
          <SitePanel site={wf.site} />
          {loadError ? <p className="gm-error" role="alert">{loadError}</p> : null}
          <ElementsPanel sets={sets} onChange={setSets} query={win.query} nowMs={nowMs} />

          <section className="gm-section" aria-labelledby="window-h">
            <h2 id="window-h">Window</h2>
            <div className="gm-row">
              <div className="gm-wide gm-start-row">
                <NumberField label="Start" unit="UTC" value={form.startUtc} onChange={(v) => setForm({ ...form, startUtc: v })} error={win.errors.startUtc} testId="window-start" hint="e.g. 2026-12-01T06:00Z" />
                <button type="button" className="gm-btn" onClick={() => setForm({ ...form, startUtc: utcMinuteText(Date.now()) })} data-testid="window-now">
                  Now
                </button>
              </div>
              <NumberField label="Days" value={form.days} onChange={(v) => setForm({ ...form, days: v })} error={win.errors.days} testId="window-days" />
              <NumberField label="Smallest incidence" unit="°" value={form.incidenceMinDeg} onChange={(v) => setForm({ ...form, incidenceMinDeg: v })} error={win.errors.incidenceMinDeg} testId="window-inc-min" />
              <NumberField label="Largest incidence" unit="°" value={form.incidenceMaxDeg} onChange={(v) => setForm({ ...form, incidenceMaxDeg: v })} error={win.errors.incidenceMaxDeg} testId="window-inc-max" />
              <Segmented label="Radar looks" value={form.look} options={[{ value: 'right', label: 'Right' }, { value: 'left', label: 'Left' }]} onChange={(v) => setForm({ ...form, look: v })} testId="window-look" />
            </div>
            <button type="button" className="gm-btn gm-primary" disabled={!ready || computing} onClick={run} data-testid="compute-passes">
              Show passes
            </button>
            <p className="gm-note" role="status" data-testid="passes-status">
              {computing
                ? 'Computing…'
                : !site
                  ? 'Set the site first.'
                  : sets.length === 0
                    ? 'Add an element set first.'
                    : !win.query
                      ? 'Correct the window first.'
                      : stale
                        ? 'Inputs changed: the list below is from before.'
                        : computed
                          ? `${computed.outcome.passes.length} passes in ${computed.outcome.tracks.length} tracks.`
                          : ''}
            </p>
          </section>

          {computed ? (
            <section className="gm-section" aria-labelledby="tracks-h" aria-busy={computing}>
              <h2 id="tracks-h" data-testid="tracks-h">Tracks</h2>
              {computed.outcome.errors.map((e, i) => (
                <p key={`e${i}`} className="gm-error" role="alert" data-testid={`passes-error-${i}`}>
                  {e}
                </p>
              ))}
              {computed.outcome.warnings.map((w, i) => (
                <p key={`w${i}`} className="gm-warn" data-testid={`passes-warning-${i}`}>
                  Warning: {w}
                </p>
              ))}
              <NextPassCountdown passes={computed.outcome.passes} nowMs={nowMs} />
              {notice ? (
                <p className="gm-okt" role="status" data-testid="plan-notice">
                  {notice}{' '}
                  <button type="button" className="gm-btn" onClick={() => history.push('/plan')}>
                    Go to Plan
                  </button>
                </p>
              ) : null}
              <TrackList tracks={tracks} lossesDb={losses} nowMs={nowMs} onAim={aim} onAdd={add} />
              <h2>Timeline</h2>
              <PassTimeline passes={computed.outcome.passes} startMs={computed.startMs} days={computed.days} nowMs={nowMs} />
              <h2>Sky plot</h2>
              <SkyPlot tracks={tracks} lossesDb={losses} target={wf.target} shape={wf.shape} />
            </section>
          ) : null}

          <CircularPanel siteLatDeg={site ? site.latDeg : null} onUse={useApproximate} />
        </main>
      </IonContent>
    </IonPage>
  );
}
