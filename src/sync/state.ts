/** The phone's sync facts in the device-local `syncState` table (never in a backup): typed getters and setters. */
import type { GlintmarkDb } from '../data/index.ts';
import type { Role, SyncErrorKind } from './api.ts';

export interface SessionState {
  serverUrl: string;
  token: string;
  member: { id: string; email: string; role: Role };
  device: { id: string; name: string };
  register: { id: string; name: string };
  signedInAtMs: number;
}

export interface InflightPush {
  pushId: number;
  /** Outbox entries the push carries (removed only after the register's acknowledgement). */
  seqs: number[];
  /** Register conflicts the push reports resolved. */
  conflictIds: string[];
}

export interface LastError {
  kind: SyncErrorKind;
  message: string;
  atMs: number;
}

/** A photo whose bytes could not be sent (the text records went anyway). */
export interface PhotoProblem {
  photoId: string;
  message: string;
  atMs: number;
}

export interface SyncStateShape {
  /** The register address typed in Settings (kept after sign-out so the next sign-in is quick). */
  serverUrl: string;
  session: SessionState;
  /** Register whose cursor and push numbers are stored (a different register starts from zero). */
  registerId: string;
  /** The last push number used by this device's sign-in. */
  lastPushId: number;
  inflight: InflightPush;
  cursor: number;
  lastSyncAtMs: number;
  lastError: LastError;
  /** Consecutive failed attempts (for backoff). */
  failures: number;
  photoProblems: PhotoProblem[];
}

export type SyncStateKey = keyof SyncStateShape;

export async function getState<K extends SyncStateKey>(db: GlintmarkDb, key: K): Promise<SyncStateShape[K] | undefined> {
  return (await db.syncState.get(key))?.value as SyncStateShape[K] | undefined;
}

export async function setState<K extends SyncStateKey>(db: GlintmarkDb, key: K, value: SyncStateShape[K]): Promise<void> {
  await db.syncState.put({ key, value });
}

export async function clearState(db: GlintmarkDb, key: SyncStateKey): Promise<void> {
  await db.syncState.delete(key);
}

/** A conflict that came from the register, and whether the register already has it resolved. */
export interface KnownConflict {
  resolvedOnServerAtMs: number | null;
}

export const conflictKey = (id: string) => `conflict:${id}`;

export async function knownConflict(db: GlintmarkDb, id: string): Promise<KnownConflict | undefined> {
  return (await db.syncState.get(conflictKey(id)))?.value as KnownConflict | undefined;
}
