import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { installationRepo, reflectorRepo, siteRepo, type RevisionRecord } from '../../../src/data/index.ts';
import { installationFormFromWorkflow, parseInstallationForm } from '../../../src/ui/pages/logbook/installationForm.ts';
import { buildTimeline, describeChange, loadSiteTimeline, valueText } from '../../../src/ui/pages/logbook/timeline.ts';
import { DEFAULT_WORKFLOW } from '../../../src/ui/state/workflow.ts';
import { addReflector, addSite, BY, T0_MS, useTestDb } from './helpers.ts';

const MIN_MS = 60_000;

describe('site timeline', () => {
  const db = useTestDb();

  it('lists creations, installation, edits, a cascaded delete and the restore, newest first, with who and what changed', async () => {
    const d = db();
    const site = await addSite(d);
    const refl = await addReflector(d, site.id);
    const wf = { ...DEFAULT_WORKFLOW, target: { azimuthDeg: 100, tiltDeg: 14.7, rollDeg: 0 } };
    const f = installationFormFromWorkflow(wf, { crewName: '', nowMs: T0_MS, siteId: site.id, reflectorId: refl.id });
    const core = parseInstallationForm({ ...f, measuredAzimuthDeg: '100.2', measuredTiltDeg: '14.6' }).fields!;
    const inst = await installationRepo.create(d, { ...core, geometryIds: [], photoIds: [] }, { by: 'Bo', nowMs: T0_MS + MIN_MS });
    await installationRepo.update(d, inst.id, { measuredAzimuthDeg: 101 }, { by: 'Cy', nowMs: T0_MS + 2 * MIN_MS, expectedRev: 1 });
    await siteRepo.softDelete(d, site.id, { by: BY, nowMs: T0_MS + 3 * MIN_MS });
    await siteRepo.undelete(d, site.id, { by: BY, nowMs: T0_MS + 4 * MIN_MS });

    const t = await loadSiteTimeline(d, site.id);
    expect(t.map((e) => e.title)).toEqual([
      'Restored site MF-01',
      'Deleted site MF-01',
      'Edited installation of reflector A',
      'Recorded installation of reflector A',
      'Created reflector A',
      'Created site MF-01',
    ]);
    expect(t[1].alsoChanged).toEqual(['reflector A', 'installation of reflector A']);
    expect(t[2]).toMatchObject({ by: 'Cy', rev: 2, details: ['measured azimuth (° true): 100.2 → 101'] });
    expect(await reflectorRepo.get(d, refl.id)).toMatchObject({ deletedAtMs: null });
  });
  it('is empty for an unknown site', async () => {
    expect(await loadSiteTimeline(db(), crypto.randomUUID())).toEqual([]);
  });
  it('names photo additions and removals instead of listing ids', () => {
    const rev = (before: string[], after: string[], rev: number): RevisionRecord => ({
      id: `r${rev}`, table: 'installations', recordId: 'i', rev, atMs: T0_MS + rev, by: BY, kind: 'update',
      changes: [{ field: 'photoIds', before, after }], snapshot: null, cascadeOf: null,
    });
    const t = buildTimeline([{ table: 'installations', recordId: 'i', label: 'installation of reflector A', revisions: [rev([], ['p'], 2), rev(['p'], [], 3)] }]);
    expect(t.map((e) => e.title)).toEqual(['Removed a photo from installation of reflector A', 'Added a photo to installation of reflector A']);
    expect(t[1].details).toEqual(['photos: 0 → 1']);
  });
  it('writes values as short text with their units in the field label', () => {
    expect(describeChange({ field: 'installedAtMs', before: T0_MS, after: T0_MS + MIN_MS })).toBe('installed at: 2027-07-02 12:00 UTC → 2027-07-02 12:01 UTC');
    expect(describeChange({ field: 'declinationDeg', before: null, after: 1.2345678 })).toBe('declination (°, east +): none → 1.234568');
    expect(describeChange({ field: 'azimuthMethod', before: 'compass', after: 'sun-shadow' })).toBe('azimuth method: compass (with declination) → sun shadow');
    expect(valueText('notes', '<b>x</b>')).toBe('“<b>x</b>”');
    expect(valueText('crew', ['Ann', 'Bo'])).toBe('Ann, Bo');
    expect(valueText('apex', { latDeg: 1.5, lonDeg: 2, heightEllM: 3 })).toBe('latDeg 1.5, lonDeg 2, heightEllM 3');
  });
});

describe('history shows a word-level difference of edited text', () => {
  it('an edited note carries its changed words, other fields none', async () => {
    const { textDiffOf } = await import('../../../src/ui/pages/logbook/timeline.ts');
    const d = textDiffOf({ field: 'notes', before: 'bolts checked: drain clear', after: 'bolts checked twice: drain clear' });
    expect(d?.label).toBe('notes');
    // Worked by hand: "checked:" is a different word from "checked" followed by "twice:".
    expect(d?.segments).toEqual([
      { kind: 'same', text: 'bolts ' },
      { kind: 'removed', text: 'checked:' },
      { kind: 'added', text: 'checked twice:' },
      { kind: 'same', text: ' drain clear' },
    ]);
    expect(textDiffOf({ field: 'measuredAzimuthDeg', before: 100.2, after: 101 })).toBeNull();
  });
});
