import 'fake-indexeddb/auto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { previewSiteImport } from '../../../src/data/exchange/siteImport.ts';
import { useTestDb } from '../helpers.ts';

const fixture = (name: string) => readFileSync(new URL(`../../fixtures/data/${name}`, import.meta.url), 'utf8');

describe('importing the sample files (test/fixtures/data/README.md)', () => {
  const db = useTestDb();

  it('reads a spreadsheet-style CSV export', async () => {
    const p = await previewSiteImport(db(), fixture('sites-spreadsheet.csv'), 'csv');
    expect(p.accepted.map((a) => [a.row, a.fields.code, a.fields.name, a.fields.notes])).toEqual([
      [2, 'MF-01', 'Marrowby Fen north bank', 'gate "blue", key under stone\nsurveyor: Ada Quill'],
      [3, 'MF-02', 'Marrowby Fen, east ditch', 'two lines:\r\nwatch for cattle'],
      [5, 'HR-07', 'Hollin Ridge', 'surveyor: Bo Marsh'],
    ]);
    expect(p.rejected).toEqual([{ row: 6, reason: 'latitude must be in [-90, 90] degrees, got 95.1' }]);
  });

  it('reads an RFC 7946 file and refuses the polygon', async () => {
    const p = await previewSiteImport(db(), fixture('sites.geojson'), 'geojson');
    expect(p.accepted.map((a) => [a.fields.code, a.fields.lonDeg, a.fields.latDeg, a.fields.heightEllM, a.fields.notes])).toEqual([
      ['MF-01', -1.2345, 52.4123, 61.2, 'gate "blue", key under stone'],
      ['HR-07', -2.5007, 53.0011, 312.4, 'surveyor: Bo Marsh'],
    ]);
    expect(p.rejected).toEqual([{ row: 2, reason: 'has no Point geometry (found "Polygon")' }]);
  });
});
