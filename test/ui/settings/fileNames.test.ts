import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { backupFileName, EXPORT_FILE_TYPES, EXPORT_KINDS, exportFileName, importKindOf, utcStamp } from '../../../src/ui/pages/settings/fileNames.ts';

const T0_MS = Date.UTC(2027, 6, 2, 9, 5, 59, 999); // 2027-07-02T09:05:59.999Z

describe('file names', () => {
  it('backup: glintmark-backup-YYYYMMDD-HHMMZ.glintmark.zip in UTC, minutes truncated', () => {
    expect(backupFileName(T0_MS)).toBe('glintmark-backup-20270702-0905Z.glintmark.zip');
    expect(backupFileName(Date.UTC(2027, 11, 31, 23, 59))).toBe('glintmark-backup-20271231-2359Z.glintmark.zip');
  });

  it('the stamp reads back as the same UTC minute for any date from 1970 to 9999', () => {
    const maxMs = Date.UTC(9999, 11, 31, 23, 59);
    fc.assert(
      fc.property(fc.integer({ min: 0, max: maxMs }), (ms) => {
        const m = /^(\d{4})(\d{2})(\d{2})-(\d{2})(\d{2})Z$/.exec(utcStamp(ms));
        expect(m).not.toBeNull();
        const [, y, mo, d, h, mi] = (m as RegExpExecArray).map(Number);
        expect(Date.UTC(y, mo - 1, d, h, mi)).toBe(Math.floor(ms / 60_000) * 60_000);
      }),
    );
  });

  it('exports: one name and media type per kind', () => {
    expect(EXPORT_KINDS.map((k) => exportFileName(k, T0_MS))).toEqual([
      'glintmark-sites-20270702-0905Z.geojson',
      'glintmark-sites-20270702-0905Z.csv',
      'glintmark-installations-20270702-0905Z.csv',
      'glintmark-inspections-20270702-0905Z.csv',
    ]);
    // RFC 7946 §12 registers application/geo+json; RFC 4180 §3 registers text/csv with a charset parameter.
    expect(EXPORT_FILE_TYPES['sites-geojson'].mime).toBe('application/geo+json');
    expect(EXPORT_FILE_TYPES['installations-csv'].mime).toBe('text/csv;charset=utf-8');
  });

  it('refuses an instant that is not a finite number, naming it', () => {
    expect(() => utcStamp(Number.NaN)).toThrow(RangeError);
    expect(() => backupFileName(Infinity)).toThrow('atMs must be a finite time in ms since 1970, got Infinity');
    expect(() => exportFileName('photos' as never, T0_MS)).toThrow(/kind must be one of sites-geojson/);
  });
});

describe('import file kind', () => {
  it('goes by the extension, then by the first character', () => {
    expect(importKindOf('sites.CSV', '{')).toBe('csv');
    expect(importKindOf('sites.geojson', 'code,name')).toBe('geojson');
    expect(importKindOf('export.json', '')).toBe('geojson');
    expect(importKindOf('sites', '\uFEFF  {"type":"FeatureCollection"}')).toBe('geojson');
    expect(importKindOf('sites', 'code,name,latitude')).toBe('csv');
    expect(importKindOf('list.dat', '')).toBe('csv');
  });
});
