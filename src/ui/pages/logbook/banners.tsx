/** Banners and choices shared by the Logbook screens: deleted (Undo), draft restored, stale edit, photo errors, not stored. */
import type { ReactNode } from 'react';
import { BackLink } from './bits.tsx';
import type { PhotoFailure } from './saveRecords.ts';
import { fmtUtc, photoRoleLabel } from './words.ts';

/** A soft-deleted record: what was deleted (`children`, in words and with ✕) and the Undo button. */
export function DeletedBanner(props: { testId: string; onUndo: () => void; children: ReactNode }) {
  return (
    <div className="gm-lb-deleted" role="status" data-testid={props.testId}>
      <p>{props.children}</p>
      <button type="button" className="gm-btn gm-primary" onClick={props.onUndo} data-testid="undo-delete">
        Undo delete
      </button>
    </div>
  );
}

/** "Draft restored from …" (or `what` restored) with Discard; nothing when no draft was restored. */
export function DraftRestoredBanner(props: { restoredAtMs: number | null; onDiscard: () => void; what?: string }) {
  if (props.restoredAtMs === null) return null;
  return (
    <div className="gm-card" role="status" data-testid="draft-restored">
      <p>
        {props.what ?? 'Draft'} restored from {fmtUtc(props.restoredAtMs)}.
      </p>
      <button type="button" className="gm-btn" onClick={props.onDiscard} data-testid="discard-draft">
        Discard draft
      </button>
    </div>
  );
}

/** After a save refused because the record changed elsewhere: write the same changes onto the current version. */
export function ApplyToCurrentButton(props: { onClick: () => void }) {
  return (
    <button type="button" className="gm-btn gm-primary" onClick={props.onClick} data-testid="apply-to-current">
      Apply my changes to the current version
    </button>
  );
}

/** The two ways out of a refused edit: apply the changes to the current version, or drop them. */
export function StaleEditChoices(props: { onApply: () => void; onDiscard: () => void }) {
  return (
    <div className="gm-lb-actions">
      <ApplyToCurrentButton onClick={props.onApply} />
      <button type="button" className="gm-btn" onClick={props.onDiscard} data-testid="discard-mine">
        Discard my changes
      </button>
    </div>
  );
}

/** Photos that could not be stored with a saved record, one line each, in words. */
export function PhotoErrors(props: { errors: readonly PhotoFailure[] }) {
  return (
    <>
      {props.errors.map((e) => (
        <p key={e.role} className="gm-error" role="alert" data-testid={`photo-error-${e.role}`}>
          {photoRoleLabel(e.role)}: {e.message}
        </p>
      ))}
    </>
  );
}

/**
 * The screen of one stored record: "Loading…" while it is read (`rec` undefined), the way back and why (`missing`)
 * when it is not on this device (`rec` null), else `children(rec)`.
 */
export function WhenStored<R>(props: { rec: R | null | undefined; back: string; testId: string; missing: string; children: (rec: R) => ReactNode }) {
  if (props.rec === undefined) return <p>Loading…</p>;
  if (props.rec === null)
    return (
      <>
        <BackLink to="/logbook">{props.back}</BackLink>
        <p className="gm-warn" data-testid={props.testId}>
          {props.missing}
        </p>
      </>
    );
  return <>{props.children(props.rec)}</>;
}
