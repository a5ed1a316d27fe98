/** First start: offer the invented demo scenario (clearly marked, removable in one step from Settings). */
import { IonModal } from '@ionic/react';
import { useState } from 'react';
import { getAppDb } from '../../data/index.ts';
import { settings } from '../state/settings.ts';
import { useStore } from '../state/store.ts';
import { workflow } from '../state/workflow.ts';

export function DemoOffer() {
  const s = useStore(settings);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const open = s.safetyAcknowledgedAtMs !== null && s.demoOfferedAtMs === null;

  const load = async () => {
    setBusy(true);
    setError(null);
    try {
      // Loaded on demand: the orbit code and the scenario stay out of the first screen's bundle.
      const [{ parseTle }, { DEMO_TLE }, { DEMO_SITES, demoTracks, loadDemoScenario }, { addElementSets }] = await Promise.all([
        import('../../core/orbit/tle.ts'),
        import('../../demo/elements.ts'),
        import('../../demo/scenario.ts'),
        import('../pages/passes/elementsStore.ts'),
      ]);
      const nowMs = Date.now();
      const demo = await loadDemoScenario(getAppDb(), nowMs);
      await addElementSets(parseTle(DEMO_TLE).sets, { demo: true, nowMs });
      const site = DEMO_SITES[0];
      const track = demoTracks(nowMs).find((t) => t.direction === 'descending');
      workflow.set({
        site: { id: demo.siteIds[0], code: site.code, name: site.name, latDeg: site.latDeg, lonDeg: site.lonDeg, heightEllM: site.heightEllM, source: 'logbook' },
        ...(track
          ? {
              geometries: [{
                incidenceDeg: track.incidenceDeg.toFixed(2), headingDeg: track.headingDeg.toFixed(2), look: track.look,
                losAzimuthDeg: track.reflectorAzimuthDeg, direction: track.direction, source: 'orbital-elements' as const,
                satellite: track.satellite, label: `DEMO ${track.satellite} ${track.direction} ${track.incidenceDeg.toFixed(1)}°`,
              }],
            }
          : {}),
      });
      settings.set({ demoOfferedAtMs: nowMs });
    } catch (e) {
      setError(`The demo could not be loaded: ${e instanceof Error ? e.message : String(e)}. Nothing of yours was changed.`);
    } finally {
      setBusy(false);
    }
  };

  return (
    <IonModal isOpen={open} backdropDismiss={false} aria-labelledby="demo-title">
      <div className="ion-padding">
        <h1 id="demo-title" style={{ fontSize: 22 }}>Try the demo?</h1>
        <p>
          The demo is an <strong>invented</strong> subsidence-monitoring network: four sites on Marrowby Fen (an invented
          place), watched by the invented satellite GLINT-A, with one installation already logged. Every demo record is marked
          <span className="gm-demo-badge" style={{ marginLeft: 6 }}>DEMO</span> and can be removed in one step from Settings
          without touching your own records.
        </p>
        {error ? <p className="gm-error" role="alert">{error}</p> : null}
        <div className="gm-row">
          <button type="button" className="gm-btn gm-primary" disabled={busy} onClick={load} data-testid="load-demo-scenario">
            {busy ? 'Loading…' : 'Load the demo'}
          </button>
          <button type="button" className="gm-btn" disabled={busy} onClick={() => settings.set({ demoOfferedAtMs: Date.now() })} data-testid="skip-demo">
            Start with an empty logbook
          </button>
        </div>
      </div>
    </IonModal>
  );
}
