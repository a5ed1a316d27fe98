/**
 * Capture ~3 s of steady readings (or typed readings from other instruments) for the logbook. The Capture bar sits
 * with the live readings on the first screen; the method and the typed readings sit behind the disclosure.
 */
import { useState } from 'react';
import { useHistory } from 'react-router-dom';
import { NumberField, Segmented } from '../../components/fields.tsx';
import { fmtNum } from '../../format.ts';
import { settings } from '../../state/settings.ts';
import { createStore, useStore } from '../../state/store.ts';
import { workflow, type Capture } from '../../state/workflow.ts';
import { buildCapture, buildManualCapture, METHOD_LABEL, METHOD_SHORT, type CaptureRequest, type ManualForm } from './captureAlign.ts';
import { AUTO_CAPTURE_HOLD_MS } from './computeAlign.ts';
import type { LiveAlignment } from './liveAlign.ts';

export type PhoneMethod = CaptureRequest['method'];

/** What a capture needs from the screen (the request's fields that do not change per tap), plus the live state. */
export interface CaptureInputs
  extends Pick<CaptureRequest, 'steady' | 'declination' | 'tiltBiasDeg' | 'independent' | 'methodToleranceDeg' | 'fieldDisturbed' | 'reflector' | 'passes'> {
  live: LiveAlignment;
  method: PhoneMethod;
}

/** The Align screen's passing state between renders: the last capture's message and the hold countdown. */
export const alignNotes = createStore<{ message: string | null; holdLeftMs: number | null }>({ message: null, holdLeftMs: null });

/** Take a capture now (a tap, or the steady hold); the result goes to the workflow, its words to alignNotes. */
export function takeCapture(p: CaptureInputs, how: 'tap' | 'hold'): void {
  const out = buildCapture({
    method: p.method,
    window: p.live.captureWindow(),
    steady: p.steady,
    declination: p.declination,
    tiltBiasDeg: p.tiltBiasDeg,
    independent: p.independent,
    methodToleranceDeg: p.methodToleranceDeg,
    fieldDisturbed: p.fieldDisturbed,
    reflector: p.reflector,
    passes: p.passes,
    atMs: Date.now(),
  });
  if (out.ok) {
    workflow.set({ capture: out.capture });
    alignNotes.set({ message: [how === 'hold' ? 'Captured by the steady hold.' : null, out.check.message].filter(Boolean).join(' ') || null });
  } else alignNotes.set({ message: out.message });
}

function CaptureSummary(props: { c: Capture }) {
  const c = props.c;
  return (
    <p data-testid="capture-result">
      Captured {new Date(c.atMs).toISOString().slice(11, 19)} UTC: azimuth {fmtNum(c.azimuthDeg, 1)}° true ({METHOD_LABEL[c.method]}
      {c.declinationDeg !== null ? `, declination ${fmtNum(c.declinationDeg, 1)}° ${c.declinationModel ?? ''}` : ''}), tilt {fmtNum(c.tiltDeg, 2)}°, roll {fmtNum(c.rollDeg, 2)}°
      {c.samples > 1 ? `, mean of ${c.samples} readings` : ''}
      {c.predictedLossDb !== null ? `; predicted loss ${Number.isFinite(c.predictedLossDb) ? fmtNum(c.predictedLossDb, 2) + ' dB' : 'total (outside the corner)'}` : ''}.
    </p>
  );
}

