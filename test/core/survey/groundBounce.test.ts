import { describe, expect, it } from 'vitest';
import { groundBounce } from '../../../src/core/survey/groundBounce.ts';
import { runCli } from '../../cli/run.ts';

// Rule: extra two-way range ≈ 2·h·cos θ (common practice, no source); worked by hand below.
describe('ground bounce of a raised reflector', () => {
  it('2 m pole at 60° incidence: 2·2·0.5 = 2.0 m < 2.3 m cell → warn; 2.3 / (2·0.5) = 2.3 m clears it', () => {
    const g = groundBounce(2, 60, 2.3);
    expect(g.extraRangeM).toBeCloseTo(2, 12);
    expect(g.insideCell).toBe(true);
    expect(g.heightToClearM).toBeCloseTo(2.3, 12);
    expect(g.warning).toMatch(/above 2\.30 m/);
  });
  it('6 m roof at 60°: 6 m extra range is outside a 2.3 m cell, no warning', () => {
    const g = groundBounce(6, 60, 2.3);
    expect(g.insideCell).toBe(false);
    expect(g.warning).toBeUndefined();
  });
  it('aim --mount-height --range-resolution adds groundBounce and keeps the existing fields', async () => {
    const r = await runCli(['aim', '--incidence', '60', '--heading', '190', '--mount-height', '2', '--range-resolution', '2.3', '--json']);
    const j = r.json() as { reflectorAzimuthDeg: number; groundBounce: { insideCell: boolean } };
    expect(j.reflectorAzimuthDeg).toBeCloseTo(100, 9);
    expect(j.groundBounce.insideCell).toBe(true);
    const r2 = await runCli(['aim', '--incidence', '60', '--heading', '190', '--mount-height', '2']);
    expect(r2.code).toBe(2);
    expect(r2.stderr).toMatch(/go together/);
  });
});
