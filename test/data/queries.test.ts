import 'fake-indexeddb/auto';
import { liveQuery } from 'dexie';
import { describe, expect, it } from 'vitest';
import { mergeBackup } from '../../src/data/merge.ts';
import { querySiteDetail, querySiteListSources } from '../../src/data/queries.ts';
import { resolveConflict } from '../../src/data/repo/conflicts.ts';
import { inspectionRepo, installationRepo, reflectorRepo } from '../../src/data/repo/entities.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { exportBackup } from '../../src/data/backup.ts';
import { BY, T0_MS, inspectionFields, installationFields, reflectorFields, seedSample, useTestDb } from './helpers.ts';

describe('read models', () => {
  const db = useTestDb();

  it('site list sources: live sites with their latest live installation or inspection time', async () => {
    const ids = await seedSample(db());
    const later = await installationRepo.create(db(), installationFields(ids.site.id, ids.refl.id, { installedAtMs: T0_MS + 9e7 }), BY);
    let rows = await querySiteListSources(db());
    expect(rows.map((r) => [r.site.code, r.lastVisitAtMs]).sort()).toEqual([['MF-01', T0_MS + 9e7], ['MF-02', null]]);
    await installationRepo.softDelete(db(), later.id, BY);
    rows = await querySiteListSources(db());
    expect(rows.find((r) => r.site.code === 'MF-01')?.lastVisitAtMs).toBe(T0_MS + 86_400_000); // the inspection
  });

  it('site detail: live children in list order, the site history and its open conflicts', async () => {
    const ids = await seedSample(db());
    await inspectionRepo.create(db(), inspectionFields(ids.site.id, ids.refl.id, { inspectedAtMs: T0_MS + 2e8 }), BY);
    const b = await reflectorRepo.create(db(), reflectorFields(ids.site.id, { label: 'B' }), BY);
    await reflectorRepo.create(db(), reflectorFields(ids.site.id, { label: 'A2' }), BY);
    await reflectorRepo.softDelete(db(), b.id, BY);
    const d = await querySiteDetail(db(), ids.site.id);
    expect(d?.site.code).toBe('MF-01');
    expect(d?.reflectors.map((r) => r.label)).toEqual(['A', 'A2']);
    expect(d?.installations.map((i) => i.id)).toEqual([ids.inst.id]);
    expect(d?.inspections.map((i) => i.inspectedAtMs)).toEqual([T0_MS + 2e8, T0_MS + 86_400_000]);
    expect(d?.history.map((h) => h.kind)).toEqual(['create']);
    expect(d?.conflicts).toEqual([]);
    expect(await querySiteDetail(db(), crypto.randomUUID())).toBeNull();
  });

  it('shows a merge conflict on its site until it is resolved', async () => {
    const ids = await seedSample(db());
    const doc = await exportBackup(db(), { appVersion: '0.1.0' });
    await siteRepo.update(db(), ids.site.id, { notes: 'here' }, BY);
    const theirs = structuredClone(doc);
    const s = theirs.tables.sites.find((x) => x.id === ids.site.id);
    if (!s) throw new Error('site missing from the backup');
    Object.assign(s, { notes: 'there', rev: 2, updatedAtMs: T0_MS + 5 });
    await mergeBackup(db(), theirs, BY);
    const [c] = (await querySiteDetail(db(), ids.site.id))?.conflicts ?? [];
    expect(c).toMatchObject({ recordId: ids.site.id, kept: 'local' });
    await resolveConflict(db(), c.id, T0_MS);
    expect((await querySiteDetail(db(), ids.site.id))?.conflicts).toEqual([]);
  });

  it('re-runs under liveQuery (as useLiveQuery does) when a write commits', async () => {
    const ids = await seedSample(db());
    const seen: number[] = [];
    const sub = liveQuery(() => querySiteListSources(db())).subscribe((rows) => seen.push(rows.length));
    try {
      await expect.poll(() => seen.length).toBe(1);
      await siteRepo.softDelete(db(), ids.site2.id, BY);
      await expect.poll(() => seen.at(-1)).toBe(1);
      expect(seen[0]).toBe(2);
    } finally {
      sub.unsubscribe();
    }
  });
});
