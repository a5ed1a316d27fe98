/**
 * Push: send the records the outbox names to the team register, exactly once by construction.
 *
 * Each push carries a per-device number (1, 2, 3 …). Before the request goes out, the number and the outbox
 * entries it carries are stored as `inflight` (one transaction); a push that is cut off is sent again with the
 * SAME number and the same entries, so the register either applies it now or answers with its stored reply
 * (`duplicate`). Entries leave the outbox only in the transaction that records the register's acknowledgement.
 * A record is sent whole (its current row and every revision it has): the register keeps revisions by id, so
 * sending one twice never doubles it.
 *
 * Photos: the bytes go first, by hash (HEAD, then PUT when the register lacks them). A photo whose bytes cannot
 * be sent is left out of the push and stays in the outbox; the text records go anyway. Photo rows the register
 * defers (`deferredPhotos`) also stay.
 */
import { VERSIONED_TABLES, withoutBlob, type GlintmarkDb, type OutboxEntry, type PhotoRecord, type RevisionRecord, type VersionedTable } from '../data/index.ts';
import { SyncError, type Change, type PushRequest, type PushResponse, type RegisterClient } from './api.ts';
import { photoSha256 } from './sha256.ts';
import { conflictKey, getState, setState, type InflightPush, type KnownConflict, type PhotoProblem } from './state.ts';

export interface PushOptions {
  /** Records per push (default 200; a record's revisions travel with it). */
  batchSize?: number;
  nowMs?: () => number;
}

export interface PushResult {
  pushes: number;
  duplicates: number;
  sentRecords: number;
  /** Photos left in the outbox this time (bytes not sent, or deferred by the register). */
  deferredPhotos: string[];
  /** Records the register refused, with its words. */
  refused: { table: VersionedTable; id: string; message: string }[];
  conflicts: { table: string; id: string; reason: string }[];
}

const keyOf = (e: { table: string; recordId: string }) => `${e.table}:${e.recordId}`;
const tableOrder = (t: string) => VERSIONED_TABLES.indexOf(t as VersionedTable);

/** Register conflicts resolved on this phone that the register has not yet been told about. */
async function pendingResolutions(db: GlintmarkDb): Promise<{ conflictId: string; resolvedAtMs: number }[]> {
  const known = await db.syncState.where('key').startsWith('conflict:').toArray();
  const out: { conflictId: string; resolvedAtMs: number }[] = [];
  for (const k of known) {
    if ((k.value as KnownConflict).resolvedOnServerAtMs !== null) continue;
    const id = k.key.slice('conflict:'.length);
    const c = await db.conflicts.get(id);
    if (c?.resolvedAtMs != null) out.push({ conflictId: id, resolvedAtMs: c.resolvedAtMs });
  }
  return out;
}

/** Choose the next batch: whole records in outbox order, skipping those held back in this run or refused before. */
async function nextBatch(db: GlintmarkDb, skip: ReadonlySet<string>, batchSize: number): Promise<number[]> {
  const entries = await db.outbox.orderBy('seq').toArray();
  const byRecord = new Map<string, OutboxEntry[]>();
  for (const e of entries) {
    const k = keyOf(e);
    if (skip.has(k)) continue;
    byRecord.set(k, [...(byRecord.get(k) ?? []), e]);
  }
  const seqs: number[] = [];
  let records = 0;
  for (const list of byRecord.values()) {
    if (list.every((e) => e.refused !== undefined)) continue;
    if (records >= batchSize) break;
    records++;
    for (const e of list) seqs.push(e.seq as number);
  }
  return seqs;
}

interface Built {
  /** Records with no row any more (removed demo data) are left out; their entries are simply acknowledged. */
  body: PushRequest;
  photoProblems: PhotoProblem[];
  heldPhotos: Set<string>;
  records: Map<string, OutboxEntry[]>;
}

async function buildPush(db: GlintmarkDb, client: RegisterClient, inflight: InflightPush, nowMs: number, uploaded: Map<string, boolean>): Promise<Built> {
  const entries = (await db.outbox.bulkGet(inflight.seqs)).filter((e): e is OutboxEntry => e !== undefined);
  const records = new Map<string, OutboxEntry[]>();
  for (const e of entries) records.set(keyOf(e), [...(records.get(keyOf(e)) ?? []), e]);
  const changes: Change[] = [];
  const heldPhotos = new Set<string>();
  const photoProblems: PhotoProblem[] = [];
  const keys = [...records.keys()].sort((a, b) => tableOrder(a.split(':')[0]) - tableOrder(b.split(':')[0]));
  for (const k of keys) {
    const [table, id] = k.split(':') as [VersionedTable, string];
    const row = (await db.table(table).get(id)) as Record<string, unknown> | undefined;
    if (!row) continue;
    const revisions = (await db.revisions.where('[table+recordId]').equals([table, id]).toArray()).sort(
      (x: RevisionRecord, y: RevisionRecord) => x.rev - y.rev || x.atMs - y.atMs || x.id.localeCompare(y.id),
    );
    if (table === 'photos') {
      const photo = row as unknown as PhotoRecord;
      const sha256 = await photoSha256(photo);
      if (!uploaded.has(sha256)) {
        try {
          if (!(await client.hasPhoto(sha256))) await client.putPhoto(sha256, photo.blob, photo.mime);
          uploaded.set(sha256, true);
        } catch (e) {
          if (!(e instanceof SyncError) || e.kind !== 'refused') throw e;
          uploaded.set(sha256, false);
          photoProblems.push({ photoId: id, message: `The photo could not be sent: ${e.message}`, atMs: nowMs });
        }
      }
      if (uploaded.get(sha256) !== true) {
        heldPhotos.add(id);
        continue;
      }
      changes.push({ table, row: { ...withoutBlob(row), sha256 }, revisions });
    } else changes.push({ table, row, revisions });
  }
  const resolved: { conflictId: string; resolvedAtMs: number }[] = [];
  for (const conflictId of inflight.conflictIds) {
    const c = await db.conflicts.get(conflictId);
    if (c?.resolvedAtMs != null) resolved.push({ conflictId, resolvedAtMs: c.resolvedAtMs });
  }
  return { body: { pushId: inflight.pushId, changes, resolvedConflicts: resolved, elements: [] }, photoProblems, heldPhotos, records };
}

