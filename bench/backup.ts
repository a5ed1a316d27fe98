/**
 * Backup archive at a season's size: the `data` bench's logbook (1,000 sites, 10,000 installations, 20,000
 * revisions) plus 1 GB of photos (171 photos of 6 MB, seeded random bytes), on fake-indexeddb in Node.
 * Prints export and restore times and peak memory (RSS, V8 heap, external) above the level with the data held,
 * beside the targets (restore ≤ 60 s, peak ≤ 300 MB above the data held); asserts nothing.
 * Run alone: `npx tsx bench/run.ts backup`.
 */
import 'fake-indexeddb/auto';
import { performance } from 'node:perf_hooks';
import { exportBackupArchive, restoreBackup } from '../src/data/backup.ts';
import { openGlintmarkDb } from '../src/data/db.ts';
import { sha256Hex } from '../src/data/hash.ts';
import type { InstallationRecord, PhotoRecord } from '../src/data/types.ts';
import { randomBytes } from '../test/helpers/random.ts';
import { seeded } from './data.ts';

const PHOTO_BYTES = 6_000_000;
const PHOTOS = Math.ceil(1_000_000_000 / PHOTO_BYTES);
const MB = 1e6;

interface Peak {
  rss: number;
  heapUsed: number;
  external: number;
}

/** Sample memory every 20 ms while `fn` runs; peaks in bytes. */
async function withPeak<T>(fn: () => Promise<T>): Promise<{ result: T; ms: number; peak: Peak }> {
  const peak: Peak = { rss: 0, heapUsed: 0, external: 0 };
  const sample = () => {
    const m = process.memoryUsage();
    peak.rss = Math.max(peak.rss, m.rss);
    peak.heapUsed = Math.max(peak.heapUsed, m.heapUsed);
    peak.external = Math.max(peak.external, m.external + m.arrayBuffers);
  };
  const timer = setInterval(sample, 20);
  const t0 = performance.now();
  try {
    const result = await fn();
    sample();
    return { result, ms: performance.now() - t0, peak };
  } finally {
    clearInterval(timer);
  }
}

const settle = async () => {
  (globalThis as { gc?: () => void }).gc?.();
  await new Promise((r) => setTimeout(r, 200));
  const m = process.memoryUsage();
  return { rss: m.rss, heapUsed: m.heapUsed, external: m.external + m.arrayBuffers };
};

function report(what: string, ms: number, targetMs: number | null, peak: Peak, base: Peak) {
  const over = (k: keyof Peak) => ((peak[k] - base[k]) / MB).toFixed(0).padStart(5);
  const worst = Math.max(peak.rss - base.rss, peak.heapUsed - base.heapUsed, peak.external - base.external) / MB;
  console.log(`${what.padEnd(44)} ${(ms / 1000).toFixed(1).padStart(6)} s   ${targetMs === null ? '(no target)    ' : `target ≤ ${targetMs / 1000} s${ms <= targetMs ? '' : ' OVER'}`}`);
  console.log(`${''.padEnd(44)} peak above data held: RSS ${over('rss')} MB, heap ${over('heapUsed')} MB, external ${over('external')} MB   target ≤ 300 MB${worst <= 300 ? '' : '   OVER TARGET'}`);
}

export async function bench(): Promise<void> {
  const db = await seeded(`bench-backup-${crypto.randomUUID()}`);
  const installations = (await db.installations.limit(PHOTOS).toArray()) as InstallationRecord[];
  for (let i = 0; i < PHOTOS; i++) {
    const bytes = randomBytes(PHOTO_BYTES, 7000 + i);
    const inst = installations[i];
    const photo: PhotoRecord = {
      id: crypto.randomUUID(), rev: 1, createdAtMs: inst.installedAtMs, updatedAtMs: inst.installedAtMs, deletedAtMs: null,
      ownerTable: 'installations', ownerId: inst.id, role: 'boresight', mime: 'image/jpeg',
      blob: new Blob([bytes], { type: 'image/jpeg' }), bytes: PHOTO_BYTES, sha256: await sha256Hex(bytes), takenAtMs: inst.installedAtMs,
    };
    await db.transaction('rw', db.photos, db.installations, async () => {
      await db.photos.add(photo);
      await db.installations.put({ ...inst, photoIds: [photo.id] });
    });
  }
  console.log(`${await db.installations.count()} installations, ${await db.revisions.count()} revisions, ${PHOTOS} photos of ${PHOTO_BYTES / MB} MB (${((PHOTOS * PHOTO_BYTES) / MB).toFixed(0)} MB), fake-indexeddb`);
  if (!(globalThis as { gc?: unknown }).gc) console.log('(run node with --expose-gc for steadier memory baselines)');

  const base = await settle();
  console.log(`data held: RSS ${(base.rss / MB).toFixed(0)} MB, heap ${(base.heapUsed / MB).toFixed(0)} MB, external ${(base.external / MB).toFixed(0)} MB`);
  const exp = await withPeak(() => exportBackupArchive(db, { appVersion: 'bench' }));
  report(`export archive (${(exp.result.size / MB).toFixed(0)} MB)`, exp.ms, null, exp.peak, base);

  const base2 = await settle();
  const target = openGlintmarkDb(`bench-backup-restore-${crypto.randomUUID()}`);
  const res = await withPeak(() => restoreBackup(target, exp.result));
  report(`restore archive into an empty database (${res.result.photos} photos)`, res.ms, 60_000, res.peak, base2);
  await target.delete();
  await db.delete();
}
