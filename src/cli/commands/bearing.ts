import { geodesicInverse } from '../../core/geodesy/bearing.ts';
import { requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import type { Args } from '../args.ts';
import type { Command } from '../command.ts';
import { parseLatLon } from '../common.ts';
import { fmt, keyValueTable } from '../output.ts';

function readPoint(args: Args, name: string): { latDeg: number; lonDeg: number } {
  const p = parseLatLon(`--${name}`, args.string(name));
  requireLatDeg(`--${name} latitude`, p.latDeg);
  requireLonDeg(`--${name} longitude`, p.lonDeg);
  return p;
}

export const command: Command = {
  name: 'bearing',
  summary: 'true azimuth and distance from one point to another on the WGS84 ellipsoid (reference line set-out)',
  usage: '--from LAT,LON --to LAT,LON [--json]',
  run(args, out) {
    const json = args.flag('json');
    const from = readPoint(args, 'from');
    const to = readPoint(args, 'to');
    args.assertNoUnknown();

    const g = geodesicInverse(from, to);
    const result = { azimuthDeg: g.azimuthDeg, distanceM: g.distanceM };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          ['azimuth', `${fmt(g.azimuthDeg, 4)}° true (from --from toward --to)`],
          ['back azimuth', `${fmt(g.backAzimuthDeg, 4)}° true (from --to toward --from)`],
          ['distance', `${fmt(g.distanceM, 3)} m`],
        ]),
      );
    return 0;
  },
};
