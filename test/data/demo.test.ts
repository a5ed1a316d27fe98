import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { removeDemoData } from '../../src/data/demo.ts';
import { geometryRepo, inspectionRepo, installationRepo, reflectorRepo } from '../../src/data/repo/entities.ts';
import { addPhoto } from '../../src/data/repo/photos.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { BY, dumpDb, geometryFields, inspectionFields, installationFields, reflectorFields, seedSample, siteFields, useTestDb } from './helpers.ts';

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
});
