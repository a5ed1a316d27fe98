import { describe, expect, it } from 'vitest';
import { computePlan } from '../../../src/ui/pages/plan/computePlan.ts';
import { pickPlanReflector, scrVerdict } from '../../../src/ui/pages/plan/planReflector.ts';
import { DEFAULT_WORKFLOW, isLegacyExample } from '../../../src/ui/state/workflow.ts';

const FORM = { shape: 'triangular' as const, edgeM: '1.0', band: 'C', frequencyGhz: '5.405', clutterDb: '-10', rangeResolutionM: '3', azimuthResolutionM: '20', targetScrDb: '20' };

describe('an empty phone has no aim', () => {
  it('starts with a blank geometry: no target, no error, marked empty', () => {
    const p = computePlan({ ...FORM, geometries: DEFAULT_WORKFLOW.geometries });
    expect(p.empty).toBe(true);
    expect(p.target).toBeNull();
    expect(p.geometries[0].errors).toEqual({});
    expect(p.scrDb).toBeNull();
  });
  it('a typed geometry gives an aim (right-looking, heading 190°: reflector faces 100°, tilt 50° − 35.26° = 14.74°)', () => {
    const p = computePlan({ ...FORM, geometries: [{ incidenceDeg: '40', headingDeg: '190', look: 'right', source: 'typed' }] });
    expect(p.empty).toBe(false);
    expect(p.target?.azimuthDeg).toBeCloseTo(100, 6);
    expect(p.target?.tiltDeg).toBeCloseTo(50 - (Math.atan(1 / Math.SQRT2) * 180) / Math.PI, 2);
  });
  it('recognises the old example row so a saved task does not turn it into an aim', () => {
    expect(isLegacyExample({ incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'typed' })).toBe(true);
    expect(isLegacyExample({ incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'orbital-elements', label: 'GLINT-A' })).toBe(false);
  });
});

describe('the site’s reflector', () => {
  const R = [
    { id: 'a', label: 'MF-01-A', deletedAtMs: null },
    { id: 'd', label: 'MF-01-D', deletedAtMs: null },
    { id: 'x', label: 'AAA', deletedAtMs: 5 },
  ];
  const G = [
    { reflectorId: 'd', satellite: 'GLINT-A', direction: 'descending' as const, deletedAtMs: null },
    { reflectorId: 'a', satellite: 'GLINT-A', direction: 'ascending' as const, deletedAtMs: null },
  ];
  it('picks the reflector that serves the planned track, else the first live one by label', () => {
    expect(pickPlanReflector(R, G, [{ satellite: 'GLINT-A', direction: 'descending' }])).toBe('d');
    expect(pickPlanReflector(R, G, [{ satellite: 'GLINT-A', direction: 'ascending' }])).toBe('a');
    expect(pickPlanReflector(R, G, [{}])).toBe('a');
    expect(pickPlanReflector([R[2]], G, [{}])).toBeNull();
  });
  it('says in words when the signal-to-clutter is below target', () => {
    expect(scrVerdict(17.5, 20, 1.45)).toEqual({ ok: false, text: expect.stringMatching(/Below the 20 dB target by 2\.5 dB.*1\.45 m edge/) });
    expect(scrVerdict(23, 20, 0.9)?.ok).toBe(true);
    expect(scrVerdict(null, 20, null)).toBeNull();
  });
});
