/** Upcoming tracks: one card each, with the aim it needs and buttons to hand it to the Plan screen. */
import type { Pass } from '../../../core/orbit/passes.ts';
import { fmtNum } from '../../format.ts';
import { fmtSiteTime } from '../../siteTime.ts';
import { formatCountdown, formatDays, formatUtc, nextPassAfter, trackNextAfterMs, type DisplayTrack } from './computePasses.ts';


const ARROW = { ascending: '▲', descending: '▼' } as const;

/** The pass time in the site's zone, named; nothing when the zone is unknown (UTC is shown beside it anyway). */
const siteTime = (ms: number, zone: string | null) => (zone ? fmtSiteTime(ms, zone, { seconds: true }) + ' site time' : 'site time zone unknown');

export function NextPassCountdown(props: { passes: readonly Pass[]; nowMs: number; zone: string | null }) {
  const next = nextPassAfter(props.passes, props.nowMs);
  return (
    <div className="gm-card" aria-live="off">
      <div className="gm-label">Next pass</div>
      {next ? (
        <>
          <div className="gm-big" data-testid="next-pass-countdown">
            {formatCountdown(next.timeMs - props.nowMs)}
          </div>
          <div className="gm-note">
            {next.satellite} {ARROW[next.direction]} {next.direction}, incidence {fmtNum(next.incidenceDeg, 1)}° — {formatUtc(next.timeMs)} · <span data-testid="next-pass-site-time">{siteTime(next.timeMs, props.zone)}</span>
          </div>
        </>
      ) : (
        <div className="gm-mid" data-testid="next-pass-countdown">
          No pass after now in this window
        </div>
      )}
    </div>
  );
}

export function TrackList(props: {
  tracks: readonly DisplayTrack[];
  lossesDb: readonly (number | null)[];
  nowMs: number;
  zone: string | null;
  onAim: (t: DisplayTrack) => void;
  onAdd: (t: DisplayTrack) => void;
}) {
  if (props.tracks.length === 0) return <p className="gm-warn" data-testid="no-tracks">No pass in this window and incidence range on this look side.</p>;
  return (
    <ol className="gm-passes-tracks" data-testid="track-list">
      {props.tracks.map((t, i) => {
        const loss = props.lossesDb[i];
        const upcomingMs = trackNextAfterMs(t, props.nowMs);
        const lastMs = Date.parse(t.passTimesUtc[t.passTimesUtc.length - 1]);
        return (
          <li key={t.id + t.satellite} className="gm-card" data-testid={`track-${i}`} data-incidence-deg={t.incidenceDeg} data-reflector-azimuth-deg={t.reflectorAzimuthDeg}>
            <h3 className="gm-track-title">
              <span aria-hidden="true">{ARROW[t.direction]} </span>
              {t.label} {t.demo ? <span className="gm-demo-badge">DEMO</span> : null}
            </h3>
            <dl className="gm-track-figures">
              <div>
                <dt>Direction</dt>
                <dd data-testid={`track-direction-${i}`}>{t.direction === 'ascending' ? 'Ascending (northbound)' : 'Descending (southbound)'}</dd>
              </div>
              <div>
                <dt>Incidence</dt>
                <dd className="gm-mid" data-testid={`track-incidence-${i}`}>{fmtNum(t.incidenceDeg, 2)}°</dd>
              </div>
              <div>
                <dt>Reflector azimuth (true)</dt>
                <dd className="gm-mid" data-testid={`track-azimuth-${i}`}>{fmtNum(t.reflectorAzimuthDeg, 2)}°</dd>
              </div>
              <div>
                <dt>Base tilt (open side up +)</dt>
                <dd className="gm-mid" data-testid={`track-tilt-${i}`}>{fmtNum(t.baseTiltDeg, 2)}°</dd>
              </div>
              <div>
                <dt>Heading (site horizontal)</dt>
                <dd>{fmtNum(t.headingDeg, 2)}° true, looking {t.look}</dd>
              </div>
              <div>
                <dt>Repeats</dt>
                <dd>{t.repeatDays === null ? 'one pass in the window' : `every ${formatDays(t.repeatDays)}`}</dd>
              </div>
              <div>
                <dt>{upcomingMs !== null ? 'Next pass' : 'Last pass in the window (over)'}</dt>
                <dd data-testid={`track-next-${i}`}>
                  {formatUtc(upcomingMs ?? lastMs)}
                  <br />
                  {siteTime(upcomingMs ?? lastMs, props.zone)}
                </dd>
              </div>
              {loss !== null && loss !== undefined ? (
                <div>
                  <dt>Loss at the current aim</dt>
                  <dd data-testid={`track-loss-${i}`}>{Number.isFinite(loss) ? `${fmtNum(loss, 2)} dB below peak` : 'outside the corner (no return)'}</dd>
                </div>
              ) : null}
            </dl>
            <div className="gm-passes-buttons">
              <button type="button" className="gm-btn gm-primary" onClick={() => props.onAim(t)} data-testid={`aim-track-${i}`}>
                Aim for this track
              </button>
              <button type="button" className="gm-btn" onClick={() => props.onAdd(t)} data-testid={`add-track-${i}`}>
                Add to plan
              </button>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
