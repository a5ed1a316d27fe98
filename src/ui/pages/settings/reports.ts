/** Plain-words summaries of what a backup holds, what a restore, merge or demo removal did. */
import { BACKUP_TABLES, type BackupDocument, type BackupTable, type DemoRemovalReport, type MergeReport, type TableCounts } from '../../../data/index.ts';

const NOUNS: Record<BackupTable, [string, string]> = {
  sites: ['site', 'sites'],
  reflectors: ['reflector', 'reflectors'],
  geometries: ['planned geometry', 'planned geometries'],
  installations: ['installation', 'installations'],
  inspections: ['inspection', 'inspections'],
  photos: ['photo', 'photos'],
  revisions: ['history entry', 'history entries'],
  conflicts: ['kept conflict', 'kept conflicts'],
  elements: ['element set', 'element sets'],
};

/** "1 site", "3 sites", "0 photos". */
export function countOf(table: BackupTable, n: number): string {
  const [one, many] = NOUNS[table];
  return `${n} ${n === 1 ? one : many}`;
}

/** The table's noun for a column or list heading ("Sites", "History entries"). */
export const tableHeading = (table: BackupTable): string => NOUNS[table][1].replace(/^./, (c) => c.toUpperCase());

/** "3 sites, 1 reflector, 2 photos" — tables with no rows left out; "nothing" when all are empty. */
export function formatCounts(counts: Partial<Record<BackupTable, number>>): string {
  const parts = BACKUP_TABLES.filter((t) => (counts[t] ?? 0) > 0).map((t) => countOf(t, counts[t] ?? 0));
  return parts.length ? parts.join(', ') : 'nothing';
}

/** Rows per table in a checked backup document. */
export const countsOf = (doc: BackupDocument): TableCounts =>
  Object.fromEntries(BACKUP_TABLES.map((t) => [t, (doc.tables[t] as unknown[] | undefined)?.length ?? 0])) as TableCounts;

/** "2027-07-02 12:00 UTC" */
export const utcMinute = (atMs: number): string => new Date(atMs).toISOString().slice(0, 16).replace('T', ' ') + ' UTC';

/** What the crew is about to restore or merge. */
export function describeBackup(doc: BackupDocument): string {
  const at = Date.parse(doc.exportedAtUtc);
  const when = Number.isFinite(at) ? utcMinute(at) : doc.exportedAtUtc;
  return `Backup made ${when} by Glintmark ${doc.app.version}. It holds ${formatCounts(countsOf(doc))}.`;
}

export const restoreSummary = (counts: TableCounts): string => `Restored ${formatCounts(counts)}.`;

export interface MergeRow {
  table: BackupTable;
  heading: string;
  added: number;
  updated: number;
  unchanged: number;
  localNewer: number;
  conflicts: number;
}

/** One row per table that the backup had rows for (or that has a conflict), in BACKUP_TABLES order. */
export function mergeRows(report: MergeReport): MergeRow[] {
  return BACKUP_TABLES.map((t) => {
    const r = report[t];
    return { table: t, heading: tableHeading(t), added: r.added, updated: r.updated, unchanged: r.unchanged, localNewer: r.localNewer, conflicts: r.conflicts.length };
  }).filter((r) => r.added + r.updated + r.unchanged + r.localNewer + r.conflicts > 0);
}

/** Every conflict of a merge, one line each: which record and what happened to it. */
export function mergeConflictLines(report: MergeReport): string[] {
  return BACKUP_TABLES.flatMap((t) => report[t].conflicts.map((c) => `${NOUNS[c.table][0]} ${c.id}: ${c.reason}`));
}

/** "Merged: 4 added, 1 updated, 20 unchanged, 2 newer on this phone, 1 conflict (listed below)." */
export function mergeSummary(report: MergeReport): string {
  const sum = (k: 'added' | 'updated' | 'unchanged' | 'localNewer') => BACKUP_TABLES.reduce((s, t) => s + report[t][k], 0);
  const conflicts = BACKUP_TABLES.reduce((s, t) => s + report[t].conflicts.length, 0);
  const c = conflicts === 0 ? 'no conflicts' : `${conflicts} conflict${conflicts === 1 ? '' : 's'} (listed below; both versions are kept)`;
  return `Merged: ${sum('added')} added, ${sum('updated')} updated, ${sum('unchanged')} unchanged, ${sum('localNewer')} newer on this phone, ${c}.`;
}

export interface DemoRemovalView {
  removed: string;
  kept: string[];
}

/** What a demo removal removed, and each demo record it kept because real records still point to it. */
export function demoRemovalView(report: DemoRemovalReport): DemoRemovalView {
  const counts = report.removed as Partial<Record<BackupTable, number>>;
  const total = Object.values(report.removed).reduce((s, n) => s + n, 0);
  return {
    removed: total === 0 ? 'There was no demo data to remove.' : `Removed ${formatCounts(counts)}.`,
    kept: report.kept.map((k) => `Kept the demo ${NOUNS[k.table][0]} ${k.id} because a real record uses it (${k.reason}).`),
  };
}
