import { readLook } from '../common.ts';
import { misalignment } from '../../core/reflector/misalignment.ts';
import { peakRcsM2 } from '../../core/reflector/trihedral.ts';
import { normalizeAzimuthDeg, toDb } from '../../core/units.ts';
import { requireFinite } from '../../core/validate.ts';
import type { Command } from '../command.ts';
import { fmt, keyValueTable } from '../output.ts';
import { rcsJson, rcsRows, readReflector, reflectorWarnings } from './rcs.ts';

export const command: Command = {
  name: 'misalign',
  summary: 'angle off boresight and RCS loss of an installed reflector for one pass geometry',
  usage:
    '--incidence DEG --heading DEG [--look right|left] --reflector-azimuth DEG --tilt DEG [--roll DEG] ' +
    '[--shape triangular|square] --edge M (--wavelength M | --frequency GHZ | --band NAME) [--json]',
  run(args, out) {
    const json = args.flag('json');
    const incidenceDeg = args.number('incidence');
    const headingDeg = args.number('heading');
    const look = readLook(args);
    const azimuthDeg = normalizeAzimuthDeg(requireFinite('reflector-azimuth', args.number('reflector-azimuth')));
    const tiltDeg = args.number('tilt');
    const rollDeg = args.optNumber('roll') ?? 0;
    const r = readReflector(args, 'triangular');
    args.assertNoUnknown();

    const m = misalignment(r, { azimuthDeg, tiltDeg, rollDeg }, { incidenceDeg, headingDeg, look });
    const peak = peakRcsM2(r);
    const warnings = reflectorWarnings(r);
    const result = {
      offBoresightDeg: m.offBoresightDeg,
      ...rcsJson(m),
      peakRcsM2: peak,
      peakRcsDbsm: toDb(peak),
      ...r,
      geometry: { incidenceDeg, headingDeg, look },
      orientation: { reflectorAzimuthDeg: azimuthDeg, baseTiltDeg: tiltDeg, rollDeg },
      warnings,
    };
    if (json) {
      out.stdout(JSON.stringify(result, null, 2) + '\n');
      return 0;
    }
    out.stdout(
      keyValueTable([
        ['off boresight', `${fmt(m.offBoresightDeg, 2)}°`],
        ...rcsRows(m),
        [`peak RCS (${r.shape}, edge ${fmt(r.edgeM, 3)} m)`, `${fmt(peak, 3)} m² = ${fmt(result.peakRcsDbsm, 2)} dBsm`],
        ...warnings.map((w): [string, string] => ['warning', w]),
      ]),
    );
    return 0;
  },
};
