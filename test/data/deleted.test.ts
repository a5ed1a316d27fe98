import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { listDeletedRecords, siteChildCounts } from '../../src/data/deleted.ts';
import { installationRepo } from '../../src/data/repo/entities.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { BY, hashDb, seedSample, useTestDb } from './helpers.ts';

describe('deleted records list', () => {
  const db = useTestDb();

  it('lists a deleted installation with words a crew reads, and undelete brings it back off the list', async () => {
    const ids = await seedSample(db());
    await installationRepo.softDelete(db(), ids.inst.id, BY);
    const before = await hashDb(db());
    const all = await listDeletedRecords(db());
    expect(await hashDb(db())).toBe(before); // read-only
    // Newest deletion first: MF-03 was deleted at the sample's fixed instant in 2027, after today's clock.
    expect(all.map((e) => [e.table, e.label, e.parentDeleted])).toEqual([
      ['sites', 'site MF-03', false],
      ['installations', 'installation of reflector A at MF-01, 2027-07-02', false],
    ]);
    expect((await listDeletedRecords(db(), { siteId: ids.site.id })).map((e) => e.id)).toEqual([ids.inst.id]);
    await installationRepo.undelete(db(), ids.inst.id, BY);
    expect((await listDeletedRecords(db(), { siteId: ids.site.id }))).toEqual([]);
  });

  it('marks children deleted with their site, and counts what a site delete would take', async () => {
    const ids = await seedSample(db());
    expect(await siteChildCounts(db(), ids.site.id)).toEqual({ reflectors: 1, geometries: 1, installations: 1, inspections: 1 });
    await siteRepo.softDelete(db(), ids.site.id, BY);
    const mine = await listDeletedRecords(db(), { siteId: ids.site.id });
    expect(mine.find((e) => e.table === 'sites')?.parentDeleted).toBe(false);
    expect(mine.filter((e) => e.table !== 'sites').every((e) => e.parentDeleted)).toBe(true);
    expect(await siteChildCounts(db(), ids.site.id)).toEqual({ reflectors: 0, geometries: 0, installations: 0, inspections: 0 });
  });
});
