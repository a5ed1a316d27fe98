import { sunPosition } from '../../core/sun/sunPosition.ts';
import { requireInRange, requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import type { Command } from '../command.ts';
import { fmt, keyValueTable } from '../output.ts';
import { parseIsoUtcMs } from '../../core/time.ts';

export const command: Command = {
  name: 'sun',
  summary: 'sun azimuth (true) and apparent elevation at a site and time, for the shadow method',
  usage: '--lat DEG --lon DEG --time ISO [--height M] [--json]  (time with a zone, e.g. 2027-07-02T12:00:00Z)',
  run(args, out) {
    const json = args.flag('json');
    const latDeg = requireLatDeg('--lat', args.number('lat'));
    const lonDeg = requireLonDeg('--lon', args.number('lon'));
    const heightM = requireInRange('--height', args.optNumber('height') ?? 0, { min: -500, max: 100_000, unit: 'm' });
    const timeMs = parseIsoUtcMs(args.string('time'), '--time', { requireTime: true });
    args.assertNoUnknown();

    const p = sunPosition({ latDeg, lonDeg, heightM, timeMs });
    const result = { azimuthDeg: p.azimuthDeg, elevationDeg: p.elevationDeg };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          ['sun azimuth', `${fmt(p.azimuthDeg, 2)}° true`],
          ['shadow azimuth', `${fmt((p.azimuthDeg + 180) % 360, 2)}° true`],
          ['elevation', `${fmt(p.elevationDeg, 2)}° (apparent, standard refraction)${p.elevationDeg < 0 ? ' — below the horizon' : ''}`],
        ]),
      );
    return 0;
  },
};
