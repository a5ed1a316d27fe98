import { writeFileSync } from 'node:fs';
import { aimForPass } from '../../core/geometry/pointing.ts';
import { compromiseOrientation } from '../../core/reflector/compromise.ts';
import { misalignment } from '../../core/reflector/misalignment.ts';
import { peakRcsM2 } from '../../core/reflector/trihedral.ts';
import { formatCsv } from '../../core/text/csv.ts';
import { toDb } from '../../core/units.ts';
import { requirePositive } from '../../core/validate.ts';
import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';
import { assertOutIsNotInput, readInputText } from '../input.ts';
import { jsonNumber, readGeometries, readShape, readWavelengthM } from '../common.ts';
import { parseSitesCsv } from '../sitesCsv.ts';
import { reflectorWarnings } from './rcs.ts';

const COLUMNS = [
  'site_code', 'latitude_deg', 'longitude_deg', 'height_m', 'incidence_deg', 'heading_deg', 'look',
  'reflector_azimuth_deg', 'boresight_elevation_deg', 'base_tilt_deg', 'roll_deg', 'peak_rcs_dbsm', 'loss_db', 'predicted_rcs_dbsm',
] as const;

export const command: Command = {
  name: 'plan',
  summary: 'aim and predicted RCS for every site in a CSV and every geometry (CSV out, or JSON)',
  usage:
    '--sites FILE.csv --geometry INC,HEADING,LOOK [--geometry ...] --shape S --edge M --wavelength M [--one-reflector] [--out FILE] [--json]\n' +
    'Sites CSV header: code,latitude,longitude,height_m. Azimuths are true, clockwise from north, toward the satellite.\n' +
    '--one-reflector aims one reflector per site at the best compromise for all geometries; otherwise each geometry gets its own aim.',
  switches: ['one-reflector'],
  async run(args, out) {
    const json = args.flag('json');
    const oneReflector = args.flag('one-reflector');
    const sitesPath = args.string('sites');
    const geometries = readGeometries(args);
    const shape = readShape(args);
    const edgeM = requirePositive('edge', args.number('edge'), 'm');
    const wavelengthM = readWavelengthM(args);
    const outPath = args.optString('out');
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
    const doc = json
      ? JSON.stringify(rows.map((r) => ({ ...r, lossDb: jsonNumber(r.lossDb), predictedRcsDbsm: jsonNumber(r.predictedRcsDbsm) })), null, 2) + '\n'
      : formatCsv([COLUMNS as unknown as string[], ...rows.map((r) => [
          r.siteCode, r.latDeg, r.lonDeg, r.heightM, r.incidenceDeg, r.headingDeg, r.look,
          r.reflectorAzimuthDeg.toFixed(3), r.boresightElevationDeg.toFixed(3), r.baseTiltDeg.toFixed(3), r.rollDeg.toFixed(3),
          peakDbsmText(r.peakRcsDbsm), Number.isFinite(r.lossDb) ? r.lossDb.toFixed(3) : '', Number.isFinite(r.predictedRcsDbsm) ? r.predictedRcsDbsm.toFixed(2) : '',
        ])]);
    if (outPath) {
      try {
        writeFileSync(outPath, doc);
      } catch (e) {
        throw new UsageError(`cannot write --out ${outPath}: ${(e as NodeJS.ErrnoException).code ?? 'error'}`);
      }
      out.stderr(`wrote ${rows.length} rows to ${outPath}\n`);
    } else out.stdout(doc);
    return 0;
  },
};

const peakDbsmText = (x: number) => x.toFixed(2);
