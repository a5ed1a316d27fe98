import { describe, expect, it } from 'vitest';
import { compareAzimuthMethods, type AzimuthMethod, type AzimuthReading } from '../../../src/core/alignment/methodCheck.ts';

const TOL_DEG = 1;

describe('compareAzimuthMethods', () => {
  it('all methods within tolerance: agree, compass trusted', () => {
    const r = compareAzimuthMethods(
      [
        { method: 'sun-shadow', azimuthDeg: 359.6 },
        { method: 'reference-bearing', azimuthDeg: 0.2 },
        { method: 'compass', azimuthDeg: 0.3 },
      ],
      TOL_DEG,
    );
    expect(r.agree).toBe(true);
    expect(r.maxDisagreementDeg).toBeCloseTo(0.7, 9); // wraps across north
    expect(r.compassTrusted).toBe(true);
    expect(r.message).toMatch(/agree/);
  });

  it('compass off from an independent method: blamed on disturbance, not trusted', () => {
    const r = compareAzimuthMethods(
      [
        { method: 'sun-shadow', azimuthDeg: 120.2 },
        { method: 'compass', azimuthDeg: 127.5 },
      ],
      TOL_DEG,
    );
    expect(r.agree).toBe(false);
    expect(r.maxDisagreementDeg).toBeCloseTo(7.3, 9);
    expect(r.compassTrusted).toBe(false);
    expect(r.message).toMatch(/disturbed compass/);
    expect(r.message).toMatch(/7\.3°/);
  });

  it('two independent methods disagreeing point at the set-out, not the compass', () => {
    const r = compareAzimuthMethods(
      [
        { method: 'sun-shadow', azimuthDeg: 80 },
        { method: 'reference-bearing', azimuthDeg: 83 },
        { method: 'compass', azimuthDeg: 81.5 },
      ],
      2,
    );
    expect(r.agree).toBe(false);
    expect(r.compassTrusted).toBe(true);
    expect(r.message).toMatch(/recheck the set-out/);
    expect(r.message).not.toMatch(/disturbed compass/);
  });

  it('nothing independent: the compass is unverified, so not trusted', () => {
    const one = compareAzimuthMethods([{ method: 'compass', azimuthDeg: 10 }], TOL_DEG);
    expect(one).toMatchObject({ agree: true, maxDisagreementDeg: 0, compassTrusted: false });
    expect(one.message).toMatch(/second method/);
    const two = compareAzimuthMethods(
      [
        { method: 'compass', azimuthDeg: 10 },
        { method: 'compass', azimuthDeg: 10.4 },
      ],
      TOL_DEG,
    );
    expect(two.compassTrusted).toBe(false);
    expect(two.message).toMatch(/Only compass readings/);
  });

  it('rejects empty lists, unknown methods, non-finite azimuths and bad tolerances', () => {
    expect(() => compareAzimuthMethods([], TOL_DEG)).toThrow(/empty list/);
    const bad = [{ method: 'dowsing' as AzimuthMethod, azimuthDeg: 1 }];
    expect(() => compareAzimuthMethods(bad, TOL_DEG)).toThrow(/readings\[0\]\.method must be one of/);
    const nan: AzimuthReading[] = [{ method: 'compass', azimuthDeg: NaN }];
    expect(() => compareAzimuthMethods(nan, TOL_DEG)).toThrow(/readings\[0\]\.azimuthDeg/);
    expect(() => compareAzimuthMethods([{ method: 'compass', azimuthDeg: 1 }], 0)).toThrow(/toleranceDeg/);
  });
});