/** Capture within thumb's reach: the button, the steady-hold switch, and what came of the last capture. */
export function CaptureBar(props: { inputs: CaptureInputs; capture: Capture | null; autoCapture: boolean }) {
  const history = useHistory();
  const notes = useStore(alignNotes);
  const holdS = AUTO_CAPTURE_HOLD_MS / 1000;
  return (
    <section className="gm-capture-bar" aria-label="Capture">
      <div className="gm-capture-row">
        <button type="button" className="gm-btn gm-primary gm-capture-btn" onClick={() => takeCapture(props.inputs, 'tap')} data-testid="capture">
          Capture
        </button>
        <button
          type="button"
          className="gm-btn gm-auto-btn"
          aria-pressed={props.autoCapture}
          onClick={() => settings.set({ autoCapture: !props.autoCapture })}
          data-testid="auto-capture"
        >
          Auto {props.autoCapture ? 'on' : 'off'}
        </button>
      </div>
      <p className={props.inputs.steady ? 'gm-okt gm-capture-line' : 'gm-note gm-capture-line'} data-testid="capture-steady">
        {props.inputs.steady ? '● Steady' : '○ Hold the phone still on the plate'} · {METHOD_SHORT[props.inputs.method]}
        {props.autoCapture
          ? notes.holdLeftMs !== null
            ? ` · capturing in ${Math.ceil(notes.holdLeftMs / 1000)} s`
            : ` · captures after ${holdS} s steady within tolerance`
          : ' · average of ~3 s'}
      </p>
      {notes.message ? (
        <p className="gm-warn" data-testid="capture-message">
          {notes.message}
        </p>
      ) : null}
      {props.capture ? (
        <div className="gm-card">
          <CaptureSummary c={props.capture} />
          <button type="button" className="gm-btn gm-primary" onClick={() => history.push('/logbook/new-installation')} data-testid="go-logbook">
            Go to logbook
          </button>
        </div>
      ) : null}
    </section>
  );
}

/** Behind the disclosure: which method set the azimuth, and readings typed from other instruments. */
export function CaptureMethodCard(props: { method: PhoneMethod; onMethod: (m: PhoneMethod) => void; inputs: Pick<CaptureInputs, 'reflector' | 'passes'> }) {
  const [manual, setManual] = useState<ManualForm>({ azimuthDeg: '', tiltDeg: '', rollDeg: '0' });
  const [manualTried, setManualTried] = useState(false);
  // Only the field errors are shown while typing; the capture is stamped with the time of the tap (below).
  const manualOut = buildManualCapture(manual, props.inputs.reflector, props.inputs.passes, 0);
  const saveManual = () => {
    setManualTried(true);
    const out = buildManualCapture(manual, props.inputs.reflector, props.inputs.passes, Date.now());
    if (out.capture) workflow.set({ capture: out.capture });
  };

  return (
    <section className="gm-section" aria-labelledby="cap-h">
      <h2 id="cap-h">Capture method</h2>
      <Segmented
        label="Method that set the azimuth"
        value={props.method}
        options={(['compass', 'sun-shadow', 'reference-bearing'] as const).map((m) => ({ value: m, label: METHOD_SHORT[m] }))}
        onChange={props.onMethod}
        testId="capture-method"
      />
      <h3>Typed readings from other instruments</h3>
      <p className="gm-note">Azimuth true (e.g. from a survey instrument), tilt and roll from an inclinometer.</p>
      <div className="gm-row">
        <NumberField label="Azimuth" unit="° true" value={manual.azimuthDeg} onChange={(v) => setManual({ ...manual, azimuthDeg: v })} error={manualTried ? manualOut.errors.azimuthDeg : undefined} testId="manual-azimuth" />
        <NumberField label="Tilt" unit="°" value={manual.tiltDeg} onChange={(v) => setManual({ ...manual, tiltDeg: v })} error={manualTried ? manualOut.errors.tiltDeg : undefined} testId="manual-tilt" />
        <NumberField label="Roll" unit="°" value={manual.rollDeg} onChange={(v) => setManual({ ...manual, rollDeg: v })} error={manualTried ? manualOut.errors.rollDeg : undefined} testId="manual-roll" />
      </div>
      <div className="gm-btnrow">
        <button type="button" className="gm-btn" onClick={saveManual} data-testid="manual-save">
          Save typed readings as the capture
        </button>
      </div>
    </section>
  );
}
