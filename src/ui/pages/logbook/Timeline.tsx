/** A history timeline (newest first): when, who, what happened and what changed. Record text is shown as text. */
import { useHistory as useRecordHistory, type VersionedTable } from '../../../data/index.ts';
import { buildTimeline, type TimelineEntry } from './timeline.ts';
import { fmtUtc } from './words.ts';

export function Timeline(props: { entries: readonly TimelineEntry[]; testId?: string }) {
  if (props.entries.length === 0) return <p className="gm-note">No history yet.</p>;
  return (
    <ol className="gm-lb-timeline" data-testid={props.testId ?? 'timeline'}>
      {props.entries.map((e) => (
        <li key={e.id} data-kind={e.kind} data-testid="timeline-entry">
          <div className="gm-lb-when">
            {fmtUtc(e.atMs)} · by {e.by} · revision {e.rev}
          </div>
          <div>
            <b>{e.title}</b>
          </div>
          {e.details.length ? (
            <ul>
              {e.details.map((d, i) => {
                const diff = e.textDiffs[i];
                if (!diff) return <li key={i}>{d}</li>;
                return (
                  <li key={i} data-testid="timeline-text-diff">
                    {diff.label}:{' '}
                    <span className="gm-lb-text">
                      {diff.segments.map((s, k) =>
                        s.kind === 'same' ? (
                          <span key={k}>{s.text}</span>
                        ) : s.kind === 'removed' ? (
                          <del key={k} className="gm-diff-del" aria-label={`removed: ${s.text}`}>
                            {s.text}
                          </del>
                        ) : (
                          <ins key={k} className="gm-diff-ins" aria-label={`added: ${s.text}`}>
                            {s.text}
                          </ins>
                        ),
                      )}
                    </span>
                  </li>
                );
              })}
            </ul>
          ) : null}
          {e.alsoChanged.length ? <p className="gm-note">With it: {e.alsoChanged.join(', ')}.</p> : null}
        </li>
      ))}
    </ol>
  );
}

/** The history of one record (installation, inspection), live. */
export function RecordHistory(props: { table: VersionedTable; id: string; label: string }) {
  const revisions = useRecordHistory(props.table, props.id);
  if (revisions === undefined) return <p>Loading history…</p>;
  const entries = buildTimeline([{ table: props.table, recordId: props.id, label: props.label, revisions }]);
  return <Timeline entries={entries} testId="record-history" />;
}
