import { declination } from '../../core/magnetic/declination.ts';
import { parseIsoUtcMs } from '../../core/time.ts';
import { requireInRange, requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import type { Command } from '../command.ts';
import { fmt, keyValueTable } from '../output.ts';

export const command: Command = {
  name: 'declination',
  summary: 'magnetic declination, dip and field strength from WMM2025 (valid 2025-01-01 to 2030-01-01)',
  usage: '--lat DEG --lon DEG [--height M] --date ISO [--json]',
  run(args, out) {
    const json = args.flag('json');
    const latDeg = requireLatDeg('--lat', args.number('lat'));
    const lonDeg = requireLonDeg('--lon', args.number('lon'));
    const heightM = requireInRange('--height', args.optNumber('height') ?? 0, { min: -1000, max: 850_000, unit: 'm' });
    const timeMs = parseIsoUtcMs(args.string('date'), '--date');
    args.assertNoUnknown();

    const r = declination({ latDeg, lonDeg, heightM, timeMs });
    if (!r.ok) {
      out.stderr(`glintmark declination: ${r.error.message}\n`);
      return 2;
    }
    const f = r.value;
    const result = {
      declinationDeg: f.declinationDeg,
      inclinationDeg: f.inclinationDeg,
      totalIntensityNt: f.totalIntensityNt,
      model: f.model,
    };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          ['declination', `${fmt(Math.abs(f.declinationDeg), 2)}° ${f.declinationDeg >= 0 ? 'E' : 'W'} (true = magnetic + declination)`],
          ['inclination', `${fmt(f.inclinationDeg, 2)}° (positive down)`],
          ['total field', `${fmt(f.totalIntensityNt, 0)} nT`],
          ['model', `${f.model}, valid 2025-01-01 to 2030-01-01`],
        ]),
      );
    return 0;
  },
};
