/** The live parts of the Align screen: status banner, measured values with their errors, tolerance and losses. */
import { useState } from 'react';
import type { AxisGuidance } from '../../../core/alignment/guidance.ts';
import type { SteadinessStatus } from '../../../core/alignment/smoothing.ts';
import { requireInRange } from '../../../core/validate.ts';
import { NumberField, parseField, Segmented } from '../../components/fields.tsx';
import { fmtNum } from '../../format.ts';
import { settings, type Settings } from '../../state/settings.ts';
import { signedDeg, toleranceFor, toleranceLimitsText, type AlignTarget, type AlignView, type toleranceCost } from './computeAlign.ts';

const BANNER_CLASS: Record<AlignView['state'], string> = {
  within: 'gm-within',
  'tilt-roll-within': 'gm-within',
  adjust: 'gm-adjust',
  'cannot-measure': 'gm-cannot',
  waiting: '',
  'no-target': '',
};
const BANNER_MARK: Record<AlignView['state'], string> = {
  within: '✔',
  'tilt-roll-within': '✔',
  adjust: '↻',
  'cannot-measure': '✖',
  waiting: '…',
  'no-target': '?',
};

export function StatusBanner(props: { view: AlignView }) {
  const v = props.view;
  return (
    <section className={`gm-align-status ${BANNER_CLASS[v.state]}`} data-testid="align-status" data-state={v.state} role="status" aria-live="polite">
      <span aria-hidden="true">{BANNER_MARK[v.state]} </span>
      {v.statusText}
      {v.error ? <div className="gm-note" style={{ color: 'inherit' }}>{v.error}</div> : null}
    </section>
  );
}

/** Target, signed error and instruction under one measured axis. */
function Sub(props: { axis: 'azimuth' | 'tilt' | 'roll'; g: AxisGuidance<number | null> | undefined; targetDeg: number | null }) {
  const target = props.targetDeg !== null ? <span className="gm-reading-target">target {fmtNum(props.targetDeg, 1)}°</span> : null;
  if (!props.g) return target;
  if (props.g.errorDeg === null) {
    return (
      <>
        {target}
        <span className="gm-align-instr" data-testid={`instruction-${props.axis}`}>
          not measured: set it by sun shadow or a reference bearing
        </span>
      </>
    );
  }
  return (
    <>
      {target}
      <span className="gm-reading-error" data-testid={`error-${props.axis}`}>
        error {signedDeg(props.g.errorDeg)}
      </span>
      <span className="gm-align-instr" data-testid={`instruction-${props.axis}`}>
        {props.g.within ? '✔ ' : ''}
        {props.g.instruction}
      </span>
    </>
  );
}

function Reading(props: { axis: 'azimuth' | 'tilt' | 'roll'; label: string; value: number | null; g: AxisGuidance<number | null> | undefined; targetDeg: number | null }) {
  const g = props.g;
  const tone = g && g.errorDeg !== null ? (g.within ? ' gm-ok' : ' gm-bad') : '';
  return (
    <div className={`gm-reading${tone}`}>
      <div className="gm-reading-head">
        <span className="gm-label">{props.label}</span>
        <span className="gm-reading-value" data-testid={`live-${props.axis}`}>
          {props.value !== null ? fmtNum(props.value, 1) : '—'}°
        </span>
      </div>
      <div className="gm-reading-sub">
        <Sub axis={props.axis} g={g} targetDeg={props.targetDeg} />
      </div>
    </div>
  );
}

/** The three readings with their targets and signed errors: compact, so that they, the verdict and Capture fit one screen. */
export function LiveCards(props: { view: AlignView; target: AlignTarget | null }) {
  const { view, target } = props;
  const m = view.measured;
  const g = view.guidance;
  return (
    <section className="gm-readings" aria-label="Measured">
      <Reading axis="azimuth" label="Azimuth (true)" value={m?.azimuthTrueDeg ?? null} g={g?.azimuth} targetDeg={target?.azimuthDeg ?? null} />
      <Reading axis="tilt" label="Tilt (open side up +)" value={m ? m.tiltDeg : null} g={g?.tilt} targetDeg={target?.tiltDeg ?? null} />
      <Reading axis="roll" label="Roll (right side up +)" value={m ? m.rollDeg : null} g={g?.roll} targetDeg={target?.rollDeg ?? null} />
    </section>
  );
}

/** After this long without a new event, say that the value shown is held, s. */
const QUIET_NOTE_AFTER_S = 10;

