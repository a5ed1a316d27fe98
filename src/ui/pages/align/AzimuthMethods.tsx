/** Azimuth without (or besides) the compass: sun and shadow, a reference bearing, and the compass cross-check. */
import { useState } from 'react';
import type { AzimuthReading } from '../../../core/alignment/methodCheck.ts';
import { NumberField } from '../../components/fields.tsx';
import { fmtLength, fmtNum } from '../../format.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { methodCheck } from './captureAlign.ts';
import { signedDeg, type PositionInput } from './computeAlign.ts';
import { referenceLayoutView, sunLayoutView, type BearingForm, type SunLayoutView } from './azimuthLayouts.ts';

export interface AzimuthMethodsProps {
  targetAzimuthDeg: number | null;
  position: PositionInput | null;
  readings: readonly AzimuthReading[];
  onRecord: (r: AzimuthReading) => void;
  compassTrueDeg: number | null;
  methodToleranceDeg: number;
  fieldDisturbed: boolean;
}

const utcTime = (ms: number) => new Date(ms).toISOString().slice(11, 19) + ' UTC';

function Steps(props: { steps: string[]; testId: string }) {
  return (
    <ol className="gm-steps" data-testid={props.testId}>
      {props.steps.map((s, i) => (
        <li key={i}>{s}</li>
      ))}
    </ol>
  );
}

