import { ENGINE_FALLBACK, isEngineError } from '../../engineErrors.ts';

/** A failure as a sentence for the crew. Data-layer errors already are sentences; storage errors get plain words. */
export function messageOf(e: unknown): string {
  if (!(e instanceof Error)) return String(e);
  switch (e.name) {
    case 'QuotaExceededError':
      return "The phone's storage for Glintmark is full, so nothing was written. Make a backup, remove photos you no longer need, and try again.";
    case 'DatabaseClosedError':
    case 'InvalidStateError':
      return 'The logbook was closed (by another tab or an update), so nothing was written. Reload Glintmark and try again.';
    case 'VersionError':
      return 'This phone holds a logbook from a newer Glintmark. Update the app; nothing was changed.';
    default:
      return isEngineError(e) ? ENGINE_FALLBACK : e.message;
  }
}
