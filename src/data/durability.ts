/**
 * Keeping records on a phone that is offline for days: ask the browser not to evict our storage, watch
 * the quota, and survive a dropped database connection.
 * - Storage persistence: WHATWG Storage Standard, §4 "Persistence" (navigator.storage.persist/persisted).
 * - Estimates: same standard, §5 "Usage and quota" (navigator.storage.estimate); figures are approximate.
 */
import type Dexie from 'dexie';
import type { GlintmarkDb } from './db.ts';
import { setMeta } from './repo/meta.ts';

export type PersistResult = 'granted' | 'denied' | 'unsupported';

/** The part of the browser's StorageManager we use; tests pass a fake. */
export interface StorageManagerLike {
  persist?: () => Promise<boolean>;
  persisted?: () => Promise<boolean>;
  estimate?: () => Promise<{ usage?: number; quota?: number }>;
}

const browserStorage = (): StorageManagerLike | undefined =>
  typeof navigator !== 'undefined' && navigator.storage ? navigator.storage : undefined;

/**
 * Ask for persistent storage (already persisted counts as granted). With `db`, the answer is stored in
 * meta 'persistence' as {result, atMs} so the UI can remind the crew. Rejects only if the browser's call rejects.
 */
export async function requestPersistentStorage(opts: { storage?: StorageManagerLike; db?: GlintmarkDb; nowMs?: number } = {}): Promise<PersistResult> {
  const storage = opts.storage ?? browserStorage();
  let result: PersistResult;
  if (!storage?.persist) result = 'unsupported';
  else if (storage.persisted && (await storage.persisted())) result = 'granted';
  else result = (await storage.persist()) ? 'granted' : 'denied';
  if (opts.db) await setMeta(opts.db, 'persistence', { result, atMs: opts.nowMs ?? Date.now() });
  return result;
}

/** Fraction of the quota above which the UI should warn (make a backup, remove old photos). */
export const STORAGE_WARN_FRACTION = 0.8;

export interface StorageEstimate {
  usageBytes: number | null;
  quotaBytes: number | null;
  /** usage / quota, or null when either is unknown. */
  usedFraction: number | null;
  /** 'warn' when usage > 80 % of quota; 'unknown' without an estimate. */
  level: 'ok' | 'warn' | 'unknown';
}

export async function storageEstimate(storage: StorageManagerLike | undefined = browserStorage()): Promise<StorageEstimate> {
  if (!storage?.estimate) return { usageBytes: null, quotaBytes: null, usedFraction: null, level: 'unknown' };
  const e = await storage.estimate();
  const usageBytes = typeof e.usage === 'number' ? e.usage : null;
  const quotaBytes = typeof e.quota === 'number' ? e.quota : null;
  if (usageBytes === null || quotaBytes === null || quotaBytes <= 0) return { usageBytes, quotaBytes, usedFraction: null, level: 'unknown' };
  const usedFraction = usageBytes / quotaBytes;
  return { usageBytes, quotaBytes, usedFraction, level: usedFraction > STORAGE_WARN_FRACTION ? 'warn' : 'ok' };
}

/** Error names meaning the connection went away (closed by a version change elsewhere, the OS, or the app). */
const CONNECTION_LOST = new Set(['DatabaseClosedError', 'InvalidStateError']);

/**
 * Run `op`; if it fails because the connection was lost, reopen the database and run it once more.
 * `op` must be safe to repeat: a failed Dexie transaction wrote nothing, so a whole repository call is.
 * Any other error, or a second failure, reaches the caller unchanged.
 */
export async function withReopen<T>(db: Dexie, op: () => Promise<T>): Promise<T> {
  try {
    return await op();
  } catch (e) {
    if (!(e instanceof Error) || !CONNECTION_LOST.has(e.name)) throw e;
    if (db.isOpen()) db.close({ disableAutoOpen: false });
    await db.open();
    return op();
  }
}
