/** Merge conflicts kept on this device: list them and mark them resolved once the crew has decided. */
import type { GlintmarkDb } from '../db.ts';
import { RecordNotFoundError } from '../errors.ts';
import type { ConflictRecord } from '../types.ts';

/** Conflicts, newest first; open ones only unless asked. */
export async function listConflicts(db: GlintmarkDb, opts: { includeResolved?: boolean } = {}): Promise<ConflictRecord[]> {
  const rows = await db.conflicts.toArray();
  return rows.filter((c) => opts.includeResolved || c.resolvedAtMs === null).sort((a, b) => b.detectedAtMs - a.detectedAtMs || a.id.localeCompare(b.id));
}

/**
 * Mark a conflict resolved (the row and the other version stay, for the record). To adopt the other
 * version, the UI first writes the wanted fields with the table's repository update(), then resolves.
 */
export async function resolveConflict(db: GlintmarkDb, id: string, nowMs = Date.now()): Promise<ConflictRecord> {
  return db.transaction('rw', db.conflicts, async () => {
    const c = await db.conflicts.get(id);
    if (!c) throw new RecordNotFoundError('conflicts', id);
    const next = { ...c, resolvedAtMs: c.resolvedAtMs ?? nowMs };
    await db.conflicts.put(next);
    return next;
  });
}
