import { describe, expect, it } from 'vitest';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';
import { createElementsStore, ELEMENTS_STORAGE_KEY, memoryStorage } from '../../../src/ui/pages/passes/elementsStore.ts';

const A = parseTle(DEMO_TLE).sets[0];
const B = parseTle(DEMO_TLE_B).sets[0];

describe('element-set store', () => {
  it('adds, lists and removes sets, keeping the demo mark and the time added', async () => {
    const s = createElementsStore(memoryStorage());
    expect(await s.listElementSets()).toEqual([]);
    await s.addElementSets([A], { demo: true, nowMs: 5 });
    const after = await s.addElementSets([B], { nowMs: 7 });
    expect(after.map((x) => [x.name, x.catalogNumber, x.demo, x.addedAtMs])).toEqual([
      ['GLINT-A', '99001', true, 5],
      ['GLINT-B', '99002', false, 7],
    ]);
    expect(await s.listElementSets()).toEqual(after);
    expect((await s.removeElementSet('99001')).map((x) => x.catalogNumber)).toEqual(['99002']);
    expect((await s.removeElementSet('12345')).map((x) => x.catalogNumber)).toEqual(['99002']);
  });
  it('replaces a set with the same catalogue number (last added wins)', async () => {
    const s = createElementsStore(memoryStorage());
    await s.addElementSets([A], { nowMs: 1 });
    const list = await s.addElementSets([{ ...A, name: 'GLINT-A fresh' }], { nowMs: 2 });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ name: 'GLINT-A fresh', addedAtMs: 2 });
  });
  it('survives a new store over the same storage (what a restart does)', async () => {
    const storage = memoryStorage();
    await createElementsStore(storage).addElementSets([A, B], { nowMs: 3 });
    const again = await createElementsStore(storage).listElementSets();
    expect(again.map((x) => x.epochMs)).toEqual([A.epochMs, B.epochMs]);
  });
  it('drops damaged entries instead of passing them on', async () => {
    const storage = memoryStorage();
    const broken = { ...A, line2: A.line2.slice(0, 68) + String((Number(A.line2[68]) + 1) % 10) };
    storage.setItem(ELEMENTS_STORAGE_KEY, JSON.stringify([broken, { ...B, demo: 'yes' }, null, 42]));
    const list = await createElementsStore(storage).listElementSets();
    expect(list.map((x) => [x.catalogNumber, x.demo])).toEqual([['99002', false]]);
    storage.setItem(ELEMENTS_STORAGE_KEY, '{not json');
    expect(await createElementsStore(storage).listElementSets()).toEqual([]);
  });
  it('lets a full storage’s error reach the caller', async () => {
    const full = { getItem: () => null, setItem: () => { throw new DOMException('full', 'QuotaExceededError'); } };
    await expect(createElementsStore(full).addElementSets([A])).rejects.toMatchObject({ name: 'QuotaExceededError' });
  });
});
