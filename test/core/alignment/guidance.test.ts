import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  NO_AZIMUTH_INSTRUCTION,
  TOLERANCE_PRESETS,
  guidance,
  toleranceLossDb,
  type AlignmentTolerance,
} from '../../../src/core/alignment/guidance.ts';

const TOL: AlignmentTolerance = { azimuthDeg: 0.5, tiltDeg: 0.5, rollDeg: 1 };
const ROUNDING_DEG = 0.05; // instructions print one decimal

describe('guidance: instructions and signs', () => {
  it('measured anticlockwise of the target → turn clockwise; and the other way round across north', () => {
    const g = guidance({ azimuthDeg: 100, tiltDeg: 10 }, { azimuthDeg: 97.6, tiltDeg: 10, rollDeg: 0 }, TOL);
    expect(g.azimuth.errorDeg).toBeCloseTo(-2.4, 12);
    expect(g.azimuth.instruction).toBe('turn 2.4° clockwise');
    const h = guidance({ azimuthDeg: 358, tiltDeg: 10 }, { azimuthDeg: 2, tiltDeg: 10, rollDeg: 0 }, TOL);
    expect(h.azimuth.errorDeg).toBeCloseTo(4, 12);
    expect(h.azimuth.instruction).toBe('turn 4.0° anticlockwise');
  });

  it('open side too low → raise it; too high → lower it', () => {
    const g = guidance({ azimuthDeg: 0, tiltDeg: 10 }, { azimuthDeg: 0, tiltDeg: 9.2, rollDeg: 0 }, TOL);
    expect(g.tilt.errorDeg).toBeCloseTo(-0.8, 12);
    expect(g.tilt.instruction).toBe('raise the open side 0.8°');
    const h = guidance({ azimuthDeg: 0, tiltDeg: 10 }, { azimuthDeg: 0, tiltDeg: 11.3, rollDeg: 0 }, TOL);
    expect(h.tilt.instruction).toBe('lower the open side 1.3°');
  });

  it('right-hand side low (negative roll) → raise it; high → lower it; target roll defaults to 0', () => {
    const g = guidance({ azimuthDeg: 0, tiltDeg: 0 }, { azimuthDeg: 0, tiltDeg: 0, rollDeg: -1.5 }, TOL);
    expect(g.roll.instruction).toBe('raise the right-hand side 1.5°');
    const h = guidance({ azimuthDeg: 0, tiltDeg: 0, rollDeg: 3 }, { azimuthDeg: 0, tiltDeg: 0, rollDeg: 5 }, TOL);
    expect(h.roll.instruction).toBe('lower the right-hand side 2.0°');
  });

  it('"hold" on every axis within tolerance (boundary included), and allWithin', () => {
    const g = guidance({ azimuthDeg: 10, tiltDeg: 5 }, { azimuthDeg: 10.5, tiltDeg: 4.5, rollDeg: 1 }, TOL);
    expect([g.azimuth.instruction, g.tilt.instruction, g.roll.instruction]).toEqual(['hold', 'hold', 'hold']);
    expect(g.allWithin).toBe(true);
  });

  it('no compass: azimuth error null, the instruction points to another method, allWithin false', () => {
    const g = guidance({ azimuthDeg: 10, tiltDeg: 5 }, { azimuthDeg: null, tiltDeg: 5, rollDeg: 0 }, TOL);
    expect(g.azimuth).toEqual({ errorDeg: null, within: false, instruction: NO_AZIMUTH_INSTRUCTION });
    expect(g.azimuth.instruction).toMatch(/another method/);
    expect(g.tilt.within && g.roll.within).toBe(true);
    expect(g.allWithin).toBe(false);
  });

  it('following the instructions lands within rounding of the target (property)', () => {
    fc.assert(
      fc.property(
        fc.record({
          ta: fc.double({ min: 0, max: 359.99, noNaN: true }),
          tt: fc.double({ min: -30, max: 30, noNaN: true }),
          tr: fc.double({ min: -10, max: 10, noNaN: true }),
          ma: fc.double({ min: 0, max: 359.99, noNaN: true }),
          mt: fc.double({ min: -30, max: 30, noNaN: true }),
          mr: fc.double({ min: -10, max: 10, noNaN: true }),
        }),
        ({ ta, tt, tr, ma, mt, mr }) => {
          const g = guidance({ azimuthDeg: ta, tiltDeg: tt, rollDeg: tr }, { azimuthDeg: ma, tiltDeg: mt, rollDeg: mr }, TOL);
          // Signed change the crew makes: clockwise raises the azimuth; "raise" raises tilt or roll.
          const step = (instruction: string): number => {
            if (instruction === 'hold') return 0;
            const x = Number(/([\d.]+)°/.exec(instruction)![1]);
            return /anticlockwise$|^lower/.test(instruction) ? -x : x;
          };
          const a = ma + step(g.azimuth.instruction);
          const t = mt + step(g.tilt.instruction);
          const r = mr + step(g.roll.instruction);
          const after = guidance({ azimuthDeg: ta, tiltDeg: tt, rollDeg: tr }, { azimuthDeg: a, tiltDeg: t, rollDeg: r }, TOL);
          expect(Math.abs(after.azimuth.errorDeg!)).toBeLessThanOrEqual(Math.max(TOL.azimuthDeg, ROUNDING_DEG + 1e-9));
          expect(Math.abs(after.tilt.errorDeg)).toBeLessThanOrEqual(Math.max(TOL.tiltDeg, ROUNDING_DEG + 1e-9));
          expect(Math.abs(after.roll.errorDeg)).toBeLessThanOrEqual(Math.max(TOL.rollDeg, ROUNDING_DEG + 1e-9));
        },
      ),
      { numRuns: 500 },
    );
  });

  it('rejects bad input, naming it', () => {
    const m = { azimuthDeg: 0, tiltDeg: 0, rollDeg: 0 };
    expect(() => guidance({ azimuthDeg: NaN, tiltDeg: 0 }, m, TOL)).toThrow(/target\.azimuthDeg/);
    expect(() => guidance({ azimuthDeg: 0, tiltDeg: 95 }, m, TOL)).toThrow(/target\.tiltDeg must be in \[-90, 90\]/);
    expect(() => guidance({ azimuthDeg: 0, tiltDeg: 0 }, { ...m, rollDeg: 200 }, TOL)).toThrow(/measured\.rollDeg/);
    expect(() => guidance({ azimuthDeg: 0, tiltDeg: 0 }, m, { ...TOL, tiltDeg: 0 })).toThrow(/tol\.tiltDeg must be greater than 0/);
  });
});

