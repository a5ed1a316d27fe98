import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { removeDemoData } from '../../src/data/demo.ts';
import { geometryRepo, inspectionRepo, installationRepo, reflectorRepo } from '../../src/data/repo/entities.ts';
import { addPhoto } from '../../src/data/repo/photos.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { exportBackup } from '../../src/data/backup.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { history } from '../../src/data/repo/revisions.ts';
import { BY, dumpDb, hashDb, geometryFields, inspectionFields, installationFields, reflectorFields, seedSample, siteFields, useTestDb } from './helpers.ts';

describe('removeDemoData', () => {
  const db = useTestDb();

  async function seedDemo() {
    const d = { demo: true };
    const site = await siteRepo.create(db(), siteFields({ code: 'DEMO-1', name: 'Marrowby Fen (demo)', ...d }), BY);
    const refl = await reflectorRepo.create(db(), reflectorFields(site.id, d), BY);
    const geo = await geometryRepo.create(db(), geometryFields(site.id, { reflectorId: refl.id, ...d }), BY);
    const inst = await installationRepo.create(db(), installationFields(site.id, refl.id, { geometryIds: [geo.id], ...d }), BY);
    await inspectionRepo.create(db(), inspectionFields(site.id, refl.id, d), BY);
    await addPhoto(db(), { table: 'installations', id: inst.id }, 'north', new Blob([new Uint8Array([9])], { type: 'image/png' }), BY);
    await siteRepo.update(db(), site.id, { notes: 'edited demo' }, BY);
    return { site, refl, inst };
  }

  it('hard-deletes demo records with their photos and history, and leaves every real row exactly as it was', async () => {
    await seedSample(db());
    const realBefore = await dumpDb(db());
    await seedDemo();
    const report = await removeDemoData(db());
    // Revisions: 5 creates, the site edit, the photo's create and the installation's photoIds update.
    expect(report.removed).toEqual({ sites: 1, reflectors: 1, geometries: 1, installations: 1, inspections: 1, photos: 1, revisions: 8, conflicts: 0, elements: 0 });
    expect(report.kept).toEqual([]);
    expect(await dumpDb(db())).toEqual(realBefore);
  });

  it('keeps a demo record a real record points to, and says why', async () => {
    const { site } = await seedDemo();
    const real = await reflectorRepo.create(db(), reflectorFields(site.id, { label: 'real one' }), BY);
    const report = await removeDemoData(db());
    expect(report.kept).toEqual([{ table: 'sites', id: site.id, reason: `reflectors ${real.id} points to it` }]);
    expect(await siteRepo.get(db(), site.id)).toBeDefined();
    expect(await reflectorRepo.get(db(), real.id)).toBeDefined();
    expect(report.removed.reflectors).toBe(1);
  });

  it('does nothing on a logbook without demo records', async () => {
    await seedSample(db());
    const before = await dumpDb(db());
    const report = await removeDemoData(db());
    expect(Object.values(report.removed).every((n) => n === 0)).toBe(true);
    expect(await dumpDb(db())).toEqual(before);
  });

  it('an update cannot make a record demo (or real): refused in words, nothing written', async () => {
    const { site, refl } = await seedSample(db());
    const before = await hashDb(db());
    await expect(siteRepo.update(db(), site.id, { demo: true }, BY)).rejects.toMatchObject({
      name: 'ValidationError',
      message: expect.stringMatching(/demo.*set when the record is created and cannot be changed/),
    });
    await expect(reflectorRepo.update(db(), refl.id, { demo: true, notes: 'x' }, BY)).rejects.toMatchObject({ name: 'ValidationError' });
    expect(await hashDb(db())).toBe(before);
    const { site: demoSite } = await seedDemo();
    await expect(siteRepo.update(db(), demoSite.id, { demo: false }, BY)).rejects.toMatchObject({ name: 'ValidationError' });
    // Passing the unchanged flag along with a real edit is fine.
    await expect(siteRepo.update(db(), site.id, { demo: false, notes: 'edited' }, BY)).resolves.toMatchObject({ notes: 'edited', demo: false });
  });

  it('a real record flagged demo by any other path is never removed: the creation revision decides', async () => {
    const { site, inst } = await seedSample(db());
    // As an older app or an edited file could leave it: the row says demo, its 'create' revision says real.
    await db().sites.put({ ...(await siteRepo.get(db(), site.id))!, demo: true });
    await db().installations.put({ ...(await installationRepo.get(db(), inst.id))!, demo: true });
    const before = await hashDb(db());
    const report = await removeDemoData(db());
    expect(Object.values(report.removed).every((n) => n === 0)).toBe(true);
    expect(await hashDb(db())).toBe(before);
    expect((await history(db(), 'sites', site.id)).length).toBeGreaterThan(0);
  });

  it('a merge that marks a real record demo reports a conflict and keeps ours; demo removal then leaves it', async () => {
    const { site } = await seedSample(db());
    const doc = await exportBackup(db(), { appVersion: '0.1.0' });
    const theirs = doc.tables.sites.find((s) => s.id === site.id)!;
    // The other phone's file claims a later revision that turned the site into demo data.
    theirs.demo = true;
    theirs.rev += 1;
    theirs.updatedAtMs += 1000;
    doc.tables.revisions.push({ id: crypto.randomUUID(), table: 'sites', recordId: site.id, rev: theirs.rev, atMs: theirs.updatedAtMs, by: 'Bo Marsh', kind: 'update', changes: [{ field: 'demo', before: false, after: true }], snapshot: null, cascadeOf: null });
    const report = await mergeBackup(db(), doc, BY);
    expect(report.sites.conflicts).toEqual([{ table: 'sites', id: site.id, reason: expect.stringMatching(/demo/) }]);
    expect((await siteRepo.get(db(), site.id))?.demo).toBe(false);
    expect((await history(db(), 'sites', site.id)).some((r) => r.changes.some((c) => c.field === 'demo'))).toBe(false);
    const removal = await removeDemoData(db());
    expect(removal.removed.sites).toBe(0);
    expect(await siteRepo.get(db(), site.id)).toBeDefined();
  });
});
