import 'fake-indexeddb/auto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { installationRepo } from '../../../src/data/index.ts';
import {
  applyCapture,
  captureLossUnstorable,
  captureSummary,
  installationFormFromRecord,
  installationFormFromWorkflow,
  isInstallationForm,
  parseInstallationForm,
} from '../../../src/ui/pages/logbook/installationForm.ts';
import { changedFields } from '../../../src/ui/pages/logbook/siteForm.ts';
import { DEFAULT_WORKFLOW, type Capture, type Workflow } from '../../../src/ui/state/workflow.ts';
import { addReflector, addSite, BY, T0_MS, useTestDb } from './helpers.ts';

const CAPTURE: Capture = {
  azimuthDeg: 100.234,
  tiltDeg: 14.71,
  rollDeg: -180,
  azimuthStdDeg: 0.31,
  tiltStdDeg: 0.05,
  samples: 45,
  method: 'compass',
  declinationDeg: 1.234,
  declinationModel: 'WMM2025',
  atMs: T0_MS + 5_000,
  predictedLossDb: 0.4321,
};
const WF: Workflow = { ...DEFAULT_WORKFLOW, geometries: [{ incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'typed' }], target: { azimuthDeg: 100, tiltDeg: 14.74, rollDeg: 0 }, capture: CAPTURE };
const IDS = { siteId: '0b7d8a52-3f0e-4d52-9d7a-6c1f2b3a4e5f', reflectorId: '1c8e9b63-4a1f-4e63-8e8b-7d2a3c4b5f60' };

