import { rcsInReflectorFrame, type RcsSample } from '../../core/reflector/pattern.ts';
import { checkOpticalRegion, peakRcsM2, type Reflector } from '../../core/reflector/trihedral.ts';
import { toDb } from '../../core/units.ts';
import { requireInRange, requirePositive } from '../../core/validate.ts';
import type { Args } from '../args.ts';
import type { Command } from '../command.ts';
import { jsonNumber, readShape, readWavelengthM } from '../common.ts';
import { fmt, keyValueTable } from '../output.ts';

/** --shape (required unless `fallbackShape`), --edge M and the wavelength options → a reflector. */
export function readReflector(args: Args, fallbackShape?: Reflector['shape']): Reflector {
  const shape = readShape(args, fallbackShape);
  const edgeM = requirePositive('edge', args.number('edge'), 'm');
  const wavelengthM = readWavelengthM(args);
  return { shape, edgeM, wavelengthM };
}

/** Warnings to print with a result: today only an edge below the optical region (a < 10 λ). */
export function reflectorWarnings(r: Reflector): string[] {
  const check = checkOpticalRegion(r);
  return check.ok ? [] : [check.error.message];
}

/**
 * JSON fields of an RCS sample. JSON has no ±Infinity: outside the corner rcsDbsm and lossDb are null and
 * outsideCorner is true.
 */
export function rcsJson(s: RcsSample): { rcsM2: number; rcsDbsm: number | null; lossDb: number | null; outsideCorner: boolean } {
  return { rcsM2: s.rcsM2, rcsDbsm: jsonNumber(s.rcsDbsm), lossDb: jsonNumber(s.lossDb), outsideCorner: s.rcsM2 === 0 };
}

/** Table rows for an RCS sample. */
export function rcsRows(s: RcsSample): [string, string][] {
  if (s.rcsM2 === 0) return [['RCS', '0 m² (radar outside the corner: no triple-bounce return)']];
  return [
    ['RCS', `${fmt(s.rcsM2, 3)} m² = ${fmt(s.rcsDbsm, 2)} dBsm`],
    ['loss below peak', `${fmt(s.lossDb, 2)} dB`],
  ];
}

export const command: Command = {
  name: 'rcs',
  summary: 'RCS of a trihedral toward a direction given in the reflector frame (elevation above the plate, offset from the bisector)',
  usage:
    '--shape triangular|square --edge M (--wavelength M | --frequency GHZ | --band NAME) --elevation DEG --azimuth-offset DEG [--json]',
  run(args, out) {
    const json = args.flag('json');
    const r = readReflector(args);
    const elevationDeg = requireInRange('elevation', args.number('elevation'), { min: -90, max: 90, unit: '°' });
    const azimuthOffsetDeg = requireInRange('azimuth-offset', args.number('azimuth-offset'), { min: -180, max: 180, unit: '°' });
    args.assertNoUnknown();

    const s = rcsInReflectorFrame(r, { elevationDeg, azimuthOffsetDeg });
    const peak = peakRcsM2(r);
    const warnings = reflectorWarnings(r);
    const result = { ...rcsJson(s), peakRcsM2: peak, peakRcsDbsm: toDb(peak), ...r, elevationDeg, azimuthOffsetDeg, warnings };
    if (json) {
      out.stdout(JSON.stringify(result, null, 2) + '\n');
      return 0;
    }
    const rows: [string, string][] = [
      ['direction', `${fmt(elevationDeg, 2)}° above the plate, ${fmt(azimuthOffsetDeg, 2)}° from the bisector`],
      ...rcsRows(s),
      [`peak RCS (${r.shape}, edge ${fmt(r.edgeM, 3)} m)`, `${fmt(peak, 3)} m² = ${fmt(result.peakRcsDbsm, 2)} dBsm`],
      ...warnings.map((w): [string, string] => ['warning', w]),
    ];
    out.stdout(keyValueTable(rows));
    return 0;
  },
};

