/**
 * A failed write in plain words for the crew. Repositories reject with typed errors (switched on by `name`, as the
 * data README says) whose messages are already plain sentences; storage-level errors get words of our own. Pure.
 */

import { isEngineError } from '../../engineErrors.ts';

const STORAGE_FULL =
  'This phone’s storage is full, so nothing was saved. Make a backup (Settings), remove old photos or other files, and try again. The form is kept.';
const CLOSED = 'The logbook could not be reached (the phone may have freed memory). Nothing was saved; tap Save again. If it keeps failing, restart the app.';
const NEWER = 'This phone holds a logbook written by a newer version of Glintmark. Update the app; nothing was changed.';

/** Plain words for a rejected save; `kept` adds that the form is still there (not for photos or deletes). */
export function saveErrorMessage(e: unknown, kept = true): string {
  const name = e instanceof Error || (typeof e === 'object' && e !== null && 'name' in e) ? String((e as { name: unknown }).name) : '';
  const message = e instanceof Error ? e.message : String(e);
  const tail = kept ? ' Nothing was changed; your entries are still in the form.' : '';
  switch (name) {
    case 'ValidationError':
    case 'MissingReferenceError':
    case 'DuplicateCodeError':
    case 'InvalidStateForEditError':
    case 'RecordNotFoundError':
      return `${message}${tail}`;
    case 'StaleRecordError':
      return `${message.replace(/;? ?reload it and try again\.?$/i, '.')} Your entries are still in the form: apply them to the current version (the other change stays in every field you did not edit), or discard them.`;
    case 'PhotoTooLargeError':
      return message;
    case 'QuotaExceededError':
      return STORAGE_FULL;
    case 'DatabaseClosedError':
    case 'InvalidStateError':
      return CLOSED;
    case 'VersionError':
      return NEWER;
    default:
      return isEngineError(e) ? `Not saved: something went wrong inside Glintmark.${tail || ' Nothing was changed.'} Try again; if it keeps failing, restart the app.` : `Not saved: ${message.replace(/\.$/, '')}.${tail}`;
  }
}
