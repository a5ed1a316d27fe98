/** Element sets for data-layer tests: the invented GLINT-A/B demo satellites (src/demo/elements.ts), re-dated. */
import { parseTle, tleChecksum, type TleSet } from '../../src/core/orbit/tle.ts';
import { DEMO_TLE, DEMO_TLE_B } from '../../src/demo/elements.ts';

export const GLINT_A: TleSet = parseTle(DEMO_TLE).sets[0];
export const GLINT_B: TleSet = parseTle(DEMO_TLE_B).sets[0];

/**
 * The same set with another epoch (line 1 columns 19–32, "YYDDD.DDDDDDDD") and a recomputed checksum
 * (column 69), parsed back so epochMs matches the line.
 */
export function redated(set: TleSet, epochField: string): TleSet {
  if (epochField.length !== 14) throw new RangeError(`epochField must have 14 characters, got ${JSON.stringify(epochField)}`);
  const body = set.line1.slice(0, 18) + epochField + set.line1.slice(32, 68);
  const line1 = body + String(tleChecksum(body + '0'));
  const parsed = parseTle(`${set.name}\n${line1}\n${set.line2}`);
  if (parsed.errors.length) throw new Error(`redated set does not parse: ${parsed.errors[0].message}`);
  return parsed.sets[0];
}
