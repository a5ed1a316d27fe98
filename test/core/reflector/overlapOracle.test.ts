/**
 * Independent oracle for the physical-optics effective aperture, written here and sharing no code with src/:
 * the projected aperture is the convex hull (monotone chain) of the projected panel corners, and the area of
 * its overlap with its point reflection through the projected apex is integrated numerically row by row
 * (midpoint rule over 800 horizontal rows; each row's chord of a convex polygon is exact). The code under test
 * uses a closed form (triangular) and Sutherland–Hodgman clipping (square) instead.
 * The overlap rule itself: Robertson 1947 (BSTJ 26:852–869); ../shared/REFERENCES.md §1 [derived] cross-check.
 */
import { describe, expect, it } from 'vitest';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG } from '../../../src/core/units.ts';
import { rcsInReflectorFrame } from '../../../src/core/reflector/pattern.ts';
import { peakRcsM2 } from '../../../src/core/reflector/trihedral.ts';
import { bodyVector, oracleAreaRatio } from './overlapOracle.ts';

const TOL_DB = 0.05; // agreement required where the RCS is within WINDOW_DB of peak
const WINDOW_DB = 20;

describe('independent numerical overlap oracle', () => {
  it('reproduces the boresight apertures 1/√3 (triangular) and √3 (square)', () => {
    // Robertson 1947 peak values through σ = 4π A²/λ²: A/a² = 1/√3 and √3.
    const b = bodyVector(TRIHEDRAL_BORESIGHT_ELEVATION_DEG, 0);
    expect(oracleAreaRatio('triangular', b)).toBeCloseTo(1 / Math.sqrt(3), 5);
    expect(oracleAreaRatio('square', b)).toBeCloseTo(Math.sqrt(3), 5);
  });

  it.each(['triangular', 'square'] as const)('%s: pattern agrees within 0.05 dB over a 2° grid of the octant', (shape) => {
    const r = { shape, edgeM: 1, wavelengthM: 1 };
    const peakAreaRatio = Math.sqrt(peakRcsM2(r) / (4 * Math.PI));
    let compared = 0;
    let worstDb = 0;
    for (let el = 1; el < 90; el += 2) {
      for (let az = -44; az <= 44; az += 2) {
        const oracle = oracleAreaRatio(shape, bodyVector(el, az));
        const oracleLossDb = -20 * Math.log10(oracle / peakAreaRatio);
        const ours = rcsInReflectorFrame(r, { elevationDeg: el, azimuthOffsetDeg: az });
        if (!(oracleLossDb <= WINDOW_DB) && !(ours.lossDb <= WINDOW_DB)) continue;
        compared++;
        worstDb = Math.max(worstDb, Math.abs(ours.lossDb - oracleLossDb));
      }
    }
    expect(compared).toBeGreaterThan(500);
    expect(worstDb).toBeLessThan(TOL_DB);
  });
});
