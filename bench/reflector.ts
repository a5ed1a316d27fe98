/**
 * Reflector pattern and compromise timings (printed only; nothing asserts on time).
 * Run with `npx tsx bench/run.ts reflector`.
 */
import type { PassGeometry } from '../src/core/geometry/pointing.ts';
import { losFromAzEl } from '../src/core/geometry/pointing.ts';
import { compromiseOrientation } from '../src/core/reflector/compromise.ts';
import { rcsForOrientation } from '../src/core/reflector/pattern.ts';
import type { Reflector, TrihedralShape } from '../src/core/reflector/trihedral.ts';
import type { Vec3 } from '../src/core/vec3.ts';
import { timeMs } from './timing.ts';

const ORIENTATION = { azimuthDeg: 100, tiltDeg: 14.7356, rollDeg: 0 };
const SHAPES: readonly TrihedralShape[] = ['triangular', 'square'];
const TWO: PassGeometry[] = [
  { incidenceDeg: 36, headingDeg: 192, look: 'right' },
  { incidenceDeg: 44, headingDeg: 188, look: 'right' },
];
const FOUR: PassGeometry[] = [
  ...TWO,
  { incidenceDeg: 30, headingDeg: 185, look: 'right' },
  { incidenceDeg: 41, headingDeg: 175, look: 'right' },
];

/** LOS for a 1° grid over the upper hemisphere: elevation 0..90 × azimuth 0..359 (91 × 360 directions). */
function hemisphereGrid(): Vec3[] {
  const out: Vec3[] = [];
  for (let el = 0; el <= 90; el++) for (let az = 0; az < 360; az++) out.push(losFromAzEl(az, el));
  return out;
}

export async function bench(): Promise<void> {
  const grid = hemisphereGrid();
  for (const shape of SHAPES) {
    const r: Reflector = { shape, edgeM: 0.9, wavelengthM: 0.0555 };
    const { medianMs, result: lit } = await timeMs(() => {
      let n = 0;
      for (const los of grid) if (rcsForOrientation(r, ORIENTATION, los).rcsM2 > 0) n++;
      return n;
    });
    const perS = (grid.length / medianMs) * 1000;
    console.log(
      `pattern ${shape.padEnd(10)} ${grid.length} evaluations (1° hemisphere grid, ${lit} inside the corner): ` +
        `${medianMs.toFixed(1)} ms, ${Math.round(perS).toLocaleString('en-US')} evaluations/s`,
    );
  }
  for (const shape of SHAPES) {
    const r: Reflector = { shape, edgeM: 0.9, wavelengthM: 0.0555 };
    for (const gs of [TWO, FOUR]) {
      const { medianMs, result } = await timeMs(() => compromiseOrientation(r, gs), 7);
      console.log(
        `compromise ${shape.padEnd(10)} ${gs.length} geometries: ${medianMs.toFixed(1)} ms (worst loss ${result.worstLossDb.toFixed(3)} dB)`,
      );
    }
  }
}
