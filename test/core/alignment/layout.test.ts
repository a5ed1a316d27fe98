import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { SHADOW_NOTE, shadowLayout, tapeLayout } from '../../../src/core/alignment/layout.ts';

const TOL_M = 1e-9; // metres, rounding only
const d2r = Math.PI / 180;

/** East/north of the mark reached by walking the layout from the pivot (independent of the module's formula). */
function reachedPoint(referenceAzimuthDeg: number, l: { alongM: number; offsetM: number; side: 'left' | 'right' }) {
  const fwd = [Math.sin(referenceAzimuthDeg * d2r), Math.cos(referenceAzimuthDeg * d2r)];
  // Facing along the reference line, "right" is 90° clockwise: azimuth + 90.
  const rightAz = (referenceAzimuthDeg + (l.side === 'right' ? 90 : -90)) * d2r;
  const side = [Math.sin(rightAz), Math.cos(rightAz)];
  return [l.alongM * fwd[0] + l.offsetM * side[0], l.alongM * fwd[1] + l.offsetM * side[1]];
}

describe('tapeLayout', () => {
  it('hand case: reference north, target 030°, baseline 10 m → 8.660 m along, 5.000 m right', () => {
    const l = tapeLayout(0, 30, 10);
    expect(l.turnDeg).toBeCloseTo(30, 12);
    expect(l.alongM).toBeCloseTo(10 * Math.cos(30 * d2r), 12);
    expect(l.offsetM).toBeCloseTo(5, 12);
    expect(l.side).toBe('right');
  });

  it('anticlockwise turns go left, turns beyond 90° put the along distance behind you, square turns are exact', () => {
    expect(tapeLayout(350, 320, 10)).toMatchObject({ turnDeg: -30, side: 'left' });
    const back = tapeLayout(0, 135, 10);
    expect(back.alongM).toBeLessThan(0);
    expect(back.side).toBe('right');
    expect(tapeLayout(10, 100, 4)).toEqual({ turnDeg: 90, alongM: 0, offsetM: 4, side: 'right' });
    expect(tapeLayout(10, 190, 4)).toEqual({ turnDeg: 180, alongM: -4, offsetM: 0, side: 'right' });
    expect(tapeLayout(10, 10, 4)).toEqual({ turnDeg: 0, alongM: 4, offsetM: 0, side: 'right' });
  });

  it('the mark reached lies on the target line at the baseline distance (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -720, max: 720, noNaN: true }),
        fc.double({ min: -720, max: 720, noNaN: true }),
        fc.double({ min: 0.1, max: 200, noNaN: true }),
        (ref, target, B) => {
          const l = tapeLayout(ref, target, B);
          expect(l.turnDeg).toBeGreaterThan(-180);
          expect(l.turnDeg).toBeLessThanOrEqual(180);
          expect(l.offsetM).toBeGreaterThanOrEqual(0);
          const [e, n] = reachedPoint(ref, l);
          const want = [B * Math.sin(target * d2r), B * Math.cos(target * d2r)];
          expect(Math.hypot(e - want[0], n - want[1])).toBeLessThan(TOL_M);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('rejects bad input, naming it', () => {
    expect(() => tapeLayout(NaN, 0, 1)).toThrow(/referenceAzimuthDeg/);
    expect(() => tapeLayout(0, Infinity, 1)).toThrow(/targetAzimuthDeg/);
    expect(() => tapeLayout(0, 0, 0)).toThrow(/baselineM must be greater than 0/);
  });
});

describe('shadowLayout', () => {
  it('the shadow points away from the sun and is the reference line', () => {
    const s = shadowLayout(150, 250, 10); // shadow toward 330°, target 250° → turn −80°
    expect(s.shadowAzimuthDeg).toBeCloseTo(330, 12);
    expect(s.turnDeg).toBeCloseTo(-80, 12);
    expect(s.side).toBe('left');
    const [e, n] = reachedPoint(s.shadowAzimuthDeg, s);
    expect(Math.hypot(e - 10 * Math.sin(250 * d2r), n - 10 * Math.cos(250 * d2r))).toBeLessThan(TOL_M);
    expect(s.note).toBe(SHADOW_NOTE);
    expect(s.note).toMatch(/0\.25° a minute/);
  });

  it('wraps the shadow azimuth into [0, 360) and rejects a non-finite sun azimuth', () => {
    expect(shadowLayout(270, 0, 1).shadowAzimuthDeg).toBe(90);
    expect(shadowLayout(180, 0, 1).shadowAzimuthDeg).toBe(0);
    expect(() => shadowLayout(NaN, 0, 1)).toThrow(/sunAzimuthDeg/);
  });
});
