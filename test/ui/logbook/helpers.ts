/** Shared setup for the Logbook screen tests: a uniquely named fake-indexeddb database per test, and sample records. */
import 'fake-indexeddb/auto';
import { afterEach, beforeEach } from 'vitest';
import { openGlintmarkDb, reflectorRepo, siteRepo, type GlintmarkDb, type ReflectorRecord, type SiteRecord } from '../../../src/data/index.ts';
import { EMPTY_REFLECTOR_FORM, parseReflectorForm } from '../../../src/ui/pages/logbook/reflectorForm.ts';
import { EMPTY_SITE_FORM, parseSiteForm } from '../../../src/ui/pages/logbook/siteForm.ts';

export const BY = 'Ann Tester';
/** 2027-07-02T12:00:00Z, a fixed instant. */
export const T0_MS = Date.UTC(2027, 6, 2, 12);

export function useTestDb(): () => GlintmarkDb {
  let db: GlintmarkDb | undefined;
  beforeEach(() => {
    db = openGlintmarkDb(`ui-logbook-${crypto.randomUUID()}`);
  });
  afterEach(async () => {
    await db?.delete();
    db = undefined;
  });
  return () => {
    if (!db) throw new Error('no database outside a test');
    return db;
  };
}

/** An invented site, "Marrowby Fen", typed into the form and saved. */
export async function addSite(db: GlintmarkDb, code = 'MF-01'): Promise<SiteRecord> {
  const p = parseSiteForm({ ...EMPTY_SITE_FORM, code, name: 'Marrowby Fen north bank', latDeg: '52.61', lonDeg: '0.31', heightEllM: '45.2' });
  if (!p.fields) throw new Error(JSON.stringify(p.errors));
  return siteRepo.create(db, p.fields, { by: BY, nowMs: T0_MS });
}

export async function addReflector(db: GlintmarkDb, siteId: string, label = 'A'): Promise<ReflectorRecord> {
  const p = parseReflectorForm({ ...EMPTY_REFLECTOR_FORM, label, edgeM: '1.2', apexHeightAboveMarkM: '0.9' }, siteId);
  if (!p.fields) throw new Error(JSON.stringify(p.errors));
  return reflectorRepo.create(db, p.fields, { by: BY, nowMs: T0_MS });
}
