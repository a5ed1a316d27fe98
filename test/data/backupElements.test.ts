/** Orbital element sets (schema version 4) in backup, restore, merge and demo removal. */
import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { backupToJson, exportBackup, restoreBackup, type BackupDocument } from '../../src/data/backup.ts';
import { openGlintmarkDb, type GlintmarkDb } from '../../src/data/db.ts';
import { removeDemoData } from '../../src/data/demo.ts';
import { BackupError } from '../../src/data/errors.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { elementRepo } from '../../src/data/repo/elements.ts';
import { GLINT_A, GLINT_B, redated } from './elementSets.ts';
import { T0_MS, dumpDb, seedSample, useTestDb } from './helpers.ts';

const A = { by: 'Ada Quill' };
const liveSets = async (db: GlintmarkDb) => (await elementRepo.list(db)).map((r) => [r.catalogNumber, r.epochMs]);
const docOf = async (db: GlintmarkDb) => JSON.parse(backupToJson(await exportBackup(db, { appVersion: '0.1.0', nowMs: T0_MS }))) as BackupDocument;

describe('element sets in backups', () => {
  const db = useTestDb();
  let other: GlintmarkDb;
  beforeEach(() => {
    other = openGlintmarkDb(`elements-other-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await other.delete();
  });

  it('are exported (removed ones too) and restored exactly', async () => {
    await seedSample(db());
    await elementRepo.put(db(), [GLINT_A, GLINT_B], { demo: true, nowMs: T0_MS });
    await elementRepo.remove(db(), '99002', { nowMs: T0_MS + 1 });
    const doc = await docOf(db());
    expect(doc.formatVersion).toBe(1);
    expect(doc.tables.elements.map((e) => [e.catalogNumber, e.deletedAtMs])).toEqual(expect.arrayContaining([['99001', null], ['99002', T0_MS + 1]]));
    const counts = await restoreBackup(other, doc);
    expect(counts.elements).toBe(2);
    expect((await dumpDb(other)).elements).toEqual((await dumpDb(db())).elements);
  });

  it('a backup made before element sets were in the database still restores, leaving the phone’s sets as they are', async () => {
    await seedSample(db());
    const { elements: _none, ...olderTables } = (await docOf(db())).tables;
    const older = { ...(await docOf(db())), app: { name: 'glintmark', version: '0.1.0', schemaVersion: 3 }, tables: olderTables };
    await elementRepo.put(other, [GLINT_A], { nowMs: T0_MS });
    const setsBefore = (await dumpDb(other)).elements;
    // Element sets alone do not count as records the restore would replace: they are not in this backup.
    const counts = await restoreBackup(other, JSON.stringify(older));
    expect(counts).toMatchObject({ sites: 3, elements: 0 });
    expect((await dumpDb(other)).elements).toEqual(setsBefore);
    await restoreBackup(other, older, { replace: true });
    expect((await dumpDb(other)).elements).toEqual(setsBefore);
  });

  it('a backup with element sets replaces the phone’s sets, and only with consent', async () => {
    await elementRepo.put(db(), [GLINT_B], { nowMs: T0_MS });
    await elementRepo.put(other, [GLINT_A], { nowMs: T0_MS });
    const doc = await docOf(db());
    const refused = await restoreBackup(other, doc).catch((e: unknown) => e);
    expect(refused).toMatchObject({ name: 'BackupError', kind: 'would-replace' });
    await restoreBackup(other, doc, { replace: true });
    expect(await liveSets(other)).toEqual([['99002', GLINT_B.epochMs]]);
  });

  it('refuses a damaged element row or two live sets for one number, naming the row, with nothing changed', async () => {
    await elementRepo.put(db(), [GLINT_A, GLINT_B], { nowMs: T0_MS });
    const doc = await docOf(db());
    const k = doc.tables.elements.findIndex((e) => e.catalogNumber === '99001');
    const damaged = structuredClone(doc);
    damaged.tables.elements[k].line1 = damaged.tables.elements[k].line1.replace('26332.5', '26332.6');
    const twin = structuredClone(doc);
    twin.tables.elements.push({ ...twin.tables.elements[k], id: crypto.randomUUID() });
    const before = await dumpDb(db());
    for (const [bad, kind, msg] of [
      [damaged, 'invalid-record', `elements[${k}] (99001): the element lines are not a valid set: line 1, column 69`],
      [twin, 'duplicate-id', `elements[2] (99001): is a second live element set for this catalogue number (see elements[${k}])`],
    ] as const) {
      const e = await restoreBackup(db(), bad, { replace: true }).catch((x: unknown) => x);
      expect(e).toBeInstanceOf(BackupError);
      expect(e).toMatchObject({ kind });
      expect((e as Error).message).toContain(msg);
    }
    expect(await dumpDb(db())).toEqual(before);
  });
});

describe('element sets in merges', () => {
  const phoneA = useTestDb();
  let phoneB: GlintmarkDb;
  beforeEach(() => {
    phoneB = openGlintmarkDb(`elements-b-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await phoneB.delete();
  });
  const NEWER = redated(GLINT_A, '26340.50000000');

  it('adds new sets, applies a later change and a removal, and keeps a local change made later', async () => {
    await elementRepo.put(phoneB, [GLINT_A, GLINT_B], { nowMs: T0_MS });
    let r = await mergeBackup(phoneA(), await docOf(phoneB), A);
    expect(r.elements).toEqual({ added: 2, updated: 0, unchanged: 0, localNewer: 0, conflicts: [] });
    await elementRepo.put(phoneB, [NEWER], { nowMs: T0_MS + 1 });
    await elementRepo.remove(phoneB, '99002', { nowMs: T0_MS + 2 });
    r = await mergeBackup(phoneA(), await docOf(phoneB), A);
    expect(r.elements).toMatchObject({ updated: 2, conflicts: [] });
    expect(await liveSets(phoneA())).toEqual([['99001', NEWER.epochMs]]);
    await elementRepo.put(phoneA(), [GLINT_B], { nowMs: T0_MS + 3 }); // re-added here: rev 3 > B's rev 2
    r = await mergeBackup(phoneA(), await docOf(phoneB), A);
    expect(r.elements).toMatchObject({ unchanged: 1, localNewer: 1 });
    const before = await dumpDb(phoneA());
    await mergeBackup(phoneA(), await docOf(phoneB), A);
    expect(await dumpDb(phoneA())).toEqual(before);
  });

  it('two phones that loaded the same satellite separately keep the later epoch, and agree after merging both ways', async () => {
    await elementRepo.put(phoneA(), [GLINT_A], { nowMs: T0_MS });
    await elementRepo.put(phoneB, [NEWER], { nowMs: T0_MS });
    await mergeBackup(phoneA(), await docOf(phoneB), A);
    expect(await liveSets(phoneA())).toEqual([['99001', NEWER.epochMs]]);
    await mergeBackup(phoneB, await docOf(phoneA()), A);
    expect(await liveSets(phoneB)).toEqual([['99001', NEWER.epochMs]]);
    const liveIds = async (db: GlintmarkDb) => (await elementRepo.list(db)).map((x) => x.id);
    expect(await liveIds(phoneB)).toEqual(await liveIds(phoneA()));
    // Nothing was dropped: the older set is still there, soft-deleted.
    expect((await elementRepo.list(phoneA(), { includeDeleted: true })).map((x) => x.epochMs).sort()).toEqual([GLINT_A.epochMs, NEWER.epochMs]);
  });

  it('the same revision changed differently on both phones: the later epoch is kept and the conflict reported', async () => {
    await elementRepo.put(phoneA(), [GLINT_A], { nowMs: T0_MS });
    await restoreBackup(phoneB, await docOf(phoneA()));
    await elementRepo.put(phoneA(), [{ ...GLINT_A, name: 'renamed here' }], { nowMs: T0_MS + 1 });
    await elementRepo.put(phoneB, [NEWER], { nowMs: T0_MS + 1 });
    const r = await mergeBackup(phoneA(), await docOf(phoneB), A);
    expect(r.elements.conflicts).toEqual([expect.objectContaining({ table: 'elements', reason: 'element set 99001 revision 2 differs between the phones; the incoming set (later epoch) is kept' })]);
    expect(await liveSets(phoneA())).toEqual([['99001', NEWER.epochMs]]);
  });
});

describe('element sets in demo removal', () => {
  const db = useTestDb();
  it('removes demo element sets and keeps real ones', async () => {
    await elementRepo.put(db(), [GLINT_A], { demo: true, nowMs: T0_MS });
    await elementRepo.put(db(), [GLINT_B], { nowMs: T0_MS });
    const report = await removeDemoData(db());
    expect(report.removed.elements).toBe(1);
    expect(await liveSets(db())).toEqual([['99002', GLINT_B.epochMs]]);
    expect(await db().elements.count()).toBe(1);
  });
});
