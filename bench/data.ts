/**
 * Data-layer timings on fake-indexeddb in Node: 1,000 sites × 10 installations, each installation with two
 * revisions (create + one edit). Prints medians in ms next to the targets; asserts nothing. fake-indexeddb is
 * an in-memory JavaScript implementation, so these figures indicate the cost of our code, not of a phone's
 * IndexedDB.
 */
import 'fake-indexeddb/auto';
import { performance } from 'node:perf_hooks';
import { backupToJson, exportBackup, restoreBackup } from '../src/data/backup.ts';
import { openGlintmarkDb, type GlintmarkDb } from '../src/data/db.ts';
import { exportSitesGeoJson } from '../src/data/exchange/geojson.ts';
import { exportInstallationsCsv } from '../src/data/exchange/tablesCsv.ts';
import { querySiteListSources } from '../src/data/queries.ts';
import { installationRepo } from '../src/data/repo/entities.ts';
import { makeRevision, snapshotOf } from '../src/data/repo/revisions.ts';
import { rebuildSiteVisits } from '../src/data/repo/siteVisits.ts';
import { parseFields } from '../src/data/schema/validate.ts';
import { filterAndSortSites } from '../src/data/siteList.ts';
import type { InstallationRecord, ReflectorRecord, RevisionRecord, SiteRecord } from '../src/data/types.ts';
import { timeMs } from './timing.ts';

const SITES = 1000;
const INSTALLATIONS_PER_SITE = 10;
const T0_MS = Date.UTC(2027, 0, 1);
const DAY_MS = 86_400_000;

const meta = (atMs: number, rev = 1) => ({ id: crypto.randomUUID(), rev, createdAtMs: atMs, updatedAtMs: atMs, deletedAtMs: null });

/** Rows built directly (bulk insert) but checked against the same schemas the repositories use. */
function buildRows() {
  const sites: SiteRecord[] = [];
  const reflectors: ReflectorRecord[] = [];
  const installations: InstallationRecord[] = [];
  const revisions: RevisionRecord[] = [];
  const names = ['Marrowby Fen', 'Hollin Ridge', 'Crane Sike', 'Oxley Flats', 'Sallow Mere'];
  for (let s = 0; s < SITES; s++) {
    const site: SiteRecord = {
      ...meta(T0_MS),
      ...parseFields('sites', {
        code: `S-${String(s).padStart(4, '0')}`, name: `${names[s % names.length]} ${s}`,
        latDeg: 50 + (s % 100) * 0.05, lonDeg: -3 + Math.floor(s / 100) * 0.3, heightEllM: 40 + (s % 7),
        positionSource: 'gnss-phone', positionAccuracyM: 3, referenceFrame: 'ITRF2020', frameEpoch: 2027.0,
        notes: s % 10 === 0 ? 'gate key at the farm, "blue" gate' : '', demo: false,
      }),
    };
    sites.push(site);
    const refl: ReflectorRecord = {
      ...meta(T0_MS),
      ...parseFields('reflectors', {
        siteId: site.id, label: 'A', shape: 'triangular', edgeM: 1.5,
        construction: { panels: 'solid', drainage: 'holes', foundation: 'pillar' }, apex: null, apexHeightAboveMarkM: 0.8,
        gnssArpOffsetM: null, notes: '', demo: false,
      }),
    };
    reflectors.push(refl);
    for (let k = 0; k < INSTALLATIONS_PER_SITE; k++) {
      const atMs = T0_MS + (k * 30 + (s % 30)) * DAY_MS;
      const inst: InstallationRecord = {
        ...meta(atMs, 2),
        updatedAtMs: atMs + 60_000,
        ...parseFields('installations', {
          reflectorId: refl.id, siteId: site.id, geometryIds: [], plannedAzimuthDeg: 255.7, plannedTiltDeg: -3.2,
          measuredAzimuthDeg: 256 + (k % 3) * 0.1, measuredTiltDeg: -3, measuredRollDeg: 0.2, azimuthMethod: 'sun-shadow',
          declinationDeg: null, declinationModel: null, fix: { latDeg: site.latDeg, lonDeg: site.lonDeg, accuracyM: 4, atMs },
          predictedLossDb: 0.3, crew: ['Ada Quill', 'Bo Marsh'], installedAtMs: atMs, notes: `visit ${k}, tilt checked\nbolts tight`,
          photoIds: [], demo: false,
        }),
      };
      installations.push(inst);
      revisions.push(makeRevision({ table: 'installations', recordId: inst.id, rev: 1, atMs, by: 'Ada Quill', kind: 'create', snapshot: snapshotOf({ ...inst, rev: 1, notes: '' }) }));
      revisions.push(makeRevision({ table: 'installations', recordId: inst.id, rev: 2, atMs: atMs + 60_000, by: 'Bo Marsh', kind: 'update', changes: [{ field: 'notes', before: '', after: inst.notes }] }));
    }
  }
  return { sites, reflectors, installations, revisions };
}

