import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { openGlintmarkDb } from '../../../src/data/db.ts';
import { DuplicateCodeError } from '../../../src/data/errors.ts';
import { commitSiteImport, previewSiteImport } from '../../../src/data/exchange/siteImport.ts';
import { exportSitesCsv } from '../../../src/data/exchange/tablesCsv.ts';
import { siteRepo } from '../../../src/data/repo/sites.ts';
import type { SiteRecord } from '../../../src/data/types.ts';
import { BY, dumpDb, siteFields, useTestDb } from '../helpers.ts';

describe('site import from CSV', () => {
  const db = useTestDb();

  it('accepts the plain header with name optional and extra columns kept in the notes', async () => {
    const text = 'code,latitude,longitude,height_m,owner\r\nMF-01,52.5,-1.25,60.5,Parish council\r\nMF-02,52.6,359.5,61,\r\n';
    const p = await previewSiteImport(db(), text, 'csv');
    expect(p.rejected).toEqual([]);
    expect(p.accepted).toEqual([
      { row: 2, fields: { code: 'MF-01', name: '', latDeg: 52.5, lonDeg: -1.25, heightEllM: 60.5, positionSource: 'imported', positionAccuracyM: null, referenceFrame: 'WGS84', frameEpoch: null, notes: 'owner: Parish council', demo: false } },
      { row: 3, fields: expect.objectContaining({ code: 'MF-02', lonDeg: -0.5, notes: '' }) },
    ]);
  });

  it('rejects each bad row with its line number and a plain reason, and writes nothing', async () => {
    await siteRepo.create(db(), siteFields({ code: 'OLD-1' }), BY);
    const gone = await siteRepo.create(db(), siteFields({ code: 'GONE-1' }), BY);
    await siteRepo.softDelete(db(), gone.id, BY);
    const text = [
      'code,name,latitude,longitude,height_m',
      'A-1,ok,52,-1,10',
      'A-2,lat out of range,95,-1,10',
      'A-3,not a number,abc,-1,10',
      'A-4,decimal comma,"52,5",-1,10',
      'a-1,duplicate in file,52,-1,10',
      'old-1,duplicate of a live site,52,-1,10',
      'GONE-1,code of a deleted site is free,52,-1,10',
      'A-5,too few fields,52',
      ',no code,52,-1,10',
      'A-6,no height: unknown to be surveyed,52,-1,',
      '"A-7","notes, ""quoted""",52,-1,10',
    ].join('\r\n');
    const before = await dumpDb(db());
    const p = await previewSiteImport(db(), text, 'csv');
    expect(await dumpDb(db())).toEqual(before);
    expect(p.accepted.map((a) => [a.row, a.fields.code])).toEqual([[2, 'A-1'], [8, 'GONE-1'], [11, 'A-6'], [12, 'A-7']]);
    expect(p.accepted.find((a) => a.fields.code === 'A-6')?.fields.heightEllM).toBeNull();
    expect(p.rejected).toEqual([
      { row: 3, reason: 'latitude must be in [-90, 90] degrees, got 95' },
      { row: 4, reason: 'latitude "abc" is not a number' },
      { row: 5, reason: 'latitude "52,5" is not a number: this file separates fields with commas, so decimals must use a dot (52.5); or save the file with semicolons between fields' },
      { row: 6, reason: 'code a-1 repeats the code of line 2' },
      { row: 7, reason: 'code old-1 is already used by a site on this device' },
      { row: 9, reason: 'has 3 fields but the header has 5 (fields are separated by commas)' },
      { row: 10, reason: 'site code must not be empty' },
    ]);
  });

  it('reports a missing column, and files that are not CSV at all', async () => {
    expect((await previewSiteImport(db(), 'code,name,lat\nA,b,1\n', 'csv')).rejected).toEqual([
      { row: 1, reason: 'missing column longitude, height_m; the header (fields separated by commas) must name code, latitude, longitude, height_m' },
    ]);
    expect((await previewSiteImport(db(), '{"type":"FeatureCollection"}', 'csv')).rejected[0].reason).toBe('not a CSV file: it looks like JSON (import it as GeoJSON)');
    expect((await previewSiteImport(db(), 'PK\u0003\u0004\u0000\u0000', 'csv')).rejected[0].reason).toBe('not a CSV file: it is not text');
    expect((await previewSiteImport(db(), 'code,latitude\n"MF-01,52\n', 'csv')).rejected[0]).toEqual({ row: 2, reason: 'not a valid CSV file: line 2: a quoted field is never closed (the file may be cut short)' });
    expect((await previewSiteImport(db(), '', 'csv')).rejected[0].reason).toBe('the file is empty; expected a header such as code,latitude,longitude,height_m');
  });

  it('keeps imported text as plain strings (no HTML interpretation)', async () => {
    const p = await previewSiteImport(db(), 'code,name,latitude,longitude,height_m\nH-1,<b>Fen</b> &amp;,1,2,3\n', 'csv');
    expect(p.accepted[0].fields.name).toBe('<b>Fen</b> &amp;');
  });

  it('commits all accepted sites in one transaction, or none when something changed meanwhile', async () => {
    const p = await previewSiteImport(db(), 'code,latitude,longitude,height_m\nB-1,1,2,3\nB-2,1,2,3\n', 'csv');
    await siteRepo.create(db(), siteFields({ code: 'B-2' }), BY); // typed by hand after the preview
    const before = await dumpDb(db());
    await expect(commitSiteImport(db(), p, BY)).rejects.toBeInstanceOf(DuplicateCodeError);
    expect(await dumpDb(db())).toEqual(before);
    const fresh = await previewSiteImport(db(), 'code,latitude,longitude,height_m\nB-1,1,2,3\nB-3,1,2,3\n', 'csv');
    const written = await commitSiteImport(db(), fresh, BY);
    expect(written.map((s) => s.code)).toEqual(['B-1', 'B-3']);
  });

  it('round-trips sites through the CSV export, notes with quotes, commas and newlines included', async () => {
    await siteRepo.create(db(), siteFields({ code: 'R-1', notes: 'gate "blue", key under stone\r\nsecond line' }), BY);
    await siteRepo.create(db(), siteFields({ code: 'R-2', name: 'comma, name', lonDeg: -179.5, positionAccuracyM: null, frameEpoch: null }), BY);
    const text = await exportSitesCsv(db());
    const other = openGlintmarkDb(`csv-${crypto.randomUUID()}`);
    try {
      const p = await previewSiteImport(other, text, 'csv');
      expect(p.rejected).toEqual([]);
      await commitSiteImport(other, p, BY);
      const strip = ({ id: _i, rev: _r, createdAtMs: _c, updatedAtMs: _u, positionSource: _p, ...rest }: SiteRecord) => rest;
      expect((await siteRepo.list(other)).map(strip)).toEqual((await siteRepo.list(db())).map(strip));
    } finally {
      await other.delete();
    }
  });
});

