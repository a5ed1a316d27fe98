import { edgeForScrM, resolutionCellAreaM2 } from '../../core/radar/clutter.ts';
import { peakRcsM2 } from '../../core/reflector/trihedral.ts';
import { toDb } from '../../core/units.ts';
import { requireFinite, requirePositive } from '../../core/validate.ts';
import { UsageError, type Args } from '../args.ts';
import type { Command } from '../command.ts';
import { readShape, readWavelengthM } from '../common.ts';
import { fmt, keyValueTable } from '../output.ts';

export const command: Command = {
  name: 'size',
  summary: 'inner edge length needed for a target signal-to-clutter ratio',
  usage: '--wavelength M --shape S --clutter-db DB --scr-db DB (--cell-area M2 | --range-resolution M --azimuth-resolution M --incidence DEG) [--json]',
  run(args, out) {
    const json = args.flag('json');
    const wavelengthM = readWavelengthM(args);
    const shape = readShape(args);
    const clutterDb = requireFinite('clutter-db', args.number('clutter-db'));
    const targetScrDb = requireFinite('scr-db', args.number('scr-db'));
    const cellAreaM2 = readCellAreaM2(args);
    args.assertNoUnknown();

    const edgeM = edgeForScrM(shape, wavelengthM, targetScrDb, clutterDb, cellAreaM2);
    const peakRcsDbsm = toDb(peakRcsM2({ shape, edgeM, wavelengthM }));
    const result = { edgeM, peakRcsDbsm, cellAreaM2, shape, wavelengthM, clutterDb, scrDb: targetScrDb };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          [`inner edge (${shape})`, `${fmt(edgeM, 3)} m`],
          ['peak RCS', `${fmt(peakRcsDbsm, 2)} dBsm`],
          ['resolution cell', `${fmt(cellAreaM2, 1)} m²`],
          ['note', 'SCR-based precision is a lower bound; atmosphere, orbit and monument motion add to it'],
        ]),
      );
    return 0;
  },
};

/** Either --cell-area, or all of --range-resolution (slant), --azimuth-resolution, --incidence. */
function readCellAreaM2(args: Args): number {
  const area = args.optNumber('cell-area');
  const parts = ['range-resolution', 'azimuth-resolution', 'incidence'];
  const given = parts.filter((p) => args.has(p));
  if (area !== undefined) {
    if (given.length) throw new UsageError('give either --cell-area or the three resolution options, not both');
    return requirePositive('cell-area', area, 'm²');
  }
  if (given.length !== 3) {
    throw new UsageError('give --cell-area M2, or all of --range-resolution M --azimuth-resolution M --incidence DEG');
  }
  return resolutionCellAreaM2(args.number('range-resolution'), args.number('azimuth-resolution'), args.number('incidence'));
}
