/**
 * Pull: bring the register's changes since the stored cursor, a page at a time. Each page is checked with the
 * backup schemas, its photo bytes fetched (and their hash checked) BEFORE the write, then applied in ONE Dexie
 * transaction that also stores the page's cursor, so the cursor moves only with a committed page. A page that
 * fails anywhere changes nothing and is fetched again next time.
 *
 * Per record (decideRecordMerge, the rule file merge uses):
 *  - a record this phone still has to push (in the outbox) stays as it is: the push brings it to the register,
 *    which decides, and the answer comes back in a later pull;
 *  - otherwise the register's version is taken when it is new or replaces ours; when the two diverged (or share
 *    a revision number with different content) the register's choice is taken too — made by its rules, never by
 *    a phone clock — and our version is kept as a conflict unless a register conflict already holds it;
 *  - ours is kept when it is newer and already contains the register's version.
 * Register conflicts are stored under the register's id, so resolving one anywhere settles it everywhere.
 */
import {
  deepEqual,
  decideRecordMerge,
  inHistory,
  markTransactionQuiet,
  mergeElementSets,
  rebuildSiteVisits,
  syncConflictIssues,
  syncElementIssues,
  syncRecordIssues,
  syncRevisionIssues,
  VERSIONED_TABLES,
  type ConflictRecord,
  type GlintmarkDb,
  type Issue,
  type MergeRow,
  type RevisionRecord,
  type TableMergeReport,
  type VersionedTable,
} from '../data/index.ts';
import { SyncError, type PullResponse, type RegisterClient } from './api.ts';
import { sha256Hex } from './sha256.ts';
import { conflictKey, getState, type KnownConflict } from './state.ts';

export interface PullOptions {
  /** Rows per page (default 500, the register's default; at most 2000). */
  limit?: number;
  nowMs?: () => number;
}

export interface PullResult {
  pages: number;
  applied: number;
  unchanged: number;
  /** Records left as they are because this phone still has to push them. */
  waitingToPush: number;
  conflicts: number;
  cursor: number;
}

const hasNoRow = (t: string) => !(VERSIONED_TABLES as readonly string[]).includes(t);

function checkPage(page: PullResponse): void {
  const issues: Issue[] = [];
  if (!page || !Array.isArray(page.changes) || !Array.isArray(page.conflicts) || typeof page.cursor !== 'number' || typeof page.more !== 'boolean') {
    throw new SyncError('bad-response', 'The register sent a pull page this app cannot read; nothing was changed. It will be tried again.');
  }
  page.changes.forEach((c, i) => {
    if (hasNoRow(c.table)) issues.push({ path: `changes[${i}].table`, message: `is not a record table (${String(c.table)})` });
    else issues.push(...syncRecordIssues(c.table, c.row, `changes[${i}].row`));
    if (!Array.isArray(c.revisions)) issues.push({ path: `changes[${i}].revisions`, message: 'must be a list' });
    else c.revisions.forEach((r, k) => issues.push(...syncRevisionIssues(r, `changes[${i}].revisions[${k}]`)));
  });
  page.conflicts.forEach((c, i) => issues.push(...syncConflictIssues(c, `conflicts[${i}]`)));
  (page.elements ?? []).forEach((e, i) => issues.push(...syncElementIssues(e, `elements[${i}]`)));
  if (issues.length) {
    const shown = issues.slice(0, 3).map((x) => `${x.path}: ${x.message}`).join('; ');
    throw new SyncError('bad-response', `The register sent records that do not pass the phone's checks, so nothing of that page was stored: ${shown}.`);
  }
}

/** Photo bytes the page needs, fetched and checked before the write transaction. */
async function fetchPhotoBytes(db: GlintmarkDb, client: RegisterClient, page: PullResponse): Promise<Map<string, Blob>> {
  const out = new Map<string, Blob>();
  for (const c of page.changes) {
    if (c.table !== 'photos') continue;
    const row = c.row as { id: string; sha256: string; mime: string };
    const local = await db.photos.get(row.id);
    if (local?.blob instanceof Blob && (await sha256Hex(local.blob)) === row.sha256) {
      out.set(row.id, local.blob);
      continue;
    }
    const got = await client.getPhoto(row.sha256);
    const bytes = await got.arrayBuffer();
    if ((await sha256Hex(bytes)) !== row.sha256) {
      throw new SyncError('bad-response', `A photo from the register arrived damaged (its bytes do not match its hash); nothing of that page was stored. It will be tried again.`);
    }
    out.set(row.id, new Blob([bytes], { type: row.mime }));
  }
  return out;
}

/** The stored row for a pulled one: photos get their bytes back (and keep their hash, schema 5). */
function storedRow(table: VersionedTable, row: Record<string, unknown>, blobs: Map<string, Blob>): MergeRow {
  if (table !== 'photos') return row as MergeRow;
  return { ...row, blob: blobs.get(row.id as string) } as unknown as MergeRow;
}

const comparable = (r: Record<string, unknown>) => {
  const { blob: _b, sha256: _s, dataBase64: _d, ...rest } = r;
  return rest;
};