/** Remove the acknowledged entries (not those of photos held back) and clear `inflight`, in one transaction. */
async function acknowledge(db: GlintmarkDb, built: Built, res: PushResponse): Promise<string[]> {
  const deferred = new Set([...built.heldPhotos, ...(res.deferredPhotos ?? [])]);
  await db.transaction('rw', db.outbox, db.syncState, async () => {
    const done: number[] = [];
    for (const [k, list] of built.records) {
      const [table, id] = k.split(':');
      if (table === 'photos' && deferred.has(id)) continue;
      for (const e of list) done.push(e.seq as number);
    }
    await db.outbox.bulkDelete(done);
    for (const r of built.body.resolvedConflicts) {
      const known: KnownConflict = { resolvedOnServerAtMs: r.resolvedAtMs };
      await db.syncState.put({ key: conflictKey(r.conflictId), value: known });
    }
    await db.syncState.delete('inflight');
  });
  return [...deferred];
}

async function startPush(db: GlintmarkDb, seqs: number[], conflictIds: string[]): Promise<InflightPush> {
  return db.transaction('rw', db.syncState, async () => {
    const pushId = ((await getState(db, 'lastPushId')) ?? 0) + 1;
    const inflight: InflightPush = { pushId, seqs, conflictIds };
    await setState(db, 'lastPushId', pushId);
    await setState(db, 'inflight', inflight);
    return inflight;
  });
}

/**
 * Push everything waiting, batch by batch, until the outbox holds only what must wait (photos whose bytes did not
 * go, records the register refused). Throws SyncError when the register cannot be reached or refuses the sign-in;
 * whatever was acknowledged before stays acknowledged, the rest stays in the outbox.
 */
export async function pushOutbox(db: GlintmarkDb, client: RegisterClient, opts: PushOptions = {}): Promise<PushResult> {
  const now = opts.nowMs ?? Date.now;
  let batchSize = opts.batchSize ?? 200;
  const result: PushResult = { pushes: 0, duplicates: 0, sentRecords: 0, deferredPhotos: [], refused: [], conflicts: [] };
  const skip = new Set<string>();
  const uploaded = new Map<string, boolean>();
  const problems: PhotoProblem[] = [];
  let resolutionsSent = false;
  for (let guard = 0; guard < 100_000; guard++) {
    let inflight = await getState(db, 'inflight');
    if (!inflight) {
      const seqs = await nextBatch(db, skip, batchSize);
      const conflictIds = resolutionsSent ? [] : (await pendingResolutions(db)).map((r) => r.conflictId);
      resolutionsSent = true;
      if (seqs.length === 0 && conflictIds.length === 0) break;
      inflight = await startPush(db, seqs, conflictIds);
    }
    const built = await buildPush(db, client, inflight, now(), uploaded);
    problems.push(...built.photoProblems);
    let res: PushResponse;
    try {
      res = await client.push(built.body);
    } catch (e) {
      if (!(e instanceof SyncError) || e.kind !== 'refused') throw e;
      // Nothing of a refused batch was stored. Alone, the record is marked refused (until its next edit);
      // in a batch, each record is tried on its own so one bad row never holds back the others.
      await db.syncState.delete('inflight');
      if (built.records.size === 1) {
        const [k, list] = [...built.records][0];
        const [table, id] = k.split(':') as [VersionedTable, string];
        await db.outbox.bulkPut(list.map((x) => ({ ...x, refused: e.message })));
        result.refused.push({ table, id, message: e.message });
        skip.add(k);
      } else batchSize = 1;
      continue;
    }
    result.pushes++;
    if (res.duplicate) result.duplicates++;
    result.sentRecords += built.body.changes.length;
    for (const t of Object.values(res.report ?? {})) result.conflicts.push(...(t.conflicts ?? []));
    const deferred = await acknowledge(db, built, res);
    for (const p of deferred) {
      skip.add(`photos:${p}`);
      result.deferredPhotos.push(p);
    }
  }
  await setState(db, 'photoProblems', problems);
  return result;
}

/** Queue every record this phone holds (first sign-in to a register: records written before the outbox existed). */
export async function queueWholeLogbook(db: GlintmarkDb, nowMs: number): Promise<number> {
  return db.transaction('rw', [...VERSIONED_TABLES, 'outbox'], async () => {
    const pending = new Set((await db.outbox.toArray()).map(keyOf));
    const add: OutboxEntry[] = [];
    for (const table of VERSIONED_TABLES) {
      for (const id of (await db.table(table).toCollection().primaryKeys()) as string[]) {
        if (!pending.has(`${table}:${id}`)) add.push({ table, recordId: id, revisionId: null, atMs: nowMs });
      }
    }
    await db.outbox.bulkAdd(add);
    return add.length;
  });
}