/** The steadiness figures in full (behind the disclosure), and why no true azimuth is shown. */
export function SteadinessDetail(props: { view: AlignView; steadiness: SteadinessStatus; lastReadingAgeS: number | null }) {
  const { view } = props;
  const m = view.measured;
  const std = props.steadiness.std;
  return (
    <>
      {view.azimuthNote && m?.azimuthMagDeg !== null ? (
        <p className="gm-warn" data-testid="azimuth-note">
          {view.azimuthNote}
        </p>
      ) : null}
      <p className={props.steadiness.steady ? 'gm-okt' : 'gm-note'} data-testid="steadiness">
        {props.steadiness.steady ? '● Steady' : '○ Not steady yet'} — spread over {fmtNum(props.steadiness.spanS, 1)} s: tilt ±{fmtNum(std.tiltDeg, 2)}°, roll ±{fmtNum(std.rollDeg, 2)}°
        {std.azimuthDeg !== null ? `, azimuth ±${fmtNum(std.azimuthDeg, 2)}°` : ''}. Values shown are a 1 s running mean.
        {props.lastReadingAgeS !== null && props.lastReadingAgeS > QUIET_NOTE_AFTER_S
          ? ` No change from the sensor for ${fmtNum(props.lastReadingAgeS, 0)} s: the last reading is held (the phone reports only changes).`
          : ''}
      </p>
    </>
  );
}

const PRESETS = [
  { value: 'calibration', label: 'Calibration' },
  { value: 'monitoring', label: 'Monitoring' },
  { value: 'custom', label: 'Custom' },
] as const;

const tolField = (label: string, text: string) => parseField(label, text, (n, v) => requireInRange(n, v, { min: 0.05, max: 20, unit: '°' }));

export function ToleranceCard(props: { settings: Settings; cost: ReturnType<typeof toleranceCost>; view: AlignView }) {
  const s = props.settings;
  const tol = s.tolerancePreset === 'custom' ? s.customToleranceDeg : null;
  const [custom, setCustom] = useState({ az: String(s.customToleranceDeg.azimuthDeg), tilt: String(s.customToleranceDeg.tiltDeg), roll: String(s.customToleranceDeg.rollDeg) });
  const pa = tolField('Azimuth tolerance', custom.az), pt = tolField('Tilt tolerance', custom.tilt), pr = tolField('Roll tolerance', custom.roll);
  const setC = (patch: Partial<typeof custom>) => {
    const next = { ...custom, ...patch };
    setCustom(next);
    const a = tolField('a', next.az).value, t = tolField('t', next.tilt).value, r = tolField('r', next.roll).value;
    if (a !== undefined && t !== undefined && r !== undefined) settings.set({ customToleranceDeg: { azimuthDeg: a, tiltDeg: t, rollDeg: r } });
  };
  const c = props.cost.cost;
  const v = props.view;
  return (
    <section className="gm-section" aria-labelledby="tol-h">
      <h2 id="tol-h">Tolerance and predicted loss</h2>
      <Segmented label="Purpose" value={s.tolerancePreset} options={PRESETS} onChange={(p) => settings.set({ tolerancePreset: p })} testId="tolerance" />
      {tol ? (
        <div className="gm-row">
          <NumberField label="Azimuth ±" unit="°" value={custom.az} onChange={(x) => setC({ az: x })} error={pa.error} testId="tol-azimuth" />
          <NumberField label="Tilt ±" unit="°" value={custom.tilt} onChange={(x) => setC({ tilt: x })} error={pt.error} testId="tol-tilt" />
          <NumberField label="Roll ±" unit="°" value={custom.roll} onChange={(x) => setC({ roll: x })} error={pr.error} testId="tol-roll" />
        </div>
      ) : null}
      <p data-testid="tolerance-limits">
        <b>Limits {toleranceLimitsText(toleranceFor(s))}.</b>
      </p>
      <p data-testid="tolerance-cost">
        {c
          ? `At the limits this tolerance costs up to ${fmtNum(c.combinedWorstDb, 2)} dB (azimuth alone ${fmtNum(c.azimuthDb, 2)} dB, tilt alone ${fmtNum(c.tiltDb, 2)} dB, roll alone ${fmtNum(c.rollDb, 2)} dB), worst planned pass.`
          : (props.cost.message ?? 'Set a target to see what the tolerance costs.')}
      </p>
      {v.losses.length ? (
        <table className="gm-table" data-testid="pass-losses">
          <thead>
            <tr>
              <th scope="col">Pass</th>
              <th scope="col">Off boresight</th>
              <th scope="col">Loss now</th>
            </tr>
          </thead>
          <tbody>
            {v.losses.map((l, i) => (
              <tr key={i}>
                <td>{l.label}</td>
                <td>{fmtNum(l.offBoresightDeg, 1)}°</td>
                <td>{Number.isFinite(l.lossDb) ? `${fmtNum(l.lossDb, 2)} dB` : 'no return (outside the corner)'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {v.azimuthAssumed && v.losses.length ? <p className="gm-note">Loss figures assume the azimuth is on target (the phone does not measure it now).</p> : null}
    </section>
  );
}
