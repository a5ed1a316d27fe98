import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { installationRepo, openGlintmarkDb, reflectorRepo, removeDemoData, siteRepo, type GlintmarkDb } from '../../src/data/index.ts';
import { DEMO_SITES, demoTracks, loadDemoScenario } from '../../src/demo/scenario.ts';

const NOW_MS = Date.UTC(2026, 11, 2, 8);
let db: GlintmarkDb | undefined;
afterEach(async () => {
  if (!db) return;
  db.close();
  await db.delete();
  db = undefined;
});

describe('demo scenario', () => {
  it('GLINT-A sees MF-01 on at least one descending and one ascending track in a 12-day cycle', () => {
    const tracks = demoTracks(NOW_MS);
    expect(tracks.some((t) => t.direction === 'descending')).toBe(true);
    expect(tracks.some((t) => t.direction === 'ascending')).toBe(true);
  });

  it('writes four demo sites and one installation, all marked demo, and removes them without touching real records', async () => {
    const d = openGlintmarkDb(`demo-${Math.random()}`);
    db = d;
    const real = await siteRepo.create(d, { code: 'REAL-1', name: 'Real site', latDeg: 10, lonDeg: 20, heightEllM: 5, positionSource: 'typed', positionAccuracyM: null, referenceFrame: 'WGS84', frameEpoch: null, notes: '', demo: false }, { by: 'tester', nowMs: NOW_MS });
    const summary = await loadDemoScenario(d, NOW_MS);
    const sites = await siteRepo.list(d);
    expect(sites.filter((s) => s.demo).map((s) => s.code)).toEqual(DEMO_SITES.map((s) => s.code));
    const inst = await installationRepo.get(d, summary.installationId);
    expect(inst?.demo).toBe(true);
    expect(inst?.predictedLossDb).toBeGreaterThan(0);
    expect(inst?.predictedLossDb).toBeLessThan(1);
    expect(inst?.declinationModel).toBe('WMM2025');
    expect((await reflectorRepo.list(d)).every((r) => r.demo)).toBe(true);

    await removeDemoData(d);
    expect((await siteRepo.list(d, { includeDeleted: true })).map((s) => s.id)).toEqual([real.id]);
    expect(await siteRepo.get(d, real.id)).toEqual(real);
  });
});