export function AzimuthMethods(props: AzimuthMethodsProps) {
  const target = props.targetAzimuthDeg;
  const { lengthUnit } = useStore(settings);
  const [sunBaseline, setSunBaseline] = useState('10');
  const [sun, setSun] = useState<{ view: SunLayoutView | null; error: string | null } | null>(null);
  const [refBaseline, setRefBaseline] = useState('10');
  const [bf, setBf] = useState<BearingForm>({ fromLat: '', fromLon: '', toLat: '', toLon: '' });
  const pos = props.position;

  // Prefill the pivot with the known position once it is known (adjusted while rendering, as for a prop).
  // Compared by value: the position object is rebuilt on every render.
  const posKey = pos ? `${pos.latDeg},${pos.lonDeg}` : null;
  const [seenPosKey, setSeenPosKey] = useState<string | null>(null);
  if (pos && posKey !== seenPosKey) {
    setSeenPosKey(posKey);
    setBf((f) => (f.fromLat === '' && f.fromLon === '' ? { ...f, fromLat: pos.latDeg.toFixed(7), fromLon: pos.lonDeg.toFixed(7) } : f));
  }

  const ref = target !== null && (bf.toLat !== '' || bf.toLon !== '') ? referenceLayoutView(bf, target, refBaseline, lengthUnit) : null;
  const recorded = (m: AzimuthReading['method']) => props.readings.find((r) => r.method === m);
  const check = methodCheck(
    props.compassTrueDeg === null ? props.readings : [...props.readings, { method: 'compass', azimuthDeg: props.compassTrueDeg }],
    props.methodToleranceDeg,
    props.fieldDisturbed,
  );

  return (
    <section className="gm-section" aria-labelledby="azm-h">
      <h2 id="azm-h">Azimuth by sun, reference bearing or compass</h2>
      {target === null ? <p className="gm-note">Set a target first: the tape layouts lead to the target azimuth.</p> : null}

      <div className="gm-card" style={{ marginBottom: 8 }}>
        <h3>Sun and shadow</h3>
        <div className="gm-row">
          <NumberField label="Baseline (pin to mark)" unit={lengthUnit} value={sunBaseline} onChange={setSunBaseline} testId="sun-baseline" />
        </div>
        <div className="gm-btnrow">
          <button type="button" className="gm-btn gm-primary" disabled={target === null} onClick={() => target !== null && setSun(sunLayoutView(pos, Date.now(), target, sunBaseline, lengthUnit))} data-testid="sun-compute">
            {sun?.view ? 'Recompute for now' : 'Sun layout for now'}
          </button>
        </div>
        {sun?.error ? <p className="gm-error" data-testid="sun-error">{sun.error}</p> : null}
        {sun?.view ? (
          <div data-testid="sun-layout">
            <p>
              Sun azimuth {fmtNum(sun.view.sunAzimuthDeg, 1)}° true, {fmtNum(sun.view.sunElevationDeg, 1)}° high; shadow points {fmtNum(sun.view.layout.shadowAzimuthDeg, 1)}°. Computed at{' '}
              {utcTime(sun.view.computedAtMs)}.
            </p>
            {sun.view.lowSun ? (
              <p className="gm-warn" data-testid="sun-low">
                ⚠ {sun.view.lowSun}
              </p>
            ) : null}
            <p className="gm-warn">
              The shadow drifts about ¼° a minute (here now {fmtNum(Math.abs(sun.view.rateDegPerMin), 2)}° a minute): mark the shadow tip at once, or recompute.
            </p>
            <Steps steps={sun.view.steps} testId="sun-steps" />
            <button type="button" className="gm-btn" onClick={() => target !== null && props.onRecord({ method: 'sun-shadow', azimuthDeg: target })} data-testid="record-sun">
              Plate is on this line
            </button>
          </div>
        ) : null}
        {recorded('sun-shadow') ? <p className="gm-okt">Recorded: plate set on the sun-shadow line ({fmtNum(recorded('sun-shadow')!.azimuthDeg, 1)}°).</p> : null}
      </div>

      <div className="gm-card" style={{ marginBottom: 8 }}>
        <h3>Reference bearing</h3>
        <p className="gm-note">The pivot is where the reflector stands; the reference is a landmark or a second GNSS point you can sight.</p>
        <div className="gm-row">
          <NumberField label="Pivot latitude" unit="°" value={bf.fromLat} onChange={(v) => setBf({ ...bf, fromLat: v })} error={ref?.errors.fromLat} testId="ref-from-lat" />
          <NumberField label="Pivot longitude" unit="°" value={bf.fromLon} onChange={(v) => setBf({ ...bf, fromLon: v })} error={ref?.errors.fromLon} testId="ref-from-lon" />
          <NumberField label="Reference latitude" unit="°" value={bf.toLat} onChange={(v) => setBf({ ...bf, toLat: v })} error={ref?.errors.toLat} testId="ref-to-lat" />
          <NumberField label="Reference longitude" unit="°" value={bf.toLon} onChange={(v) => setBf({ ...bf, toLon: v })} error={ref?.errors.toLon} testId="ref-to-lon" />
          <NumberField label="Baseline (pivot to mark)" unit={lengthUnit} value={refBaseline} onChange={setRefBaseline} error={ref?.errors.baseline} testId="ref-baseline" />
        </div>
        {ref?.errors.points ? <p className="gm-error">{ref.errors.points}</p> : null}
        {ref?.view ? (
          <div data-testid="ref-layout">
            <p>
              Reference bearing {fmtNum(ref.view.bearingDeg, 2)}° true, {fmtLength(ref.view.distanceM, lengthUnit, 1)} away. Turn {signedDeg(ref.view.layout.turnDeg)} to the target line.
            </p>
            <Steps steps={ref.view.steps} testId="ref-steps" />
            <button type="button" className="gm-btn" onClick={() => target !== null && props.onRecord({ method: 'reference-bearing', azimuthDeg: target })} data-testid="record-ref">
              Plate is on this line
            </button>
          </div>
        ) : null}
        {recorded('reference-bearing') ? <p className="gm-okt">Recorded: plate set on the reference-bearing line ({fmtNum(recorded('reference-bearing')!.azimuthDeg, 1)}°).</p> : null}
      </div>

      <div className="gm-card" style={{ marginBottom: 8 }}>
        <h3>Compass</h3>
        {/* The 10 m stand-off for a vehicle is common practice, no source. */}
        <p>
          The phone’s compass is corrected by the declination shown above. Steel pulls it by degrees: keep the vehicle well away (10 m or more), and tools,
          rebar, steel stakes and other phones off the plate. On a steel base or reflector the compass cannot be trusted: use the sun or a reference bearing.
        </p>
        <p data-testid="compass-live">{props.compassTrueDeg === null ? 'No compass azimuth now.' : `Compass now reads ${fmtNum(props.compassTrueDeg, 1)}° true.`}</p>
      </div>

      <p className={check.compassBlocked || (check.comparison && !check.comparison.agree) ? 'gm-warn' : 'gm-note'} data-testid="method-check">
        {check.message ?? 'Record the plate on a sun-shadow or reference-bearing line to cross-check the compass.'}
      </p>
    </section>
  );
}
