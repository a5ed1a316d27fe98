/** Delete a stored record softly, or restore it (Undo): the outcome in words naming the record, or why it failed. */
import { useGlintmarkDb, withReopen, type EditContext, type GlintmarkDb } from '../../../data/index.ts';
import { saveErrorMessage } from './errorWords.ts';

/** The part of an entity repository this needs. */
export interface SoftDeleteRepo {
  softDelete(db: GlintmarkDb, id: string, ctx: EditContext): Promise<{ rev: number }>;
  undelete(db: GlintmarkDb, id: string, ctx: EditContext): Promise<{ rev: number }>;
}

/** Where the outcome goes: the screen's saved and error notes, and (edit screens) the rev the write left. */
export interface ToggleOutcome {
  setSaved: (s: string | null) => void;
  setError: (s: string | null) => void;
  rebase?: (rev: number) => void;
}

/**
 * Returns the action of the Delete / Undo delete buttons of `rec`, written by `by` onto the shown rev:
 * "<noun> deleted on this device" or "<noun> restored on this device".
 */
export function useToggleDeleted(
  repo: SoftDeleteRepo,
  rec: { id: string; rev: number; deletedAtMs: number | null },
  by: string,
  noun: string,
  out: ToggleOutcome,
): () => Promise<void> {
  const db = useGlintmarkDb();
  const deleted = rec.deletedAtMs !== null;
  return async () => {
    out.setError(null);
    out.setSaved(null);
    try {
      const ctx = { by, expectedRev: rec.rev };
      const next = await withReopen(db, () => (deleted ? repo.undelete(db, rec.id, ctx) : repo.softDelete(db, rec.id, ctx)));
      out.rebase?.(next.rev);
      out.setSaved(`${noun} ${deleted ? 'restored' : 'deleted'} on this device`);
    } catch (e) {
      out.setError(saveErrorMessage(e, false));
    }
  };
}
