import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { reflectorRepo } from '../../../src/data/index.ts';
import {
  EMPTY_REFLECTOR_FORM,
  nextReflectorLabel,
  parseReflectorForm,
  reflectorFormFromPlan,
  reflectorFormFromRecord,
  type ReflectorForm,
} from '../../../src/ui/pages/logbook/reflectorForm.ts';
import { changedFields } from '../../../src/ui/pages/logbook/siteForm.ts';
import { addSite, BY, useTestDb } from './helpers.ts';

const SITE_ID = '0b7d8a52-3f0e-4d52-9d7a-6c1f2b3a4e5f';
const GOOD: ReflectorForm = { ...EMPTY_REFLECTOR_FORM, label: 'A', edgeM: '1.2', apexHeightAboveMarkM: '0.9' };

describe('reflector form', () => {
  const db = useTestDb();

  it('leaves the apex and antenna offset out when their boxes are empty', () => {
    const p = parseReflectorForm(GOOD, SITE_ID);
    expect(p.fields).toMatchObject({ siteId: SITE_ID, label: 'A', shape: 'triangular', edgeM: 1.2, apex: null, gnssArpOffsetM: null, apexHeightAboveMarkM: 0.9 });
    expect(p.fields?.construction).toEqual({ panels: 'solid', drainage: '', foundation: '' });
  });
  it('needs all three apex coordinates once one is typed, and checks each offset', () => {
    const p = parseReflectorForm({ ...GOOD, apexLatDeg: '52.6', arpUpM: '11' }, SITE_ID);
    expect(p.fields).toBeNull();
    expect(p.errors.apexLonDeg).toBe('Apex longitude is empty');
    expect(p.errors.apexHeightEllM).toBe('Apex ellipsoidal height is empty');
    expect(p.errors.arpUpM).toBe('Antenna offset up must be in [-10, 10] m, got 11');
    expect(p.errors.arpEastM).toBe('Antenna offset east is empty');
  });
  it('keeps a mesh opening only for mesh panels, and refuses edges outside (0, 20] m', () => {
    expect(parseReflectorForm({ ...GOOD, panels: 'mesh', meshOpeningMm: '6' }, SITE_ID).fields?.construction.meshOpeningMm).toBe(6);
    expect(parseReflectorForm({ ...GOOD, panels: 'solid', meshOpeningMm: '6' }, SITE_ID).fields?.construction.meshOpeningMm).toBeUndefined();
    expect(parseReflectorForm({ ...GOOD, edgeM: '0' }, SITE_ID).errors.edgeM).toBe('Inner edge must be in (0, 20] m, got 0');
  });
  it('stores what it parses, and a stored reflector round-trips through the form', async () => {
    const site = await addSite(db());
    const form = { ...GOOD, panels: 'mesh' as const, meshOpeningMm: '6', apexLatDeg: '52.61', apexLonDeg: '0.31', apexHeightEllM: '46.1', arpEastM: '0', arpNorthM: '0', arpUpM: '0.12', drainage: 'three 20 mm holes' };
    const p = parseReflectorForm(form, site.id);
    const r = await reflectorRepo.create(db(), p.fields!, { by: BY });
    expect(r.apex).toEqual({ latDeg: 52.61, lonDeg: 0.31, heightEllM: 46.1 });
    const again = parseReflectorForm(reflectorFormFromRecord(r), site.id).fields!;
    expect(changedFields(p.fields!, again)).toEqual({});
  });
  it('suggests the next free label and takes shape and edge from the plan', () => {
    expect(nextReflectorLabel([])).toBe('A');
    expect(nextReflectorLabel(['A', 'b'])).toBe('C');
    expect(nextReflectorLabel(Array.from({ length: 26 }, (_, i) => String.fromCharCode(65 + i)))).toBe('R27');
    expect(reflectorFormFromPlan({ shape: 'square', edgeM: '1.5' }, ['A'])).toMatchObject({ label: 'B', shape: 'square', edgeM: '1.5' });
  });
});
