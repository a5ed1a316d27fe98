import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { exportBackup, restoreBackup, type BackupDocument } from '../../src/data/backup.ts';
import { openGlintmarkDb, type GlintmarkDb } from '../../src/data/db.ts';
import { BackupError } from '../../src/data/errors.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { reflectorRepo } from '../../src/data/repo/entities.ts';
import { history } from '../../src/data/repo/revisions.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { ENTITY_TABLES } from '../../src/data/types.ts';
import { T0_MS, dumpDb, reflectorFields, seedSample, siteFields, useTestDb } from './helpers.ts';

const A = { by: 'Ada Quill' };

const hex = (buf: ArrayBuffer) => Array.from(new Uint8Array(buf), (b) => b.toString(16).padStart(2, '0')).join('');
const sha256 = async (bytes: ArrayBuffer | Uint8Array<ArrayBuffer>) => hex(await crypto.subtle.digest('SHA-256', bytes));

/**
 * A row as canonical text, written here and not taken from the merge: keys sorted, undefined left out, a photo's
 * bytes as their SHA-256 (from a stored Blob, or from a backup row's base64), so two rows compare by content.
 */
async function canonical(v: unknown): Promise<string> {
  const walk = async (x: unknown): Promise<unknown> => {
    if (x instanceof Blob) return { sha256: await sha256(await x.arrayBuffer()) };
    if (Array.isArray(x)) return Promise.all(x.map(walk));
    if (x !== null && typeof x === 'object') {
      const o = x as Record<string, unknown>;
      const entries: [string, unknown][] = [];
      for (const k of Object.keys(o)) {
        if (o[k] === undefined) continue;
        if (k === 'dataBase64') entries.push(['blob', { sha256: await sha256(Uint8Array.from(atob(o[k] as string), (c) => c.charCodeAt(0))) }]);
        else entries.push([k, await walk(o[k])]);
      }
      return Object.fromEntries(entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
    }
    return x;
  };
  return JSON.stringify(await walk(v));
}
const same = async (a: unknown, b: unknown) => (await canonical(a)) === (await canonical(b));
const B = { by: 'Bo Marsh' };

describe('mergeBackup', () => {
  const phoneA = useTestDb();
  let phoneB: GlintmarkDb;
  beforeEach(() => {
    phoneB = openGlintmarkDb(`phone-b-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await phoneB.delete();
  });

  const backupOf = (db: GlintmarkDb) => exportBackup(db, { appVersion: '0.1.0' });
  /** Phone B starts as a copy of phone A. */
  async function fork() {
    const ids = await seedSample(phoneA());
    await restoreBackup(phoneB, await backupOf(phoneA()));
    return ids;
  }
  /** Every incoming row version is on phone A afterwards: in its table or kept in the conflicts table. */
  async function expectNothingDropped(doc: BackupDocument) {
    for (const t of ENTITY_TABLES) {
      for (const row of doc.tables[t]) {
        const here = await phoneA().table(t).get(row.id);
        const kept = (await phoneA().conflicts.where('[table+recordId]').equals([t, row.id]).toArray()).map((c) => c.other);
        // A site renamed to a free code is the incoming row plus that one logged edit.
        const renamed = t === 'sites' && here !== undefined && (await same({ ...here, code: (row as { code: string }).code, rev: row.rev, updatedAtMs: row.updatedAtMs }, row));
        const keptOne = (await Promise.all(kept.map((o) => same(o, row)))).some(Boolean);
        expect((await same(here, row)) || keptOne || renamed).toBe(true);
      }
    }
    for (const p of doc.tables.photos) {
      const here = await phoneA().photos.get(p.id);
      const kept = (await phoneA().conflicts.where('[table+recordId]').equals(['photos', p.id]).toArray()).map((c) => c.other);
      const keptOne = (await Promise.all(kept.map((o) => same(o, p)))).some(Boolean);
      expect((await same(here, p)) || keptOne).toBe(true);
    }
    for (const r of doc.tables.revisions) expect((await phoneA().revisions.get(r.id)) ?? (await phoneA().conflicts.toArray()).flatMap((c) => c.otherRevisions).find((x) => x.id === r.id)).toBeTruthy();
  }

  it('into an empty phone: everything is added', async () => {
    await seedSample(phoneB);
    const doc = await backupOf(phoneB);
    const report = await mergeBackup(phoneA(), doc, A);
    expect(report.sites).toEqual({ added: 3, updated: 0, unchanged: 0, localNewer: 0, conflicts: [] });
    expect(report.photos.added).toBe(1);
    expect(report.revisions.added).toBe(doc.tables.revisions.length);
    await expectNothingDropped(doc);
  });

  it('merging the same backup twice changes nothing the second time', async () => {
    await fork();
    const doc = await backupOf(phoneB);
    const first = await mergeBackup(phoneA(), doc, A);
    expect(first.sites).toMatchObject({ added: 0, updated: 0, unchanged: 3, conflicts: [] });
    const before = await dumpDb(phoneA());
    await mergeBackup(phoneA(), doc, A);
    expect(await dumpDb(phoneA())).toEqual(before);
  });

  it('an edit made on the other phone arrives (higher rev wins) with its history', async () => {
    const { site } = await fork();
    await siteRepo.update(phoneB, site.id, { notes: 'fence repaired' }, { ...B, nowMs: T0_MS + 100 });
    const doc = await backupOf(phoneB);
    const report = await mergeBackup(phoneA(), doc, A);
    expect(report.sites).toMatchObject({ updated: 1, unchanged: 2, conflicts: [] });
    expect((await siteRepo.get(phoneA(), site.id))?.notes).toBe('fence repaired');
    expect((await history(phoneA(), 'sites', site.id)).map((r) => r.by)).toEqual(['Ada Quill', 'Bo Marsh']);
  });

  it('an older copy does not overwrite a newer local edit', async () => {
    const { site } = await fork();
    await siteRepo.update(phoneA(), site.id, { notes: 'newer here' }, { ...A, nowMs: T0_MS + 100 });
    const report = await mergeBackup(phoneA(), await backupOf(phoneB), A);
    expect(report.sites).toMatchObject({ updated: 0, localNewer: 1, conflicts: [] });
    expect((await siteRepo.get(phoneA(), site.id))?.notes).toBe('newer here');
  });

  it('the same revision edited differently on both phones: local kept, incoming recorded as a conflict', async () => {
    const { site } = await fork();
    await siteRepo.update(phoneA(), site.id, { notes: 'A says' }, { ...A, nowMs: T0_MS + 100 });
    await siteRepo.update(phoneB, site.id, { notes: 'B says' }, { ...B, nowMs: T0_MS + 200 });
    const doc = await backupOf(phoneB);
    const report = await mergeBackup(phoneA(), doc, { ...A, nowMs: T0_MS + 300 });
    expect(report.sites.conflicts).toEqual([{ table: 'sites', id: site.id, reason: 'revision 2 differs between the phones; the local version is kept' }]);
    expect((await siteRepo.get(phoneA(), site.id))?.notes).toBe('A says');
    const [c] = await phoneA().conflicts.toArray();
    expect(c).toMatchObject({ table: 'sites', recordId: site.id, kept: 'local', other: { notes: 'B says', rev: 2 }, detectedAtMs: T0_MS + 300, resolvedAtMs: null });
    expect(c.otherRevisions.map((r) => r.by)).toEqual(['Ada Quill', 'Bo Marsh']);
    await expectNothingDropped(doc);
    // Merging again does not add a second copy of the same conflict.
    await mergeBackup(phoneA(), doc, A);
    expect(await phoneA().conflicts.count()).toBe(1);
  });

  it('diverged edits where the incoming rev is higher: incoming applied, local kept as a conflict', async () => {
    const { site } = await fork();
    await siteRepo.update(phoneA(), site.id, { notes: 'A once' }, { ...A, nowMs: T0_MS + 100 });
    await siteRepo.update(phoneB, site.id, { notes: 'B once' }, { ...B, nowMs: T0_MS + 100 });
    await siteRepo.update(phoneB, site.id, { notes: 'B twice' }, { ...B, nowMs: T0_MS + 200 });
    const report = await mergeBackup(phoneA(), await backupOf(phoneB), A);
    expect(report.sites).toMatchObject({ updated: 1 });
    expect(report.sites.conflicts[0].reason).toMatch('incoming revision 3 replaced local revision 2');
    expect((await siteRepo.get(phoneA(), site.id))?.notes).toBe('B twice');
    expect((await phoneA().conflicts.toArray())[0]).toMatchObject({ kept: 'incoming', other: { notes: 'A once' } });
  });

  it('diverged edits where the local rev is higher: local kept, incoming kept as a conflict', async () => {
    const { site } = await fork();
    await siteRepo.update(phoneA(), site.id, { notes: 'A once' }, { ...A, nowMs: T0_MS + 100 });
    await siteRepo.update(phoneA(), site.id, { notes: 'A twice' }, { ...A, nowMs: T0_MS + 200 });
    await siteRepo.update(phoneB, site.id, { notes: 'B once' }, { ...B, nowMs: T0_MS + 100 });
    const doc = await backupOf(phoneB);
    const report = await mergeBackup(phoneA(), doc, A);
    expect(report.sites.conflicts[0].reason).toMatch('local revision 3 kept');
    expect((await siteRepo.get(phoneA(), site.id))?.notes).toBe('A twice');
    await expectNothingDropped(doc);
  });

  it('two phones that created the same site code: the incoming site gets a free code and keeps its children', async () => {
    await siteRepo.create(phoneA(), siteFields({ code: 'MF-05' }), A);
    const theirs = await siteRepo.create(phoneB, siteFields({ code: 'MF-05', name: 'their MF-05' }), B);
    const refl = await reflectorRepo.create(phoneB, reflectorFields(theirs.id), B);
    const doc = await backupOf(phoneB);
    const report = await mergeBackup(phoneA(), doc, { ...A, nowMs: T0_MS });
    await expectNothingDropped(doc);
    expect(report.sites.added).toBe(1);
    expect(report.sites.conflicts[0].reason).toMatch('site code "MF-05" is already used by local site');
    expect((await siteRepo.get(phoneA(), theirs.id))).toMatchObject({ code: 'MF-05~2', name: 'their MF-05', rev: 2 });
    expect((await reflectorRepo.get(phoneA(), refl.id))?.siteId).toBe(theirs.id);
    expect((await history(phoneA(), 'sites', theirs.id)).at(-1)?.changes).toEqual([{ field: 'code', before: 'MF-05', after: 'MF-05~2' }]);
  });

  it('refuses a backup with records pointing nowhere, and an invalid one, writing nothing', async () => {
    await fork();
    const doc = await backupOf(phoneB);
    const siteId = doc.tables.reflectors[0].siteId;
    doc.tables.sites = doc.tables.sites.filter((s) => s.id !== siteId);
    await phoneA().delete();
    await phoneA().open();
    const before = await dumpDb(phoneA());
    await expect(mergeBackup(phoneA(), doc, A)).rejects.toMatchObject({ name: 'BackupError', kind: 'dangling-reference' });
    await expect(mergeBackup(phoneA(), '{"format": "glintmark-backup", "formatVersion": 1, "tables": {', A)).rejects.toBeInstanceOf(BackupError);
    expect(await dumpDb(phoneA())).toEqual(before);
  });

  it('the same photo id with different bytes is a conflict: our bytes stay, theirs are kept with the conflict', async () => {
    const { photo } = await fork();
    const doc = await backupOf(phoneB);
    const theirBytes = new Uint8Array([1, 2, 3, 250, 99]); // same length, one byte differs
    doc.tables.photos[0].dataBase64 = btoa(String.fromCharCode(...theirBytes));
    // A consistent row (its hash names its bytes): a different photo under the same id, not a damaged one.
    (doc.tables.photos[0] as { sha256?: string }).sha256 = await sha256(theirBytes);
    const report = await mergeBackup(phoneA(), doc, A);
    expect(report.photos).toMatchObject({ added: 0, updated: 0, unchanged: 0 });
    expect(report.photos.conflicts).toEqual([{ table: 'photos', id: photo.id, reason: expect.stringMatching(/different bytes/) }]);
    // Judged by hashes computed here from the bytes seedSample wrote and the bytes put into the file.
    const ours = await sha256(new Uint8Array([1, 2, 3, 250, 251]));
    expect(await sha256(await (await phoneA().photos.get(photo.id))!.blob.arrayBuffer())).toBe(ours);
    const [c] = await phoneA().conflicts.where('[table+recordId]').equals(['photos', photo.id]).toArray();
    expect(await sha256(await (c.other.blob as Blob).arrayBuffer())).toBe(await sha256(theirBytes));
    await expectNothingDropped(doc);
  });
});
