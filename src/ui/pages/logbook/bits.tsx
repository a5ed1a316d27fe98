/** Small pieces shared by the Logbook screens: the "saved" note, the demo badge, an in-place error, a back link, Save. */
import { Link } from 'react-router-dom';

/** Shown only after a write's promise resolved: the record is on this phone. */
export function SavedNote(props: { testId?: string; children?: string }) {
  return (
    <p className="gm-lb-saved" role="status" data-testid={props.testId ?? 'saved'}>
      ✓ {props.children ?? 'Saved on this device'}
    </p>
  );
}

export function DemoBadge(props: { demo: boolean }) {
  return props.demo ? (
    <span className="gm-demo-badge" title="Demo record: removable in Settings">
      DEMO
    </span>
  ) : null;
}

export function ErrorNote(props: { message: string | null | undefined; testId?: string }) {
  return props.message ? (
    <p className="gm-error" role="alert" data-testid={props.testId ?? 'save-error'}>
      {props.message}
    </p>
  ) : null;
}

export function BackLink(props: { to: string; children: string; testId?: string }) {
  return (
    <Link className="gm-btn gm-lb-linkbtn" to={props.to} data-testid={props.testId ?? 'back'}>
      ← {props.children}
    </Link>
  );
}

/** The form's main Save button: "Saving…" and disabled while the write runs. */
export function SaveButton(props: { busy: boolean; onSave: () => void; testId: string; children: string }) {
  return (
    <button type="button" className="gm-btn gm-primary" onClick={props.onSave} disabled={props.busy} data-testid={props.testId}>
      {props.busy ? 'Saving…' : props.children}
    </button>
  );
}
