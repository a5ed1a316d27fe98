import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import {
  backupToJson,
  elementRepo,
  exportBackup,
  mergeBackup,
  openGlintmarkDb,
  reflectorRepo,
  removeDemoData,
  restoreBackup,
  siteRepo,
  type BackupDocument,
} from '../../../src/data/index.ts';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { DEMO_TLE } from '../../../src/demo/elements.ts';
import { countOf, countsOf, demoRemovalView, describeBackup, formatCounts, mergeConflictLines, mergeRows, mergeSummary, restoreSummary } from '../../../src/ui/pages/settings/reports.ts';
import { BY, site, T0_MS, useTestDb } from './helpers.ts';

describe('counts', () => {
  it('singular and plural, empty tables left out', () => {
    expect(countOf('sites', 1)).toBe('1 site');
    expect(countOf('revisions', 2)).toBe('2 history entries');
    expect(formatCounts({ sites: 3, reflectors: 1, photos: 0, elements: 2 })).toBe('3 sites, 1 reflector, 2 element sets');
    expect(formatCounts({})).toBe('nothing');
  });
});

describe('reports of real operations', () => {
  const db = useTestDb();

  it('describes a backup before restoring it, and the restore after', async () => {
    const s = await siteRepo.create(db(), site('MF-01'), { ...BY, nowMs: T0_MS });
    await reflectorRepo.create(db(), { siteId: s.id, label: 'A', shape: 'triangular', edgeM: 1.5, construction: { panels: 'solid', drainage: '', foundation: '' }, apex: null, apexHeightAboveMarkM: 0.8, gnssArpOffsetM: null, notes: '', demo: false }, BY);
    await elementRepo.put(db(), parseTle(DEMO_TLE).sets, { demo: true, nowMs: T0_MS });
    const doc = JSON.parse(backupToJson(await exportBackup(db(), { appVersion: '0.1.0', nowMs: T0_MS }))) as BackupDocument;
    expect(describeBackup(doc)).toBe('Backup made 2027-07-02 12:00 UTC by Glintmark 0.1.0. It holds 1 site, 1 reflector, 2 history entries, 1 element set.');
    const other = openGlintmarkDb(`restore-${crypto.randomUUID()}`);
    try {
      expect(restoreSummary(await restoreBackup(other, doc))).toBe('Restored 1 site, 1 reflector, 2 history entries, 1 element set.');
    } finally {
      await other.delete();
    }
    expect(countsOf(doc)).toMatchObject({ sites: 1, reflectors: 1, revisions: 2, elements: 1, photos: 0 });
  });

  it('sums a merge and lists each conflict with its record and reason', async () => {
    const s = await siteRepo.create(db(), site('MF-01'), { ...BY, nowMs: T0_MS });
    const doc = JSON.parse(backupToJson(await exportBackup(db(), { appVersion: '0.1.0' }))) as BackupDocument;
    const other = openGlintmarkDb(`merge-${crypto.randomUUID()}`);
    try {
      await restoreBackup(other, doc);
      await siteRepo.update(other, s.id, { notes: 'there' }, { ...BY, nowMs: T0_MS + 1 });
      await siteRepo.create(other, site('MF-02'), BY);
      await siteRepo.update(db(), s.id, { notes: 'here' }, { ...BY, nowMs: T0_MS + 2 });
      const report = await mergeBackup(db(), await exportBackup(other, { appVersion: '0.1.0' }), BY);
      expect(mergeRows(report).map((r) => [r.heading, r.added, r.updated, r.unchanged, r.localNewer, r.conflicts])).toEqual([
        ['Sites', 1, 0, 0, 0, 1],
        ['History entries', 1, 0, 0, 0, 0], // MF-01's history travels with its conflict row
      ]);
      expect(mergeSummary(report)).toBe('Merged: 2 added, 0 updated, 0 unchanged, 0 newer on this phone, 1 conflict (listed below; both versions are kept).');
      expect(mergeConflictLines(report)).toEqual([`site ${s.id}: revision 2 differs between the phones; the local version is kept`]);
    } finally {
      await other.delete();
    }
  });

  it('says what demo removal removed and what it kept', async () => {
    expect(demoRemovalView(await removeDemoData(db()))).toEqual({ removed: 'There was no demo data to remove.', kept: [] });
    const demo = await siteRepo.create(db(), site('DEMO-1', { demo: true }), BY);
    await siteRepo.create(db(), site('DEMO-2', { demo: true }), BY);
    const real = await reflectorRepo.create(db(), { siteId: demo.id, label: 'real', shape: 'square', edgeM: 1, construction: { panels: 'solid', drainage: '', foundation: '' }, apex: null, apexHeightAboveMarkM: 0.5, gnssArpOffsetM: null, notes: '', demo: false }, BY);
    const view = demoRemovalView(await removeDemoData(db()));
    expect(view.removed).toBe('Removed 1 site, 1 history entry.');
    expect(view.kept).toEqual([`Kept the demo site ${demo.id} because a real record uses it (reflectors ${real.id} points to it).`]);
  });
});
