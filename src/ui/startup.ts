/** Work done once when the app starts: open the logbook, ask for persistent storage once, restore the task. */
import { fillPhotoHashes, getAppDb, getMeta, requestPersistentStorage } from '../data/index.ts';
import { isNativeApp, watchLifecycle } from '../sensors/lifecycle.ts';
import { persistWorkflow, restoreWorkflow } from './state/persistWorkflow.ts';

export async function startApp(): Promise<void> {
  const db = getAppDb();
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
}
