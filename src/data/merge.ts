/**
 * Merge a backup from another phone into this one, in ONE transaction, dropping nothing.
 *
 * Rows match by id. For each incoming row of sites … inspections and photos:
 *  - not here → added;
 *  - same content → unchanged (photos compare their bytes too: the same photo id arriving with other bytes is a
 *    conflict, ours kept, since photo bytes never change after creation);
 *  - higher rev → the incoming row replaces ours ("updated"); if our current version is not in the incoming
 *    history (both phones edited), ours is kept in the conflicts table and reported;
 *  - lower rev → ours stays ("localNewer"); if the incoming version is not in our history, it is kept as a conflict;
 *  - same rev, different content → ours stays and the incoming version is kept as a conflict.
 *    updatedAtMs is not used to pick a side: phone clocks drift, and a silent pick would drop an edit.
 * A live incoming site whose code is already used by another live local site is added under a free code
 * ("MF-01~2", written as a merge revision) and reported, so its children keep their parent.
 * Revisions are added when missing (rows are immutable; a differing row with the same id is a conflict);
 * the history of an incoming version that was not applied travels with its conflict row instead.
 * Orbital element sets (`elements`) merge by the rules in mergeElements.ts.
 */
import { readBackup } from './backup.ts';
import type { BackupTable } from './backup/format.ts';
import { BACKUP_TABLES } from './backup/format.ts';
import { documentLookup, linkIssues, referenceIssues, type BackupCheckOptions } from './backup/validate.ts';
import type { GlintmarkDb } from './db.ts';
import { deepEqual } from './equal.ts';
import { BackupError } from './errors.ts';
import { mergeElementSets } from './mergeElements.ts';
import { resolveContext, type WriteContext } from './repo/context.ts';
import { fillPhotoHashes } from './repo/photos.ts';
import { makeRevision } from './repo/revisions.ts';
import { liveSiteWithCode } from './repo/sites.ts';
import { rebuildSiteVisits } from './repo/siteVisits.ts';
import { VERSIONED_TABLES, type ConflictRecord, type RevisionRecord, type VersionedTable } from './types.ts';

export interface MergeConflict {
  table: BackupTable;
  id: string;
  reason: string;
}

export interface TableMergeReport {
  added: number;
  updated: number;
  unchanged: number;
  /** Ours was already newer and contains the incoming version in its history. */
  localNewer: number;
  conflicts: MergeConflict[];
}

export type MergeReport = Record<BackupTable, TableMergeReport>;

export type MergeOptions = WriteContext & Pick<BackupCheckOptions, 'maxPhotoBytes'>;

type Row = Record<string, unknown> & { id: string; rev: number; updatedAtMs: number; deletedAtMs: number | null };

const withoutBlob = (r: Record<string, unknown>) => {
  const { blob: _blob, ...rest } = r;
  return rest;
};

/** Whether two blobs hold the same bytes. */
async function sameBytes(a: Blob, b: Blob): Promise<boolean> {
  if (a.size !== b.size) return false;
  const [x, y] = await Promise.all([a.arrayBuffer(), b.arrayBuffer()]);
  const u = new Uint8Array(x);
  const w = new Uint8Array(y);
  for (let i = 0; i < u.length; i++) if (u[i] !== w[i]) return false;
  return true;
}

/** The revision that produced `row` (same rev and time), if the list has it. */
const headOf = (row: Row, revs: readonly RevisionRecord[]) => revs.find((r) => r.rev === row.rev && r.atMs === row.updatedAtMs);

