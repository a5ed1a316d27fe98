import { losPrecisionMm, phaseStdRad, scrDb } from '../../core/radar/clutter.ts';
import type { Command } from '../command.ts';
import { readWavelengthM } from '../common.ts';
import { fmt, keyValueTable } from '../output.ts';

export const command: Command = {
  name: 'precision',
  summary: 'signal-to-clutter ratio, phase noise and line-of-sight precision of a reflector',
  usage: '--rcs-dbsm DB --clutter-db DB --cell-area M2 --wavelength M [--json]',
  run(args, out) {
    const json = args.flag('json');
    const rcsDbsm = args.number('rcs-dbsm');
    const clutterDb = args.number('clutter-db');
    const cellAreaM2 = args.number('cell-area');
    const wavelengthM = readWavelengthM(args);
    args.assertNoUnknown();

    const scr = scrDb(rcsDbsm, clutterDb, cellAreaM2);
    const phase = phaseStdRad(scr);
    const result = {
      scrDb: scr,
      phaseStdRad: phase,
      losStdMm: losPrecisionMm(phase, wavelengthM),
      /** Std of the difference of two images' LOS measurements: √2 × losStdMm (independent, equal noise). */
      losStdDiffMm: Math.SQRT2 * losPrecisionMm(phase, wavelengthM),
      losStdOf: 'one image (losStdMm); the difference of two images, as in a displacement between two dates (losStdDiffMm = √2 × losStdMm)',
      note: 'lower bound from clutter alone; atmosphere, orbit errors and monument motion add to it',
      ...(scr < 10 ? { warning: 'SCR below 10 dB: the 1/sqrt(2 SCR) phase approximation is optimistic here' } : {}),
    };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          ['signal-to-clutter ratio', `${fmt(result.scrDb, 2)} dB`],
          ['phase std', `${fmt(result.phaseStdRad, 4)} rad`],
          ['LOS precision, one image', `${fmt(result.losStdMm, 3)} mm (lower bound)`],
          ['LOS precision, difference of two images', `${fmt(result.losStdDiffMm, 3)} mm (√2 larger; a displacement between two dates)`],
          ...(result.warning ? [['warning', result.warning] as [string, string]] : []),
        ]),
      );
    return 0;
  },
};
