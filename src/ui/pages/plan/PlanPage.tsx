import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import { useMemo, useState } from 'react';
import { useHistory } from 'react-router-dom';
import { BAND_PRESETS } from '../../../core/radar/bands.ts';
import { BigNumber, NumberField, Segmented, SelectField } from '../../components/fields.tsx';
import { RcsPatternPlot } from '../../components/RcsPatternPlot.tsx';
import { SafetyNotice } from '../../components/SafetyNotice.tsx';
import { useStore } from '../../state/store.ts';
import { settings } from '../../state/settings.ts';
import { workflow, type GeometryInput } from '../../state/workflow.ts';
import { computePlan } from './computePlan.ts';
import { fmtDeg, fmtNum } from '../../format.ts';

const BAND_OPTIONS = [
  ...BAND_PRESETS.map((b) => ({ value: b.name, label: `${b.name} band (${b.centreGhz} GHz)` })),
  { value: 'custom', label: 'Other frequency…' },
];

export function PlanPage() {
  const wf = useStore(workflow);
  const units = useStore(settings);
  const history = useHistory();
  const [frequencyGhz, setFrequencyGhz] = useState('5.405');
  const [clutterDb, setClutterDb] = useState('-10');
  const [rangeResolutionM, setRangeResolutionM] = useState('3');
  const [azimuthResolutionM, setAzimuthResolutionM] = useState('20');
  const [targetScrDb, setTargetScrDb] = useState('20');

  const plan = useMemo(
    () => computePlan({ geometries: wf.geometries, shape: wf.shape, edgeM: wf.edgeM, band: wf.band, frequencyGhz, clutterDb, rangeResolutionM, azimuthResolutionM, targetScrDb }),
    [wf.geometries, wf.shape, wf.edgeM, wf.band, frequencyGhz, clutterDb, rangeResolutionM, azimuthResolutionM, targetScrDb],
  );

  const setGeometry = (i: number, patch: Partial<GeometryInput>) =>
    workflow.set((s) => ({
      geometries: s.geometries.map((g, j) => {
        if (j !== i) return g;
        // A typed change makes the row a typed geometry: the orbit's exact line of sight no longer applies.
        const typed = patch.incidenceDeg !== undefined || patch.headingDeg !== undefined || patch.look !== undefined;
        return typed ? { ...g, ...patch, source: 'typed', losAzimuthDeg: undefined, label: undefined } : { ...g, ...patch };
      }),
    }));
  const addGeometry = () => workflow.set((s) => ({ geometries: [...s.geometries, { incidenceDeg: '', headingDeg: '', look: 'right', source: 'typed' }] }));
  const removeGeometry = (i: number) => workflow.set((s) => ({ geometries: s.geometries.filter((_, j) => j !== i) }));

  const goAlign = () => {
    if (!plan.target) return;
    workflow.set({ target: plan.target });
    history.push('/align');
  };

  const t = plan.target;
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Plan</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Aim and size a reflector</h1>
          {wf.site ? (
            <p className="gm-note" data-testid="plan-site">
              Site {wf.site.code ?? ''} {fmtDeg(wf.site.latDeg, 5, units.angleFormat)}, {fmtDeg(wf.site.lonDeg, 5, units.angleFormat)}
            </p>
          ) : null}
          <section className="gm-cards" aria-label="Aim">
            <BigNumber label="Reflector azimuth (true)" value={t ? fmtNum(t.azimuthDeg, 1) : '—'} unit="°" testId="result-azimuth" />
            <BigNumber label="Base tilt (open side up +)" value={t ? fmtNum(t.tiltDeg, 1) : '—'} unit="°" testId="result-tilt" />
            {t && Math.abs(t.rollDeg) > 0.05 ? <BigNumber label="Roll (right side up +)" value={fmtNum(t.rollDeg, 1)} unit="°" testId="result-roll" /> : null}
            <BigNumber label="Peak RCS" value={plan.peakRcsDbsm !== null ? fmtNum(plan.peakRcsDbsm, 1) : '—'} unit=" dBsm" testId="result-peak" sub={plan.peakRcsM2 !== null ? `${fmtNum(plan.peakRcsM2, 0)} m²` : undefined} />
          </section>
          {plan.geometries.length > 1 && plan.worstLossDb !== null ? (
            <p className={plan.separateRecommended ? 'gm-warn' : 'gm-okt'} data-testid="compromise-message">
              {plan.compromiseMessage} Worst loss {fmtNum(plan.worstLossDb, 1)} dB.
            </p>
          ) : null}
          <p className="gm-note">
            3 dB beamwidth: {fmtNum(plan.beamwidth.elevationFullDeg, 1)}° in elevation, {fmtNum(plan.beamwidth.azimuthFullDeg, 1)}° in azimuth.
            {plan.boresightElevationDeg !== null ? ` Boresight elevation ${fmtNum(plan.boresightElevationDeg, 2)}°.` : ''}
          </p>
          <button type="button" className="gm-btn gm-primary" disabled={!t} onClick={goAlign} data-testid="go-align">
            Align to this aim
          </button>

          <section className="gm-section" aria-labelledby="geo-h">
            <h2 id="geo-h">Pass geometry</h2>
            {wf.geometries.map((g, i) => {
              const r = plan.geometries[i];
              return (
                <div key={i} className="gm-card" style={{ marginBottom: 8 }} data-testid={`geometry-${i}`}>
                  {g.label ? <p className="gm-note">{g.label}</p> : null}
                  <div className="gm-row">
                    <NumberField label="Incidence" unit="°" value={g.incidenceDeg} onChange={(v) => setGeometry(i, { incidenceDeg: v })} error={r.errors.incidenceDeg} testId={`incidence-${i}`} />
                    <NumberField label="Heading" unit="° true" value={g.headingDeg} onChange={(v) => setGeometry(i, { headingDeg: v })} error={r.errors.headingDeg} testId={`heading-${i}`} />
                    <Segmented label="Look side" value={g.look} options={[{ value: 'right', label: 'Right' }, { value: 'left', label: 'Left' }]} onChange={(v) => setGeometry(i, { look: v })} testId={`look-${i}`} />
                  </div>
                  {r.lossDb !== null ? (
                    <p className="gm-note" data-testid={`loss-${i}`}>
                      At this aim: {fmtNum(r.offBoresightDeg ?? 0, 1)}° off boresight, {Number.isFinite(r.lossDb) ? `${fmtNum(r.lossDb, 2)} dB below peak` : 'outside the corner (no return)'}
                    </p>
                  ) : null}
                  {wf.geometries.length > 1 ? (
                    <button type="button" className="gm-btn" onClick={() => removeGeometry(i)} aria-label={`Remove geometry ${i + 1}`}>
                      Remove
                    </button>
                  ) : null}
                </div>
              );
            })}
            <button type="button" className="gm-btn" onClick={addGeometry} data-testid="add-geometry">
              Add another geometry
            </button>
          </section>

          <section className="gm-section" aria-labelledby="refl-h">
            <h2 id="refl-h">Reflector</h2>
            <div className="gm-row">
              <Segmented label="Shape" value={wf.shape} options={[{ value: 'triangular', label: 'Triangular' }, { value: 'square', label: 'Square' }]} onChange={(v) => workflow.set({ shape: v })} testId="shape" />
              <NumberField label="Inner edge" unit="m" value={wf.edgeM} onChange={(v) => workflow.set({ edgeM: v })} error={plan.errors.edgeM} testId="edge" />
              <SelectField label="Band" value={wf.band} options={BAND_OPTIONS} onChange={(v) => workflow.set({ band: v })} testId="band" />
              {wf.band === 'custom' ? <NumberField label="Frequency" unit="GHz" value={frequencyGhz} onChange={setFrequencyGhz} error={plan.errors.frequencyGhz} testId="frequency" /> : null}
            </div>
            {plan.wavelengthM !== null ? <p className="gm-note">Wavelength {fmtNum(plan.wavelengthM * 100, 2)} cm.</p> : null}
          </section>

          <section className="gm-section" aria-labelledby="pat-h">
            <h2 id="pat-h">Pattern around boresight</h2>
            <RcsPatternPlot
              shape={wf.shape}
              marks={plan.geometries.filter((g) => g.elevationDeg !== null).map((g, i) => ({ label: `P${i + 1}`, elevationDeg: g.elevationDeg!, azimuthOffsetDeg: g.azimuthOffsetDeg!, lossDb: g.lossDb ?? Infinity }))}
            />
          </section>

          <section className="gm-section" aria-labelledby="clut-h">
            <h2 id="clut-h">Clutter and precision</h2>
            <div className="gm-row">
              <NumberField label="Background σ⁰" unit="dB" value={clutterDb} onChange={setClutterDb} error={plan.errors.clutterDb} testId="clutter" />
              <NumberField label="Slant-range resolution" unit="m" value={rangeResolutionM} onChange={setRangeResolutionM} error={plan.errors.rangeResolutionM} testId="range-res" />
              <NumberField label="Azimuth resolution" unit="m" value={azimuthResolutionM} onChange={setAzimuthResolutionM} error={plan.errors.azimuthResolutionM} testId="azimuth-res" />
              <NumberField label="Target SCR" unit="dB" value={targetScrDb} onChange={setTargetScrDb} error={plan.errors.targetScrDb} testId="target-scr" />
            </div>
            <div className="gm-cards">
              <BigNumber label="Signal-to-clutter" value={plan.scrDb !== null ? fmtNum(plan.scrDb, 1) : '—'} unit=" dB" testId="result-scr" tone={plan.scrDb === null ? undefined : plan.scrDb >= 20 ? 'ok' : plan.scrDb < 10 ? 'bad' : undefined} />
              <BigNumber label="LOS precision" value={plan.losStdMm !== null ? fmtNum(plan.losStdMm, 2) : '—'} unit=" mm" testId="result-precision" sub={`one image, lower bound (clutter only); difference of two images ${plan.losStdDiffMm !== null ? fmtNum(plan.losStdDiffMm, 2) : '—'} mm (√2 larger)`} />
              <BigNumber label="Edge for target SCR" value={plan.edgeForTargetM !== null ? fmtNum(plan.edgeForTargetM, 2) : '—'} unit=" m" testId="result-edge-needed" />
            </div>
            <p className="gm-note">
              Cell area {plan.cellAreaM2 !== null ? `${fmtNum(plan.cellAreaM2, 1)} m²` : '—'} (ground-projected at the steepest planned incidence).
              The SCR uses the worst planned pass at this aim. Atmosphere, orbit errors and monument motion add to the precision shown.
            </p>
          </section>
          <SafetyNotice hazards={['lifting', 'edges', 'wind', 'digging', 'access']} title="Before you go to site" />
        </main>
      </IonContent>
    </IonPage>
  );
}
