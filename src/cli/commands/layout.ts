import { tapeLayout } from '../../core/alignment/layout.ts';
import { requireInRange, requirePositive } from '../../core/validate.ts';
import type { Command } from '../command.ts';
import { fmt, keyValueTable } from '../output.ts';

const AZ = { min: -360, max: 360, unit: '°' } as const;

export const command: Command = {
  name: 'layout',
  summary: 'tape offsets that set out a target azimuth from a reference line of known azimuth',
  usage: '--reference-azimuth DEG --target-azimuth DEG --baseline M [--json]',
  run(args, out) {
    const json = args.flag('json');
    const referenceAzimuthDeg = requireInRange('--reference-azimuth', args.number('reference-azimuth'), AZ);
    const targetAzimuthDeg = requireInRange('--target-azimuth', args.number('target-azimuth'), AZ);
    const baselineM = requirePositive('--baseline', args.number('baseline'), 'm');
    args.assertNoUnknown();

    const l = tapeLayout(referenceAzimuthDeg, targetAzimuthDeg, baselineM);
    const result = { turnDeg: l.turnDeg, alongM: l.alongM, offsetM: l.offsetM, side: l.side };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else {
      const turn = l.turnDeg === 0 ? 'none' : `${fmt(Math.abs(l.turnDeg), 2)}° ${l.turnDeg > 0 ? 'clockwise' : 'anticlockwise'}`;
      out.stdout(
        keyValueTable([
          ['turn from reference', turn],
          ['along the reference', `${fmt(Math.abs(l.alongM), 3)} m ${l.alongM < 0 ? 'behind you' : 'ahead'} (facing along it from the pivot)`],
          ['then square to it', `${fmt(l.offsetM, 3)} m to the ${l.side}`],
          ['check', `the mark is ${fmt(baselineM, 3)} m from the pivot`],
        ]),
      );
    }
    return 0;
  },
};
