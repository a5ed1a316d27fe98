/** React hook for the Settings sync panel: the sync status, live (re-read when the outbox or sync state change). */
import { useLiveQuery } from 'dexie-react-hooks';
import type { GlintmarkDb } from '../data/index.ts';
import { readSyncStatus, type SyncStatus } from './engine.ts';

export function useSyncStatus(db: GlintmarkDb): SyncStatus | undefined {
  return useLiveQuery(() => readSyncStatus(db), [db]);
}
