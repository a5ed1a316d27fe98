/** Sites: the generic repository plus "code is unique among live sites" (case-insensitive). */
import type { GlintmarkDb } from '../db.ts';
import { DuplicateCodeError } from '../errors.ts';
import type { SiteRecord } from '../types.ts';
import { makeEntityRepo } from './entity.ts';

/** The live site using `code` (ignoring case), other than `exceptId`; must run inside a transaction over sites for a write. */
export async function liveSiteWithCode(db: GlintmarkDb, code: string, exceptId?: string): Promise<SiteRecord | undefined> {
  return db.sites
    .where('code')
    .equalsIgnoreCase(code)
    .filter((s) => s.deletedAtMs === null && s.id !== exceptId)
    .first();
}

export const siteRepo = makeEntityRepo('sites', {
  compare: (a, b) => a.code.localeCompare(b.code, undefined, { numeric: true, sensitivity: 'base' }),
  extraCheck: async (db, id, f, changed) => {
    if (!changed('code')) return;
    const other = await liveSiteWithCode(db, f.code, id);
    if (other) throw new DuplicateCodeError(f.code, other.id);
  },
});
