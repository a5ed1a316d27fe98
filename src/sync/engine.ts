/**
 * One sync cycle (push everything waiting, then pull every page) and the sign-in around it. Nothing here blocks
 * field work: every step runs in the background and only writes in its own short transactions.
 *
 * Retries use exponential backoff with full jitter (a random wait between 0 and min(cap, base·2^n)), the scheme
 * described in M. Brooker, "Exponential Backoff And Jitter", AWS Architecture Blog, 2015; base 2 s and cap 5 min
 * are our choice (common practice, no source).
 */
import type { GlintmarkDb } from '../data/index.ts';
import { normaliseServerUrl, RegisterClient, SyncError, type FetchLike } from './api.ts';
import { pullAll, type PullResult } from './pull.ts';
import { pushOutbox, queueWholeLogbook, type PushResult } from './push.ts';
import { clearState, getState, setState, type SessionState } from './state.ts';

export const BACKOFF_BASE_MS = 2_000;
export const BACKOFF_CAP_MS = 300_000;

/** Wait before retry number `failures` (1 = first retry): uniform in [0, min(cap, base·2^(failures−1))]. */
export function backoffDelayMs(failures: number, random: () => number = Math.random): number {
  const ceiling = Math.min(BACKOFF_CAP_MS, BACKOFF_BASE_MS * 2 ** Math.max(0, failures - 1));
  return Math.floor(random() * ceiling);
}

export interface SyncDeps {
  fetch?: FetchLike;
  nowMs?: () => number;
}

async function clientFor(db: GlintmarkDb, deps: SyncDeps): Promise<{ client: RegisterClient; session: SessionState } | null> {
  const session = await getState(db, 'session');
  if (!session) return null;
  return { client: new RegisterClient(session.serverUrl, session.token, deps.fetch), session };
}

/** Sign in; a register other than the last one starts from cursor 0 and queues the whole logbook once. */
export async function signIn(db: GlintmarkDb, typedUrl: string, email: string, password: string, deviceName: string, deps: SyncDeps = {}): Promise<SessionState> {
  const serverUrl = normaliseServerUrl(typedUrl);
  const now = deps.nowMs ?? Date.now;
  const client = new RegisterClient(serverUrl, null, deps.fetch);
  const r = await client.signIn(email.trim(), password, deviceName.trim() || 'phone');
  const session: SessionState = { serverUrl, token: r.token, member: r.member, device: r.device, register: r.register, signedInAtMs: now() };
  const sameRegister = (await getState(db, 'registerId')) === r.register.id;
  await db.transaction('rw', db.syncState, async () => {
    await setState(db, 'serverUrl', serverUrl);
    await setState(db, 'session', session);
    // A new sign-in is a new device for the register: its push numbers start again at 1.
    await setState(db, 'lastPushId', 0);
    await clearState(db, 'inflight');
    await clearState(db, 'lastError');
    await setState(db, 'failures', 0);
    if (!sameRegister) {
      await setState(db, 'registerId', r.register.id);
      await setState(db, 'cursor', 0);
    }
  });
  if (!sameRegister) await queueWholeLogbook(db, now());
  return session;
}

/** Sign out: the register forgets this phone's token (when reachable); the phone forgets it in any case. Records stay. */
export async function signOut(db: GlintmarkDb, deps: SyncDeps = {}): Promise<void> {
  const c = await clientFor(db, deps);
  if (c) {
    try {
      await c.client.signOut();
    } catch {
      // offline: the token is forgotten here anyway; the lead can revoke the device in the register
    }
  }
  await clearState(db, 'session');
}

export interface SyncOutcome {
  push: PushResult;
  pull: PullResult;
  atMs: number;
}

