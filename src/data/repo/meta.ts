/** Small device-local facts: schema info, last backup time, the persistent-storage answer. Not part of backups. */
import type { GlintmarkDb } from '../db.ts';

/**
 * Known keys: 'schema' ({createdWithVersion, createdAtMs}), 'migration-v1-v2' ({atMs, sites, installations}),
 * 'lastBackupAtMs' (number), 'persistence' ({result, atMs}),
 * 'elements-import-v1' ({atMs, imported, skipped}: the one-time import of element sets an older app kept in localStorage).
 */
export type MetaKey = 'schema' | 'migration-v1-v2' | 'lastBackupAtMs' | 'persistence' | 'elements-import-v1';

export async function getMeta<T = unknown>(db: GlintmarkDb, key: MetaKey): Promise<T | undefined> {
  return (await db.meta.get(key))?.value as T | undefined;
}

export async function setMeta(db: GlintmarkDb, key: MetaKey, value: unknown): Promise<void> {
  await db.meta.put({ key, value });
}
