/**
 * "An update is ready": shown when a new version has been downloaded. It never applies itself; it waits while the
 * crew is aligning, capturing or filling in a record (the Align screen and the logbook forms), and "Later" hides
 * it until the next download.
 */
import { useState } from 'react';
import { useLocation } from 'react-router-dom';
import { applyUpdate, dismissUpdate, updateState } from '../offline.ts';
import { useStore } from '../state/store.ts';

/** Screens where a reload would interrupt the work in hand (alignment, capture, an unsaved form). */
export const BUSY_SCREENS = /^\/(align|logbook\/(new-installation|installation\/|inspection\/))/;

export function UpdateNotice() {
  const { ready, dismissed } = useStore(updateState);
  const { pathname } = useLocation();
  const [busy, setBusy] = useState(false);
  if (!ready || dismissed || BUSY_SCREENS.test(pathname)) return null;
  return (
    <div className="gm-update" role="status" data-testid="update-notice">
      <p>An update of Glintmark is ready. It is applied only when you choose; your drafts are kept.</p>
      <button
        type="button"
        className="gm-btn gm-primary"
        disabled={busy}
        onClick={() => {
          setBusy(true);
          void applyUpdate();
        }}
        data-testid="update-apply"
      >
        Update now
      </button>
      <button type="button" className="gm-btn" onClick={dismissUpdate} data-testid="update-later">
        Later
      </button>
    </div>
  );
}
