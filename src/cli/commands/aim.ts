import { aimForPass } from '../../core/geometry/pointing.ts';
import { peakRcsM2 } from '../../core/reflector/trihedral.ts';
import { toDb } from '../../core/units.ts';
import { groundBounce } from '../../core/survey/groundBounce.ts';
import { requirePositive } from '../../core/validate.ts';
import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';
import { readLook, readShape, readWavelengthM } from '../common.ts';
import { fmt, keyValueTable } from '../output.ts';

export const command: Command = {
  name: 'aim',
  summary: 'reflector azimuth, boresight elevation, base tilt and peak RCS for one pass geometry',
  usage: '--incidence DEG --heading DEG [--look right|left] [--shape triangular|square] [--edge M] [--wavelength M | --frequency GHZ | --band NAME] [--mount-height M --range-resolution M] [--json]',
  run(args, out) {
    const json = args.flag('json');
    const incidenceDeg = args.number('incidence');
    const headingDeg = args.number('heading');
    const look = readLook(args);
    const shape = readShape(args, 'triangular');
    const edgeM = requirePositive('edge', args.optNumber('edge') ?? 1, 'm');
    const wavelengthM = readWavelengthM(args, 'C');
    const mountHeightM = args.optNumber('mount-height');
    const rangeResolutionM = args.optNumber('range-resolution');
    args.assertNoUnknown();
    if ((mountHeightM === undefined) !== (rangeResolutionM === undefined)) throw new UsageError('--mount-height and --range-resolution go together (the ground-bounce check needs both)');

    const aim = aimForPass({ incidenceDeg, headingDeg, look });
    const peak = peakRcsM2({ shape, edgeM, wavelengthM });
    const result = {
      reflectorAzimuthDeg: aim.reflectorAzimuthDeg,
      boresightElevationDeg: aim.boresightElevationDeg,
      baseTiltDeg: aim.baseTiltDeg,
      wavelengthM,
      peakRcsM2: peak,
      peakRcsDbsm: toDb(peak),
      shape,
      edgeM,
      look,
      azimuthReference: 'true north, clockwise, toward the satellite',
      ...(mountHeightM !== undefined && rangeResolutionM !== undefined ? { groundBounce: groundBounce(mountHeightM, incidenceDeg, rangeResolutionM) } : {}),
    };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          ['reflector azimuth (true)', `${fmt(result.reflectorAzimuthDeg, 2)}°`],
          ['boresight elevation', `${fmt(result.boresightElevationDeg, 2)}°`],
          ['base tilt (open side up +)', `${fmt(result.baseTiltDeg, 2)}°`],
          ['wavelength', `${fmt(wavelengthM * 100, 3)} cm`],
          [`peak RCS (${shape}, edge ${fmt(edgeM, 3)} m)`, `${fmt(peak, 1)} m² = ${fmt(result.peakRcsDbsm, 2)} dBsm`],
          ...(result.groundBounce
            ? ([
                ['ground bounce extra range', `${fmt(result.groundBounce.extraRangeM, 2)} m (≈ 2·h·cos θ; clears one cell above ${fmt(result.groundBounce.heightToClearM, 2)} m)`],
                ...(result.groundBounce.warning ? [['warning', result.groundBounce.warning]] : []),
              ] as [string, string][])
            : []),
        ]),
      );
    return 0;
  },
};