/** Push then pull. Records the time of success, or the error in words (and counts the failure for backoff). */
export async function syncOnce(db: GlintmarkDb, deps: SyncDeps = {}): Promise<SyncOutcome> {
  const now = deps.nowMs ?? Date.now;
  const c = await clientFor(db, deps);
  if (!c) throw new SyncError('signed-out', 'Not signed in to a team register.');
  try {
    const viewer = c.session.member.role === 'viewer';
    const push: PushResult = viewer
      ? { pushes: 0, duplicates: 0, sentRecords: 0, deferredPhotos: [], refused: [], conflicts: [] }
      : await pushOutbox(db, c.client, { nowMs: now });
    const pull = await pullAll(db, c.client, { nowMs: now });
    const atMs = now();
    await setState(db, 'lastSyncAtMs', atMs);
    await setState(db, 'failures', 0);
    if (push.refused.length) await setState(db, 'lastError', { kind: 'refused', message: push.refused.map((r) => r.message).join(' '), atMs });
    else await clearState(db, 'lastError');
    return { push, pull, atMs };
  } catch (e) {
    const err = e instanceof SyncError ? e : new SyncError('server-error', `Sync stopped: ${e instanceof Error ? e.message : String(e)}. Nothing was lost; it will be tried again.`);
    await setState(db, 'lastError', { kind: err.kind, message: err.message, atMs: now() });
    await setState(db, 'failures', ((await getState(db, 'failures')) ?? 0) + 1);
    throw err;
  }
}

export interface SyncStatus {
  serverUrl: string | null;
  session: Omit<SessionState, 'token'> | null;
  lastSyncAtMs: number | null;
  lastError: { kind: string; message: string; atMs: number } | null;
  waitingRecords: number;
  waitingPhotos: number;
  refused: string[];
  photoProblems: string[];
}

/** What Settings shows. */
export async function readSyncStatus(db: GlintmarkDb): Promise<SyncStatus> {
  const session = await getState(db, 'session');
  const entries = await db.outbox.toArray();
  const records = new Set<string>();
  const photos = new Set<string>();
  const refused = new Set<string>();
  for (const e of entries) {
    if (e.table === 'photos') photos.add(e.recordId);
    else records.add(`${e.table}:${e.recordId}`);
    if (e.refused) refused.add(e.refused);
  }
  let publicSession: SyncStatus['session'] = null;
  if (session) {
    const { token: _t, ...rest } = session;
    publicSession = rest;
  }
  return {
    serverUrl: (await getState(db, 'serverUrl')) ?? null,
    session: publicSession,
    lastSyncAtMs: (await getState(db, 'lastSyncAtMs')) ?? null,
    lastError: (await getState(db, 'lastError')) ?? null,
    waitingRecords: records.size,
    waitingPhotos: photos.size,
    refused: [...refused],
    photoProblems: ((await getState(db, 'photoProblems')) ?? []).map((p) => p.message),
  };
}

/**
 * Automatic sync while signed in: on start, when the network comes back (`online`), when the app is shown again,
 * and every `intervalMs`; after a failure the next try waits by backoff. Returns a stop function. One cycle at a time.
 */
export function startAutoSync(db: GlintmarkDb, deps: SyncDeps & { intervalMs?: number; random?: () => number; onDone?: () => void } = {}): () => void {
  let running = false;
  let stopped = false;
  let retry: ReturnType<typeof setTimeout> | undefined;
  const run = async () => {
    if (running || stopped) return;
    if (typeof navigator !== 'undefined' && navigator.onLine === false) return;
    if (!(await getState(db, 'session'))) return;
    running = true;
    try {
      await syncOnce(db, deps);
    } catch (e) {
      if (e instanceof SyncError && e.retryable && !stopped) {
        const failures = (await getState(db, 'failures')) ?? 1;
        clearTimeout(retry);
        retry = setTimeout(() => void run(), Math.max(e.retryAfterMs ?? 0, backoffDelayMs(failures, deps.random)));
      }
    } finally {
      running = false;
      deps.onDone?.();
    }
  };
  const onOnline = () => void run();
  const onVisible = () => {
    if (document.visibilityState === 'visible') void run();
  };
  window.addEventListener('online', onOnline);
  document.addEventListener('visibilitychange', onVisible);
  const timer = setInterval(() => void run(), deps.intervalMs ?? 120_000);
  void run();
  return () => {
    stopped = true;
    clearInterval(timer);
    clearTimeout(retry);
    window.removeEventListener('online', onOnline);
    document.removeEventListener('visibilitychange', onVisible);
  };
}
