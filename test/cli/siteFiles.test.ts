/**
 * One site-file format for phone and planner: the planner reads the app's sites CSV and GeoJSON exports, the app
 * reads the planner's files, and both read (or refuse, naming the separator) the CSV files spreadsheets write in
 * other locales. Round trips go through the real export, import and `plan` functions; expected values are written
 * here by hand.
 */
import 'fake-indexeddb/auto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/core/text/csv.ts';
import { exportSitesGeoJson } from '../../src/data/exchange/geojson.ts';
import { previewSiteImport } from '../../src/data/exchange/siteImport.ts';
import { exportInstallationsCsv, exportSitesCsv } from '../../src/data/exchange/tablesCsv.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
import { BY, reflectorFields, seedSample, siteFields, useTestDb } from '../data/helpers.ts';
import { runCli } from './run.ts';

const dir = mkdtempSync(join(tmpdir(), 'glintmark-sitefiles-'));
const file = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};
const PLAN = ['--geometry', '40,190,right', '--shape', 'triangular', '--edge', '1.2', '--band', 'C', '--json'];
type Row = { siteCode: string; latDeg: number; lonDeg: number; heightM: number | null };
const sitesOf = (rows: Row[]) => rows.map((r) => [r.siteCode, r.latDeg, r.lonDeg, r.heightM]);

