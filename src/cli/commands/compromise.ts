import { compromiseOrientation } from '../../core/reflector/compromise.ts';
import { peakRcsM2 } from '../../core/reflector/trihedral.ts';
import { toDb } from '../../core/units.ts';
import type { Command } from '../command.ts';
import { jsonNumber, readGeometries } from '../common.ts';
import { fmt, keyValueTable, table } from '../output.ts';
import { readReflector, reflectorWarnings } from './rcs.ts';

export const command: Command = {
  name: 'compromise',
  summary: 'one orientation that maximises the worst-case RCS over several pass geometries (or advice to use two reflectors)',
  usage:
    '[--shape triangular|square] --edge M (--wavelength M | --frequency GHZ | --band NAME) ' +
    '--geometry INC,HEADING,LOOK [--geometry ...] [--max-loss DB] [--json]',
  run(args, out) {
    const json = args.flag('json');
    const r = readReflector(args, 'triangular');
    const geometries = readGeometries(args);
    const maxAcceptableLossDb = args.optNumber('max-loss');
    args.assertNoUnknown();

    const c = compromiseOrientation(r, geometries, { maxAcceptableLossDb });
    const peakDbsm = toDb(peakRcsM2(r));
    const perGeometry = c.perGeometry.map((p) => ({
      incidenceDeg: p.geometry.incidenceDeg,
      headingDeg: p.geometry.headingDeg,
      look: p.geometry.look,
      lossDb: jsonNumber(p.lossDb),
      offBoresightDeg: p.offBoresightDeg,
      rcsDbsm: jsonNumber(peakDbsm - p.lossDb),
      outsideCorner: p.lossDb === Infinity,
    }));
    const warnings = reflectorWarnings(r);
    const result = {
      reflectorAzimuthDeg: c.orientation.azimuthDeg,
      baseTiltDeg: c.orientation.tiltDeg,
      rollDeg: c.orientation.rollDeg,
      worstLossDb: jsonNumber(c.worstLossDb),
      worstRcsDbsm: jsonNumber(peakDbsm - c.worstLossDb),
      perGeometry,
      separateRecommended: c.separateRecommended,
      message: c.message,
      ...r,
      warnings,
    };
    if (json) {
      out.stdout(JSON.stringify(result, null, 2) + '\n');
      return 0;
    }
    const loss = (x: number | null) => (x === null ? 'outside' : fmt(x, 2));
    out.stdout(
      keyValueTable([
        ['reflector azimuth (true)', `${fmt(result.reflectorAzimuthDeg, 2)}°`],
        ['base tilt (open side up +)', `${fmt(result.baseTiltDeg, 2)}°`],
        ['roll (right side up +)', `${fmt(result.rollDeg, 2)}°`],
        ['worst-case loss', result.worstLossDb === null ? 'outside the corner' : `${fmt(result.worstLossDb, 2)} dB`],
      ]) +
        '\n' +
        table(
          ['incidence °', 'heading °', 'look', 'off boresight °', 'loss dB', 'RCS dBsm'],
          perGeometry.map((p) => [fmt(p.incidenceDeg, 2), fmt(p.headingDeg, 2), p.look, fmt(p.offBoresightDeg, 2), loss(p.lossDb), loss(p.rcsDbsm)]),
        ) +
        '\n' +
        [c.message, ...warnings.map((w) => `warning: ${w}`)].join('\n') +
        '\n',
    );
    return 0;
  },
};