describe('tolerance presets and the dB they cost', () => {
  // A quadratic main-lobe approximation, loss = 12 (θ/θ₃dB)² dB with θ₃dB = 40° full width (common practice, no
  // source; stands in for the reflector pattern supplied by the caller).
  const quadraticLossDb = (e: { azimuthErrorDeg: number; tiltErrorDeg: number }) =>
    (12 * (e.azimuthErrorDeg ** 2 + e.tiltErrorDeg ** 2)) / 40 ** 2;

  it('evaluates the caller\'s loss function at ± each tolerance and at the corners', () => {
    const l = toleranceLossDb(TOLERANCE_PRESETS.calibration, quadraticLossDb);
    expect(l.azimuthDb).toBeCloseTo((12 * 0.25) / 1600, 12);
    expect(l.tiltDb).toBeCloseTo((12 * 0.25) / 1600, 12);
    expect(l.rollDb).toBe(0);
    expect(l.combinedWorstDb).toBeCloseTo((12 * 0.5) / 1600, 12);
  });

  it('takes the worse sign for a lopsided pattern', () => {
    const l = toleranceLossDb({ azimuthDeg: 1, tiltDeg: 2, rollDeg: 3 }, (e) => Math.max(0, -e.tiltErrorDeg));
    expect(l.tiltDb).toBe(2);
    expect(l.combinedWorstDb).toBe(2);
  });

  it('monitoring is looser than calibration on every axis and costs at least as much', () => {
    const c = TOLERANCE_PRESETS.calibration, m = TOLERANCE_PRESETS.monitoring;
    expect(m.azimuthDeg).toBeGreaterThanOrEqual(c.azimuthDeg);
    expect(m.tiltDeg).toBeGreaterThanOrEqual(c.tiltDeg);
    expect(m.rollDeg).toBeGreaterThanOrEqual(c.rollDeg);
    expect(toleranceLossDb(m, quadraticLossDb).combinedWorstDb).toBeGreaterThan(toleranceLossDb(c, quadraticLossDb).combinedWorstDb);
  });

  it('rejects a loss function that returns NaN', () => {
    expect(() => toleranceLossDb(TOL, () => NaN)).toThrow(/lossDb result/);
  });
});
