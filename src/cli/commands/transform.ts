import { ecefToGrs80, grs80ToEcefM } from '../../core/frames/ellipsoid.ts';
import { parseItrfFrame } from '../../core/frames/itrf.ts';
import { requireEpochYear, transformFrameAndEpoch, type EpochMotion } from '../../core/frames/transform.ts';
import { requireFinite, requireInRange, requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import type { Vec3 } from '../../core/vec3.ts';
import { UsageError, type Args } from '../args.ts';
import type { Command } from '../command.ts';
import { parseTriple } from '../common.ts';
import { fmt, keyValueTable } from '../output.ts';

function readPosition(args: Args): Vec3 {
  const hasXyz = args.has('xyz');
  const geo = ['lat', 'lon', 'height'].filter((n) => args.has(n));
  if (hasXyz && geo.length) throw new UsageError('give either --xyz X,Y,Z or --lat/--lon/--height, not both');
  if (hasXyz) {
    const x = parseTriple('--xyz', args.string('xyz'), '4027894.0,307046.0,4919475.0');
    x.forEach((v, i) => requireFinite(`--xyz [${i + 1}]`, v));
    const r = Math.hypot(...x);
    if (r < 6_300_000 || r > 6_400_000) throw new RangeError(`--xyz must be an Earth-centred position in metres (6 300 to 6 400 km from the centre), got ${(r / 1000).toFixed(1)} km`);
    return x;
  }
  if (!geo.length) throw new UsageError('missing position: give --xyz X,Y,Z (metres) or --lat DEG --lon DEG --height M');
  const latDeg = requireLatDeg('--lat', args.number('lat'));
  const lonDeg = requireLonDeg('--lon', args.number('lon'));
  const heightEllM = requireInRange('--height', args.number('height'), { min: -1000, max: 10_000, unit: 'm' });
  return grs80ToEcefM({ latDeg, lonDeg, heightEllM });
}

function readMotion(args: Args): EpochMotion | undefined {
  if (args.has('velocity') && args.has('plate')) throw new UsageError('give only one of --velocity VE,VN,VU and --plate NAME');
  const v = args.optString('velocity');
  if (v !== undefined) {
    const enu = parseTriple('--velocity', v, '0.012,0.015,-0.001 (east, north, up in m/yr)');
    enu.forEach((x, i) => requireInRange(`--velocity [${i + 1}]`, x, { min: -1, max: 1, unit: 'm/yr' }));
    return { kind: 'velocity', enuMPerYr: enu };
  }
  const p = args.optString('plate');
  return p === undefined ? undefined : { kind: 'plate', plate: p };
}

export const command: Command = {
  name: 'transform',
  summary: 'ITRF2000/2005/2008/2014/2020 14-parameter Helmert transformation, and epoch change by site velocity or plate model',
  usage:
    '--from FRAME --to FRAME --epoch YEAR [--to-epoch YEAR] [--velocity VE,VN,VU | --plate NAME] (--xyz X,Y,Z | --lat DEG --lon DEG --height M) [--json]',
  run(args, out) {
    const json = args.flag('json');
    const from = parseItrfFrame('--from', args.string('from'));
    const to = parseItrfFrame('--to', args.string('to'));
    const epochYear = requireEpochYear('--epoch', args.number('epoch'));
    const toEpoch = args.optNumber('to-epoch');
    const toEpochYear = toEpoch === undefined ? undefined : requireEpochYear('--to-epoch', toEpoch);
    const motion = readMotion(args);
    const xyzM = readPosition(args);
    args.assertNoUnknown();
    if (toEpochYear !== undefined && !motion) throw new UsageError('--to-epoch needs --velocity VE,VN,VU (m/yr) or --plate NAME to move the position');
    if (toEpochYear === undefined && motion) throw new UsageError(`--${motion.kind} moves the position to another epoch: give --to-epoch YEAR too`);
    if (motion?.kind === 'plate' && from !== 'ITRF2014' && from !== 'ITRF2020')
      throw new UsageError(`--plate uses the plate-motion model of the --from realisation, and only ITRF2014 and ITRF2020 have one (got --from ${from}); give --velocity instead`);

    const r = transformFrameAndEpoch({ xyzM, from, to, epochYear, toEpochYear, motion });
    const input = ecefToGrs80(xyzM);
    const result = {
      xM: r.xM,
      yM: r.yM,
      zM: r.zM,
      latDeg: r.latDeg,
      lonDeg: r.lonDeg,
      heightEllM: r.heightEllM,
      frame: r.frame,
      epoch: r.epoch,
      ellipsoid: 'GRS80',
      steps: {
        input: { frame: from, epoch: epochYear, xM: xyzM[0], yM: xyzM[1], zM: xyzM[2], latDeg: input.latDeg, lonDeg: input.lonDeg, heightEllM: input.heightEllM },
        ...(r.velocityEcefMPerYr
          ? { epochChange: { toEpoch: r.epoch, velocityEcefMPerYr: r.velocityEcefMPerYr, shiftM: r.epochShiftM, ...(r.plateModel ? { plateModel: r.plateModel } : {}) } }
          : {}),
        helmert: r.legs.map((l) => ({ from: l.from, to: l.to, table: l.table, inverted: l.inverted, atEpoch: r.epoch })),
      },
    };
    if (json) {
      out.stdout(JSON.stringify(result, null, 2) + '\n');
      return 0;
    }
    const rows: [string, string][] = [['input', `${from} at ${epochYear}: X ${fmt(xyzM[0], 4)}  Y ${fmt(xyzM[1], 4)}  Z ${fmt(xyzM[2], 4)} m`]];
    if (r.velocityEcefMPerYr && r.epochShiftM) {
      const s = r.epochShiftM;
      rows.push([
        'epoch change',
        `${epochYear} → ${r.epoch} ${r.plateModel ? `with ${r.plateModel} plate ${motion?.kind === 'plate' ? motion.plate.toUpperCase() : ''}` : 'with the site velocity'}: ΔX ${fmt(s[0], 4)}  ΔY ${fmt(s[1], 4)}  ΔZ ${fmt(s[2], 4)} m`,
      ]);
    }
    for (const l of r.legs) rows.push(['helmert', `${l.from} → ${l.to} (${l.table}${l.inverted ? ', inverted' : ''}) at epoch ${r.epoch}`]);
    if (!r.legs.length) rows.push(['helmert', 'none (same realisation)']);
    rows.push(['result', `${r.frame} at ${r.epoch}: X ${fmt(r.xM, 4)}  Y ${fmt(r.yM, 4)}  Z ${fmt(r.zM, 4)} m`]);
    rows.push(['geodetic (GRS80)', `${fmt(r.latDeg, 9)}°  ${fmt(r.lonDeg, 9)}°  ${fmt(r.heightEllM, 4)} m`]);
    out.stdout(keyValueTable(rows));
    return 0;
  },
};
