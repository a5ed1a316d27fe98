import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { parseCsv, unprotectCsvCell } from '../../../src/core/text/csv.ts';
import { exportInspectionsCsv, exportInstallationsCsv, INSPECTION_COLUMNS, INSTALLATION_COLUMNS } from '../../../src/data/exchange/tablesCsv.ts';
import { installationRepo, reflectorRepo } from '../../../src/data/repo/entities.ts';
import { siteRepo } from '../../../src/data/repo/sites.ts';
import { BY, T0_MS, installationFields, reflectorFields, seedSample, siteFields, useTestDb } from '../helpers.ts';

const asObjects = (text: string) => {
  const [h, ...rows] = parseCsv(text);
  return rows.map((r) => Object.fromEntries(h.fields.map((k, i) => [k, r.fields[i]])));
};

describe('installation and inspection CSV exports', () => {
  const db = useTestDb();

  it('installations: header with units, CRLF records, ISO 8601 UTC times, one row per live installation', async () => {
    const ids = await seedSample(db());
    const text = await exportInstallationsCsv(db());
    expect(text.split('\r\n')[0]).toBe(INSTALLATION_COLUMNS.join(','));
    expect(text).toContain('measured_azimuth_deg');
    expect(text.endsWith('\r\n')).toBe(true);
    const [row] = asObjects(text);
    expect(row).toMatchObject({
      installation_id: ids.inst.id,
      site_code: 'MF-01',
      reflector_label: 'A',
      installed_at_utc: '2027-07-02T12:00:00.000Z',
      measured_azimuth_deg: '256.1',
      measured_tilt_deg: '-3',
      azimuth_method: 'sun-shadow',
      declination_deg: '',
      geometry_ids: ids.geo.id,
      crew: 'Ada Quill; Bo Marsh',
      photo_count: '1',
      rev: '2',
    });
  });

  it('round-trips notes with quotes, commas and newlines', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const r = await reflectorRepo.create(db(), reflectorFields(s.id), BY);
    const tricky = ['tilt, "checked" twice\nbolts tight', 'CRLF\r\ninside', '"', ',', 'plain', '', '=SUM(A1)'];
    for (const [k, notes] of tricky.entries()) await installationRepo.create(db(), installationFields(s.id, r.id, { notes, installedAtMs: T0_MS + k }), BY);
    const rows = asObjects(await exportInstallationsCsv(db()));
    // '=SUM(A1)' is protected against spreadsheet formulas (csvInjection.test.ts); read back it is the same text.
    expect(rows.map((x) => unprotectCsvCell(x.notes))).toEqual(tricky);
  });

  it('leaves out deleted installations', async () => {
    const ids = await seedSample(db());
    await installationRepo.softDelete(db(), ids.inst.id, BY);
    expect(asObjects(await exportInstallationsCsv(db()))).toEqual([]);
  });

  it('inspections: checklist columns and re-measured angles', async () => {
    await seedSample(db());
    const text = await exportInspectionsCsv(db());
    expect(text.split('\r\n')[0]).toBe(INSPECTION_COLUMNS.join(','));
    expect(asObjects(text)[0]).toMatchObject({
      inspected_at_utc: '2027-07-03T12:00:00.000Z',
      debris: 'ok',
      standing_water: 'issue',
      snow_ice: 'not-checked',
      remeasured_azimuth_deg: '256',
      remeasured_roll_deg: '0.5',
      notes: 'water in the corner; drain hole cleared',
    });
  });
});