async function applyPage(db: GlintmarkDb, page: PullResponse, blobs: Map<string, Blob>, nowMs: number, result: PullResult): Promise<void> {
  const scope = [...VERSIONED_TABLES, 'revisions', 'conflicts', 'elements', 'siteVisits', 'outbox', 'syncState'];
  await db.transaction('rw', scope, async (tx) => {
    markTransactionQuiet(tx.idbtrans);
    const pending = new Set((await db.outbox.toArray()).map((e) => `${e.table}:${e.recordId}`));
    const pageConflicts = page.conflicts;

    /** Is this version of the record already held by a register conflict (this page or stored)? */
    const covered = async (table: VersionedTable, row: Record<string, unknown>) => {
      const stored = await db.conflicts.where('[table+recordId]').equals([table, row.id as string]).toArray();
      return [...pageConflicts.filter((c) => c.table === table && c.recordId === row.id), ...stored].some((c) => deepEqual(comparable(c.other), comparable(row)));
    };
    const addRevisions = async (revs: readonly RevisionRecord[]) => {
      for (const r of revs) if (!(await db.revisions.get(r.id))) await db.revisions.add(r);
    };

    for (const change of page.changes) {
      const table = change.table;
      const incoming = storedRow(table, change.row, blobs);
      if (pending.has(`${table}:${incoming.id}`)) {
        result.waitingToPush++;
        continue;
      }
      const mine = (await db.table(table).get(incoming.id)) as MergeRow | undefined;
      const myRevs = mine ? await db.revisions.where('[table+recordId]').equals([table, incoming.id]).toArray() : [];
      const d = decideRecordMerge(mine, myRevs, incoming, change.revisions);
      if (d.action === 'unchanged' || (d.action === 'keep-local' && !d.diverged)) {
        await addRevisions(change.revisions);
        result.unchanged++;
        continue;
      }
      await db.table(table).put(incoming);
      await addRevisions(change.revisions);
      result.applied++;
      if (mine && d.action !== 'add' && !inHistory(mine, myRevs, change.revisions) && !(await covered(table, mine))) {
        const c: ConflictRecord = {
          id: crypto.randomUUID(),
          table,
          recordId: incoming.id,
          reason: `changed on this phone and in the team register; the register's revision ${incoming.rev} is now in the logbook and this phone's revision ${mine.rev} is kept here`,
          kept: 'incoming',
          other: mine,
          otherRevisions: [],
          detectedAtMs: nowMs,
          resolvedAtMs: null,
        };
        await db.conflicts.add(c);
        result.conflicts++;
      }
    }

    for (const c of pageConflicts) {
      const local = await db.conflicts.get(c.id);
      // Resolved here but not yet told to the register: keep our resolution (the push carries it).
      const resolvedAtMs = c.resolvedAtMs ?? local?.resolvedAtMs ?? null;
      await db.conflicts.put({ ...c, resolvedAtMs });
      const known: KnownConflict = { resolvedOnServerAtMs: c.resolvedAtMs };
      await db.syncState.put({ key: conflictKey(c.id), value: known });
      // A phone-only conflict holding the same version is now the register's: drop the duplicate.
      const same = await db.conflicts.where('[table+recordId]').equals([c.table, c.recordId]).toArray();
      for (const o of same) {
        if (o.id !== c.id && !(await db.syncState.get(conflictKey(o.id))) && deepEqual(comparable(o.other), comparable(c.other))) await db.conflicts.delete(o.id);
      }
      if (c.resolvedAtMs === null && !local) result.conflicts++;
    }

    const elementReport: TableMergeReport = { added: 0, updated: 0, unchanged: 0, localNewer: 0, conflicts: [] };
    await mergeElementSets(db, page.elements ?? [], elementReport, nowMs);
    await rebuildSiteVisits(db);
    await db.syncState.put({ key: 'cursor', value: page.cursor });
  });
}

/** Pull every page since the stored cursor. Throws SyncError; pages already applied stay applied. */
export async function pullAll(db: GlintmarkDb, client: RegisterClient, opts: PullOptions = {}): Promise<PullResult> {
  const now = opts.nowMs ?? Date.now;
  const limit = Math.min(2000, Math.max(1, opts.limit ?? 500));
  const result: PullResult = { pages: 0, applied: 0, unchanged: 0, waitingToPush: 0, conflicts: 0, cursor: (await getState(db, 'cursor')) ?? 0 };
  for (let guard = 0; guard < 1_000_000; guard++) {
    const since = (await getState(db, 'cursor')) ?? 0;
    const page = await client.pull(since, limit);
    checkPage(page);
    if (page.cursor < since) throw new SyncError('bad-response', 'The register answered with an older position than this phone already has; nothing was changed. Sign out and in again if it keeps happening.');
    const blobs = await fetchPhotoBytes(db, client, page);
    await applyPage(db, page, blobs, now(), result);
    result.pages++;
    result.cursor = page.cursor;
    if (!page.more) break;
  }
  return result;
}
