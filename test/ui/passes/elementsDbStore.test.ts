import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { getMeta, openGlintmarkDb, type GlintmarkDb } from '../../../src/data/index.ts';
import { DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';
import { createDbElementsStore, createElementsStore, ELEMENTS_STORAGE_KEY, memoryStorage, type KeyValueStorage } from '../../../src/ui/pages/passes/elementsStore.ts';

const A = parseTle(DEMO_TLE).sets[0];
const B = parseTle(DEMO_TLE_B).sets[0];

/** memoryStorage with removeItem, as localStorage has. */
function legacyStorage(): KeyValueStorage & { keys: () => string[] } {
  const m = new Map<string, string>();
  return { getItem: (k) => m.get(k) ?? null, setItem: (k, v) => void m.set(k, v), removeItem: (k) => void m.delete(k), keys: () => [...m.keys()] };
}

describe('element-set store over the logbook database', () => {
  let db: GlintmarkDb;
  beforeEach(() => {
    db = openGlintmarkDb(`elements-store-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await db.delete();
  });

  it('behaves as the earlier store did: add, list, replace by number, remove', async () => {
    const s = createDbElementsStore(() => db);
    expect(await s.listElementSets()).toEqual([]);
    await s.addElementSets([A], { demo: true, nowMs: 5 });
    const after = await s.addElementSets([B], { nowMs: 7 });
    expect(after).toEqual([
      { ...A, demo: true, addedAtMs: 5 },
      { ...B, demo: false, addedAtMs: 7 },
    ]);
    expect(await s.listElementSets()).toEqual(after);
    const replaced = await s.addElementSets([{ ...A, name: 'GLINT-A fresh' }], { nowMs: 9 });
    expect(replaced.map((x) => [x.name, x.addedAtMs])).toEqual([['GLINT-B', 7], ['GLINT-A fresh', 9]]);
    expect((await s.removeElementSet('99001')).map((x) => x.catalogNumber)).toEqual(['99002']);
    expect((await s.removeElementSet('12345')).map((x) => x.catalogNumber)).toEqual(['99002']);
    // What a restart does: a new store over the same database.
    expect((await createDbElementsStore(() => db).listElementSets()).map((x) => x.catalogNumber)).toEqual(['99002']);
  });

  it('imports the sets an older version kept in localStorage once, then clears the old key', async () => {
    const legacy = legacyStorage();
    await createElementsStore(legacy).addElementSets([A, B], { demo: true, nowMs: 3 });
    const broken = JSON.parse(legacy.getItem(ELEMENTS_STORAGE_KEY) as string) as unknown[];
    legacy.setItem(ELEMENTS_STORAGE_KEY, JSON.stringify([...broken, { line1: 'damaged', line2: '' }]));

    const list = await createDbElementsStore(() => db, legacy).listElementSets();
    expect(list).toEqual([
      { ...A, demo: true, addedAtMs: 3 },
      { ...B, demo: true, addedAtMs: 3 },
    ]);
    expect(legacy.keys()).toEqual([]);
    expect(await getMeta(db, 'elements-import-v1')).toMatchObject({ imported: 2 });

    // Old entries written again later (an older version in another tab) are not imported a second time.
    await createElementsStore(legacy).addElementSets([A], { nowMs: 4 });
    await createDbElementsStore(() => db, legacy).removeElementSet('99001');
    expect((await createDbElementsStore(() => db, legacy).listElementSets()).map((x) => x.catalogNumber)).toEqual(['99002']);
  });

  it('works when the old storage cannot remove keys, and without any old storage', async () => {
    const plain = memoryStorage();
    await createElementsStore(plain).addElementSets([B], { nowMs: 1 });
    expect((await createDbElementsStore(() => db, plain).listElementSets()).map((x) => x.catalogNumber)).toEqual(['99002']);
    expect(await createDbElementsStore(() => db).addElementSets([A], { nowMs: 2 })).toHaveLength(2);
  });

  it('lets a failed write reach the caller with nothing written, and retries the import after a failure', async () => {
    const s = createDbElementsStore(() => db);
    const badChecksum = { ...A, line1: A.line1.slice(0, 68) + String((Number(A.line1[68]) + 1) % 10) };
    await expect(s.addElementSets([B, badChecksum])).rejects.toMatchObject({ name: 'ValidationError' });
    expect(await s.listElementSets()).toEqual([]);

    const legacy = legacyStorage();
    await createElementsStore(legacy).addElementSets([A], { nowMs: 1 });
    let fail = true;
    const flaky = () => {
      if (fail) throw Object.assign(new Error('database closed'), { name: 'DatabaseClosedError' });
      return db;
    };
    const s2 = createDbElementsStore(flaky, legacy);
    await expect(s2.listElementSets()).rejects.toMatchObject({ name: 'DatabaseClosedError' });
    fail = false;
    expect((await s2.listElementSets()).map((x) => x.catalogNumber)).toEqual(['99001']);
  });
});
