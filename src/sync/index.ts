/** The phone's sync with the team register (outbox push, paged pull), under the UI and over src/data/. */
export { normaliseServerUrl, RegisterClient, SyncError, type FetchLike, type SyncErrorKind } from './api.ts';
export { backoffDelayMs, readSyncStatus, signIn, signOut, startAutoSync, syncOnce, type SyncOutcome, type SyncStatus } from './engine.ts';
export { pullAll } from './pull.ts';
export { pushOutbox, queueWholeLogbook } from './push.ts';
export { useSyncStatus } from './hooks.ts';
export { INSPECTION_INTERVAL_MS, registerOverview, type RegisterOverview } from './overview.ts';
