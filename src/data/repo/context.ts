/** Who and when for every write. The clock is injectable so tests and merges stay deterministic. */
import * as v from 'valibot';
import { ValidationError } from '../errors.ts';
import { lineText, toIssues } from '../schema/fields.ts';

export interface WriteContext {
  /** Crew member making the change (shown in the history). */
  by: string;
  /** Time of the change, ms since epoch UTC; defaults to Date.now(). */
  nowMs?: number;
}

const bySchema = lineText('crew name (by)', { min: 1, max: 80 });

/** Checks the context and returns the write time. */
export function resolveContext(ctx: WriteContext): { by: string; nowMs: number } {
  const r = v.safeParse(bySchema, ctx?.by);
  if (!r.success) throw new ValidationError('The change', toIssues(r.issues, 'by'));
  const nowMs = ctx.nowMs ?? Date.now();
  if (!Number.isInteger(nowMs) || nowMs < 0) throw new ValidationError('The change', [{ path: 'nowMs', message: `must be a whole number of ms since 1970, got ${nowMs}` }]);
  return { by: r.output, nowMs };
}
