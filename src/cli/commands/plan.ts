import { writeFileSync } from 'node:fs';
import { aimForPass } from '../../core/geometry/pointing.ts';
import { compromiseOrientation } from '../../core/reflector/compromise.ts';
import { misalignment } from '../../core/reflector/misalignment.ts';
import { peakRcsM2 } from '../../core/reflector/trihedral.ts';
import { formatCsv } from '../../core/text/csv.ts';
import { toDb } from '../../core/units.ts';
import { requirePositive } from '../../core/validate.ts';
import { UsageError, type Args } from '../args.ts';
import type { Command } from '../command.ts';
import { assertOutIsNotInput, readInputText } from '../input.ts';
import { jsonNumber, readGeometries, readShape, readWavelengthM } from '../common.ts';
import { fmt, table } from '../output.ts';
import { parseSitesCsv } from '../sitesCsv.ts';
import { reflectorWarnings } from './rcs.ts';

const COLUMNS = [
  'site_code', 'latitude_deg', 'longitude_deg', 'height_m', 'incidence_deg', 'heading_deg', 'look',
  'reflector_azimuth_deg', 'boresight_elevation_deg', 'base_tilt_deg', 'roll_deg', 'peak_rcs_dbsm', 'loss_db', 'predicted_rcs_dbsm',
] as const;

const FORMATS = ['table', 'csv', 'json'] as const;
type Format = (typeof FORMATS)[number];

/** The output format: --json, or --format, else a table on the screen and CSV in an --out file. */
function readFormat(args: Args, hasOut: boolean): Format {
  const json = args.flag('json');
  const f = args.optString('format');
  if (f !== undefined && !(FORMATS as readonly string[]).includes(f)) throw new UsageError(`--format must be one of ${FORMATS.join(', ')}; got "${f}"`);
  if (json && f !== undefined && f !== 'json') throw new UsageError(`give either --json or --format ${f}, not both`);
  if (json) return 'json';
  return (f as Format | undefined) ?? (hasOut ? 'csv' : 'table');
}

/** Where the wavelength came from, in the words of the flag the user typed. */
function wavelengthOrigin(args: Args): string {
  if (args.has('band')) return `--band ${args.optString('band')}`;
  if (args.has('frequency')) return `--frequency ${args.optString('frequency')} GHz`;
  return '--wavelength';
}