describe('site import from GeoJSON', () => {
  const db = useTestDb();
  const fc = (features: unknown[]) => JSON.stringify({ type: 'FeatureCollection', features });
  const point = (coordinates: unknown, properties: unknown) => ({ type: 'Feature', geometry: { type: 'Point', coordinates }, properties });

  it('reads Point features, longitude first, and rejects the rest by feature index', async () => {
    const p = await previewSiteImport(db(), fc([
      point([-1.25, 52.5, 60], { code: 'G-1', name: 'Fen', colour: 'red' }),
      point([-1.25, 52.5], { code: 'G-2' }),
      point([-1.25, 52.5], { code: 'G-3', height_ell_m: 12 }),
      { type: 'Feature', geometry: { type: 'LineString', coordinates: [[0, 0], [1, 1]] }, properties: { code: 'G-4' } },
      point([200.5, 52.5, 1], { code: 'G-5' }),
      point([10, 95, 1], { code: 'G-6' }),
      point(['10', 5, 1], { code: 'G-7' }),
      point([10, 5, 1], {}),
    ]), 'geojson');
    expect(p.accepted.map((a) => [a.row, a.fields.code, a.fields.lonDeg, a.fields.latDeg, a.fields.heightEllM])).toEqual([
      [0, 'G-1', -1.25, 52.5, 60],
      [1, 'G-2', -1.25, 52.5, null],
      [2, 'G-3', -1.25, 52.5, 12],
      [4, 'G-5', -159.5, 52.5, 1],
    ]);
    expect(p.accepted[0].fields.notes).toBe('colour: red');
    expect(p.rejected).toEqual([
      { row: 3, reason: 'has no Point geometry (found "LineString")' },
      { row: 5, reason: 'latitude must be in [-90, 90] degrees, got 95' },
      { row: 6, reason: 'Point coordinates must be 2 or 3 numbers [longitude, latitude, height]' },
      { row: 7, reason: 'site code must not be empty' },
    ]);
  });

  it('refuses text that is not GeoJSON at all', async () => {
    expect((await previewSiteImport(db(), 'code,lat\n', 'geojson')).rejected).toEqual([{ row: 0, reason: 'not a GeoJSON file: the text is not JSON' }]);
    expect((await previewSiteImport(db(), '{"type":"Topology"}', 'geojson')).rejected).toEqual([{ row: 0, reason: 'not a GeoJSON FeatureCollection (its type is "Topology")' }]);
    expect((await previewSiteImport(db(), JSON.stringify(point([1, 2, 3], { code: 'ONE' })), 'geojson')).accepted).toHaveLength(1);
  });
});
