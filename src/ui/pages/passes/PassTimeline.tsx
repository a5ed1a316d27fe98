/** Passes across the planning window: days across, ascending ▲ and descending ▼ on their own labelled rows. */
import { fmtNum } from '../../format.ts';
import { formatUtc } from './computePasses.ts';
import { fmtSiteTime } from '../../siteTime.ts';
import { nowAnchor, TIMELINE_AXIS_Y, timelineLayout, trianglePoints, type TimelineInput } from './plotLayout.ts';

const MARK_PX = 7;

export function PassTimeline(props: { passes: readonly TimelineInput[]; startMs: number; days: number; nowMs: number; zone: string | null }) {
  const l = timelineLayout(props.passes, props.startMs, props.days, undefined, props.zone);
  const nowX = l.plotLeft + ((props.nowMs - props.startMs) / (props.days * 86_400_000)) * (l.plotRight - l.plotLeft);
  const asc = l.marks.filter((m) => m.direction === 'ascending').length;
  const desc = l.marks.length - asc;
  return (
    <figure style={{ margin: 0 }}>
      <svg
        className="gm-plot"
        viewBox={`0 0 ${l.width} ${l.height}`}
        role="img"
        aria-label={`Timeline of ${l.marks.length} passes over ${fmtNum(props.days, 0)} days: ${asc} ascending, ${desc} descending`}
        data-testid="pass-timeline"
      >
        <line x1={l.plotLeft} x2={l.plotRight} y1={TIMELINE_AXIS_Y} y2={TIMELINE_AXIS_Y} stroke="currentColor" strokeWidth="1" />
        {l.rows.map((r) => (
          <g key={r.direction}>
            <line x1={l.plotLeft} x2={l.plotRight} y1={r.y} y2={r.y} stroke="currentColor" strokeWidth="1" />
            <text x={4} y={r.y + 4} fontSize="12" fontWeight="700" fill="currentColor">
              {r.label}
            </text>
          </g>
        ))}
        {l.ticks.map((t, i) => (
          <g key={i}>
            <line x1={t.x} x2={t.x} y1={TIMELINE_AXIS_Y} y2={TIMELINE_AXIS_Y + (t.label ? 8 : 4)} stroke="currentColor" strokeWidth="1" />
            {t.label ? (
              <text x={t.x} y={TIMELINE_AXIS_Y + 21} fontSize="11" textAnchor="middle" fill="currentColor">
                {t.label}
              </text>
            ) : null}
          </g>
        ))}
        {nowX >= l.plotLeft && nowX <= l.plotRight ? (
          <g>
            <line x1={nowX} x2={nowX} y1={10} y2={TIMELINE_AXIS_Y} stroke="currentColor" strokeWidth="2" strokeDasharray="3 2" />
            <text x={nowX} y={9} fontSize="10" textAnchor={nowAnchor(nowX, l.plotLeft, l.plotRight)} fill="currentColor" data-testid="timeline-now">
              now
            </text>
          </g>
        ) : null}
        {l.marks.map((m, i) => (
          <g key={i} data-testid={`timeline-mark-${i}`} data-direction={m.direction}>
            <title>{`${m.satellite} ${m.direction} ${formatUtc(m.timeMs)}${props.zone ? ` (${fmtSiteTime(m.timeMs, props.zone)})` : ''}, incidence ${fmtNum(m.incidenceDeg, 1)}°`}</title>
            <polygon points={trianglePoints(m.x, m.y, MARK_PX, m.shape)} fill={m.shape === 'up' ? 'currentColor' : 'var(--gm-bg, #fff)'} stroke="currentColor" strokeWidth="2" />
            <text x={m.x} y={m.shape === 'up' ? m.y - MARK_PX - 3 : m.y + MARK_PX + 11} fontSize="10" fontWeight="700" textAnchor="middle" fill="currentColor">
              {m.letter}
            </text>
          </g>
        ))}
      </svg>
      <figcaption className="gm-note" data-testid="timeline-caption">{props.zone ? `Days of the site’s calendar (${props.zone}).` : 'Days in UTC.'} ▲ A = ascending (northbound), ▼ D = descending (southbound).</figcaption>
    </figure>
  );
}
