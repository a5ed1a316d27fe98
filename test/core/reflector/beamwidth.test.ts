import { describe, expect, it } from 'vitest';
import { beamwidth3dB } from '../../../src/core/reflector/beamwidth.ts';
import { rcsInReflectorFrame } from '../../../src/core/reflector/pattern.ts';
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG } from '../../../src/core/units.ts';
import { bodyVector, oracleAreaRatio, type V3 } from './overlapOracle.ts';

const TOL_DEG = 1e-6;
const TOL_DB = 1e-6;

describe('beamwidth3dB', () => {
  it('triangular: 38.887° full width in both cuts, from the closed form s − 2/s with s = √3 cos θ', () => {
    // [derived] from the Doerry (Sandia report, 2nd ed.) closed form: in the s − 2/s branch A/a² depends only on
    // s = √3 cos θ; −3 dB at s − 2/s = 10^(−3/20)/√3. REFERENCES.md §1 gives "about ±19.4°" [derived].
    const g = 10 ** (-3 / 20) / Math.sqrt(3);
    const s3 = (g + Math.sqrt(g * g + 8)) / 2;
    const halfDeg = (Math.acos(s3 / Math.sqrt(3)) * 180) / Math.PI;
    expect(halfDeg).toBeCloseTo(19.4437, 4);
    const bw = beamwidth3dB('triangular');
    expect(Math.abs(bw.elevationFullDeg - 2 * halfDeg)).toBeLessThan(TOL_DEG);
    expect(Math.abs(bw.azimuthFullDeg - 2 * halfDeg)).toBeLessThan(TOL_DEG);
    expect(Math.abs(bw.elevationAboveDeg - halfDeg)).toBeLessThan(TOL_DEG);
  });

  it('square: the −3 dB points of both cuts equal a brute-force search over the independent overlap oracle', () => {
    // Independent value: the numerical aperture-overlap oracle (./overlapOracle.ts, sharing no code with src/) is
    // scanned outward from boresight, first in 0.1° steps and then in 0.002° steps inside the bracket, for the
    // first direction 3 dB below its own boresight aperture (√3 a², Robertson 1947). REFERENCES.md §1 quotes
    // "≈ 22° in elevation" [derived]. The oracle integrates 800 rows (≈ 1e-3 dB), so 0.02° covers it and the step.
    const SEARCH_TOL_DEG = 0.02;
    const peak = oracleAreaRatio('square', bodyVector(TRIHEDRAL_BORESIGHT_ELEVATION_DEG, 0));
    const lossDb = (k: V3) => -20 * Math.log10(oracleAreaRatio('square', k) / peak);
    const firstCrossingDeg = (dirAt: (tDeg: number) => V3) => {
      let lo = 0;
      while (lossDb(dirAt(lo + 0.1)) < 3) lo += 0.1;
      let t = lo;
      while (lossDb(dirAt(t)) < 3) t += 0.002;
      return t - 0.001;
    };
    const b0 = TRIHEDRAL_BORESIGHT_ELEVATION_DEG;
    const aboveDeg = firstCrossingDeg((t) => bodyVector(b0 + t, 0));
    const belowDeg = firstCrossingDeg((t) => bodyVector(b0 - t, 0));
    // Azimuth cut: cos t · b + sin t · right, b = boresight (CONVENTIONS.md body axes right, forward, up).
    const bF = Math.sqrt(2 / 3), bU = Math.sqrt(1 / 3);
    const azHalfDeg = firstCrossingDeg((t) => {
      const r = (t * Math.PI) / 180;
      return [Math.sin(r), Math.cos(r) * bF, Math.cos(r) * bU];
    });
    const bw = beamwidth3dB('square');
    expect(Math.abs(bw.elevationAboveDeg - aboveDeg)).toBeLessThan(SEARCH_TOL_DEG);
    expect(Math.abs(bw.elevationBelowDeg - belowDeg)).toBeLessThan(SEARCH_TOL_DEG);
    expect(Math.abs(bw.elevationFullDeg - (aboveDeg + belowDeg))).toBeLessThan(2 * SEARCH_TOL_DEG);
    expect(Math.abs(bw.azimuthFullDeg - 2 * azHalfDeg)).toBeLessThan(2 * SEARCH_TOL_DEG);
    expect(aboveDeg + belowDeg).toBeGreaterThan(21.5); // and the search agrees with REFERENCES.md's ≈ 22°
    expect(aboveDeg + belowDeg).toBeLessThan(23);
  });

  it('square: the −3 dB points found by the code really are 3 dB down on its own pattern', () => {
    const bw = beamwidth3dB('square');
    const r = { shape: 'square' as const, edgeM: 1, wavelengthM: 1 };
    const up = rcsInReflectorFrame(r, { elevationDeg: TRIHEDRAL_BORESIGHT_ELEVATION_DEG + bw.elevationAboveDeg, azimuthOffsetDeg: 0 });
    const down = rcsInReflectorFrame(r, { elevationDeg: TRIHEDRAL_BORESIGHT_ELEVATION_DEG - bw.elevationBelowDeg, azimuthOffsetDeg: 0 });
    expect(Math.abs(up.lossDb - 3)).toBeLessThan(TOL_DB);
    expect(Math.abs(down.lossDb - 3)).toBeLessThan(TOL_DB);
  });

  it('is repeatable (memoised copies cannot be mutated from outside) and rejects an unknown shape', () => {
    const a = beamwidth3dB('triangular');
    a.elevationFullDeg = 0;
    expect(beamwidth3dB('triangular').elevationFullDeg).toBeGreaterThan(38);
    expect(() => beamwidth3dB('conical' as never)).toThrow(/shape must be one of triangular, square, got "conical"/);
  });
});
