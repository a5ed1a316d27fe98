/** Unsaved form state, one row per form key. Survives app restarts; not part of backups. */
import type { GlintmarkDb } from '../db.ts';
import { ValidationError } from '../errors.ts';

export interface Draft<T> {
  value: T;
  savedAtMs: number;
}

/**
 * Store `value` (JSON-compatible: it is stored as its JSON round trip, so undefined fields and functions
 * vanish) under `key`, replacing any earlier draft. Resolves after the write commits.
 */
export async function saveDraft(db: GlintmarkDb, key: string, value: unknown, nowMs = Date.now()): Promise<void> {
  if (typeof key !== 'string' || key.length === 0 || key.length > 100) {
    throw new ValidationError('The draft', [{ path: 'key', message: 'must be a name of 1 to 100 characters' }]);
  }
  const json = JSON.stringify(value);
  if (json === undefined) throw new ValidationError('The draft', [{ path: 'value', message: 'must be JSON data (an object, list, text, number or true/false)' }]);
  await db.drafts.put({ key, value: JSON.parse(json) as unknown, savedAtMs: nowMs });
}

/** The draft under `key`, or undefined. The caller validates the value's shape (it may come from an older app). */
export async function loadDraft<T = unknown>(db: GlintmarkDb, key: string): Promise<Draft<T> | undefined> {
  const row = await db.drafts.get(key);
  return row ? { value: row.value as T, savedAtMs: row.savedAtMs } : undefined;
}

export async function clearDraft(db: GlintmarkDb, key: string): Promise<void> {
  await db.drafts.delete(key);
}
