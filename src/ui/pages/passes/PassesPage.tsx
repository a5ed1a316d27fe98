import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import { useEffect, useEffectEvent, useMemo, useRef, useState } from 'react';
import { useHistory } from 'react-router-dom';
import { NumberField, Segmented } from '../../components/fields.tsx';
import { fmtDeg } from '../../format.ts';
import { parseSiteLocalMs, siteMinuteText, siteTimeZone } from '../../siteTime.ts';
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

  const [elementsOpen, setElementsOpen] = useState(true);
  const setsKnown = useRef(false);
  useEffect(() => {
    listElementSets().then((list) => {
      if (!setsKnown.current && list.length > 0) setElementsOpen(false);
      setsKnown.current = true;
      setSets(list);
    }, (e: unknown) => setLoadError(`Stored element sets could not be read: ${e instanceof Error ? e.message : String(e)}`));
  }, []);

  const site = wf.site;
  // The site and element panels fold away when they are already set as the screen opens (the tracks come first);
  // set during this visit, they stay open to show what was set. The crew can open or close either at any time.
  const [siteOpen] = useState(() => workflow.get().site === null);
  const zone = site ? siteTimeZone(site.latDeg, site.lonDeg) : null;
  // The start may be typed in the site's own time: it is turned into UTC before the window is checked.
  const [startIn, setStartIn] = useState<'utc' | 'site'>('utc');
  const [startSite, setStartSite] = useState<string | null>(null);
  let startSiteError: string | undefined;
  let startUtc = form.startUtc;
  if (startIn === 'site' && zone && startSite !== null) {
    try {
      startUtc = utcMinuteText(parseSiteLocalMs(startSite, zone));
    } catch (e) {
      startSiteError = e instanceof Error ? e.message : String(e);
    }
  }
  const win0 = parseWindowForm({ ...form, startUtc });
  const win = startSiteError ? { errors: { ...win0.errors, startUtc: startSiteError }, query: null } : win0;
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
              <NextPassCountdown passes={computed.outcome.passes} nowMs={nowMs} zone={zone} />
              {notice ? (
                <p className="gm-okt" role="status" data-testid="plan-notice">
                  {notice}{' '}
                  <button type="button" className="gm-btn" onClick={() => history.push('/plan')}>
                    Go to Plan
                  </button>
                </p>
              ) : null}
              <TrackList tracks={tracks} lossesDb={losses} nowMs={nowMs} zone={zone} onAim={aim} onAdd={add} />
            </section>
          ) : null}
          <details className="gm-fold" open={siteOpen} data-testid="site-fold">
            <summary data-testid="site-fold-summary">
              Site: {site ? `${site.code ? site.code + ' ' : ''}${fmtDeg(site.latDeg, 4)}, ${fmtDeg(site.lonDeg, 4)}${zone ? ` · ${zone}` : ''}` : 'not set'}
            </summary>
            <SitePanel site={wf.site} />
          </details>
          {loadError ? <p className="gm-error" role="alert">{loadError}</p> : null}
          <details className="gm-fold" open={elementsOpen} data-testid="elements-fold">
            <summary data-testid="elements-fold-summary">
              Orbital elements: {sets.length === 0 ? 'none yet' : `${sets.length} set${sets.length === 1 ? '' : 's'} (${sets.map((x) => x.name || x.catalogNumber).join(', ')})`}
            </summary>
            <ElementsPanel sets={sets} onChange={setSets} query={win.query} nowMs={nowMs} />
          </details>
          <section className="gm-section" aria-labelledby="window-h">
            <h2 id="window-h">Window</h2>
            <div className="gm-row">
              <div className="gm-wide gm-start-row">
                {startIn === 'site' && zone ? (
                  <NumberField label="Start" unit={`site time, ${zone}`} value={startSite ?? ''} onChange={setStartSite} error={win.errors.startUtc} testId="window-start-site" hint="e.g. 2026-12-01T06:00 (the site’s wall clock)" />
                ) : (
                  <NumberField label="Start" unit="UTC" value={form.startUtc} onChange={(v) => setForm({ ...form, startUtc: v })} error={win.errors.startUtc} testId="window-start" hint="e.g. 2026-12-01T06:00Z" />
                )}
                <button
                  type="button"
                  className="gm-btn"
                  onClick={() => {
                    setForm({ ...form, startUtc: utcMinuteText(Date.now()) });
                    setStartSite(zone ? siteMinuteText(Date.now(), zone) : null);
                  }}
                  data-testid="window-now"
                >
                  Now
                </button>
              </div>
              {zone ? (
                <Segmented
                  label="Start typed in"
                  value={startIn}
                  options={[{ value: 'utc', label: 'UTC' }, { value: 'site', label: `Site time` }]}
                  onChange={(v) => {
                    if (v === 'utc' && win.query) setForm({ ...form, startUtc: utcMinuteText(win.query.startMs) });
                    setStartSite(v === 'site' ? siteMinuteText(win.query?.startMs ?? Date.now(), zone) : null);
                    setStartIn(v);
                  }}
                  testId="window-start-in"
                />
              ) : null}
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
            <section className="gm-section" aria-label="Timeline and sky plot">
              <h2>Timeline</h2>
              <PassTimeline passes={computed.outcome.passes} startMs={computed.startMs} days={computed.days} nowMs={nowMs} zone={zone} />
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