const line = (what: string, ms: number, targetMs: number | null) =>
  console.log(
    `${what.padEnd(58)} ${ms.toFixed(1).padStart(8)} ms   ${targetMs === null ? '(no target)' : `target < ${targetMs} ms${ms < targetMs ? '' : '   OVER TARGET'}`}`,
  );

/** A database holding the logbook above (also used by the backup bench). */
export async function seeded(name: string): Promise<GlintmarkDb> {
  const db = openGlintmarkDb(name);
  const rows = buildRows();
  await db.transaction('rw', [db.sites, db.reflectors, db.installations, db.inspections, db.revisions, db.siteVisits], async () => {
    await db.sites.bulkAdd(rows.sites);
    await db.reflectors.bulkAdd(rows.reflectors);
    await db.installations.bulkAdd(rows.installations);
    await db.revisions.bulkAdd(rows.revisions);
    await rebuildSiteVisits(db); // as restore does
  });
  return db;
}

export async function bench(): Promise<void> {
  const db = await seeded(`bench-${crypto.randomUUID()}`);
  console.log(`${SITES} sites, ${SITES * INSTALLATIONS_PER_SITE} installations, ${2 * SITES * INSTALLATIONS_PER_SITE} revisions (fake-indexeddb, median of 5)`);

  const list = await timeMs(async () => filterAndSortSites(await querySiteListSources(db), { sort: 'code' }));
  const visited = list.result.filter((r) => r.lastVisitAtMs !== null).length;
  if (visited !== SITES) throw new Error(`bench setup: ${visited} of ${SITES} sites have a last visit`);
  line('open site list (query + last visit + sort by code)', list.medianMs, 100);
  const byVisit = await timeMs(async () => filterAndSortSites(await querySiteListSources(db), { sort: 'lastVisit' }));
  line('open site list sorted by last visit', byVisit.medianMs, 100);
  const sources = await querySiteListSources(db);
  const search = await timeMs(() => filterAndSortSites(sources, { search: 'fen 12', sort: 'distance', here: { latDeg: 51, lonDeg: -2 } }));
  line(`search loaded list ("fen 12", by distance: ${search.result.length} hits)`, search.medianMs, 100);
  const searchQ = await timeMs(async () => filterAndSortSites(await querySiteListSources(db), { search: 'gate' }));
  line('search including the query', searchQ.medianMs, 100);

  const geo = await timeMs(async () => JSON.stringify(await exportSitesGeoJson(db)));
  line(`export GeoJSON (${(geo.result.length / 1e6).toFixed(2)} MB)`, geo.medianMs, 1000);
  const csv = await timeMs(() => exportInstallationsCsv(db));
  line(`export installations CSV (${(csv.result.length / 1e6).toFixed(2)} MB)`, csv.medianMs, 1000);

  const site = list.result[0].site;
  const refl = (await db.reflectors.where('siteId').equals(site.id).toArray())[0];
  const proto = (await db.installations.where('siteId').equals(site.id).first()) as InstallationRecord;
  const { id: _i, rev: _r, createdAtMs: _c, updatedAtMs: _u, deletedAtMs: _d, ...fields } = proto;
  const write = await timeMs(() => installationRepo.create(db, { ...fields, reflectorId: refl.id }, { by: 'Ada Quill' }));
  line('record one installation (write + revision + summary)', write.medianMs, null);

  const text = backupToJson(await exportBackup(db, { appVersion: 'bench' }));
  const times: number[] = [];
  for (let i = 0; i < 3; i++) {
    const target = openGlintmarkDb(`bench-restore-${crypto.randomUUID()}`);
    const t0 = performance.now();
    await restoreBackup(target, text);
    times.push(performance.now() - t0);
    await target.delete();
  }
  times.sort((a, b) => a - b);
  line(`restore full backup (${(text.length / 1e6).toFixed(1)} MB JSON, median of 3)`, times[1], 5000);
  await db.delete();
}
