import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { geometryRepo, history, installationRepo, listPhotos, reflectorRepo } from '../../../src/data/index.ts';
import { plannedGeometryFields } from '../../../src/ui/pages/logbook/geometryPlan.ts';
import { newInspectionForm, parseInspectionForm } from '../../../src/ui/pages/logbook/inspectionForm.ts';
import { installationFormFromWorkflow, parseInstallationForm } from '../../../src/ui/pages/logbook/installationForm.ts';
import { createInspection, createInstallation } from '../../../src/ui/pages/logbook/saveRecords.ts';
import { DEFAULT_WORKFLOW, type Workflow } from '../../../src/ui/state/workflow.ts';
import { addReflector, addSite, BY, T0_MS, useTestDb } from './helpers.ts';

const WF: Workflow = {
  ...DEFAULT_WORKFLOW,
  geometries: [
    { incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'typed' },
    { incidenceDeg: '41', headingDeg: '349', look: 'right', source: 'typed' },
  ],
  target: { azimuthDeg: 100, tiltDeg: 14.7, rollDeg: 0 },
  capture: { azimuthDeg: 100.2, tiltDeg: 14.6, rollDeg: 0.1, samples: 1, method: 'other-instrument', declinationDeg: null, declinationModel: null, atMs: T0_MS, predictedLossDb: 0.3 },
};
const png = (bytes: number) => new Blob([new Uint8Array(bytes)], { type: 'image/png' });

async function setup(db: Parameters<typeof addSite>[0]) {
  const site = await addSite(db);
  const refl = await addReflector(db, site.id);
  const form = installationFormFromWorkflow(WF, { crewName: 'Ann', nowMs: T0_MS, siteId: site.id, reflectorId: refl.id });
  const core = parseInstallationForm(form).fields!;
  const geos = plannedGeometryFields(form, site.id, refl.id).fields;
  return { site, refl, core, geos };
}

describe('saving an installation', () => {
  const db = useTestDb();

  it('records the planned geometries, lists them on the installation, then adds the photos', async () => {
    const { site, core, geos } = await setup(db());
    const out = await createInstallation(db(), core, geos, [{ role: 'boresight', blob: png(100) }, { role: 'north', blob: png(50) }], BY);
    expect(out.photoErrors).toEqual([]);
    const stored = await geometryRepo.list(db(), { siteId: site.id });
    expect(stored.map((g) => g.incidenceDeg)).toEqual([37, 41]);
    expect(out.record.geometryIds).toEqual(stored.map((g) => g.id));
    const photos = await listPhotos(db(), { table: 'installations', id: out.record.id });
    expect(photos.map((p) => p.role)).toEqual(['boresight', 'north']);
    expect(out.record.photoIds).toEqual(photos.map((p) => p.id));
    expect(out.record.rev).toBe(3);
  });
  it('reuses the site’s geometries on the next installation instead of duplicating them', async () => {
    const { site, core, geos } = await setup(db());
    const a = await createInstallation(db(), core, geos, [], BY);
    const b = await createInstallation(db(), core, geos, [], BY);
    expect(b.record.geometryIds).toEqual(a.record.geometryIds);
    expect(await geometryRepo.list(db(), { siteId: site.id })).toHaveLength(2);
  });
  it('keeps the record when a photo is too large, and says so in plain words', async () => {
    const { core } = await setup(db());
    const out = await createInstallation(db(), core, [], [{ role: 'boresight', blob: png(8_000_001) }, { role: 'base', blob: png(10) }], BY);
    expect(out.photoErrors).toHaveLength(1);
    expect(out.photoErrors[0].role).toBe('boresight');
    expect(out.photoErrors[0].message).toMatch(/The photo is 8\.0 MB, more than the 8\.0 MB limit; it was not saved \(the record itself is kept\)/);
    expect(await installationRepo.get(db(), out.record.id)).toBeDefined();
    expect(out.record.photoIds).toHaveLength(1);
  });
  it('writes nothing (not even the geometries) when the reflector was deleted meanwhile', async () => {
    const { site, refl, core, geos } = await setup(db());
    await reflectorRepo.softDelete(db(), refl.id, { by: BY });
    await expect(createInstallation(db(), core, geos, [], BY)).rejects.toMatchObject({ name: 'MissingReferenceError' });
    expect(await geometryRepo.list(db(), { siteId: site.id, includeDeleted: true })).toEqual([]);
    expect(await installationRepo.list(db(), { includeDeleted: true })).toEqual([]);
  });
  it('records an inspection with its photos and history', async () => {
    const { site, refl } = await setup(db());
    const f = newInspectionForm({ siteId: site.id, reflectorId: refl.id, crewName: 'Bo', nowMs: T0_MS });
    const p = parseInspectionForm({ ...f, checklist: { ...f.checklist, debris: 'issue' } }).fields!;
    const out = await createInspection(db(), p, [{ role: 'boresight', blob: png(20) }], BY);
    expect(out.record.checklist.debris).toBe('issue');
    expect(out.record.photoIds).toHaveLength(1);
    const h = await history(db(), 'inspections', out.record.id);
    expect(h.map((r) => r.kind)).toEqual(['create', 'update']);
  });
});
