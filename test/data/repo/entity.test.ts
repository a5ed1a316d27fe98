import 'fake-indexeddb/auto';
import { describe, expect, it, vi } from 'vitest';
import {
  DuplicateCodeError,
  InvalidStateForEditError,
  MissingReferenceError,
  RecordNotFoundError,
  StaleRecordError,
  ValidationError,
} from '../../../src/data/errors.ts';
import { geometryRepo, inspectionRepo, installationRepo, reflectorRepo } from '../../../src/data/repo/entities.ts';
import { history, versionAt } from '../../../src/data/repo/revisions.ts';
import { siteRepo } from '../../../src/data/repo/sites.ts';
import { BY, T0_MS, dumpDb, geometryFields, installationFields, reflectorFields, siteFields, useTestDb } from '../helpers.ts';

describe('entity repositories', () => {
  const db = useTestDb();

  it('create writes the row and a create revision holding the full snapshot', async () => {
    const s = await siteRepo.create(db(), siteFields(), { by: 'Ada Quill', nowMs: T0_MS });
    expect(s).toMatchObject({ rev: 1, createdAtMs: T0_MS, updatedAtMs: T0_MS, deletedAtMs: null, code: 'MF-01' });
    expect(await siteRepo.get(db(), s.id)).toEqual(s);
    const h = await history(db(), 'sites', s.id);
    expect(h).toHaveLength(1);
    expect(h[0]).toMatchObject({ table: 'sites', recordId: s.id, rev: 1, atMs: T0_MS, by: 'Ada Quill', kind: 'create', changes: [] });
    expect(h[0].snapshot).toEqual(s);
  });

  it('update records who, when and exactly which fields changed; history rebuilds every version', async () => {
    const s = await siteRepo.create(db(), siteFields(), { ...BY, nowMs: T0_MS });
    const s2 = await siteRepo.update(db(), s.id, { name: 'Fen north', heightEllM: 61.9 }, { by: 'Bo Marsh', nowMs: T0_MS + 1000 });
    expect(s2).toMatchObject({ rev: 2, updatedAtMs: T0_MS + 1000, name: 'Fen north', heightEllM: 61.9, createdAtMs: T0_MS });
    const h = await history(db(), 'sites', s.id);
    expect(h.map((r) => r.kind)).toEqual(['create', 'update']);
    expect(h[1]).toMatchObject({ rev: 2, by: 'Bo Marsh', atMs: T0_MS + 1000 });
    expect(h[1].changes).toEqual([
      { field: 'name', before: 'Marrowby Fen north bank', after: 'Fen north' },
      { field: 'heightEllM', before: 61.2, after: 61.9 },
    ]);
    expect(versionAt(h, 1)).toEqual(s);
    expect(versionAt(h, 2)).toEqual(s2);
  });

  it('a patch that changes nothing writes nothing', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const before = await dumpDb(db());
    expect(await siteRepo.update(db(), s.id, { name: s.name }, BY)).toEqual(s);
    expect(await dumpDb(db())).toEqual(before);
  });

  it('invalid input is refused with a plain message naming the field and value, and nothing is written', async () => {
    const before = await dumpDb(db());
    const err = await siteRepo.create(db(), siteFields({ latDeg: 95 }), BY).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ValidationError);
    expect((err as ValidationError).message).toBe('The site was not saved: latDeg: latitude must be in [-90, 90] degrees, got 95');
    expect((err as ValidationError).issues).toEqual([{ path: 'latDeg', message: 'latitude must be in [-90, 90] degrees, got 95' }]);
    expect(await dumpDb(db())).toEqual(before);
  });

  it.each([
    ['longitude 180 (range is [-180, 180))', { lonDeg: 180 }, 'lonDeg: longitude must be in [-180, 180) degrees, got 180'],
    ['NaN height', { heightEllM: Number.NaN }, 'heightEllM: ellipsoidal height must be a number, got NaN'],
    ['infinite accuracy', { positionAccuracyM: Infinity }, 'positionAccuracyM: position accuracy must be a finite number, got Infinity'],
    ['empty code', { code: '' }, 'code: site code must not be empty'],
    ['unknown position source', { positionSource: 'guess' as never }, 'positionSource: position source must be one of gnss-phone, gnss-survey, typed, imported, got "guess"'],
  ])('rejects %s', async (_label, patch, message) => {
    await expect(siteRepo.create(db(), siteFields(patch), BY)).rejects.toThrow(message);
  });

  it('an unknown or misspelt field is an error, not silently dropped', async () => {
    const bad = { ...siteFields(), lattitude: 1 } as never;
    await expect(siteRepo.create(db(), bad, BY)).rejects.toThrow('lattitude: is not a known field');
    const s = await siteRepo.create(db(), siteFields(), BY);
    await expect(siteRepo.update(db(), s.id, { rev: 9 } as never, BY)).rejects.toThrow('rev: is not a known field');
  });

  it('the crew name is required on every write', async () => {
    await expect(siteRepo.create(db(), siteFields(), { by: '' })).rejects.toThrow('by: crew name (by) must not be empty');
  });

  it('a compass azimuth needs its declination', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const r = await reflectorRepo.create(db(), reflectorFields(s.id), BY);
    await expect(installationRepo.create(db(), installationFields(s.id, r.id, { azimuthMethod: 'compass' }), BY)).rejects.toThrow(
      'declinationDeg: a compass azimuth needs the declination',
    );
    const ok = await installationRepo.create(
      db(),
      installationFields(s.id, r.id, { azimuthMethod: 'compass', declinationDeg: -0.8, declinationModel: 'WMM2025' }),
      BY,
    );
    expect(ok.declinationModel).toBe('WMM2025');
  });

  it('site codes are unique among live sites, ignoring case; a deleted site frees its code', async () => {
    const a = await siteRepo.create(db(), siteFields({ code: 'MF-01' }), BY);
    const err = await siteRepo.create(db(), siteFields({ code: 'mf-01' }), BY).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(DuplicateCodeError);
    expect((err as Error).message).toBe('Site code "mf-01" is already used by another site on this device; choose a different code.');
    await siteRepo.softDelete(db(), a.id, BY);
    const b = await siteRepo.create(db(), siteFields({ code: 'MF-01' }), BY);
    await expect(siteRepo.undelete(db(), a.id, BY)).rejects.toBeInstanceOf(DuplicateCodeError);
    await expect(siteRepo.update(db(), b.id, { code: 'MF-01' }, BY)).resolves.toMatchObject({ rev: 1 });
  });

  it('expectedRev guards against overwriting a change made elsewhere', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    await siteRepo.update(db(), s.id, { notes: 'first' }, { ...BY, expectedRev: 1 });
    const err = await siteRepo.update(db(), s.id, { notes: 'second' }, { ...BY, expectedRev: 1 }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(StaleRecordError);
    expect((await siteRepo.get(db(), s.id))?.notes).toBe('first');
  });

  it('unknown ids reject with RecordNotFoundError', async () => {
    await expect(siteRepo.update(db(), crypto.randomUUID(), { notes: 'x' }, BY)).rejects.toBeInstanceOf(RecordNotFoundError);
  });

  it('children need a live parent on the same site', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const other = await siteRepo.create(db(), siteFields({ code: 'MF-02' }), BY);
    await expect(reflectorRepo.create(db(), reflectorFields(crypto.randomUUID()), BY)).rejects.toBeInstanceOf(MissingReferenceError);
    const r = await reflectorRepo.create(db(), reflectorFields(s.id), BY);
    const gOther = await geometryRepo.create(db(), geometryFields(other.id), BY);
    await expect(installationRepo.create(db(), installationFields(other.id, r.id), BY)).rejects.toThrow('belongs to another site');
    await expect(installationRepo.create(db(), installationFields(s.id, r.id, { geometryIds: [gOther.id] }), BY)).rejects.toThrow(
      `geometry ${gOther.id}: belongs to another site`,
    );
    await expect(installationRepo.create(db(), installationFields(s.id, r.id, { photoIds: [crypto.randomUUID()] }), BY)).rejects.toThrow(
      'is not a live photo of this record',
    );
  });

  it('soft delete cascades from a site; undelete restores exactly what that delete took', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const r1 = await reflectorRepo.create(db(), reflectorFields(s.id, { label: 'A' }), BY);
    const r2 = await reflectorRepo.create(db(), reflectorFields(s.id, { label: 'B' }), BY);
    const g = await geometryRepo.create(db(), geometryFields(s.id, { reflectorId: r1.id }), BY);
    const i = await installationRepo.create(db(), installationFields(s.id, r1.id, { geometryIds: [g.id] }), BY);
    await reflectorRepo.softDelete(db(), r2.id, BY); // deleted on its own before the site
    const deleted = await siteRepo.softDelete(db(), s.id, { ...BY, nowMs: T0_MS });
    expect(deleted).toMatchObject({ deletedAtMs: T0_MS, rev: 2 });
    expect(await siteRepo.list(db())).toEqual([]);
    expect(await reflectorRepo.list(db(), { siteId: s.id })).toEqual([]);
    expect((await installationRepo.get(db(), i.id))?.deletedAtMs).toBe(T0_MS);
    await expect(siteRepo.update(db(), s.id, { notes: 'x' }, BY)).rejects.toBeInstanceOf(InvalidStateForEditError);

    await siteRepo.undelete(db(), s.id, BY);
    expect((await reflectorRepo.list(db(), { siteId: s.id })).map((x) => x.label)).toEqual(['A']);
    expect((await geometryRepo.get(db(), g.id))?.deletedAtMs).toBeNull();
    expect((await installationRepo.get(db(), i.id))?.deletedAtMs).toBeNull();
    expect((await reflectorRepo.get(db(), r2.id))?.deletedAtMs).not.toBeNull();
    const h = await history(db(), 'installations', i.id);
    expect(h.map((x) => x.kind)).toEqual(['create', 'delete', 'undelete']);
  });

  it('a child cannot be restored while its parent is deleted', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const r = await reflectorRepo.create(db(), reflectorFields(s.id), BY);
    await siteRepo.softDelete(db(), s.id, BY);
    await expect(reflectorRepo.undelete(db(), r.id, BY)).rejects.toThrow('site MF-01 is deleted; restore it first');
  });

  it('the row and its revision commit together: a failing revision write leaves no row', async () => {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const takenRevisionId = (await history(db(), 'sites', s.id))[0].id;
    const before = await dumpDb(db());
    const newId = crypto.randomUUID();
    const spy = vi.spyOn(crypto, 'randomUUID');
    spy.mockReturnValueOnce(newId as never).mockReturnValueOnce(takenRevisionId as never);
    try {
      await expect(siteRepo.create(db(), siteFields({ code: 'MF-09' }), BY)).rejects.toMatchObject({ name: 'ConstraintError' });
    } finally {
      spy.mockRestore();
    }
    expect(await dumpDb(db())).toEqual(before);
  });

  it('lists sort by code (natural order) and newest installation first', async () => {
    for (const code of ['MF-10', 'MF-2', 'mf-1']) await siteRepo.create(db(), siteFields({ code }), BY);
    expect((await siteRepo.list(db())).map((s) => s.code)).toEqual(['mf-1', 'MF-2', 'MF-10']);
    const s = (await siteRepo.list(db()))[0];
    const r = await reflectorRepo.create(db(), reflectorFields(s.id), BY);
    await installationRepo.create(db(), installationFields(s.id, r.id, { installedAtMs: T0_MS }), BY);
    await installationRepo.create(db(), installationFields(s.id, r.id, { installedAtMs: T0_MS + 5 }), BY);
    expect((await installationRepo.list(db(), { reflectorId: r.id })).map((x) => x.installedAtMs)).toEqual([T0_MS + 5, T0_MS]);
    expect(await inspectionRepo.list(db(), { siteId: s.id })).toEqual([]);
  });
});
