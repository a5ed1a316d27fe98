import { validateOrientation } from '../../core/geometry/orientation.ts';
import { reduceToApex, type ApexOffset } from '../../core/survey/apex.ts';
import { requireInRange, requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import { UsageError, parseNumber, type Args } from '../args.ts';
import type { Command } from '../command.ts';
import { parseTriple } from '../common.ts';
import { fmt, keyValueTable } from '../output.ts';

function readOffset(args: Args): ApexOffset {
  const enu = args.optString('offset-enu');
  const body = args.optString('offset-body');
  const angles = ['azimuth', 'tilt', 'roll'].filter((n) => args.has(n));
  if (enu !== undefined && body !== undefined) throw new UsageError('give either --offset-enu E,N,U or --offset-body X,Y,Z, not both');
  if (enu !== undefined) {
    if (angles.length) throw new UsageError(`--${angles[0]} belongs to --offset-body; --offset-enu is already in east, north, up`);
    return { kind: 'enu', enuM: parseTriple('--offset-enu', enu, '0,0,0.85 (east, north, up in m)') };
  }
  if (body === undefined) throw new UsageError('missing offset: give --offset-enu E,N,U or --offset-body X,Y,Z with --azimuth, --tilt and --roll');
  const bodyM = parseTriple('--offset-body', body, '0,0.12,0.85 (right, forward, up in m)');
  const o = { azimuthDeg: args.number('azimuth'), tiltDeg: args.number('tilt'), rollDeg: args.number('roll') };
  requireInRange('--azimuth', o.azimuthDeg, { min: 0, max: 360, maxInclusive: false, unit: '°' });
  requireInRange('--tilt', o.tiltDeg, { min: -90, max: 90, unit: '°' });
  requireInRange('--roll', o.rollDeg, { min: -180, max: 180, unit: '°' });
  return { kind: 'body', bodyM, orientation: validateOrientation(o) };
}

export const command: Command = {
  name: 'apex',
  summary: 'apex (phase centre) coordinates from a surveyed mark and the mount offsets, step by step',
  usage: '--mark LAT,LON,H (--offset-enu E,N,U | --offset-body X,Y,Z --azimuth DEG --tilt DEG --roll DEG) [--json]',
  run(args, out) {
    const json = args.flag('json');
    const m = args.string('mark').split(',');
    if (m.length !== 3) throw new UsageError(`--mark must be LAT,LON,H (degrees, degrees, ellipsoidal metres), e.g. 52.61,0.27,31.4; got "${args.string('mark')}"`);
    const mark = {
      latDeg: requireLatDeg('--mark latitude', parseNumber('--mark latitude', m[0])),
      lonDeg: requireLonDeg('--mark longitude', parseNumber('--mark longitude', m[1])),
      heightM: requireInRange('--mark height', parseNumber('--mark height', m[2]), { min: -1000, max: 10_000, unit: 'm' }),
    };
    const offset = readOffset(args);
    args.assertNoUnknown();
    const r = reduceToApex(mark, offset);
    if (json) {
      out.stdout(JSON.stringify(r, null, 2) + '\n');
      return 0;
    }
    const v = (x: readonly number[], d = 4) => x.map((c) => fmt(c, d)).join(', ');
    const rows: [string, string][] = [
      ['1 mark', `${fmt(mark.latDeg, 9)}°, ${fmt(mark.lonDeg, 9)}°, ${fmt(mark.heightM, 4)} m (WGS84 ellipsoidal)`],
      ['  mark ECEF', `${v(r.steps.markXyzM)} m`],
    ];
    if (r.steps.offsetBodyM && offset.kind === 'body') {
      const o = offset.orientation;
      rows.push(['2 body offset', `${v(r.steps.offsetBodyM)} m (right, forward, up) at azimuth ${fmt(o.azimuthDeg, 2)}°, tilt ${fmt(o.tiltDeg, 2)}°, roll ${fmt(o.rollDeg, 2)}°`]);
    }
    rows.push(['3 offset ENU', `${v(r.steps.offsetEnuM)} m (east, north, up)`]);
    rows.push(['  offset ECEF', `${v(r.steps.offsetEcefM)} m`]);
    rows.push(['4 apex ECEF', `${v(r.apexXyzM)} m`]);
    rows.push(['  apex', `${fmt(r.apexLatDeg, 9)}°, ${fmt(r.apexLonDeg, 9)}°, ${fmt(r.apexHeightEllM, 4)} m (WGS84 ellipsoidal)`]);
    out.stdout(keyValueTable(rows));
    return 0;
  },
};
