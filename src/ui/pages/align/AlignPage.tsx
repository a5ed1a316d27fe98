/**
 * Align: live guidance to set the planned azimuth, tilt and roll with the phone lying on the base plate, with true
 * north from the magnetic model, the sun, or a reference bearing; capture for the logbook.
 * Sensor events go into a fixed-size buffer (useLiveAlign); the screen renders about ten times a second.
 */
import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar, useIonViewDidLeave, useIonViewWillEnter } from '@ionic/react';
import { useEffect, useMemo, useRef, useState } from 'react';
import type { AzimuthReading } from '../../../core/alignment/methodCheck.ts';
import { fieldDisturbance } from '../../../core/magnetic/declination.ts';
import { sensors } from '../../../sensors/index.ts';
import { SafetyNotice } from '../../components/SafetyNotice.tsx';
import { useStore } from '../../state/store.ts';
import { settings } from '../../state/settings.ts';
import { workflow } from '../../state/workflow.ts';
import { AzimuthMethods } from './AzimuthMethods.tsx';
import { alignNotes, CaptureBar, CaptureMethodCard, takeCapture, type CaptureInputs, type PhoneMethod } from './CaptureCard.tsx';
import { AutoCaptureGate, computeAlign, CueGate, declinationAt, declinationText, passesFrom, reflectorFrom, toleranceCost, toleranceFor, toleranceLimitsText } from './computeAlign.ts';
import { LiveCards, StatusBanner, SteadinessDetail, ToleranceCard } from './LivePanels.tsx';
import { PositionCard, usePosition } from './PositionCard.tsx';
import { ReversalCard } from './ReversalCard.tsx';
import { TargetCard } from './TargetCard.tsx';
import { useLiveAlign } from './useLiveAlign.ts';
import './align.css';
import { useNow } from '../../components/useNow.ts';

/** The declination is recomputed when the minute changes (it moves by ~0.1° a year). */
const minuteOf = (ms: number) => Math.floor(ms / 60_000);

