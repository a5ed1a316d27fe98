import 'fake-indexeddb/auto';
import { createHash } from 'node:crypto';
import Dexie from 'dexie';
import { afterEach, describe, expect, it } from 'vitest';
import { CURRENT_SCHEMA_VERSION, SCHEMA_V1, SCHEMA_V2, SCHEMA_V3, SCHEMA_V4, V1_DECLINATION_MODEL, openGlintmarkDb, type GlintmarkDb } from '../../src/data/db.ts';
import { elementRepo } from '../../src/data/repo/elements.ts';
import { getMeta } from '../../src/data/repo/meta.ts';
import { addPhoto, fillPhotoHashes } from '../../src/data/repo/photos.ts';
import { parseFields, splitRow } from '../../src/data/schema/validate.ts';
import type { EntityTable } from '../../src/data/types.ts';
import { GLINT_A } from './elementSets.ts';
import { T0_MS, dumpDb, seedSample } from './helpers.ts';

const names: string[] = [];
const uniqueName = () => {
  const n = `migration-${crypto.randomUUID()}`;
  names.push(n);
  return n;
};
afterEach(async () => {
  while (names.length) await Dexie.delete(names.pop() as string);
});

const ID = {
  siteGnss: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0001',
  siteTyped: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0002',
  refl: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0003',
  geo: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0004',
  instWithGeo: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0005',
  instNoGeo: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0006',
  rev: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0007',
};
const meta = { rev: 1, createdAtMs: T0_MS, updatedAtMs: T0_MS, deletedAtMs: null };

/** Rows exactly as the 0.1 release wrote them. */
const v1Site = (id: string, code: string, gnssFix: boolean) => ({
  id, ...meta, code, name: `Site ${code}`, latDeg: 52.1, lonDeg: -1.5, heightEllM: 60, gnssFix,
  positionAccuracyM: gnssFix ? 4 : null, referenceFrame: 'WGS84', frameEpoch: null, notes: 'v1 note', demo: false,
});
const v1Installation = (id: string, geometryId: string | null, declinationDeg: number | null) => ({
  id, ...meta, reflectorId: ID.refl, siteId: ID.siteGnss, geometryId, plannedAzimuthDeg: 255, plannedTiltDeg: -3,
  measuredAzimuthDeg: 255.5, measuredTiltDeg: -2.9, measuredRollDeg: 0.1,
  azimuthMethod: declinationDeg === null ? 'sun-shadow' : 'compass', declinationDeg, fix: null, predictedLossDb: null,
  crew: ['Ada Quill'], installedAtMs: T0_MS, notes: '', photoIds: [], demo: false,
});

async function writeV1(name: string): Promise<void> {
  const raw = new Dexie(name);
  raw.version(1).stores(SCHEMA_V1);
  await raw.table('sites').bulkAdd([v1Site(ID.siteGnss, 'MF-01', true), v1Site(ID.siteTyped, 'MF-02', false)]);
  await raw.table('reflectors').add({
    id: ID.refl, ...meta, siteId: ID.siteGnss, label: 'A', shape: 'triangular', edgeM: 1.5,
    construction: { panels: 'solid', drainage: 'holes', foundation: 'pillar' }, apex: null, apexHeightAboveMarkM: 0.8,
    gnssArpOffsetM: null, notes: '', demo: false,
  });
  await raw.table('geometries').add({
    id: ID.geo, ...meta, siteId: ID.siteGnss, reflectorId: ID.refl, incidenceDeg: 38, headingDeg: 346, look: 'right',
    direction: 'ascending', band: 'C', wavelengthM: 0.0555, source: 'typed', satellite: null, elementsEpochMs: null, demo: false,
  });
  await raw.table('installations').bulkAdd([v1Installation(ID.instWithGeo, ID.geo, 1.25), v1Installation(ID.instNoGeo, null, null)]);
  await raw.table('revisions').add({ id: ID.rev, table: 'sites', recordId: ID.siteGnss, rev: 1, atMs: T0_MS, by: 'Ada Quill', kind: 'create', changes: [], snapshot: null, cascadeOf: null });
  await raw.table('drafts').put({ key: 'installation-form', value: { notes: 'half typed' }, savedAtMs: T0_MS });
  raw.close();
}

/** Every migrated row must also pass today's validation. */
async function expectValid(db: GlintmarkDb, table: EntityTable): Promise<void> {
  for (const row of await db.table(table).toArray()) expect(() => parseFields(table, splitRow(row).fields)).not.toThrow();
}

