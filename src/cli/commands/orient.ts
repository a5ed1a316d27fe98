import { magneticToTrueAzimuthDeg, plateOrientationFromDeviceAngles, DEFAULT_MAX_TILT_DEG } from '../../core/alignment/deviceOrientation.ts';
import { requireInRange } from '../../core/validate.ts';
import type { Command } from '../command.ts';
import { fmt, keyValueTable } from '../output.ts';

export const command: Command = {
  name: 'orient',
  summary: 'reflector azimuth, tilt and roll from the W3C angles of a phone lying on the base plate (top toward the open side)',
  usage: '--alpha DEG --beta DEG --gamma DEG [--declination DEG] [--max-tilt DEG] [--json]  (alpha from an absolute source: 0 = top toward magnetic north)',
  run(args, out) {
    const json = args.flag('json');
    // W3C ranges: alpha [0, 360), beta [−180, 180), gamma [−90, 90); the closed ends are accepted too.
    const alphaDeg = requireInRange('--alpha', args.number('alpha'), { min: 0, max: 360, unit: '°' });
    const betaDeg = requireInRange('--beta', args.number('beta'), { min: -180, max: 180, unit: '°' });
    const gammaDeg = requireInRange('--gamma', args.number('gamma'), { min: -90, max: 90, unit: '°' });
    const declinationDeg = args.optNumber('declination');
    if (declinationDeg !== undefined) requireInRange('--declination', declinationDeg, { min: -180, max: 180, unit: '°' });
    const maxTiltDeg = requireInRange('--max-tilt', args.optNumber('max-tilt') ?? DEFAULT_MAX_TILT_DEG, {
      min: 0,
      max: 90,
      minInclusive: false,
      maxInclusive: false,
      unit: '°',
    });
    args.assertNoUnknown();

    const r = plateOrientationFromDeviceAngles({ alphaDeg, betaDeg, gammaDeg }, { maxTiltDeg });
    if (!r.ok) {
      out.stderr(`glintmark orient: ${r.error.message}\n`);
      return 2;
    }
    const o = r.value;
    const azimuthReference: 'magnetic' | 'true' = declinationDeg === undefined ? 'magnetic' : 'true';
    const reflectorAzimuthDeg = declinationDeg === undefined ? o.azimuthDeg : magneticToTrueAzimuthDeg(o.azimuthDeg, declinationDeg);
    // The contract's reflectorAzimuthDeg is magnetic until --declination is given; the magnetic value is always
    // also given under a name that says so.
    const result = { reflectorAzimuthDeg, tiltDeg: o.tiltDeg, rollDeg: o.rollDeg, azimuthReference, reflectorAzimuthMagDeg: o.azimuthDeg };
    if (declinationDeg === undefined) out.stderr('note: no --declination given, so reflectorAzimuthDeg is MAGNETIC (glintmark declination gives it)\n');
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          [
            'reflector azimuth',
            `${fmt(reflectorAzimuthDeg, 2)}° ${azimuthReference}` + (declinationDeg === undefined ? ' (give --declination for true)' : ''),
          ],
          ['tilt', `${fmt(o.tiltDeg, 2)}° (open side ${o.tiltDeg >= 0 ? 'raised' : 'lowered'})`],
          ['roll', `${fmt(o.rollDeg, 2)}° (right-hand side ${o.rollDeg >= 0 ? 'raised' : 'lowered'})`],
        ]),
      );
    return 0;
  },
};
