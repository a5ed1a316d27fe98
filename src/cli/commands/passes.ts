/**
 * `glintmark passes`: zero-Doppler overpasses of a site from a TLE file, one row per pass or per track.
 * All numbers come from src/core/orbit; this file reads options, the TLE file, and prints.
 */
import { LOOK_SIDES } from '../../core/geometry/pointing.ts';
import { findPasses, DEFAULT_INCIDENCE_MAX_DEG, DEFAULT_INCIDENCE_MIN_DEG, type Pass } from '../../core/orbit/passes.ts';
import { parseIsoUtcMs } from '../../core/time.ts';
import { formatTleError, parseTle } from '../../core/orbit/tle.ts';
import { groupTracks, type Track } from '../../core/orbit/tracks.ts';
import { requireIncidenceDeg, requireInRange, requireLatDeg, requireLonDeg, requireOneOf } from '../../core/validate.ts';
import { UsageError, type Args } from '../args.ts';
import type { Command } from '../command.ts';
import { readInputText } from '../input.ts';
import { fmt, table, type Out } from '../output.ts';

const USAGE =
  '--tle FILE --lat DEG --lon DEG [--height M] --start ISO --days N ' +
  '[--incidence-min DEG] [--incidence-max DEG] [--look right|left] [--tracks] [--json]\n' +
  `  --height     site height above the WGS84 ellipsoid, m (default 0)\n` +
  `  --start      ISO 8601 date or date-time with zone, e.g. 2026-12-01 or 2026-12-01T06:00Z\n` +
  `  --days       window length, (0, 366]\n` +
  `  --incidence-min/--incidence-max  incidence range used by the radar, degrees (default ${DEFAULT_INCIDENCE_MIN_DEG}–${DEFAULT_INCIDENCE_MAX_DEG})\n` +
  `  --look       radar look side (default right)\n` +
  `  --tracks     group passes with the same geometry into tracks`;

const passRow = (p: Pass): string[] => [
  p.timeUtc.replace(/\.\d+Z$/, 'Z'),
  p.satellite,
  p.direction === 'ascending' ? 'asc' : 'desc',
  fmt(p.incidenceDeg, 2),
  fmt(p.headingDeg, 2),
  fmt(p.reflectorAzimuthDeg, 2),
  fmt(p.baseTiltDeg, 2),
  fmt(p.slantRangeKm, 1),
];

const trackRow = (t: Track): string[] => [
  t.id,
  t.direction === 'ascending' ? 'asc' : 'desc',
  fmt(t.incidenceDeg, 2),
  fmt(t.headingDeg, 2),
  fmt(t.reflectorAzimuthDeg, 2),
  fmt(t.baseTiltDeg, 2),
  String(t.passTimesUtc.length),
  t.repeatDays === null ? '' : fmt(t.repeatDays, 2),
  t.nextTimeUtc.replace(/\.\d+Z$/, 'Z'),
];

async function run(args: Args, out: Out): Promise<number> {
  const tlePath = args.string('tle');
  const latDeg = requireLatDeg('--lat', args.number('lat'));
  const lonDeg = requireLonDeg('--lon', args.number('lon'));
  const heightM = requireInRange('--height', args.optNumber('height') ?? 0, { min: -1000, max: 10_000, unit: 'm' });
  const startText = args.string('start');
  const days = requireInRange('--days', args.number('days'), { min: 0, max: 366, minInclusive: false, unit: 'days' });
  const incidenceMinDeg = requireIncidenceDeg('--incidence-min', args.optNumber('incidence-min') ?? DEFAULT_INCIDENCE_MIN_DEG);
  const incidenceMaxDeg = requireIncidenceDeg('--incidence-max', args.optNumber('incidence-max') ?? DEFAULT_INCIDENCE_MAX_DEG);
  const look = requireOneOf('--look', args.optString('look') ?? 'right', LOOK_SIDES);
  const json = args.flag('json');
  const tracks = args.flag('tracks');
  args.assertNoUnknown();
  if (!(incidenceMinDeg < incidenceMaxDeg)) {
    throw new UsageError(`--incidence-min (${incidenceMinDeg}) must be less than --incidence-max (${incidenceMaxDeg})`);
  }
  const startMs = parseIsoUtcMs(startText, '--start');

  const parsed = parseTle(await readInputText('--tle', tlePath, out));
  if (parsed.sets.length === 0) {
    const first = parsed.errors[0];
    const more = parsed.errors.length > 1 ? ` (and ${parsed.errors.length - 1} more problem${parsed.errors.length > 2 ? 's' : ''})` : '';
    throw new UsageError(
      first ? `no usable element set in ${tlePath}: ${formatTleError(first)}${more}` : `no element set found in ${tlePath}: the file is empty`,
    );
  }
  for (const e of parsed.errors) out.stderr(`warning: ${tlePath} ${formatTleError(e)}; that part was skipped\n`);

  const passes: Pass[] = [];
  for (const set of parsed.sets) {
    const r = findPasses(set, { latDeg, lonDeg, heightM }, { startMs, days }, { incidenceMinDeg, incidenceMaxDeg, look });
    passes.push(...r.passes);
    for (const w of r.warnings) out.stderr(`warning: ${w}\n`);
  }
  passes.sort((a, b) => a.timeMs - b.timeMs);

  if (tracks) {
    const ts = groupTracks(passes);
    if (json) out.stdout(JSON.stringify(ts, null, 2) + '\n');
    else if (!ts.length) out.stdout('no passes in the window with the site inside the incidence range\n');
    else out.stdout(table(['track', 'dir', 'incidence°', 'heading°', 'reflector az°', 'base tilt°', 'passes', 'repeat d', 'next (UTC)'], ts.map(trackRow)));
    return 0;
  }
  if (json) out.stdout(JSON.stringify(passes, null, 2) + '\n');
  else if (!passes.length) out.stdout('no passes in the window with the site inside the incidence range\n');
  else out.stdout(table(['time (UTC)', 'satellite', 'dir', 'incidence°', 'heading°', 'reflector az°', 'base tilt°', 'slant km'], passes.map(passRow)));
  return 0;
}

export const command: Command = {
  name: 'passes',
  summary: 'zero-Doppler passes of a site from orbital elements (TLE): time, incidence, heading, reflector aim',
  usage: USAGE,
  switches: ['tracks'],
  run,
};
