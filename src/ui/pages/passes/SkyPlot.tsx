/**
 * The sky seen from the reflector: each track's line of sight (▲ ascending, ▼ descending, numbered like the list)
 * and the reflector's −3 dB beam at its current aim (an approximate outline), so the crew sees what it serves.
 */
import { useId } from 'react';
import type { ReflectorOrientation } from '../../../core/geometry/orientation.ts';
import type { TrihedralShapeName } from '../../../core/radar/shapes.ts';
import { beamwidth3dB } from '../../../core/reflector/beamwidth.ts';
import { fmtNum } from '../../format.ts';
import type { DisplayTrack } from './computePasses.ts';
import { beamOutline, boresightDirection, placeLabels, skyPoint, trackDirection, trianglePoints } from './plotLayout.ts';

const SIZE = 320;
const FRAME = { cx: SIZE / 2, cy: SIZE / 2, radiusPx: 130 };
const MARK_PX = 6;
/** Room for one "T12" label at 12 px bold type, px. */
const LABEL_W_PX = 26;
const LABEL_H_PX = 14;
const CARDINALS = [
  { label: 'N', az: 0 },
  { label: 'E', az: 90 },
  { label: 'S', az: 180 },
  { label: 'W', az: 270 },
];

export function SkyPlot(props: { tracks: readonly DisplayTrack[]; lossesDb: readonly (number | null)[]; target: ReflectorOrientation | null; shape: TrihedralShapeName }) {
  const clipId = `sky-clip-${useId().replace(/[^A-Za-z0-9_-]/g, '')}`;
  let beam: { points: string; bore: { x: number; y: number }; boreText: string } | null = null;
  if (props.target) {
    try {
      const outline = beamOutline(props.target, beamwidth3dB(props.shape)).map((d) => skyPoint(d, FRAME));
      const b = boresightDirection(props.target);
      beam = { points: outline.map((p) => `${p.x},${p.y}`).join(' '), bore: skyPoint(b, FRAME), boreText: `azimuth ${fmtNum(b.azimuthDeg, 1)}°, elevation ${fmtNum(b.elevationDeg, 1)}°` };
    } catch {
      beam = null;
    }
  }
  const points = props.tracks.map((t) => skyPoint(trackDirection(t), FRAME));
  const labels = placeLabels(points, LABEL_W_PX, LABEL_H_PX, MARK_PX);
  const trackText = props.tracks.map((t) => `T${t.index + 1} ${t.direction} azimuth ${fmtNum(t.reflectorAzimuthDeg, 1)}°, elevation ${fmtNum(90 - t.incidenceDeg, 1)}°`).join('; ');
  return (
    <figure style={{ margin: 0 }}>
      <svg className="gm-plot" viewBox={`0 0 ${SIZE} ${SIZE}`} role="img" data-testid="sky-plot" aria-label={`Sky plot. ${trackText}.${beam ? ` Reflector boresight ${beam.boreText}.` : ' No reflector aim yet.'}`}>
        <defs>
          <clipPath id={clipId}>
            <circle cx={FRAME.cx} cy={FRAME.cy} r={FRAME.radiusPx} />
          </clipPath>
        </defs>
        {[0, 30, 60].map((el) => (
          <g key={el}>
            <circle cx={FRAME.cx} cy={FRAME.cy} r={(FRAME.radiusPx * (90 - el)) / 90} fill="none" stroke="currentColor" strokeWidth={el === 0 ? 2 : 1} strokeDasharray={el === 0 ? undefined : '2 3'} />
            {el > 0 ? (
              <text x={FRAME.cx + 3} y={FRAME.cy - (FRAME.radiusPx * (90 - el)) / 90 - 2} fontSize="10" fill="currentColor">
                {el}°
              </text>
            ) : null}
          </g>
        ))}
        {CARDINALS.map((c) => {
          const p = skyPoint({ azimuthDeg: c.az, elevationDeg: -11 }, FRAME);
          return (
            <text key={c.label} x={p.x} y={p.y + 5} fontSize="14" fontWeight="700" textAnchor="middle" fill="currentColor">
              {c.label}
            </text>
          );
        })}
        {beam ? (
          <g data-testid="sky-beam" clipPath={`url(#${clipId})`}>
            <polygon points={beam.points} fill="none" stroke="currentColor" strokeWidth="2" strokeDasharray="6 4" />
            <path d={`M${beam.bore.x - 8},${beam.bore.y}h16M${beam.bore.x},${beam.bore.y - 8}v16`} stroke="currentColor" strokeWidth="3" />
          </g>
        ) : null}
        {props.tracks.map((t, i) => {
          const p = points[i];
          const shape = t.direction === 'ascending' ? 'up' : 'down';
          // Labels are placed so that none overlaps another label or a mark (placeLabels).
          const b = labels[i];
          return (
            <g key={t.index} data-testid={`sky-track-${t.index}`}>
              <polygon points={trianglePoints(p.x, p.y, MARK_PX, shape)} fill={shape === 'up' ? 'currentColor' : 'var(--gm-bg, #fff)'} stroke="currentColor" strokeWidth="2" />
              <text x={b.x + b.w / 2} y={b.y + b.h - 2} fontSize="12" fontWeight="700" textAnchor="middle" fill="currentColor" data-testid={`sky-label-${t.index}`}>
                T{t.index + 1}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="gm-note">
        Drawn as seen from above, like a map: north at the top, east to the right, horizon on the rim, zenith in the centre. ▲ ascending, ▼ descending; T1… as in the list.{' '}
        {beam
          ? `Dashed outline: the reflector’s −3 dB beam at the current aim (APPROXIMATE: an ellipse through the two measured cuts), + its boresight (${beam.boreText}).`
          : 'No reflector aim yet: aim on the Plan screen to see the beam here.'}
      </figcaption>
      <table className="gm-table gm-sky-table" data-testid="sky-table">
        <thead>
          <tr>
            <th scope="col">Track</th>
            <th scope="col">Azimuth</th>
            <th scope="col">Elevation</th>
            <th scope="col">Loss at aim</th>
          </tr>
        </thead>
        <tbody>
          {props.tracks.map((t, i) => {
            const loss = props.lossesDb[i];
            return (
              <tr key={t.index}>
                <th scope="row">
                  T{t.index + 1} {t.direction === 'ascending' ? '▲ asc' : '▼ desc'}
                </th>
                <td>{fmtNum(t.reflectorAzimuthDeg, 1)}°</td>
                <td>{fmtNum(90 - t.incidenceDeg, 1)}°</td>
                <td data-testid={`sky-loss-${t.index}`}>{loss === null || loss === undefined ? '—' : Number.isFinite(loss) ? `${fmtNum(loss, 1)} dB` : 'no return'}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </figure>
  );
}
