/** Two-position reversal to find this phone's tilt bias (core: reversalCalibration), saved in the settings. */
import { useState } from 'react';
import { reversalCalibration, type ReversalCalibration } from '../../../core/alignment/reversal.ts';
import { fmtNum } from '../../format.ts';
import { settings } from '../../state/settings.ts';
import type { LiveAlignment } from './liveAlign.ts';
import { signedDeg } from './computeAlign.ts';

/** A bias larger than this is refused as a misreading (the core accepts ±45°), degrees (common practice, no source). */
const MAX_SENSIBLE_BIAS_DEG = 10;

export function ReversalCard(props: { live: LiveAlignment; steady: boolean; biasDeg: number; biasAtMs: number | null }) {
  const [t1, setT1] = useState<number | null>(null);
  const [result, setResult] = useState<ReversalCalibration | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  const read = (): number | null => {
    const w = props.live.captureWindow();
    if (!props.steady || !w) {
      setMessage('Hold the phone still on the plate until the readings are steady, then read.');
      return null;
    }
    setMessage(null);
    return w.tiltDeg;
  };
  const step1 = () => {
    const t = read();
    if (t === null) return;
    setT1(t);
    setResult(null);
  };
  const step2 = () => {
    const t = read();
    if (t === null || t1 === null) return;
    try {
      const r = reversalCalibration(t1, t);
      if (Math.abs(r.biasDeg) > MAX_SENSIBLE_BIAS_DEG) {
        setMessage(`The two readings give a bias of ${fmtNum(r.biasDeg, 2)}°, too large to be the phone: was it turned end for end on the same spot? Start again.`);
        setT1(null);
        return;
      }
      setResult(r);
    } catch (e) {
      setMessage(e instanceof Error ? e.message : String(e));
    }
  };
  const save = () => {
    if (!result) return;
    settings.set({ tiltBiasDeg: result.biasDeg, tiltBiasMeasuredAtMs: Date.now() });
    setT1(null);
    setResult(null);
  };

  return (
    <section className="gm-section" aria-labelledby="rev-h">
      <h2 id="rev-h">Tilt bias of this phone (reversal)</h2>
      <p data-testid="tilt-bias">
        Bias in use: {signedDeg(props.biasDeg, 2)}
        {props.biasAtMs !== null ? `, measured ${new Date(props.biasAtMs).toISOString().slice(0, 16).replace('T', ' ')} UTC` : ' (never measured on this phone)'}.
      </p>
      <ol className="gm-steps">
        <li>Lay the phone on the plate, top toward the open side, and hold still. Read step 1.</li>
        <li>Turn the phone end for end on the same spot (top toward the corner), hold still. Read step 2.</li>
      </ol>
      <div className="gm-btnrow">
        <button type="button" className="gm-btn" onClick={step1} data-testid="reversal-1">
          Read step 1
        </button>
        <button type="button" className="gm-btn" onClick={step2} disabled={t1 === null} data-testid="reversal-2">
          Read step 2
        </button>
      </div>
      {t1 !== null ? <p>Step 1: {signedDeg(t1, 2)}.</p> : null}
      {message ? <p className="gm-warn">{message}</p> : null}
      {result ? (
        <div data-testid="reversal-result">
          <p>
            Plate tilt {signedDeg(result.tiltDeg, 2)}; phone bias {signedDeg(result.biasDeg, 2)}.
          </p>
          <button type="button" className="gm-btn gm-primary" onClick={save} data-testid="reversal-save">
            Save bias for this phone
          </button>
        </div>
      ) : null}
    </section>
  );
}
