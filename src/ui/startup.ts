/** Work done once when the app starts: open the logbook, ask for persistent storage once, restore the task. */
import { CURRENT_SCHEMA_VERSION, fillPhotoHashes, getAppDb, getMeta, requestPersistentStorage, type GlintmarkDb } from '../data/index.ts';
import { isNativeApp, watchLifecycle } from '../sensors/lifecycle.ts';
import { persistWorkflow, restoreWorkflow } from './state/persistWorkflow.ts';

export const NEWER_LOGBOOK_MESSAGE =
  'This logbook was written by a newer version of Glintmark. Update the app to open it; nothing on this phone was changed.';
export const UNOPENED_LOGBOOK_MESSAGE =
  'The logbook could not be opened, so nothing was written. Close Glintmark and open it again; if this keeps happening, update the app. Your records are kept on the phone.';

export type StartupResult = { ok: true } | { ok: false; message: string };

let problem: string | null = null;
const listeners = new Set<() => void>();
/** Why the logbook did not open at start-up (a sentence for a banner), or null. */
export const startupProblem = (): string | null => problem;
export function subscribeStartupProblem(fn: () => void): () => void {
  listeners.add(fn);
  return () => listeners.delete(fn);
}

/**
 * Whether the phone holds this logbook at a schema newer than this app's, read WITHOUT opening it: Dexie 4 opens
 * a newer database instead of failing with VersionError, and adds this app's tables to it (a schema write).
 * Dexie stores version n as IndexedDB version 10·n. Unknown (no indexedDB.databases()): false, then Dexie decides.
 */
async function storedVersionIsNewer(name: string): Promise<boolean> {
  if (typeof indexedDB === 'undefined' || typeof indexedDB.databases !== 'function') return false;
  const info = (await indexedDB.databases()).find((d) => d.name === name);
  return info?.version !== undefined && info.version > CURRENT_SCHEMA_VERSION * 10;
}

export async function startApp(db: GlintmarkDb = getAppDb()): Promise<StartupResult> {
  try {
    if (await storedVersionIsNewer(db.name)) throw Object.assign(new Error('stored schema is newer'), { name: 'VersionError' });
    await db.open();
  } catch (e) {
    // A newer database (VersionError) is left exactly as it is: no draft, meta or persistence write follows.
    const name = e instanceof Error ? e.name : '';
    problem = name === 'VersionError' ? NEWER_LOGBOOK_MESSAGE : UNOPENED_LOGBOOK_MESSAGE;
    for (const fn of listeners) fn();
    return { ok: false, message: problem };
  }
  persistWorkflow(db);
  try {
    await restoreWorkflow(db);
  } catch {
    /* an unreadable draft is dropped; the records themselves are untouched */
  }
  // Photos stored before schema 5 get their SHA-256 (a pass after opening; see src/data/db.ts version 5).
  void fillPhotoHashes(db).catch(() => undefined);
  try {
    if ((await getMeta(db, 'persistence')) === undefined) await requestPersistentStorage({ db });
  } catch {
    /* Settings shows the storage state and lets the crew ask again */
  }
  // On a phone, write the day's automatic backup file when the app goes to the background; in a browser a
  // download needs a tap, so the Logbook and Settings screens show a reminder instead.
  if (isNativeApp()) {
    watchLifecycle(
      () => void import('./pages/settings/autoBackup.ts').then((m) => m.maybeAutoBackup(db)).catch(() => undefined),
      () => undefined,
    );
  }
  return { ok: true };
}
