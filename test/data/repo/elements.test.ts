import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { elementRepo, importElementSetsOnce } from '../../../src/data/repo/elements.ts';
import { getMeta } from '../../../src/data/repo/meta.ts';
import { ValidationError } from '../../../src/data/errors.ts';
import { dumpDb, T0_MS, useTestDb } from '../helpers.ts';
import { GLINT_A, GLINT_B, redated } from '../elementSets.ts';

const DAY_MS = 86_400_000;

describe('elementRepo', () => {
  const db = useTestDb();

  it('adds, lists (oldest added first) and soft-deletes sets, keeping the demo mark and the time added', async () => {
    await elementRepo.put(db(), [GLINT_B], { demo: true, nowMs: T0_MS + 5 });
    await elementRepo.put(db(), [GLINT_A], { nowMs: T0_MS + 7 });
    const list = await elementRepo.list(db());
    expect(list.map((r) => [r.name, r.catalogNumber, r.demo, r.addedAtMs, r.rev, r.epochMs])).toEqual([
      ['GLINT-B', '99002', true, T0_MS + 5, 1, GLINT_B.epochMs],
      ['GLINT-A', '99001', false, T0_MS + 7, 1, GLINT_A.epochMs],
    ]);
    expect(list[0]).toMatchObject({ line1: GLINT_B.line1, line2: GLINT_B.line2, createdAtMs: T0_MS + 5, updatedAtMs: T0_MS + 5, deletedAtMs: null });

    const removed = await elementRepo.remove(db(), '99002', { nowMs: T0_MS + 9 });
    expect(removed).toMatchObject({ catalogNumber: '99002', rev: 2, deletedAtMs: T0_MS + 9, updatedAtMs: T0_MS + 9 });
    expect((await elementRepo.list(db())).map((r) => r.catalogNumber)).toEqual(['99001']);
    expect((await elementRepo.list(db(), { includeDeleted: true })).map((r) => r.catalogNumber)).toEqual(['99002', '99001']);
    expect(await elementRepo.remove(db(), '12345')).toBeUndefined();
  });

  it('replaces the set of a catalogue number in the same row (rev + 1), also after a removal', async () => {
    const [first] = await elementRepo.put(db(), [GLINT_A], { nowMs: T0_MS });
    const newer = redated(GLINT_A, '26340.50000000');
    const [second] = await elementRepo.put(db(), [{ ...newer, name: 'GLINT-A fresh' }], { nowMs: T0_MS + 1 });
    expect(second).toMatchObject({ id: first.id, rev: 2, name: 'GLINT-A fresh', epochMs: newer.epochMs, addedAtMs: T0_MS + 1, createdAtMs: T0_MS });
    expect(second.epochMs - GLINT_A.epochMs).toBe(8 * DAY_MS);
    await elementRepo.remove(db(), '99001', { nowMs: T0_MS + 2 });
    const [third] = await elementRepo.put(db(), [GLINT_A], { nowMs: T0_MS + 3 });
    expect(third).toMatchObject({ id: first.id, rev: 4, deletedAtMs: null, epochMs: GLINT_A.epochMs });
    expect(await db().elements.count()).toBe(1);
  });

  it('keeps the last of two sets with one number given together', async () => {
    const newer = redated(GLINT_A, '26340.50000000');
    const rows = await elementRepo.put(db(), [GLINT_A, GLINT_B, newer], { nowMs: T0_MS });
    expect(rows.map((r) => [r.catalogNumber, r.epochMs])).toEqual([['99001', newer.epochMs], ['99002', GLINT_B.epochMs]]);
    expect(await db().elements.count()).toBe(2);
  });

  it('refuses a set whose lines do not parse as that set, writing nothing', async () => {
    await elementRepo.put(db(), [GLINT_B], { nowMs: T0_MS });
    const before = await dumpDb(db());
    const badChecksum = { ...GLINT_A, line2: GLINT_A.line2.slice(0, 68) + String((Number(GLINT_A.line2[68]) + 1) % 10) };
    const attempts = [
      [GLINT_A, badChecksum],
      [{ ...GLINT_A, catalogNumber: '99002' }],
      [{ ...GLINT_A, epochMs: GLINT_A.epochMs + 1 }],
      [{ ...GLINT_A, name: 'two\nlines' }],
    ];
    const messages = [];
    for (const sets of attempts) {
      const e = await elementRepo.put(db(), sets, { nowMs: T0_MS + 1 }).catch((x: unknown) => x);
      expect(e).toBeInstanceOf(ValidationError);
      messages.push((e as Error).message);
    }
    expect(messages[0]).toMatch(/sets\[1\]: the element lines are not a valid set: line 2, column 69: .*checksum/i);
    expect(messages[1]).toMatch(/the element lines are for catalogue number 99001, not 99002/);
    expect(messages[2]).toMatch(/differs from the epoch in line 1/);
    expect(messages[3]).toMatch(/satellite name must be one line/);
    expect(await dumpDb(db())).toEqual(before);
  });

  it('a second live row for one number (left by an older merge) is retired when the number is written', async () => {
    const [a] = await elementRepo.put(db(), [GLINT_A], { nowMs: T0_MS });
    await db().elements.add({ ...a, id: crypto.randomUUID(), updatedAtMs: T0_MS - 1 });
    await elementRepo.put(db(), [GLINT_A], { nowMs: T0_MS + 1 });
    const rows = await elementRepo.list(db(), { includeDeleted: true });
    expect(rows.filter((r) => r.deletedAtMs === null).map((r) => r.id)).toEqual([a.id]);
    expect(rows).toHaveLength(2);
  });
});

describe('importElementSetsOnce', () => {
  const db = useTestDb();
  const asFields = (s: typeof GLINT_A, addedAtMs: number, demo = false) => ({ ...s, addedAtMs, demo });

  it('imports the sets of an older app once, keeping their time added and demo mark', async () => {
    const r = await importElementSetsOnce(db(), [asFields(GLINT_A, 11, true), asFields(GLINT_B, 12)], T0_MS);
    expect(r).toEqual({ imported: 2, skipped: [] });
    expect((await elementRepo.list(db())).map((x) => [x.catalogNumber, x.addedAtMs, x.demo, x.createdAtMs])).toEqual([
      ['99001', 11, true, T0_MS],
      ['99002', 12, false, T0_MS],
    ]);
    expect(await getMeta(db(), 'elements-import-v1')).toEqual({ atMs: T0_MS, imported: 2, skipped: 0 });
    // A second start finds the import done and writes nothing, even when the old sets are still there.
    const before = await dumpDb(db());
    expect(await importElementSetsOnce(db(), [asFields(GLINT_A, 11)], T0_MS + 1)).toBeNull();
    expect(await dumpDb(db())).toEqual(before);
  });

  it('skips damaged entries and numbers already stored, and says why', async () => {
    await elementRepo.put(db(), [GLINT_B], { nowMs: T0_MS });
    const r = await importElementSetsOnce(db(), [asFields({ ...GLINT_A, epochMs: 0 }, 1), asFields(GLINT_B, 2)], T0_MS);
    expect(r?.imported).toBe(0);
    expect(r?.skipped.map((i) => i.path)).toEqual(['sets[0]', 'sets[1]']);
    expect(r?.skipped[1].message).toBe('catalogue number 99002 is already stored');
  });
});
