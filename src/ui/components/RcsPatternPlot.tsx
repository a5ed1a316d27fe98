/**
 * The RCS pattern around boresight in the reflector's own frame (azimuth offset from the bisector across,
 * elevation above the base plate up), shaded by dB below peak, with the planned passes marked.
 */
import { useMemo } from 'react';
import { rcsInReflectorFrame } from '../../core/reflector/pattern.ts';
import type { TrihedralShapeName } from '../../core/radar/shapes.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG } from '../../core/units.ts';

export interface PatternMark {
  label: string;
  elevationDeg: number;
  azimuthOffsetDeg: number;
  lossDb: number;
}

const AZ_MIN = -75, AZ_MAX = 75, EL_MIN = -10, EL_MAX = 90, STEP = 2.5;
const W = 360, H = 260, PAD_L = 36, PAD_B = 28, PAD_T = 8, PAD_R = 8;
const BANDS = [
  { maxDb: 1, fill: '#0b3d91', label: '≤1 dB' },
  { maxDb: 3, fill: '#3f72c4', label: '1–3 dB' },
  { maxDb: 6, fill: '#8fb1e3', label: '3–6 dB' },
  { maxDb: 10, fill: '#d3e0f3', label: '6–10 dB' },
  { maxDb: Infinity, fill: 'transparent', label: '>10 dB' },
];

const x = (az: number) => PAD_L + ((az - AZ_MIN) / (AZ_MAX - AZ_MIN)) * (W - PAD_L - PAD_R);
const y = (el: number) => PAD_T + ((EL_MAX - el) / (EL_MAX - EL_MIN)) * (H - PAD_T - PAD_B);

export function RcsPatternPlot(props: { shape: TrihedralShapeName; marks: readonly PatternMark[] }) {
  const cells = useMemo(() => {
    const out: { az: number; el: number; band: number }[] = [];
    for (let el = EL_MIN; el < EL_MAX; el += STEP) {
      for (let az = AZ_MIN; az < AZ_MAX; az += STEP) {
        const r = rcsInReflectorFrame({ shape: props.shape, edgeM: 1, wavelengthM: 0.05 }, { elevationDeg: el + STEP / 2, azimuthOffsetDeg: az + STEP / 2 });
        const loss = r.lossDb ?? Infinity;
        const band = BANDS.findIndex((b) => loss <= b.maxDb);
        if (BANDS[band].fill !== 'transparent') out.push({ az, el, band });
      }
    }
    return out;
  }, [props.shape]);

  const summary = props.marks.map((m) => `${m.label}: ${Number.isFinite(m.lossDb) ? m.lossDb.toFixed(1) + ' dB below peak' : 'outside the beam'}`).join('; ');
  return (
    <figure style={{ margin: 0 }}>
      <svg className="gm-plot" viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`RCS pattern of a ${props.shape} trihedral around boresight. ${summary}`} data-testid="rcs-pattern">
        {cells.map((c) => (
          <rect key={`${c.az},${c.el}`} x={x(c.az)} y={y(c.el + STEP)} width={x(c.az + STEP) - x(c.az) + 0.3} height={y(c.el) - y(c.el + STEP) + 0.3} fill={BANDS[c.band].fill} />
        ))}
        <rect x={PAD_L} y={PAD_T} width={W - PAD_L - PAD_R} height={H - PAD_T - PAD_B} fill="none" stroke="currentColor" />
        <line x1={x(AZ_MIN)} x2={x(AZ_MAX)} y1={y(0)} y2={y(0)} stroke="currentColor" strokeDasharray="4 3" />
        {[-60, -30, 0, 30, 60].map((a) => (
          <text key={a} x={x(a)} y={H - 10} fontSize="11" textAnchor="middle" fill="currentColor">{a}°</text>
        ))}
        {[0, 30, 60, 90].map((e) => (
          <text key={e} x={PAD_L - 4} y={y(e) + 4} fontSize="11" textAnchor="end" fill="currentColor">{e}°</text>
        ))}
        <text x={(W + PAD_L) / 2} y={H - 0} fontSize="10" textAnchor="middle" fill="currentColor">azimuth offset from bisector (clockwise +)</text>
        <g aria-hidden="true">
          <circle cx={x(0)} cy={y(TRIHEDRAL_BORESIGHT_ELEVATION_DEG)} r={4} fill="#fff" stroke="#000" strokeWidth={2} />
          {props.marks.map((m, i) => {
            const cx = x(Math.max(AZ_MIN, Math.min(AZ_MAX, m.azimuthOffsetDeg)));
            const cy = y(Math.max(EL_MIN, Math.min(EL_MAX, m.elevationDeg)));
            return (
              <g key={i}>
                <path d={`M${cx - 7},${cy - 7} L${cx + 7},${cy + 7} M${cx - 7},${cy + 7} L${cx + 7},${cy - 7}`} stroke="#b00000" strokeWidth={3} />
                <text x={cx + 9} y={cy - 6} fontSize="12" fontWeight="700" fill="#b00000" stroke="#fff" strokeWidth={3} paintOrder="stroke">{m.label}</text>
              </g>
            );
          })}
        </g>
      </svg>
      <figcaption className="gm-note">
        Shading: {BANDS.slice(0, 4).map((b) => (
          <span key={b.label} style={{ marginRight: 8 }}>
            <span style={{ display: 'inline-block', width: 12, height: 12, background: b.fill, border: '1px solid currentColor', verticalAlign: 'middle' }} /> {b.label}
          </span>
        ))}
        below peak. ○ boresight, ✕ planned passes.
      </figcaption>
    </figure>
  );
}
