import { readFile } from 'node:fs/promises';
import { azimuthToSatelliteDeg } from '../../core/geometry/pointing.ts';
import { horizonFromGrid } from '../../core/horizon/rayMarch.ts';
import { beamwidth3dB } from '../../core/reflector/beamwidth.ts';
import { clearanceForTracks, type HorizonPoint } from '../../core/survey/clearance.ts';
import { CsvSyntaxError, parseCsv } from '../../core/text/csv.ts';
import { requireInRange, requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import { UsageError, WorkError, parseNumber, type Args } from '../args.ts';
import type { Command } from '../command.ts';
import { readGeometries, readShape } from '../common.ts';
import { readElevationGrid } from '../dem.ts';
import { fmt, table } from '../output.ts';

/** Sightings CSV: header row with azimuthDeg and elevationDeg (true azimuth, degrees), optional label. */
async function readSightings(path: string): Promise<HorizonPoint[]> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    throw new WorkError(`cannot read --sightings ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
  }
  let rows;
  try {
    rows = parseCsv(text);
  } catch (e) {
    if (e instanceof CsvSyntaxError) throw new UsageError(`--sightings ${path} line ${e.line}: ${e.message}`);
    throw e;
  }
  const head = rows[0]?.fields.map((h) => h.trim()) ?? [];
  const az = head.indexOf('azimuthDeg'), el = head.indexOf('elevationDeg'), lab = head.indexOf('label');
  if (az < 0 || el < 0) throw new UsageError(`--sightings ${path} needs a header row with azimuthDeg and elevationDeg columns`);
  if (rows.length < 2) throw new UsageError(`--sightings ${path} holds no sightings`);
  return rows.slice(1).map((r) => ({
    azimuthDeg: requireInRange(`--sightings line ${r.line} azimuthDeg`, parseNumber(`--sightings line ${r.line} azimuthDeg`, r.fields[az] ?? ''), { min: 0, max: 360, unit: '°' }),
    elevationDeg: requireInRange(`--sightings line ${r.line} elevationDeg`, parseNumber(`--sightings line ${r.line} elevationDeg`, r.fields[el] ?? ''), { min: -90, max: 90, unit: '°' }),
    ...(lab >= 0 && r.fields[lab] ? { label: r.fields[lab] } : {}),
  }));
}

type HorizonSource = { source: string; points: HorizonPoint[] } | { source: string; dem: { path: string; latDeg: number; lonDeg: number; heightM: number } };

async function readHorizon(args: Args): Promise<HorizonSource> {
  const dem = args.optString('dem');
  const sightings = args.optString('sightings');
  if (dem !== undefined && sightings !== undefined) throw new UsageError('give either --dem FILE.tif or --sightings FILE.csv, not both');
  if (sightings !== undefined) return { points: await readSightings(sightings), source: `sightings ${sightings}` };
  if (dem === undefined) throw new UsageError('missing horizon: give --dem FILE.tif with --lat, --lon, --height, or --sightings FILE.csv');
  const latDeg = requireLatDeg('--lat', args.number('lat'));
  const lonDeg = requireLonDeg('--lon', args.number('lon'));
  const heightM = requireInRange('--height', args.number('height'), { min: -500, max: 9000, unit: 'm' });
  return { source: `dem ${dem}`, dem: { path: dem, latDeg, lonDeg, heightM } };
}

export const command: Command = {
  name: 'clearance',
  summary: 'per-track sightline verdict (clear by / blocked by N°) from a DEM horizon or a sightline sweep',
  usage: '(--dem FILE.tif --lat DEG --lon DEG --height M | --sightings FILE.csv) --geometry INC,HEADING[,LOOK]… [--shape triangular|square] [--tolerance DEG] [--json]',
  async run(args, out) {
    const json = args.flag('json');
    const h = await readHorizon(args);
    const geometries = readGeometries(args);
    const shape = readShape(args, 'triangular');
    const toleranceDeg = requireInRange('--tolerance', args.optNumber('tolerance') ?? 0, { min: 0, max: 45, unit: '°' });
    args.assertNoUnknown();
    let points: HorizonPoint[];
    if ('points' in h) points = h.points;
    else {
      const grid = await readElevationGrid(h.dem.path);
      points = horizonFromGrid(grid, { latDeg: h.dem.latDeg, lonDeg: h.dem.lonDeg, heightM: h.dem.heightM, azimuthStepDeg: 0.5 })
        .filter((p) => p.elevationDeg !== null)
        .map((p) => ({ azimuthDeg: p.azimuthDeg, elevationDeg: p.elevationDeg as number, distanceM: p.distanceM, label: `terrain at ${fmt(p.distanceM, 0)} m` }));
    }
    const halfBeamDeg = beamwidth3dB(shape).azimuthFullDeg / 2;
    const tracks = geometries.map((g, i) => ({
      name: `track ${i + 1} (${g.look}, heading ${g.headingDeg}°)`,
      incidenceDeg: g.incidenceDeg,
      azimuthToSatelliteDeg: g.losAzimuthDeg ?? azimuthToSatelliteDeg(g.headingDeg, g.look),
    }));
    const verdicts = clearanceForTracks(points, tracks, halfBeamDeg, toleranceDeg);
    if (json) {
      out.stdout(JSON.stringify({ horizonSource: h.source, shape, halfBeamwidthDeg: halfBeamDeg, toleranceDeg, tracks: verdicts }, null, 2) + '\n');
      return 0;
    }
    out.stdout(
      table(
        ['track', 'LOS elev °', 'azimuth °', 'sector ±°', 'verdict'],
        verdicts.map((v) => [v.name, fmt(v.losElevationDeg, 1), fmt(v.azimuthToSatelliteDeg, 1), fmt(v.sectorHalfWidthDeg, 1), v.text]),
      ) + `Horizon from ${h.source}; beam ±${fmt(halfBeamDeg, 1)}° (${shape} 3 dB azimuth half-width) + ${fmt(toleranceDeg, 1)}° tolerance.\n`,
    );
    return 0;
  },
};