export const command: Command = {
  name: 'plan',
  summary: 'aim and predicted RCS for every site in a site file and every geometry (table, CSV or JSON)',
  usage:
    '--sites FILE --geometry INC,HEADING[,LOOK] [--geometry ...] --shape S --edge M (--wavelength M | --frequency GHZ | --band L|S|C|X|Ku) [--one-reflector] [--out FILE] [--format table|csv|json] [--json]\n' +
    'Sites file: CSV with header code,latitude,longitude,height_m (also the app\'s sites export: latitude_deg, longitude_deg,\n' +
    '  height_ell_m, name, notes ...; comma, semicolon or tab separated; decimal comma in semicolon files) or the app\'s GeoJSON.\n' +
    'Units: degrees (incidence, heading, azimuths true, clockwise from north, toward the satellite), metres, dBsm, dB.\n' +
    'Defaults: LOOK right when a --geometry omits it; each geometry gets its own aim unless --one-reflector (one compromise per\n' +
    '  site); output a table on the screen, CSV in an --out file, JSON with --json. No default band, shape or edge: give them.',
  switches: ['one-reflector'],
  async run(args, out) {
    const oneReflector = args.flag('one-reflector');
    const sitesPath = args.string('sites');
    const geometrySpecs = args.strings('geometry');
    const geometries = readGeometries(args);
    const shape = readShape(args);
    const edgeM = requirePositive('edge', args.number('edge'), 'm');
    const origin = wavelengthOrigin(args);
    const wavelengthM = readWavelengthM(args);
    const outPath = args.optString('out');
    const format = readFormat(args, outPath !== undefined);
    args.assertNoUnknown();

    if (outPath) assertOutIsNotInput(outPath, [{ flag: '--sites', path: sitesPath }]);
    const text = await readInputText('--sites', sitesPath, out);
    const sites = parseSitesCsv(sitesPath, text);
    const reflector = { shape, edgeM, wavelengthM };
    const peakDbsm = toDb(peakRcsM2(reflector));
    const compromise = oneReflector ? compromiseOrientation(reflector, geometries) : null;
    const shared = compromise?.orientation ?? null;
    if (compromise?.separateRecommended) out.stderr(`warning: ${compromise.message}\n`);
    for (const w of reflectorWarnings(reflector)) out.stderr(`warning: ${w}\n`);

    const rows = sites.flatMap((s) =>
      geometries.map((g) => {
        const aim = aimForPass(g);
        const o = shared ?? { azimuthDeg: aim.reflectorAzimuthDeg, tiltDeg: aim.baseTiltDeg, rollDeg: 0 };
        const m = misalignment(reflector, o, g);
        return {
          siteCode: s.code, latDeg: s.latDeg, lonDeg: s.lonDeg, heightM: s.heightM,
          incidenceDeg: g.incidenceDeg, headingDeg: g.headingDeg, look: g.look,
          reflectorAzimuthDeg: o.azimuthDeg, boresightElevationDeg: aim.boresightElevationDeg, baseTiltDeg: o.tiltDeg, rollDeg: o.rollDeg,
          peakRcsDbsm: peakDbsm, lossDb: m.lossDb, predictedRcsDbsm: m.rcsDbsm,
        };
      }),
    );
    const lookDefaulted = geometrySpecs.some((g) => !(g.split(',')[2] ?? '').trim());
    const assumptions = [
      `reflector ${shape}, inner edge ${fmt(edgeM, 3)} m; wavelength ${fmt(wavelengthM * 100, 3)} cm (${origin}); peak RCS ${fmt(peakDbsm, 2)} dBsm`,
      shared ? 'one reflector per site, aimed at the best compromise for all geometries (--one-reflector)' : 'each geometry gets its own aim (no --one-reflector)',
      ...(lookDefaulted ? ['look side right where a --geometry gives none (default)'] : []),
      'azimuths true, clockwise from north, toward the satellite; tilt open side up positive',
    ];
    let doc: string;
    if (format === 'json') {
      doc = JSON.stringify(rows.map((r) => ({ ...r, lossDb: jsonNumber(r.lossDb), predictedRcsDbsm: jsonNumber(r.predictedRcsDbsm) })), null, 2) + '\n';
    } else if (format === 'csv') {
      doc = formatCsv([COLUMNS as unknown as string[], ...rows.map((r) => [
        r.siteCode, r.latDeg, r.lonDeg, r.heightM, r.incidenceDeg, r.headingDeg, r.look,
        r.reflectorAzimuthDeg.toFixed(3), r.boresightElevationDeg.toFixed(3), r.baseTiltDeg.toFixed(3), r.rollDeg.toFixed(3),
        peakDbsmText(r.peakRcsDbsm), Number.isFinite(r.lossDb) ? r.lossDb.toFixed(3) : '', Number.isFinite(r.predictedRcsDbsm) ? r.predictedRcsDbsm.toFixed(2) : '',
      ])]);
    } else {
      doc =
        assumptions.map((a) => `${a}\n`).join('') +
        '\n' +
        table(
          ['site', 'incidence °', 'heading °', 'look', 'reflector azimuth °', 'base tilt °', 'roll °', 'loss dB', 'predicted RCS dBsm'],
          rows.map((r) => [
            r.siteCode, fmt(r.incidenceDeg, 2), fmt(r.headingDeg, 2), r.look, fmt(r.reflectorAzimuthDeg, 2), fmt(r.baseTiltDeg, 2), fmt(r.rollDeg, 2),
            Number.isFinite(r.lossDb) ? fmt(r.lossDb, 2) : 'no return', Number.isFinite(r.predictedRcsDbsm) ? fmt(r.predictedRcsDbsm, 2) : '—',
          ]),
        );
    }
    if (outPath) {
      try {
        writeFileSync(outPath, doc);
      } catch (e) {
        throw new UsageError(`cannot write --out ${outPath}: ${(e as NodeJS.ErrnoException).code ?? 'error'}`);
      }
      out.stderr(`wrote ${rows.length} rows to ${outPath}\n`);
    } else out.stdout(doc);
    // The assumptions go with every non-JSON result: in the table itself, else on stderr beside the CSV.
    if (format === 'csv') for (const a of assumptions) out.stderr(`plan: ${a}\n`);
    return 0;
  },
};

const peakDbsmText = (x: number) => x.toFixed(2);
