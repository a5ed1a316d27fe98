/** An open merge conflict in words: which record, why, which version is in the logbook, and the other one's fields. */
import type { ConflictRecord } from '../../../data/index.ts';
import { countOf, utcMinute } from './reports.ts';

export interface ConflictView {
  title: string;
  reason: string;
  detected: string;
  kept: string;
  /** The version not in the logbook, one "field: value" line per field (bookkeeping and photo bytes left out). */
  otherFields: string[];
}

const HIDDEN = new Set(['id', 'rev', 'createdAtMs', 'updatedAtMs', 'blob', 'dataBase64']);

const shown = (v: unknown): string => (typeof v === 'string' ? v : JSON.stringify(v) ?? 'nothing');

export function conflictView(c: ConflictRecord): ConflictView {
  const o = c.other as Record<string, unknown>;
  const label = typeof o.code === 'string' ? ` ${o.code}` : typeof o.label === 'string' ? ` ${o.label}` : '';
  const noun = countOf(c.table, 1).replace(/^1 /, '');
  return {
    title: `${noun}${label} (${c.recordId})`,
    reason: c.reason,
    detected: `Found ${utcMinute(c.detectedAtMs)}.`,
    kept:
      c.kept === 'local'
        ? "This phone's version is in the logbook; the other phone's version is below."
        : "The other phone's version is in the logbook; this phone's earlier version is below.",
    otherFields: Object.entries(o)
      .filter(([k]) => !HIDDEN.has(k))
      .map(([k, v]) => `${k}: ${shown(v)}`),
  };
}