/** Merge a backup archive (Blob) or a JSON backup (Blob, text or document); everything is checked before writing. */
export async function mergeBackup(db: GlintmarkDb, input: Blob | string | unknown, opts: MergeOptions): Promise<MergeReport> {
  const { by, nowMs } = resolveContext(opts);
  const { doc, rows } = await readBackup(input, { maxPhotoBytes: opts.maxPhotoBytes, checkReferences: false });
  // Photos stored before schema 5 get their hash first, so photos compare by their bytes' hash like any field.
  await fillPhotoHashes(db);
  const incomingRevs = new Map<string, RevisionRecord[]>();
  for (const r of doc.tables.revisions) incomingRevs.set(`${r.table}:${r.recordId}`, [...(incomingRevs.get(`${r.table}:${r.recordId}`) ?? []), r]);
  for (const list of incomingRevs.values()) list.sort((x, y) => x.rev - y.rev || x.atMs - y.atMs || x.id.localeCompare(y.id));
  const revsOf = (t: VersionedTable, id: string) => incomingRevs.get(`${t}:${id}`) ?? [];

  // Photo bytes are read before the transaction (a Blob read is not an IndexedDB request and would end it).
  // Photos are never changed after creation, so what is read here is what the transaction sees.
  const photosWithOtherBytes = new Set<string>();
  const incomingPhotos = rows.photos as { id: string; blob?: unknown }[];
  const localPhotos = await db.photos.bulkGet(incomingPhotos.map((p) => p.id));
  for (const [i, mine] of localPhotos.entries()) {
    const theirs = incomingPhotos[i].blob;
    if (mine && theirs instanceof Blob && !(await sameBytes(mine.blob, theirs))) photosWithOtherBytes.add(mine.id);
  }

  const report = Object.fromEntries(
    BACKUP_TABLES.map((t) => [t, { added: 0, updated: 0, unchanged: 0, localNewer: 0, conflicts: [] }]),
  ) as unknown as MergeReport;

  return db.transaction('rw', [...BACKUP_TABLES, 'siteVisits'], async () => {
    const local = new Map<BackupTable, Set<string>>();
    for (const t of BACKUP_TABLES) local.set(t, new Set((await db.table(t).toCollection().primaryKeys()) as string[]));
    const docIds = new Map(BACKUP_TABLES.map((t) => [t, new Set(rows[t].map((r) => r.id as string))]));
    const refs = referenceIssues(doc.tables, (t, id) => docIds.get(t)?.has(id) === true || local.get(t)?.has(id) === true);
    if (refs.length) throw new BackupError('dangling-reference', `The backup was not merged: ${refs[0].path} ${refs[0].message}.`, refs);
    // The repositories' link rules, each row checked against the file's rows, then this phone's (read before any write).
    const inDoc = documentLookup(doc.tables);
    const localRows = new Map<string, Map<string, Record<string, unknown>>>();
    for (const t of [...VERSIONED_TABLES]) localRows.set(t, new Map((await db.table(t).toArray()).map((r: Record<string, unknown>) => [r.id as string, r])));
    const links = linkIssues(doc.tables, (t, id) => inDoc(t, id) ?? localRows.get(t)?.get(id));
    if (links.length) {
      const shown = links.slice(0, 5).map((i) => `${i.path}: ${i.message}`).join('; ');
      throw new BackupError('dangling-reference', `The backup was not merged: some records are linked in a way this app never writes. ${shown}${links.length > 5 ? ` (and ${links.length - 5} more)` : ''}`, links);
    }

    const skipRevisionsOf = new Set<string>();
    const keepConflict = async (table: VersionedTable, recordId: string, kept: 'local' | 'incoming', other: Record<string, unknown>, otherRevisions: RevisionRecord[], reason: string) => {
      const existing = await db.conflicts.where('[table+recordId]').equals([table, recordId]).toArray();
      if (!existing.some((c) => deepEqual(withoutBlob(c.other), withoutBlob(other)))) {
        const c: ConflictRecord = { id: crypto.randomUUID(), table, recordId, reason, kept, other, otherRevisions, detectedAtMs: nowMs, resolvedAtMs: null };
        await db.conflicts.add(c);
      }
      report[table].conflicts.push({ table, id: recordId, reason });
    };

    /** Give a live incoming site a free code when its code is taken by another live local site. */
    const freeCode = async (site: Row): Promise<Row> => {
      if (site.deletedAtMs !== null) return site;
      const code = site.code as string;
      const other = await liveSiteWithCode(db, code, site.id);
      if (!other) return site;
      let n = 2;
      let candidate = `${code.slice(0, 28)}~${n}`;
      while (await liveSiteWithCode(db, candidate, site.id)) candidate = `${code.slice(0, 28)}~${++n}`;
      const renamed = { ...site, code: candidate, rev: site.rev + 1, updatedAtMs: nowMs };
      const changes = [{ field: 'code', before: code, after: candidate }];
      await db.revisions.add(makeRevision({ table: 'sites', recordId: site.id, rev: renamed.rev, atMs: nowMs, by, kind: 'update', changes }));
      const reason = `site code "${code}" is already used by local site ${other.id}; the incoming site was saved as "${candidate}". Rename or combine them.`;
      await keepConflict('sites', site.id, 'incoming', site, [], reason);
      return renamed;
    };

    for (const table of VERSIONED_TABLES) {
      const r = report[table];
      for (const incoming of rows[table] as Row[]) {
        const mine = (await db.table(table).get(incoming.id)) as Row | undefined;
        const theirRevs = revsOf(table, incoming.id);
        if (!mine) {
          await db.table(table).add(table === 'sites' ? await freeCode(incoming) : incoming);
          r.added++;
          continue;
        }
        if (table === 'photos' && photosWithOtherBytes.has(incoming.id)) {
          skipRevisionsOf.add(`${table}:${incoming.id}`);
          await keepConflict(table, incoming.id, 'local', incoming, theirRevs, 'the same photo arrived with different bytes (photos never change after they are taken); the local photo is kept');
          continue;
        }
        if (deepEqual(withoutBlob(mine), withoutBlob(incoming))) {
          r.unchanged++;
          continue;
        }
        if ('demo' in mine && incoming.demo !== mine.demo) {
          // Demo is a property of creation (repo/entity.ts): a version that flips it is never applied.
          skipRevisionsOf.add(`${table}:${incoming.id}`);
          await keepConflict(table, incoming.id, 'local', incoming, theirRevs, `the incoming version marks this record as ${incoming.demo === true ? 'demo data' : 'real data'}; whether a record is demo is set when it is created, so the local version is kept`);
          continue;
        }
        const myRevs = await db.revisions.where('[table+recordId]').equals([table, incoming.id]).toArray();
        if (incoming.rev > mine.rev) {
          const myHead = headOf(mine, myRevs);
          await db.table(table).put(table === 'sites' ? await freeCode(incoming) : incoming);
          r.updated++;
          if (!myHead || !theirRevs.some((x) => x.id === myHead.id)) {
            await keepConflict(table, incoming.id, 'incoming', mine, [], `edited on both phones: incoming revision ${incoming.rev} replaced local revision ${mine.rev}; the local version is kept here`);
          }
        } else if (incoming.rev < mine.rev) {
          const theirHead = headOf(incoming, theirRevs);
          if (theirHead && myRevs.some((x) => x.id === theirHead.id)) r.localNewer++;
          else {
            skipRevisionsOf.add(`${table}:${incoming.id}`);
            await keepConflict(table, incoming.id, 'local', incoming, theirRevs, `edited on both phones: local revision ${mine.rev} kept; the incoming revision ${incoming.rev} is not in its history`);
          }
        } else {
          skipRevisionsOf.add(`${table}:${incoming.id}`);
          await keepConflict(table, incoming.id, 'local', incoming, theirRevs, `revision ${mine.rev} differs between the phones; the local version is kept`);
        }
      }
    }

    for (const rev of doc.tables.revisions) {
      if (skipRevisionsOf.has(`${rev.table}:${rev.recordId}`)) continue;
      const mine = await db.revisions.get(rev.id);
      if (!mine) {
        await db.revisions.add(rev);
        report.revisions.added++;
      } else if (deepEqual(mine, rev)) report.revisions.unchanged++;
      else report.revisions.conflicts.push({ table: 'revisions', id: rev.id, reason: 'a history row with this id differs between the phones; the local row is kept' });
    }
    for (const c of rows.conflicts as unknown as ConflictRecord[]) {
      if (await db.conflicts.get(c.id)) report.conflicts.unchanged++;
      else {
        await db.conflicts.add(c);
        report.conflicts.added++;
      }
    }
    await mergeElementSets(db, doc.tables.elements, report.elements, nowMs);
    await rebuildSiteVisits(db);
    return report;
  });
}
