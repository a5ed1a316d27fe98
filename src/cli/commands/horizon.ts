import { horizonFromGrid } from '../../core/horizon/rayMarch.ts';
import { requireInRange, requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import type { Command } from '../command.ts';
import { readElevationGrid } from '../dem.ts';
import { fmt, table } from '../output.ts';

export const command: Command = {
  name: 'horizon',
  summary: 'horizon elevation per azimuth from a GeoTIFF elevation model (ray march with Earth curvature)',
  usage: '--dem FILE.tif --lat DEG --lon DEG --height M [--azimuth-from DEG --azimuth-to DEG --step DEG] [--max-distance M] [--json]',
  async run(args, out) {
    const json = args.flag('json');
    const dem = args.string('dem');
    const latDeg = requireLatDeg('--lat', args.number('lat'));
    const lonDeg = requireLonDeg('--lon', args.number('lon'));
    const heightM = requireInRange('--height', args.number('height'), { min: -500, max: 9000, unit: 'm' });
    const azimuthFromDeg = requireInRange('--azimuth-from', args.optNumber('azimuth-from') ?? 0, { min: 0, max: 360, unit: '°' });
    const azimuthToDeg = requireInRange('--azimuth-to', args.optNumber('azimuth-to') ?? 360, { min: 0, max: 360, unit: '°' });
    const azimuthStepDeg = requireInRange('--step', args.optNumber('step') ?? 1, { min: 0.1, max: 90, unit: '°' });
    const maxDistanceM = requireInRange('--max-distance', args.optNumber('max-distance') ?? 50_000, { min: 10, max: 200_000, unit: 'm' });
    args.assertNoUnknown();
    const grid = await readElevationGrid(dem);
    const profile = horizonFromGrid(grid, { latDeg, lonDeg, heightM, azimuthFromDeg, azimuthToDeg, azimuthStepDeg, maxDistanceM });
    if (json) {
      out.stdout(JSON.stringify({ profile, refraction: 'ignored', curvature: 'd²/2R, R = 6371008.8 m' }, null, 2) + '\n');
      return 0;
    }
    out.stdout(
      table(
        ['azimuth °', 'elevation °', 'distance m'],
        profile.map((p) => [fmt(p.azimuthDeg, 1), p.elevationDeg === null ? 'no data' : fmt(p.elevationDeg, 2), p.distanceM === null ? '' : fmt(p.distanceM, 0)]),
      ) + 'Earth curvature included (drop d²/2R); atmospheric refraction ignored.\n',
    );
    return 0;
  },
};