describe('the planner reads the app\'s site exports', () => {
  const db = useTestDb();

  it('reads the sites CSV export, a site with unknown height included', async () => {
    await seedSample(db());
    await siteRepo.create(db(), siteFields({ code: 'MF-04', latDeg: 52.000000012345, lonDeg: 1.5, heightEllM: null }), BY);
    const p = file('app-sites.csv', await exportSitesCsv(db()));
    const r = await runCli(['plan', '--sites', p, ...PLAN]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(sitesOf(r.json() as Row[])).toEqual([
      ['MF-01', 52.4123, -1.2345, 61.2],
      ['MF-02', -33.5, 151.25, 25],
      ['MF-04', 52.00000001, 1.5, null], // 8 decimals (about 1 mm) in the export
    ]);
  });

  it('reads the GeoJSON export', async () => {
    await seedSample(db());
    const p = file('app-sites.geojson', JSON.stringify(await exportSitesGeoJson(db())));
    const r = await runCli(['plan', '--sites', p, ...PLAN]);
    expect(r.code).toBe(0);
    expect(sitesOf(r.json() as Row[])).toEqual([
      ['MF-01', 52.4123, -1.2345, 61.2],
      ['MF-02', -33.5, 151.25, 25],
    ]);
  });
});

describe('the app reads the planner\'s files', () => {
  const db = useTestDb();

  it('imports the planner\'s minimal sites file and its plan output (one row per site and geometry, read once)', async () => {
    const sites = file('planner-sites.csv', 'code,latitude,longitude,height_m\r\nPL-1,52.1,4.3,-2.5\r\nPL-2,52.2,4.4,1\r\n');
    const p1 = await previewSiteImport(db(), readFileSync(sites, 'utf8'), 'csv');
    expect(p1.rejected).toEqual([]);
    expect(p1.accepted.map((a) => [a.fields.code, a.fields.latDeg, a.fields.lonDeg, a.fields.heightEllM])).toEqual([
      ['PL-1', 52.1, 4.3, -2.5],
      ['PL-2', 52.2, 4.4, 1],
    ]);
    const out = join(dir, 'plan-out.csv');
    const r = await runCli(['plan', '--sites', sites, '--geometry', '40,190,right', '--geometry', '35,350,right', '--shape', 'triangular', '--edge', '1.2', '--band', 'C', '--out', out]);
    expect(r.code).toBe(0);
    const p2 = await previewSiteImport(db(), readFileSync(out, 'utf8'), 'csv');
    expect(p2.accepted.map((a) => [a.row, a.fields.code, a.fields.latDeg, a.fields.heightEllM, a.fields.notes])).toEqual([
      [2, 'PL-1', 52.1, -2.5, ''],
      [4, 'PL-2', 52.2, 1, ''],
    ]);
    expect(p2.rejected.map((x) => [x.row, x.reason])).toEqual([
      [3, 'same site as line 2 (code PL-1, every field the same); read once'],
      [5, 'same site as line 4 (code PL-2, every field the same); read once'],
    ]);
  });
});

describe('site CSV files written in other locales, read alike by the app and the planner', () => {
  const db = useTestDb();
  const both = async (text: string) => {
    const app = await previewSiteImport(db(), text, 'csv');
    const cli = await runCli(['plan', '--sites', file(`x-${crypto.randomUUID()}.csv`, text), ...PLAN]);
    return { app, cli };
  };
  const EXPECTED = [
    ['LC-1', 52.125, -1.5, 61.25],
    ['LC-2', -33.75, 151.0625, 3],
  ];

  it.each([
    ['semicolon separator, decimal comma, BOM, CRLF', '\uFEFFcode;latitude;longitude;height_m\r\nLC-1;52,125;-1,5;61,25\r\nLC-2;-33,75;151,0625;3\r\n'],
    ['semicolon separator, decimal dot', 'code;latitude;longitude;height_m\nLC-1;52.125;-1.5;61.25\nLC-2;-33.75;151.0625;3\n'],
    ['tab separator, BOM, CRLF', '\uFEFFcode\tlatitude\tlongitude\theight_m\r\nLC-1\t52.125\t-1.5\t61.25\r\nLC-2\t-33.75\t151.0625\t3\r\n'],
    ['tab separator, decimal comma that cannot be a thousands group', 'code\tlatitude\tlongitude\theight_m\nLC-1\t52,1250\t-1,5\t61,25\nLC-2\t-33,75\t151,0625\t3\n'],
    ['comma separator, BOM, CRLF, quoted text', '\uFEFFcode,name,latitude,longitude,height_m\r\nLC-1,"Fen, north",52.125,-1.5,61.25\r\nLC-2,Ridge,-33.75,151.0625,3\r\n'],
  ])('%s', async (_name, text) => {
    const { app, cli } = await both(text);
    expect(app.rejected).toEqual([]);
    expect(app.accepted.map((a) => [a.fields.code, a.fields.latDeg, a.fields.lonDeg, a.fields.heightEllM])).toEqual(EXPECTED);
    expect(cli.code).toBe(0);
    expect(sitesOf(cli.json() as Row[])).toEqual(EXPECTED);
  });

  it('refuses a decimal comma in a comma-separated file, naming the separator and what to change', async () => {
    const { app, cli } = await both('code,latitude,longitude,height_m\nLC-1,52,125,-1,5,61,25\n');
    expect(app.accepted).toEqual([]);
    expect(app.rejected[0].reason).toMatch(/has 7 fields but the header has 4 \(fields are separated by commas here, so a decimal comma such as 52,1 splits a number in two: use a dot for decimals, or save the file with semicolons between fields\)/);
    expect(cli.code).toBe(2);
    expect(cli.stderr).toMatch(/line 2: has 7 fields .*separated by commas.*semicolons/);
  });

  it('refuses a tab-separated value that could be a thousands group', async () => {
    const { app, cli } = await both('code\tlatitude\tlongitude\theight_m\nLC-1\t52.1\t4.2\t1,234\n');
    expect(app.rejected[0].reason).toBe('height "1,234" is ambiguous: in a tab-separated file it may be a decimal comma or a thousands separator; write it with a dot as the decimal separator');
    expect(cli.stderr).toMatch(/line 2: height "1,234" is ambiguous/);
  });

  it('names the separator it found when the header misses columns', async () => {
    const { app, cli } = await both('code;lat;lon\nA;1;2\n');
    expect(app.rejected[0].reason).toBe('missing column height_m; the header (fields separated by semicolons) must name code, latitude, longitude, height_m');
    expect(cli.stderr).toMatch(/line 1: missing column height_m; the header \(fields separated by semicolons\)/);
  });
});

describe('exports that stand alone', () => {
  const db = useTestDb();

  it('the installations CSV names the reflector, the geometry it serves and the method as the screen shows it, rounded', async () => {
    const ids = await seedSample(db());
    const { installationRepo } = await import('../../src/data/repo/entities.ts');
    await installationRepo.update(db(), ids.inst.id, { measuredAzimuthDeg: 256.10000000000002, predictedLossDb: 0.123456789 }, BY);
    const [h, row] = parseCsv(await exportInstallationsCsv(db())).map((r) => r.fields);
    const o = Object.fromEntries(h.map((k, i) => [k, row[i]]));
    expect(o).toMatchObject({
      reflector_label: 'A',
      reflector_shape: 'triangular',
      reflector_edge_m: '1.5',
      azimuth_method: 'sun-shadow',
      azimuth_method_label: 'sun shadow',
      geometry_satellites: 'GLINT-A',
      geometry_directions: 'ascending',
      geometry_incidence_deg: '38.5',
      geometry_heading_deg: '345.7',
      geometry_look: 'right',
      measured_azimuth_deg: '256.1',
      predicted_loss_db: '0.12',
    });
  });

  it('the GeoJSON carries every live reflector of a site with its latest installation', async () => {
    const ids = await seedSample(db());
    const { reflectorRepo } = await import('../../src/data/repo/entities.ts');
    await reflectorRepo.create(db(), reflectorFields(ids.site.id, { label: 'B', edgeM: 1.2 }), BY);
    const gone = await reflectorRepo.create(db(), reflectorFields(ids.site.id, { label: 'C' }), BY);
    await reflectorRepo.softDelete(db(), gone.id, BY);
    const f = (await exportSitesGeoJson(db())).features.find((x) => x.properties.code === 'MF-01')!;
    const refl = f.properties.reflectors as { label: string; shape: string; edge_m: number; latest_installation: { installation_id: string; azimuth_method_label: string; geometries: { satellite: string; incidence_deg: number }[] } | null }[];
    expect(refl.map((r) => [r.label, r.shape, r.edge_m])).toEqual([
      ['A', 'triangular', 1.5],
      ['B', 'triangular', 1.2],
    ]);
    expect(refl[0].latest_installation?.installation_id).toBe(ids.inst.id);
    expect(refl[0].latest_installation?.azimuth_method_label).toBe('sun shadow');
    expect(refl[0].latest_installation?.geometries[0]).toMatchObject({ satellite: 'GLINT-A', incidence_deg: 38.5 });
    expect(refl[1].latest_installation).toBeNull();
  });
});
