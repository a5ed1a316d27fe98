/** Shared test setup: one uniquely named database per test, deleted afterwards, and field factories. */
import { afterEach, beforeEach } from 'vitest';
import { blobToBase64 } from '../../src/data/base64.ts';
import { openGlintmarkDb, type GlintmarkDb } from '../../src/data/db.ts';
import type {
  GeometryFields,
  InspectionFields,
  InstallationFields,
  ReflectorFields,
  SiteFields,
} from '../../src/data/types.ts';

/** Call in a describe block; the returned getter gives the current test's database. */
export function useTestDb(): () => GlintmarkDb {
  let db: GlintmarkDb | undefined;
  beforeEach(() => {
    db = openGlintmarkDb(`test-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await db?.delete();
    db = undefined;
  });
  return () => {
    if (!db) throw new Error('useTestDb: no database outside a test');
    return db;
  };
}

export const BY = { by: 'Test Crew' };
/** 2027-07-02T12:00:00Z, a fixed instant for deterministic rows. */
export const T0_MS = Date.UTC(2027, 6, 2, 12);

export const siteFields = (o: Partial<SiteFields> = {}): SiteFields => ({
  code: 'MF-01',
  name: 'Marrowby Fen north bank',
  latDeg: 52.4123,
  lonDeg: -1.2345,
  heightEllM: 61.2,
  positionSource: 'gnss-phone',
  positionAccuracyM: 3.5,
  referenceFrame: 'ITRF2020',
  frameEpoch: 2027.5,
  notes: '',
  demo: false,
  ...o,
});

export const reflectorFields = (siteId: string, o: Partial<ReflectorFields> = {}): ReflectorFields => ({
  siteId,
  label: 'A',
  shape: 'triangular',
  edgeM: 1.5,
  construction: { panels: 'solid', drainage: 'three 20 mm holes at the apex', foundation: 'concrete pillar 0.6 m' },
  apex: null,
  apexHeightAboveMarkM: 0.8,
  gnssArpOffsetM: null,
  notes: '',
  demo: false,
  ...o,
});

export const geometryFields = (siteId: string, o: Partial<GeometryFields> = {}): GeometryFields => ({
  siteId,
  reflectorId: null,
  incidenceDeg: 38.5,
  headingDeg: 345.7,
  look: 'right',
  direction: 'ascending',
  band: 'C',
  wavelengthM: 0.055466,
  source: 'circular-approximation',
  satellite: 'GLINT-A',
  elementsEpochMs: null,
  demo: false,
  ...o,
});

export const installationFields = (siteId: string, reflectorId: string, o: Partial<InstallationFields> = {}): InstallationFields => ({
  reflectorId,
  siteId,
  geometryIds: [],
  plannedAzimuthDeg: 255.7,
  plannedTiltDeg: -3.2,
  measuredAzimuthDeg: 256.1,
  measuredTiltDeg: -3.0,
  measuredRollDeg: 0.4,
  azimuthMethod: 'sun-shadow',
  declinationDeg: null,
  declinationModel: null,
  fix: { latDeg: 52.41231, lonDeg: -1.23452, accuracyM: 4, atMs: T0_MS },
  predictedLossDb: 0.3,
  crew: ['Ada Quill', 'Bo Marsh'],
  installedAtMs: T0_MS,
  notes: '',
  photoIds: [],
  demo: false,
  ...o,
});

export const inspectionFields = (siteId: string, reflectorId: string, o: Partial<InspectionFields> = {}): InspectionFields => ({
  reflectorId,
  siteId,
  inspectedAtMs: T0_MS + 86_400_000,
  checklist: { debris: 'ok', standingWater: 'issue', snowIce: 'not-checked', vegetation: 'ok', damage: 'ok', movement: 'ok' },
  remeasured: { azimuthDeg: 256.0, tiltDeg: -3.1, rollDeg: 0.5 },
  crew: ['Ada Quill'],
  notes: 'water in the corner; drain hole cleared',
  photoIds: [],
  demo: false,
  ...o,
});

/** Every row of every table, sorted by key, photo blobs as {mime, base64}: compare two dumps with toEqual. */
export async function dumpDb(db: GlintmarkDb): Promise<Record<string, unknown[]>> {
  const out: Record<string, unknown[]> = {};
  for (const t of db.tables) {
    const rows = (await t.toArray()) as Record<string, unknown>[];
    const plain = [];
    for (const r of rows) {
      const copy: Record<string, unknown> = { ...r };
      if (r.blob instanceof Blob) copy.blob = { type: r.blob.type, base64: await blobToBase64(r.blob) };
      plain.push(copy);
    }
    out[t.name] = plain.sort((a, b) => String(a.id ?? a.key).localeCompare(String(b.id ?? b.key)));
  }
  return out;
}

/**
 * A small realistic logbook: two sites (one with reflector, geometry, installation with a photo, an
 * inspection and an edit), and a soft-deleted site. Returns the ids.
 */
export async function seedSample(db: GlintmarkDb) {
  const { siteRepo } = await import('../../src/data/repo/sites.ts');
  const { reflectorRepo, geometryRepo, installationRepo, inspectionRepo } = await import('../../src/data/repo/entities.ts');
  const { addPhoto } = await import('../../src/data/repo/photos.ts');
  const ctx = { by: 'Ada Quill', nowMs: T0_MS };
  const site = await siteRepo.create(db, siteFields({ notes: 'gate code 4711, "blue" gate\nsecond line' }), ctx);
  const site2 = await siteRepo.create(db, siteFields({ code: 'MF-02', latDeg: -33.5, lonDeg: 151.25, heightEllM: 25 }), ctx);
  const gone = await siteRepo.create(db, siteFields({ code: 'MF-03' }), ctx);
  await siteRepo.softDelete(db, gone.id, { ...ctx, nowMs: T0_MS + 10 });
  const refl = await reflectorRepo.create(db, reflectorFields(site.id), ctx);
  const geo = await geometryRepo.create(db, geometryFields(site.id, { reflectorId: refl.id }), ctx);
  const inst = await installationRepo.create(db, installationFields(site.id, refl.id, { geometryIds: [geo.id], notes: 'tilt, "checked" twice\nbolts tight' }), ctx);
  const photo = await addPhoto(db, { table: 'installations', id: inst.id }, 'boresight', new Blob([new Uint8Array([1, 2, 3, 250, 251])], { type: 'image/jpeg' }), { ...ctx, nowMs: T0_MS + 20 });
  const insp = await inspectionRepo.create(db, inspectionFields(site.id, refl.id), { ...ctx, nowMs: T0_MS + 30 });
  await siteRepo.update(db, site2.id, { name: 'Hollin Ridge' }, { by: 'Bo Marsh', nowMs: T0_MS + 40 });
  return { site, site2, gone, refl, geo, inst, photo, insp };
}

/**
 * SHA-256 (hex) of the whole database: every table's rows in key order, canonical JSON with sorted keys, each
 * blob replaced by the SHA-256 of its bytes and its type. Equal before and after a refused operation proves the
 * operation changed nothing, photo bytes included.
 */
export async function hashDb(db: GlintmarkDb): Promise<string> {
  const hex = (buf: ArrayBuffer) => Array.from(new Uint8Array(buf), (b) => b.toString(16).padStart(2, '0')).join('');
  const canonical = async (v: unknown): Promise<unknown> => {
    if (v instanceof Blob) return { $blob: hex(await crypto.subtle.digest('SHA-256', await v.arrayBuffer())), type: v.type };
    if (Array.isArray(v)) return Promise.all(v.map(canonical));
    if (v !== null && typeof v === 'object') {
      const out: Record<string, unknown> = {};
      for (const k of Object.keys(v).sort()) out[k] = await canonical((v as Record<string, unknown>)[k]);
      return out;
    }
    return v;
  };
  const tables: Record<string, unknown> = {};
  for (const t of [...db.tables].sort((a, b) => a.name.localeCompare(b.name))) {
    const keys = (await t.toCollection().primaryKeys()).map(String).sort();
    const rows = [];
    for (const k of keys) rows.push(await canonical(await t.get(k)));
    tables[t.name] = rows;
  }
  return hex(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(JSON.stringify(tables))));
}
