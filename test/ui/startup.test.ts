/**
 * Opening a logbook written by a newer app version: the start-up says so in words ("update the app") and writes
 * nothing; the newer database is byte for byte as it was (read back at its own version).
 */
import 'fake-indexeddb/auto';
import Dexie from 'dexie';
import { afterEach, describe, expect, it } from 'vitest';
import { openGlintmarkDb } from '../../src/data/db.ts';
import { startApp, startupProblem } from '../../src/ui/startup.ts';

const name = `newer-${crypto.randomUUID()}`;
afterEach(async () => {
  await Dexie.delete(name);
});

async function dump(): Promise<string> {
  const raw = new Dexie(name);
  await raw.open(); // dynamic mode: opens at whatever version is stored
  const out: Record<string, unknown> = { version: raw.verno };
  for (const t of raw.tables) out[t.name] = await t.toArray();
  raw.close();
  return JSON.stringify(out);
}

describe('start-up with a logbook from a newer Glintmark', () => {
  it('says "update the app" and writes nothing', async () => {
    const newer = new Dexie(name);
    newer.version(9).stores({ sites: 'id, code', meta: 'key', drafts: 'key', futureTable: 'id' });
    await newer.table('sites').add({ id: 's1', code: 'MF-01', fromTheFuture: true });
    newer.close();
    const before = await dump();
    const db = openGlintmarkDb(name);
    const result = await startApp(db);
    expect(result).toEqual({ ok: false, message: expect.stringMatching(/^This logbook was written by a newer version of Glintmark\. Update the app/) });
    expect(startupProblem()).toBe(result.ok ? null : result.message);
    db.close();
    expect(await dump()).toBe(before);
  });
});
