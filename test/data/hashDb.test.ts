import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { hashDb, seedSample, useTestDb } from './helpers.ts';
import { siteRepo } from '../../src/data/repo/sites.ts';
describe('hashDb', () => {
  const db = useTestDb();
  it('changes when a row changes and not otherwise', async () => {
    const ids = await seedSample(db());
    const a = await hashDb(db());
    expect(await hashDb(db())).toBe(a);
    await siteRepo.update(db(), ids.site.id, { notes: 'x' }, { by: 'T' });
    expect(await hashDb(db())).not.toBe(a);
  });
});
