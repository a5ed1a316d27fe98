import { describe, expect, it } from 'vitest';
import { wavelengthFromFrequencyM } from '../../../src/core/radar/bands.ts';
import type { GeometryRecord } from '../../../src/data/index.ts';
import { bandFrequencyGhz, describeGeometry, matchGeometries, plannedGeometryFields } from '../../../src/ui/pages/logbook/geometryPlan.ts';
import type { GeometryInput } from '../../../src/ui/state/workflow.ts';
import { T0_MS } from './helpers.ts';

const SITE = '0b7d8a52-3f0e-4d52-9d7a-6c1f2b3a4e5f';
const REFL = '1c8e9b63-4a1f-4e63-8e8b-7d2a3c4b5f60';
const TOL_M = 1e-12;
const typed: GeometryInput = { incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'typed' };
const orbital: GeometryInput = { incidenceDeg: '41.25', headingDeg: '348.5', look: 'right', source: 'orbital-elements', direction: 'ascending', satellite: 'GLINT-A', elementsEpochMs: T0_MS };

describe('planned geometries → geometry records', () => {
  it('carries angles, look, direction, satellite and the band wavelength λ = c/f', () => {
    const r = plannedGeometryFields({ geometries: [typed, orbital], band: 'C', frequencyGhz: '5.405' }, SITE, REFL);
    expect(r.errors).toEqual([]);
    expect(r.fields).toHaveLength(2);
    expect(r.fields[0]).toMatchObject({ siteId: SITE, reflectorId: REFL, incidenceDeg: 37, headingDeg: 190, look: 'right', direction: null, band: 'C', source: 'typed', satellite: null, elementsEpochMs: null, demo: false });
    expect(Math.abs(r.fields[0].wavelengthM - wavelengthFromFrequencyM(5.405e9))).toBeLessThan(TOL_M);
    expect(r.fields[1]).toMatchObject({ direction: 'ascending', satellite: 'GLINT-A', elementsEpochMs: T0_MS, source: 'orbital-elements' });
  });
  it('skips a geometry with a bad angle, saying which, and asks for a frequency when there is none', () => {
    const r = plannedGeometryFields({ geometries: [typed, { ...typed, incidenceDeg: '95' }], band: 'C', frequencyGhz: '5.405' }, SITE, REFL);
    expect(r.fields).toHaveLength(1);
    expect(r.errors[0]).toBe('Planned geometry 2 is not recorded: Incidence must be in (0, 90)°, got 95');
    expect(plannedGeometryFields({ geometries: [typed], band: 'other', frequencyGhz: '' }, SITE, REFL).frequencyError).toBe('Radar frequency is empty');
    expect(plannedGeometryFields({ geometries: [], band: 'other', frequencyGhz: '' }, SITE, REFL)).toEqual({ fields: [], errors: [] });
  });
  it('gives preset band frequencies and none for a custom band', () => {
    expect(bandFrequencyGhz('X')).toBe('9.65');
    expect(bandFrequencyGhz('custom')).toBeNull();
  });
  it('reuses a stored geometry of the same plan (also one without a reflector) and no deleted one', () => {
    const want = plannedGeometryFields({ geometries: [typed, orbital], band: 'C', frequencyGhz: '5.405' }, SITE, REFL).fields;
    const rec = (o: Partial<GeometryRecord>): GeometryRecord => ({ id: crypto.randomUUID(), rev: 1, createdAtMs: T0_MS, updatedAtMs: T0_MS, deletedAtMs: null, ...want[0], ...o });
    const generic = rec({ reflectorId: null });
    const other = rec({ headingDeg: 190.01 });
    const deleted = rec({ deletedAtMs: T0_MS });
    expect(matchGeometries(want, [deleted, other, generic])).toEqual([generic.id, null]);
    expect(matchGeometries(want, [rec({ reflectorId: SITE })])).toEqual([null, null]);
  });
  it('describes a geometry with its units', () => {
    const g = plannedGeometryFields({ geometries: [orbital], band: 'C', frequencyGhz: '5.405' }, SITE, REFL).fields[0];
    expect(describeGeometry(g)).toBe('incidence 41.3°, heading 348.5° true, right-looking, C band (5.55 cm), ascending, GLINT-A');
  });
});