export function AlignPage() {
  const wf = useStore(workflow);
  const st = useStore(settings);
  const [active, setActive] = useState(true);
  useIonViewWillEnter(() => setActive(true));
  useIonViewDidLeave(() => setActive(false));
  const { snap, status, field, fieldUnavailable, live } = useLiveAlign(active);
  const pos = usePosition(wf.site);
  const [readings, setReadings] = useState<AzimuthReading[]>([]);

  const minute = minuteOf(useNow(60_000));
  const decl = useMemo(() => declinationAt(pos.position, minute * 60_000), [pos.position, minute]);
  const passes = useMemo(() => passesFrom(wf.geometries), [wf.geometries]);
  const reflector = useMemo(() => reflectorFrom({ shape: wf.shape, edgeM: wf.edgeM, band: wf.band }), [wf.shape, wf.edgeM, wf.band]);
  const tol = toleranceFor(st);
  const cost = useMemo(() => toleranceCost(reflector, wf.target, tol, passes), [reflector, wf.target, tol, passes]);
  const view = computeAlign({ target: wf.target, live: snap, declination: decl, tiltBiasDeg: st.tiltBiasDeg, tol, reflector, passes });

  let disturbance: ReturnType<typeof fieldDisturbance> | null = null;
  try {
    disturbance = field && decl.ok ? fieldDisturbance(field.totalIntensityNt, decl.totalIntensityNt) : null;
  } catch {
    disturbance = null;
  }

  const cueGate = useRef(new CueGate());
  const autoGate = useRef(new AutoCaptureGate());
  const within = view.state === 'within' || view.state === 'tilt-roll-within';
  useEffect(() => {
    if (cueGate.current.update(within, Date.now())) sensors.cues.withinTolerance();
  }, [within]);

  const [pickedMethod, setMethod] = useState<PhoneMethod | null>(null);
  const method: PhoneMethod = pickedMethod ?? (status.kind === 'absolute' ? 'compass' : 'sun-shadow');
  const inputs: CaptureInputs = {
    live,
    method,
    steady: snap.steadiness.steady,
    declination: decl,
    tiltBiasDeg: st.tiltBiasDeg,
    independent: readings,
    methodToleranceDeg: st.methodToleranceDeg,
    fieldDisturbed: disturbance?.disturbed ?? false,
    reflector,
    passes,
  };
  // Capture by a steady hold: within tolerance and steady for AUTO_CAPTURE_HOLD_MS, once per hold.
  const holding = active && st.autoCapture && within && snap.steadiness.steady;
  useEffect(() => {
    const r = autoGate.current.update(holding, Date.now());
    if (alignNotes.get().holdLeftMs !== r.holdLeftMs) alignNotes.set({ holdLeftMs: r.holdLeftMs });
    if (r.capture) takeCapture(inputs, 'hold');
  });

  const record = (r: AzimuthReading) => setReadings((rs) => [...rs.filter((x) => x.method !== r.method), r]);
  const askMotion = () => void sensors.orientation.requestPermission();
  const tolText = `${st.tolerancePreset === 'custom' ? 'custom' : st.tolerancePreset} ${toleranceLimitsText(tol)}`;

  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Align</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main className="gm-align-page">
          <h1 className="gm-visually-hidden">Align the reflector</h1>
          {/* First screen: verdict, the three readings and Capture, with no scrolling on a 360 × 640 phone. */}
          {wf.target ? null : <TargetCard target={wf.target} />}
          <StatusBanner view={view} />
          <p className={status.kind === 'absolute' ? 'gm-okt gm-compass-line' : 'gm-warn gm-compass-line'} data-testid="compass-status">
            {status.message}
            {view.state !== 'cannot-measure' && snap.compassAccuracyDeg !== null ? ` Compass accuracy ±${snap.compassAccuracyDeg.toFixed(0)}°.` : ''}
          </p>
          {status.kind === 'permission-needed' || sensors.orientation.permissionNeeded() ? (
            <button type="button" className="gm-btn gm-primary" onClick={askMotion} data-testid="allow-motion">
              Allow motion sensors
            </button>
          ) : null}
          <LiveCards view={view} target={wf.target} />
          <CaptureBar inputs={inputs} capture={wf.capture} autoCapture={st.autoCapture} />

          <details className="gm-align-more" data-testid="align-more">
            <summary data-testid="align-more-summary">
              Target, method, declination, tolerance and passes
              <span className="gm-note gm-more-sub">
                {' '}
                — tolerance {tolText}
                {decl.ok ? `; declination ${declinationText(decl.declinationDeg)}` : ''}
              </span>
            </summary>
            {wf.target ? <TargetCard target={wf.target} /> : null}
            <p className="gm-note">Lay the phone screen-up on the base plate, its top edge pointing out of the open side along the bisector.</p>
            <SteadinessDetail view={view} steadiness={snap.steadiness} lastReadingAgeS={snap.lastReadingAgeS} />
            <p className={decl.ok ? 'gm-note' : 'gm-warn'} data-testid="declination">
              {decl.ok ? decl.text : decl.message}
            </p>
            {disturbance ? (
              <p className={disturbance.disturbed ? 'gm-warn' : 'gm-note'} data-testid="field-check">
                {disturbance.message}
              </p>
            ) : fieldUnavailable ? (
              <p className="gm-note" data-testid="field-check">
                {fieldUnavailable}
              </p>
            ) : null}
            <ToleranceCard settings={st} cost={cost} view={view} />
            <CaptureMethodCard method={method} onMethod={setMethod} inputs={inputs} />
            <AzimuthMethods
              targetAzimuthDeg={wf.target?.azimuthDeg ?? null}
              position={pos.position}
              readings={readings}
              onRecord={record}
              compassTrueDeg={view.measured?.azimuthTrueDeg ?? null}
              methodToleranceDeg={st.methodToleranceDeg}
              fieldDisturbed={disturbance?.disturbed ?? false}
            />
            <PositionCard p={pos} site={wf.site} />
            <ReversalCard live={live} steady={snap.steadiness.steady} biasDeg={st.tiltBiasDeg} biasAtMs={st.tiltBiasMeasuredAtMs} />
          </details>
          <SafetyNotice hazards={['lifting', 'pinch', 'wind', 'lightning', 'traffic']} />
        </main>
      </IonContent>
    </IonPage>
  );
}
