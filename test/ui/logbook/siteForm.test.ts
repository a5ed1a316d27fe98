import 'fake-indexeddb/auto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { siteRepo } from '../../../src/data/index.ts';
import type { Fix } from '../../../src/sensors/index.ts';
import {
  changedFields,
  editSiteForm,
  EMPTY_SITE_FORM,
  findWorkflowSite,
  parseSiteForm,
  siteFormFromRecord,
  siteFormFromWorkflow,
  siteFormWithFix,
  siteInputFromRecord,
  sitePatch,
  type SiteForm,
} from '../../../src/ui/pages/logbook/siteForm.ts';
import { addSite, BY, T0_MS, useTestDb } from './helpers.ts';

const GOOD: SiteForm = { ...EMPTY_SITE_FORM, code: 'MF-01', name: 'Marrowby Fen', latDeg: '52.61', lonDeg: '0.31', heightEllM: '45.2' };

describe('site form', () => {
  const db = useTestDb();

  it('a fix without altitude no longer blocks saving: the height becomes unknown, stored as null', () => {
    const fix: Fix = { latDeg: 52.5, lonDeg: -1.25, heightEllM: null, horizontalAccuracyM: 4, timeMs: T0_MS };
    const f = siteFormWithFix({ ...EMPTY_SITE_FORM, code: 'GPS-1' }, fix);
    expect(f.heightRef).toBe('unknown');
    const p = parseSiteForm(f);
    expect(p.errors).toEqual({});
    expect(p.fields?.heightEllM).toBeNull();
    expect(p.fields && 'heightMslM' in p.fields).toBe(false);
  });
  it('a sea-level altitude (iOS) is kept as such, never as ellipsoidal, and an edit back to ellipsoidal clears it', () => {
    const fix: Fix = { latDeg: 52.5, lonDeg: -1.25, heightEllM: null, heightMslM: 12.34, horizontalAccuracyM: 4, timeMs: T0_MS };
    const p = parseSiteForm(siteFormWithFix({ ...EMPTY_SITE_FORM, code: 'GPS-2' }, fix));
    expect(p.fields).toMatchObject({ heightEllM: null, heightMslM: 12.34 });
    const after = parseSiteForm({ ...siteFormWithFix({ ...EMPTY_SITE_FORM, code: 'GPS-2' }, fix), heightRef: 'ellipsoidal', heightEllM: '60.1' }).fields!;
    expect(sitePatch(p.fields!, after)).toEqual({ heightEllM: 60.1, heightMslM: null });
  });

  it('turns typed text into site fields with units, unknown accuracy and epoch as null', () => {
    const p = parseSiteForm({ ...GOOD, code: ' MF-01 ', frameEpoch: '2027.5', referenceFrame: 'ITRF2020' });
    expect(p.errors).toEqual({});
    expect(p.fields).toEqual({
      code: 'MF-01',
      name: 'Marrowby Fen',
      latDeg: 52.61,
      lonDeg: 0.31,
      heightEllM: 45.2,
      positionSource: 'typed',
      positionAccuracyM: null,
      referenceFrame: 'ITRF2020',
      frameEpoch: 2027.5,
      notes: '',
      demo: false,
    });
  });
  it('marks every bad field in place, naming the value and the range', () => {
    const p = parseSiteForm({ ...GOOD, code: '', latDeg: '95', lonDeg: 'abc', heightEllM: '', accuracyM: '-1', frameEpoch: '1800', referenceFrame: ' ' });
    expect(p.fields).toBeNull();
    expect(p.errors.code).toBe('Site code is empty');
    expect(p.errors.latDeg).toBe('Latitude must be in [-90, 90]°, got 95');
    expect(p.errors.lonDeg).toMatch(/Longitude must be a number, got "abc"/);
    expect(p.errors.heightEllM).toBe('Ellipsoidal height is empty: type it, or choose “Unknown, to be surveyed”');
    expect(p.errors.accuracyM).toMatch(/Position accuracy must be in \[0, 1000000\] m, got -1/);
    expect(p.errors.frameEpoch).toMatch(/Frame epoch must be in \[1900, 2200\]/);
    expect(p.errors.referenceFrame).toBe('Reference frame is empty');
  });
  it('wraps east longitudes above 180° and accepts a decimal comma', () => {
    expect(parseSiteForm({ ...GOOD, lonDeg: '359,5' }).fields?.lonDeg).toBe(-0.5);
  });
  it('refuses a multi-line code but keeps line breaks in notes', () => {
    expect(parseSiteForm({ ...GOOD, code: 'A\nB' }).errors.code).toBe('Site code must be one line');
    expect(parseSiteForm({ ...GOOD, notes: 'gate key\nat the farm' }).fields?.notes).toBe('gate key\nat the farm');
  });
  it('fills the position from a phone fix with its accuracy, and typing over it makes it typed', () => {
    const fix: Fix = { latDeg: 52.6123456, lonDeg: 0.3123456, heightEllM: 47.25, horizontalAccuracyM: 3.2, timeMs: T0_MS };
    const f = siteFormWithFix(GOOD, fix);
    expect(parseSiteForm(f).fields).toMatchObject({ latDeg: 52.6123456, lonDeg: 0.3123456, heightEllM: 47.25, positionAccuracyM: 3.2, positionSource: 'gnss-phone' });
    expect(siteFormWithFix(GOOD, { ...fix, heightEllM: null }).heightEllM).toBe('45.2');
    expect(editSiteForm(f, { latDeg: '52.6' }).positionSource).toBe('typed');
    expect(editSiteForm(f, { notes: 'x' }).positionSource).toBe('gnss-phone');
  });
  it('round-trips a stored site through the form unchanged, so an untouched edit writes nothing', async () => {
    const s = await addSite(db());
    const p = parseSiteForm(siteFormFromRecord(s));
    expect(changedFields(s, { ...s, ...p.fields! })).toEqual({});
    expect(changedFields(p.fields!, { ...p.fields!, name: 'Renamed' })).toEqual({ name: 'Renamed' });
  });
  it('hands a logbook site to the other tabs and finds the workflow site again by id or by code', async () => {
    const s = await addSite(db());
    const input = siteInputFromRecord(s);
    expect(input).toMatchObject({ id: s.id, code: 'MF-01', latDeg: 52.61, source: 'logbook' });
    expect(findWorkflowSite([s], input)).toBe(s);
    expect(findWorkflowSite([s], { latDeg: 1, lonDeg: 2, heightEllM: 0, code: 'mf-01', source: 'typed' })).toBe(s);
    expect(findWorkflowSite([s], { latDeg: 1, lonDeg: 2, heightEllM: 0, source: 'typed' })).toBeNull();
    const form = siteFormFromWorkflow({ latDeg: 1.5, lonDeg: 2.5, heightEllM: 3, accuracyM: 4, source: 'gnss-phone' });
    expect(form).toMatchObject({ latDeg: '1.5', lonDeg: '2.5', heightEllM: '3', accuracyM: '4', positionSource: 'gnss-phone', code: '' });
  });
  it('never passes a value the repository refuses (property: parsed fields are always stored)', async () => {
    const d = db();
    const text = fc.string({ maxLength: 40 });
    await fc.assert(
      fc.asyncProperty(
        fc.record({
          code: text,
          name: text,
          latDeg: fc.double({ min: -90, max: 90, noNaN: true }).map(String),
          lonDeg: fc.double({ min: -180, max: 359.999, noNaN: true }).map(String),
          heightEllM: fc.double({ min: -12000, max: 10000, noNaN: true }).map(String),
          accuracyM: fc.oneof(fc.constant(''), fc.double({ min: 0, max: 1e4, noNaN: true }).map(String)),
          frameEpoch: fc.oneof(fc.constant(''), fc.double({ min: 1900, max: 2200, noNaN: true }).map(String)),
          notes: fc.string({ maxLength: 30 }),
        }),
        async (o) => {
          const p = parseSiteForm({ ...EMPTY_SITE_FORM, ...o });
          if (!p.fields) return;
          const s = await siteRepo.create(d, p.fields, { by: BY });
          await siteRepo.softDelete(d, s.id, { by: BY });
        },
      ),
      { numRuns: 60 },
    );
  });
});