describe('schema versions', () => {
  it('a new database is created at the current version and records it in meta', async () => {
    const db = openGlintmarkDb(uniqueName());
    await db.open();
    expect(db.verno).toBe(CURRENT_SCHEMA_VERSION);
    expect(await getMeta(db, 'schema')).toMatchObject({ createdWithVersion: 5 });
    db.close();
  });

  it('migrates a version-1 database with data: every field of every migrated row', async () => {
    const name = uniqueName();
    await writeV1(name);
    const db = openGlintmarkDb(name);
    await db.open();
    expect(db.verno).toBe(5);

    const { gnssFix: _g1, ...siteGnss } = v1Site(ID.siteGnss, 'MF-01', true);
    const { gnssFix: _g2, ...siteTyped } = v1Site(ID.siteTyped, 'MF-02', false);
    expect(await db.sites.get(ID.siteGnss)).toEqual({ ...siteGnss, positionSource: 'gnss-phone' });
    expect(await db.sites.get(ID.siteTyped)).toEqual({ ...siteTyped, positionSource: 'typed' });

    const { geometryId: _a, ...instWithGeo } = v1Installation(ID.instWithGeo, ID.geo, 1.25);
    const { geometryId: _b, ...instNoGeo } = v1Installation(ID.instNoGeo, null, null);
    expect(await db.installations.get(ID.instWithGeo)).toEqual({ ...instWithGeo, geometryIds: [ID.geo], declinationModel: V1_DECLINATION_MODEL });
    expect(await db.installations.get(ID.instNoGeo)).toEqual({ ...instNoGeo, geometryIds: [], declinationModel: null });

    // Untouched tables come through unchanged; the new multi-entry index and conflicts table work.
    expect((await db.reflectors.get(ID.refl))?.label).toBe('A');
    expect((await db.geometries.get(ID.geo))?.incidenceDeg).toBe(38);
    expect((await db.revisions.get(ID.rev))?.by).toBe('Ada Quill');
    expect((await db.drafts.get('installation-form'))?.value).toEqual({ notes: 'half typed' });
    expect((await db.installations.where('geometryIds').equals(ID.geo).primaryKeys())).toEqual([ID.instWithGeo]);
    expect(await db.conflicts.count()).toBe(0);
    expect(await getMeta(db, 'migration-v1-v2')).toMatchObject({ sites: 2, installations: 2 });
    // v2 → v3 ran after it: the visit summary is built from the migrated installations.
    expect(await db.siteVisits.toArray()).toEqual([{ siteId: ID.siteGnss, lastVisitAtMs: T0_MS, installationCount: 2, inspectionCount: 0 }]);
    for (const t of ['sites', 'reflectors', 'geometries', 'installations'] as const) await expectValid(db, t);
    db.close();

    // Reopening an already migrated database changes nothing.
    const again = openGlintmarkDb(name);
    expect(await again.installations.get(ID.instNoGeo)).toEqual({ ...instNoGeo, geometryIds: [], declinationModel: null });
    again.close();
  });
});

describe('version 2 → 3', () => {
  it('builds the per-site visit summary from live installations and inspections; records unchanged', async () => {
    const name = uniqueName();
    const raw = new Dexie(name);
    raw.version(1).stores(SCHEMA_V1);
    raw.version(2).stores(SCHEMA_V2);
    const inst = (id: string, siteId: string, installedAtMs: number, deletedAtMs: number | null) => ({
      ...v1Installation(id, null, null), siteId, installedAtMs, deletedAtMs, geometryId: undefined, geometryIds: [], declinationModel: null,
    });
    const rows = [
      inst(ID.instWithGeo, ID.siteGnss, T0_MS + 5, null),
      inst(ID.instNoGeo, ID.siteGnss, T0_MS + 99, T0_MS + 100), // deleted: not a visit
      inst(ID.rev, ID.siteTyped, T0_MS + 7, null),
    ].map(({ geometryId: _g, ...r }) => r);
    await raw.table('installations').bulkAdd(rows);
    await raw.table('inspections').add({ id: ID.geo, ...meta, siteId: ID.siteTyped, reflectorId: ID.refl, inspectedAtMs: T0_MS + 50, checklist: {}, remeasured: null, crew: [], notes: '', photoIds: [], demo: false });
    raw.close();

    const db = openGlintmarkDb(name);
    const visits = (await db.siteVisits.toArray()).sort((a, b) => a.siteId.localeCompare(b.siteId));
    expect(visits).toEqual([
      { siteId: ID.siteGnss, lastVisitAtMs: T0_MS + 5, installationCount: 1, inspectionCount: 0 },
      { siteId: ID.siteTyped, lastVisitAtMs: T0_MS + 50, installationCount: 1, inspectionCount: 1 },
    ]);
    expect(await db.installations.toArray()).toEqual(expect.arrayContaining(rows));
    expect(await db.installations.count()).toBe(3);
    db.close();
  });
});

