import { describe, expect, it } from 'vitest';
import { fmtDeg, fmtLength, lengthToM } from '../../src/ui/format.ts';

describe('display formats', () => {
  it('degrees decimal or degrees and decimal minutes, minutes never reaching 60', () => {
    expect(fmtDeg(52.5712, 4)).toBe('52.5712°');
    expect(fmtDeg(52.5712, 4, 'dm')).toBe('52° 34.272′');
    expect(fmtDeg(-0.5, 4, 'dm')).toBe('−0° 30.000′');
    expect(fmtDeg(10.9999999, 4, 'dm')).toBe('11° 0.000′');
    expect(fmtDeg(Number.NaN)).toBe('—');
  });
  it('lengths in metres or international feet (0.3048 m exactly)', () => {
    expect(fmtLength(3.048, 'ft')).toBe('10.00 ft');
    expect(fmtLength(3.048, 'm', 1)).toBe('3.0 m');
    expect(lengthToM(10, 'ft')).toBeCloseTo(3.048, 12);
    expect(lengthToM(10, 'm')).toBe(10);
  });
});
