import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { requestPersistentStorage, storageEstimate, withReopen, type StorageManagerLike } from '../../src/data/durability.ts';
import { getMeta } from '../../src/data/repo/meta.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { BY, T0_MS, siteFields, useTestDb } from './helpers.ts';

describe('persistent storage', () => {
  const db = useTestDb();

  it.each<[string, StorageManagerLike | undefined, string]>([
    ['no StorageManager', undefined, 'unsupported'],
    ['no persist()', {}, 'unsupported'],
    ['already persisted', { persisted: async () => true, persist: async () => false }, 'granted'],
    ['granted on request', { persisted: async () => false, persist: async () => true }, 'granted'],
    ['denied', { persisted: async () => false, persist: async () => false }, 'denied'],
  ])('%s → %s', async (_l, storage, expected) => {
    // `storage: undefined` falls back to navigator.storage, absent in Node 20.
    expect(await requestPersistentStorage({ storage })).toBe(expected);
  });

  it('records the answer in meta', async () => {
    await requestPersistentStorage({ storage: { persist: async () => true }, db: db(), nowMs: T0_MS });
    expect(await getMeta(db(), 'persistence')).toEqual({ result: 'granted', atMs: T0_MS });
  });
});

describe('storage estimate', () => {
  const est = (usage?: number, quota?: number): StorageManagerLike => ({ estimate: async () => ({ usage, quota }) });
  it('warns above 80 % of the quota', async () => {
    expect(await storageEstimate(est(80, 100))).toEqual({ usageBytes: 80, quotaBytes: 100, usedFraction: 0.8, level: 'ok' });
    expect((await storageEstimate(est(81, 100))).level).toBe('warn');
  });
  it('is unknown without figures', async () => {
    expect((await storageEstimate(undefined)).level).toBe('unknown');
    expect((await storageEstimate(est(5, undefined))).level).toBe('unknown');
    expect((await storageEstimate(est(5, 0))).level).toBe('unknown');
  });
});

describe('withReopen', () => {
  const db = useTestDb();

  it('reopens after the connection was closed (as Dexie does on a version change elsewhere) and retries once', async () => {
    await siteRepo.create(db(), siteFields(), BY);
    db().close();
    await expect(siteRepo.list(db())).rejects.toMatchObject({ name: 'DatabaseClosedError' });
    let calls = 0;
    const sites = await withReopen(db(), () => {
      calls++;
      return siteRepo.list(db());
    });
    expect(calls).toBe(2);
    expect(sites.map((s) => s.code)).toEqual(['MF-01']);
  });

  it('a write interrupted by a lost connection is retried and lands exactly once', async () => {
    let calls = 0;
    await withReopen(db(), async () => {
      calls++;
      if (calls === 1) db().close();
      return siteRepo.create(db(), siteFields({ code: 'MF-07' }), BY);
    });
    expect(calls).toBe(2);
    expect((await siteRepo.list(db())).map((s) => s.code)).toEqual(['MF-07']);
  });

  it('retries only once, and never for other errors', async () => {
    let calls = 0;
    const closed = Object.assign(new Error('closed'), { name: 'DatabaseClosedError' });
    await expect(withReopen(db(), async () => { calls++; throw closed; })).rejects.toBe(closed);
    expect(calls).toBe(2);
    calls = 0;
    const quota = Object.assign(new Error('full'), { name: 'QuotaExceededError' });
    await expect(withReopen(db(), async () => { calls++; throw quota; })).rejects.toBe(quota);
    expect(calls).toBe(1);
  });
});
