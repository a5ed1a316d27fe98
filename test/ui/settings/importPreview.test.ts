import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { previewSiteImport, siteRepo, type SiteImportPreview } from '../../../src/data/index.ts';
import { importButtonLabel, previewRows, previewSummary } from '../../../src/ui/pages/settings/importPreview.ts';
import { BY, site, useTestDb } from './helpers.ts';

describe('site import preview rows', () => {
  const db = useTestDb();

  it('lists every accepted site and every rejected row with its reason, in file order', async () => {
    await siteRepo.create(db(), site('HR-07'), BY);
    const csv = [
      'code,name,latitude,longitude,height_m',
      'MF-01,<b>North bank</b>,52.4123,-1.2345,61.2',
      'MF-02,Bad latitude,95,-1.2,60',
      'MF-01,Twice,52.4,-1.2,60',
      'HR-07,Taken,53,-2.5,300',
      'MF-03,"East, ditch",-33.5,151.25,25',
    ].join('\r\n');
    const p = await previewSiteImport(db(), csv, 'csv');
    const rows = previewRows(p);
    expect(rows.map((r) => [r.where, r.status, r.code])).toEqual([
      ['line 2', 'accepted', 'MF-01'],
      ['line 3', 'rejected', ''],
      ['line 4', 'rejected', ''],
      ['line 5', 'rejected', ''],
      ['line 6', 'accepted', 'MF-03'],
    ]);
    expect(rows[1].reason).toMatch(/latitude must be in \[-90, 90\] degrees, got 95/);
    expect(rows[2].reason).toBe('code MF-01 repeats the code of line 2');
    expect(rows[3].reason).toBe('code HR-07 is already used by a site on this device');
    // Text stays exactly as typed (the page renders it as text, never as HTML).
    expect(rows[0].name).toBe('<b>North bank</b>');
    expect(rows[0].position).toBe('52.41230°, −1.23450°, 61.20 m');
    expect(rows[4].position).toBe('−33.50000°, 151.25000°, 25.00 m');
    expect(previewSummary(p)).toBe('2 sites can be imported; 3 rows were rejected (reasons below). Nothing is saved until you press "Import 2 sites".');
    expect(new Set(rows.map((r) => r.key)).size).toBe(rows.length);
  });

  it('a file that is not a site list is one rejection of the whole file', async () => {
    const csv = previewRows(await previewSiteImport(db(), '{"format":"glintmark-backup"}', 'csv'));
    expect(csv).toEqual([expect.objectContaining({ where: 'whole file', status: 'rejected', reason: 'not a CSV file: it looks like JSON (import it as GeoJSON)' })]);
    const geo = previewRows(await previewSiteImport(db(), 'code,name', 'geojson'));
    expect(geo.map((r) => r.where)).toEqual(['whole file']);
  });

  it('GeoJSON feature 0 is a feature, not the whole file', () => {
    const p: SiteImportPreview = { kind: 'geojson', accepted: [], rejected: [{ row: 0, reason: 'no height: add a third coordinate or a height_ell_m property' }] };
    expect(previewRows(p).map((r) => r.where)).toEqual(['feature 0']);
    expect(previewSummary(p)).toBe('0 sites can be imported; 1 row was rejected (reasons below). Nothing is saved until you press "Import 0 sites".');
  });

  it('labels the import button with the count', () => {
    expect([0, 1, 2].map(importButtonLabel)).toEqual(['Import 0 sites', 'Import 1 site', 'Import 2 sites']);
  });
});