describe('installation form', () => {
  const db = useTestDb();

  it('is filled from the capture and the plan, so nothing is retyped', () => {
    const f = installationFormFromWorkflow(WF, { crewName: ' Ann ', nowMs: T0_MS, ...IDS });
    expect(f).toMatchObject({
      plannedAzimuthDeg: '100.00',
      plannedTiltDeg: '14.74',
      measuredAzimuthDeg: '100.23',
      measuredTiltDeg: '14.71',
      measuredRollDeg: '180.00',
      azimuthMethod: 'compass',
      declinationDeg: '1.23',
      declinationModel: 'WMM2025',
      predictedLossDb: '0.43',
      installedAt: '2027-07-02T12:00:05Z',
      crew: 'Ann',
      band: 'C',
      frequencyGhz: '5.405',
      captureAtMs: CAPTURE.atMs,
    });
    expect(f.geometries).toEqual(WF.geometries);
    expect(f.notes).toBe('Align capture: mean of 45 readings, σ azimuth 0.31°, σ tilt 0.05°.');
    const p = parseInstallationForm(f);
    expect(p.errors).toEqual({});
    expect(p.fields).toMatchObject({ measuredRollDeg: 180, declinationDeg: 1.23, declinationModel: 'WMM2025', fix: null, crew: ['Ann'], installedAtMs: T0_MS + 5_000, demo: false });
  });
  it('without a capture leaves the measured figures for the crew, and without a plan the planned ones', () => {
    const f = installationFormFromWorkflow({ ...DEFAULT_WORKFLOW, band: 'custom' }, { crewName: '', nowMs: T0_MS });
    expect(f).toMatchObject({ measuredAzimuthDeg: '', plannedAzimuthDeg: '', azimuthMethod: 'other-instrument', band: 'other', frequencyGhz: '', captureAtMs: null, installedAt: '2027-07-02T12:00:00Z' });
    const p = parseInstallationForm(f);
    expect(p.errors.siteId).toBe('Choose the site');
    expect(p.errors.reflectorId).toBe('Choose or add the reflector');
    expect(p.errors.measuredAzimuthDeg).toBe('Measured azimuth is empty');
    expect(p.errors.plannedAzimuthDeg).toBe('Planned azimuth is empty');
  });
  it('replaces the earlier capture line in the notes when a new capture arrives', () => {
    const f = installationFormFromWorkflow(WF, { crewName: '', nowMs: T0_MS, ...IDS });
    const g = applyCapture({ ...f, notes: `${f.notes}\nfence on the north side` }, { ...CAPTURE, samples: 1, azimuthStdDeg: undefined, tiltStdDeg: undefined });
    expect(g.notes).toBe('Align capture: a single typed reading.\nfence on the north side');
    expect(captureSummary({ ...CAPTURE, tiltStdDeg: undefined })).toBe('Align capture: mean of 45 readings, σ azimuth 0.31°.');
  });
  it('does not store a loss of "no return": the field stays empty and the screen says why', () => {
    const c = { ...CAPTURE, predictedLossDb: Infinity };
    expect(captureLossUnstorable(c)).toBe(true);
    expect(captureLossUnstorable(CAPTURE)).toBe(false);
    expect(installationFormFromWorkflow({ ...WF, capture: c }, { crewName: '', nowMs: T0_MS }).predictedLossDb).toBe('');
  });
  it('asks for the declination of a compass azimuth, and for a declination when a model is named', () => {
    const f = installationFormFromWorkflow(WF, { crewName: '', nowMs: T0_MS, ...IDS });
    expect(parseInstallationForm({ ...f, declinationDeg: '' }).errors.declinationDeg).toMatch(/compass azimuth needs the declination/);
    expect(parseInstallationForm({ ...f, azimuthMethod: 'sun-shadow', declinationDeg: '' }).errors.declinationModel).toMatch(/model is named but no declination/);
    expect(parseInstallationForm({ ...f, azimuthMethod: 'sun-shadow', declinationDeg: '', declinationModel: '' }).fields).toMatchObject({ declinationDeg: null, declinationModel: null });
  });
  it('needs the whole GPS fix once part of it is typed, and a time with a zone or none (read as UTC)', () => {
    const f = installationFormFromWorkflow(WF, { crewName: '', nowMs: T0_MS, ...IDS });
    const p = parseInstallationForm({ ...f, fixLatDeg: '52.61' });
    expect(p.errors.fixLonDeg).toBe('Fix longitude is empty');
    expect(p.errors.fixAt).toBe('Fix time (UTC) is empty');
    const q = parseInstallationForm({ ...f, fixLatDeg: '52.61', fixLonDeg: '0.31', fixAccuracyM: '3', fixAt: '2027-07-02 11:59' });
    expect(q.fields?.fix).toEqual({ latDeg: 52.61, lonDeg: 0.31, accuracyM: 3, atMs: T0_MS - 60_000 });
    expect(parseInstallationForm({ ...f, installedAt: '2027-02-30T10:00Z' }).errors.installedAt).toMatch(/not a real date/);
  });
  it('stores what it parses; a stored installation round-trips, so an untouched edit writes nothing', async () => {
    const site = await addSite(db());
    const refl = await addReflector(db(), site.id);
    const f = installationFormFromWorkflow(WF, { crewName: 'Ann, Bo', nowMs: T0_MS, siteId: site.id, reflectorId: refl.id });
    const p = parseInstallationForm({ ...f, crew: 'Ann, Bo', fixLatDeg: '52.61', fixLonDeg: '0.31', fixAccuracyM: '3.5', fixAt: '2027-07-02T11:59:00Z' });
    const rec = await installationRepo.create(db(), { ...p.fields!, geometryIds: [], photoIds: [] }, { by: BY });
    const again = parseInstallationForm(installationFormFromRecord(rec)).fields!;
    expect(changedFields(p.fields!, again)).toEqual({});
  });
  it('round-trips any stored figures exactly, milliseconds included (property), so editing notes changes nothing else', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359.999999, noNaN: true }),
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: -179.999999, max: 180, noNaN: true }),
        fc.oneof(fc.constant(null), fc.double({ min: -30, max: 30, noNaN: true })),
        fc.integer({ min: 0, max: 4_000_000_000_000 }),
        fc.record({ latDeg: fc.double({ min: -90, max: 90, noNaN: true }), lonDeg: fc.double({ min: -180, max: 179.999, noNaN: true }), accuracyM: fc.double({ min: 0, max: 500, noNaN: true }), atMs: fc.integer({ min: 0, max: 4_000_000_000_000 }) }),
        (az, tilt, roll, decl, atMs, fix) => {
          const stored = {
            ...parseInstallationForm(installationFormFromWorkflow(WF, { crewName: 'Ann', nowMs: T0_MS, ...IDS })).fields!,
            measuredAzimuthDeg: az,
            measuredTiltDeg: tilt,
            measuredRollDeg: roll,
            azimuthMethod: 'other-instrument' as const,
            declinationDeg: decl,
            declinationModel: decl === null ? null : 'WMM2025',
            installedAtMs: atMs,
            fix,
          };
          const rec = { id: IDS.reflectorId, rev: 1, createdAtMs: T0_MS, updatedAtMs: T0_MS, deletedAtMs: null, ...stored, geometryIds: [], photoIds: [] };
          const again = parseInstallationForm(installationFormFromRecord(rec));
          expect(again.errors).toEqual({});
          expect(changedFields(stored, again.fields!)).toEqual({});
        },
      ),
      { numRuns: 200 },
    );
  });
  it('accepts a stored draft only with the current shape', () => {
    const f = installationFormFromWorkflow(WF, { crewName: '', nowMs: T0_MS });
    expect(isInstallationForm(JSON.parse(JSON.stringify(f)))).toBe(true);
    expect(isInstallationForm({ ...f, azimuthMethod: 'guess' })).toBe(false);
    expect(isInstallationForm({ ...f, measuredAzimuthDeg: 100 })).toBe(false);
    expect(isInstallationForm(null)).toBe(false);
    expect(isInstallationForm('x')).toBe(false);
  });
  it('never passes angles the repository refuses (property over the typed ranges)', async () => {
    const site = await addSite(db());
    const refl = await addReflector(db(), site.id);
    const base = installationFormFromWorkflow(WF, { crewName: 'Ann', nowMs: T0_MS, siteId: site.id, reflectorId: refl.id });
    await fc.assert(
      fc.asyncProperty(
        fc.double({ min: -10, max: 370, noNaN: true }),
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: -190, max: 190, noNaN: true }),
        async (az, tilt, roll) => {
          const p = parseInstallationForm({ ...base, measuredAzimuthDeg: String(az), measuredTiltDeg: String(tilt), measuredRollDeg: String(roll) });
          const inRange = az >= 0 && az < 360 && tilt >= -90 && tilt <= 90 && roll >= -180 && roll <= 180;
          expect(p.fields !== null).toBe(inRange);
          if (p.fields) await installationRepo.create(db(), { ...p.fields, geometryIds: [], photoIds: [] }, { by: BY });
        },
      ),
      { numRuns: 40 },
    );
  });
});