describe('version 3 → 4', () => {
  it('keeps every row of every table and adds an empty, working element-set table', async () => {
    // Realistic rows from today's repositories (sites … photos, history, visit summary), plus a conflict, a draft
    // and meta, written into a real version-3 database (the version-1…3 stores exactly as shipped).
    const source = openGlintmarkDb(uniqueName());
    await seedSample(source);
    await source.conflicts.add({ id: ID.rev, table: 'sites', recordId: ID.siteGnss, reason: 'test', kept: 'local', other: { code: 'MF-09' }, otherRevisions: [], detectedAtMs: T0_MS, resolvedAtMs: null });
    await source.drafts.put({ key: 'installation-form', value: { notes: 'half typed' }, savedAtMs: T0_MS });
    const v3Tables = source.tables.filter((t) => t.name !== 'elements').map((t) => t.name);
    const rows: Record<string, unknown[]> = {};
    for (const t of v3Tables) rows[t] = await source.table(t).toArray();
    source.close();
    expect(rows.photos).toHaveLength(1);
    expect(rows.siteVisits.length).toBeGreaterThan(0);

    const name = uniqueName();
    const raw = new Dexie(name);
    raw.version(1).stores(SCHEMA_V1);
    raw.version(2).stores(SCHEMA_V2);
    raw.version(3).stores(SCHEMA_V3);
    for (const t of v3Tables) await raw.table(t).bulkAdd(rows[t]);
    const before = await dumpDb(raw as unknown as GlintmarkDb);
    expect(raw.verno).toBe(3);
    raw.close();

    const db = openGlintmarkDb(name);
    await db.open();
    expect(db.verno).toBe(CURRENT_SCHEMA_VERSION);
    const after = await dumpDb(db);
    expect(after.elements).toEqual([]);
    const { elements: _e, ...kept } = after;
    expect(kept).toEqual(before);
    for (const t of Object.keys(before)) expect(before[t].length, t).toBe(rows[t].length);
    // The new table and its index work on the migrated database.
    const [set] = await elementRepo.put(db, [GLINT_A], { nowMs: T0_MS });
    expect((await db.elements.where('catalogNumber').equals('99001').toArray()).map((r) => r.id)).toEqual([set.id]);
    db.close();
  });
});

describe('version 4 → 5', () => {
  it('marks existing photos sha256: null, changes nothing else, and the pass after opening hashes them', async () => {
    // Realistic rows from today's repositories, two photos (one 6 MB), written into a real version-4 database the
    // way the 0.4 app stored them: photo rows without sha256.
    const source = openGlintmarkDb(uniqueName());
    const ids = await seedSample(source);
    const big = new Uint8Array(6_000_000).map((_, i) => (i * 7919) % 251);
    await addPhoto(source, { table: 'installations', id: ids.inst.id }, 'north', new Blob([big], { type: 'image/jpeg' }), { by: 'Ada Quill', nowMs: T0_MS + 50 });
    const tables = source.tables.map((t) => t.name);
    const rows: Record<string, Record<string, unknown>[]> = {};
    for (const t of tables) rows[t] = (await source.table(t).toArray()) as Record<string, unknown>[];
    source.close();
    rows.photos = rows.photos.map(({ sha256: _h, ...p }) => p);
    expect(rows.photos).toHaveLength(2);

    const name = uniqueName();
    const raw = new Dexie(name);
    raw.version(1).stores(SCHEMA_V1);
    raw.version(2).stores(SCHEMA_V2);
    raw.version(3).stores(SCHEMA_V3);
    raw.version(4).stores(SCHEMA_V4);
    for (const t of tables) await raw.table(t).bulkAdd(rows[t]);
    const before = await dumpDb(raw as unknown as GlintmarkDb);
    raw.close();

    const db = openGlintmarkDb(name);
    await db.open();
    expect(db.verno).toBe(5);
    const after = await dumpDb(db);
    expect(after.photos.map((p) => (p as { sha256: unknown }).sha256)).toEqual([null, null]);
    // Every other field of every row in every table is as it was.
    expect({ ...after, photos: after.photos.map((p) => ({ ...(p as object), sha256: undefined })) }).toEqual({
      ...before,
      photos: before.photos.map((p) => ({ ...(p as object), sha256: undefined })),
    });

    expect(await fillPhotoHashes(db)).toBe(2);
    expect(await fillPhotoHashes(db)).toBe(0); // once hashed, nothing more to do
    for (const p of rows.photos) {
      const stored = await db.photos.get(p.id as string);
      // Independent hash: Node's OpenSSL SHA-256 over the bytes written into the old database.
      const bytes = Buffer.from(await (p.blob as Blob).arrayBuffer());
      expect(stored?.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
      expect(stored?.rev).toBe(p.rev); // not a crew edit: no rev bump
    }
    expect(await db.revisions.count()).toBe(rows.revisions.length); // and no history row
    db.close();
  });
});
