/** No element set at hand: an APPROXIMATE geometry from a circular orbit, which can still feed the Plan screen. */
import { useState } from 'react';
import type { PassDirection } from '../../../core/orbit/passes.ts';
import { NumberField, Segmented } from '../../components/fields.tsx';
import { fmtNum } from '../../format.ts';
import { computeCircular, geometryFromCircular, type CircularForm } from './circularForm.ts';
import type { GeometryInput } from '../../state/workflow.ts';

const DIRECTIONS: readonly PassDirection[] = ['ascending', 'descending'];

export function CircularPanel(props: { siteLatDeg: number | null; onUse: (g: GeometryInput) => void }) {
  const [form, setForm] = useState<Omit<CircularForm, 'latDeg'>>({ altitudeKm: '693', inclinationDeg: '98.18', angleKind: 'incidence', angleDeg: '37', look: 'right' });
  // The latitude follows the site until the crew types one.
  const [latText, setLatText] = useState<string | null>(null);
  const latDeg = latText ?? (props.siteLatDeg !== null ? props.siteLatDeg.toFixed(4) : '');
  const full: CircularForm = { ...form, latDeg };
  const r = computeCircular(full);
  const set = (patch: Partial<CircularForm>) => setForm({ ...form, ...patch });

  return (
    <details className="gm-section gm-card" data-testid="circular-panel">
      <summary className="gm-circular-summary">No elements at hand? Circular-orbit approximation</summary>
      <p className="gm-warn">APPROXIMATE: a circular orbit over a round, rotating Earth. It gives no pass times; use an element set as soon as you have one.</p>
      <div className="gm-row">
        <NumberField label="Orbit altitude" unit="km" value={form.altitudeKm} onChange={(v) => set({ altitudeKm: v })} error={r.errors.altitudeKm} testId="circ-altitude" />
        <NumberField label="Inclination" unit="°" value={form.inclinationDeg} onChange={(v) => set({ inclinationDeg: v })} error={r.errors.inclinationDeg} testId="circ-inclination" />
        <NumberField label="Site latitude" unit="° N" value={latDeg} onChange={setLatText} error={r.errors.latDeg} testId="circ-lat" />
        <div className="gm-wide">
          <Segmented
            label="Angle known"
            value={form.angleKind}
            options={[
              { value: 'incidence', label: 'Incidence' },
              { value: 'look', label: 'Look angle' },
            ]}
            onChange={(v) => set({ angleKind: v })}
            testId="circ-angle-kind"
          />
        </div>
        <NumberField label={form.angleKind === 'incidence' ? 'Incidence at the site' : 'Look angle at the satellite'} unit="°" value={form.angleDeg} onChange={(v) => set({ angleDeg: v })} error={r.errors.angleDeg} testId="circ-angle" />
        <Segmented label="Look side" value={form.look} options={[{ value: 'right', label: 'Right' }, { value: 'left', label: 'Left' }]} onChange={(v) => set({ look: v })} testId="circ-look" />
      </div>
      {r.error ? (
        <p className="gm-error" role="alert" data-testid="circ-error">
          {r.error}
        </p>
      ) : null}
      {r.geometry ? (
        <>
          <table className="gm-table" data-testid="circ-result">
            <caption className="gm-label">APPROXIMATE geometry</caption>
            <thead>
              <tr>
                <th scope="col">Pass</th>
                <th scope="col">Heading</th>
                <th scope="col">Reflector azimuth</th>
                <th scope="col">Incidence</th>
              </tr>
            </thead>
            <tbody>
              {DIRECTIONS.map((d) => (
                <tr key={d}>
                  <th scope="row">{d === 'ascending' ? '▲ Ascending' : '▼ Descending'}</th>
                  <td data-testid={`circ-heading-${d}`}>≈ {fmtNum(r.geometry![d].headingDeg, 1)}°</td>
                  <td>≈ {fmtNum(r.geometry![d].reflectorAzimuthDeg, 1)}°</td>
                  <td>≈ {fmtNum(r.geometry![d].incidenceDeg, 1)}°</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="gm-note">
            Period {fmtNum(r.geometry.periodMin, 2)} min, slant range ≈ {fmtNum(r.geometry.ascending.slantRangeM / 1000, 0)} km. Model: {r.geometry.note}.
          </p>
          <div className="gm-passes-buttons">
            {DIRECTIONS.map((d) => (
              <button key={d} type="button" className="gm-btn" onClick={() => props.onUse(geometryFromCircular(r.geometry!, d, form.look, r.inclinationDeg!))} data-testid={`circ-use-${d}`}>
                Use {d} (approximate) on Plan
              </button>
            ))}
          </div>
        </>
      ) : null}
    </details>
  );
}
