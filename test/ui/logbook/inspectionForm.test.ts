import { describe, expect, it } from 'vitest';
import {
  applyCaptureToInspection,
  checklistSummary,
  inspectionFormFromRecord,
  isInspectionForm,
  newInspectionForm,
  parseInspectionForm,
} from '../../../src/ui/pages/logbook/inspectionForm.ts';
import { changedFields } from '../../../src/ui/pages/logbook/siteForm.ts';
import { CHECKLIST_LABELS } from '../../../src/ui/pages/logbook/words.ts';
import { T0_MS } from './helpers.ts';

const IDS = { siteId: '0b7d8a52-3f0e-4d52-9d7a-6c1f2b3a4e5f', reflectorId: '1c8e9b63-4a1f-4e63-8e8b-7d2a3c4b5f60' };
const NEW = newInspectionForm({ ...IDS, crewName: 'Ann', nowMs: T0_MS });

describe('inspection form', () => {
  it('starts with nothing checked and no re-measurement', () => {
    const p = parseInspectionForm(NEW);
    expect(p.fields).toMatchObject({ ...IDS, inspectedAtMs: T0_MS, remeasured: null, crew: ['Ann'], notes: '' });
    expect(Object.values(p.fields!.checklist)).toEqual(Array(6).fill('not-checked'));
  });
  it('takes the re-measured orientation from an Align capture (roll −180° stored as +180°)', () => {
    const f = applyCaptureToInspection(NEW, { azimuthDeg: 99.5, tiltDeg: 14, rollDeg: -180, samples: 30, method: 'sun-shadow', declinationDeg: null, declinationModel: null, atMs: T0_MS, predictedLossDb: null });
    expect(parseInspectionForm(f).fields?.remeasured).toEqual({ azimuthDeg: 99.5, tiltDeg: 14, rollDeg: 180 });
  });
  it('needs all three re-measured angles once one is typed', () => {
    const p = parseInspectionForm({ ...NEW, azimuthDeg: '99' });
    expect(p.errors.tiltDeg).toBe('Re-measured tilt is empty');
    expect(p.errors.rollDeg).toBe('Re-measured roll is empty');
  });
  it('round-trips a stored inspection', () => {
    const f = { ...NEW, azimuthDeg: '99.5', tiltDeg: '14', rollDeg: '0.5', checklist: { ...NEW.checklist, debris: 'issue' as const } };
    const fields = parseInspectionForm(f).fields!;
    const rec = { id: crypto.randomUUID(), rev: 1, createdAtMs: T0_MS, updatedAtMs: T0_MS, deletedAtMs: null, ...fields, photoIds: [] };
    expect(changedFields(fields, parseInspectionForm(inspectionFormFromRecord(rec)).fields!)).toEqual({});
  });
  it('summarises the checklist in words', () => {
    expect(checklistSummary(NEW.checklist, CHECKLIST_LABELS)).toBe('0 OK, 6 not checked');
    const allOk = { debris: 'ok', standingWater: 'ok', snowIce: 'ok', vegetation: 'ok', damage: 'ok', movement: 'ok' } as const;
    expect(checklistSummary(allOk, CHECKLIST_LABELS)).toBe('all 6 OK');
    expect(checklistSummary({ ...allOk, debris: 'issue', movement: 'issue' }, CHECKLIST_LABELS)).toBe('2 issues: debris in the corner, movement of the base');
  });
  it('accepts a stored draft only with the current shape', () => {
    expect(isInspectionForm(JSON.parse(JSON.stringify(NEW)))).toBe(true);
    expect(isInspectionForm({ ...NEW, checklist: { ...NEW.checklist, debris: 'bad' } })).toBe(false);
    expect(isInspectionForm({ ...NEW, checklist: undefined })).toBe(false);
  });
});
