/** Capture ~3 s of steady readings (or typed readings from other instruments) for the logbook. */
import { useState } from 'react';
import { useHistory } from 'react-router-dom';
import { NumberField, Segmented } from '../../components/fields.tsx';
import { fmtNum } from '../../format.ts';
import { workflow, type Capture } from '../../state/workflow.ts';
import { buildCapture, buildManualCapture, METHOD_LABEL, METHOD_SHORT, type CaptureRequest, type ManualForm } from './captureAlign.ts';
import type { LiveAlignment } from './liveAlign.ts';

type PhoneMethod = CaptureRequest['method'];

/** What a capture needs from the screen (the request's fields that do not change per tap), plus the live state. */
export interface CaptureCardProps
  extends Pick<CaptureRequest, 'steady' | 'declination' | 'tiltBiasDeg' | 'independent' | 'methodToleranceDeg' | 'fieldDisturbed' | 'reflector' | 'passes'> {
  live: LiveAlignment;
  compassAvailable: boolean;
  capture: Capture | null;
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

export function CaptureCard(props: CaptureCardProps) {
  const history = useHistory();
  const [picked, setMethod] = useState<PhoneMethod | null>(null);
  const method: PhoneMethod = picked ?? (props.compassAvailable ? 'compass' : 'sun-shadow');
  const [message, setMessage] = useState<string | null>(null);
  const [manual, setManual] = useState<ManualForm>({ azimuthDeg: '', tiltDeg: '', rollDeg: '0' });
  const [manualTried, setManualTried] = useState(false);
  // Only the field errors are shown while typing; the capture is stamped with the time of the tap (below).
  const manualOut = buildManualCapture(manual, props.reflector, props.passes, 0);

  const capture = () => {
    const out = buildCapture({
      method,
      window: props.live.captureWindow(),
      steady: props.steady,
      declination: props.declination,
      tiltBiasDeg: props.tiltBiasDeg,
      independent: props.independent,
      methodToleranceDeg: props.methodToleranceDeg,
      fieldDisturbed: props.fieldDisturbed,
      reflector: props.reflector,
      passes: props.passes,
      atMs: Date.now(),
    });
    if (out.ok) {
      workflow.set({ capture: out.capture });
      setMessage(out.check.message);
    } else setMessage(out.message);
  };
  const saveManual = () => {
    setManualTried(true);
    const out = buildManualCapture(manual, props.reflector, props.passes, Date.now());
    if (out.capture) workflow.set({ capture: out.capture });
  };

  return (
    <section className="gm-section" aria-labelledby="cap-h">
      <h2 id="cap-h">Capture</h2>
      <Segmented
        label="Method that set the azimuth"
        value={method}
        options={(['compass', 'sun-shadow', 'reference-bearing'] as const).map((m) => ({ value: m, label: METHOD_SHORT[m] }))}
        onChange={setMethod}
        testId="capture-method"
      />
      <div className="gm-btnrow">
        <button type="button" className="gm-btn gm-primary" onClick={capture} data-testid="capture">
          Capture (average of ~3 s)
        </button>
      </div>
      {!props.steady ? <p className="gm-note">Capture needs steady readings: hold the phone still on the plate.</p> : null}
      {message ? (
        <p className="gm-warn" data-testid="capture-message">
          {message}
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
