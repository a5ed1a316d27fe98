/**
 * The team register: every operation the HTTP handlers and the planner's `team` command need, each ONE
 * transaction, SQL with parameters only. Handlers stay thin: they validate and call one function here.
 *
 * Change numbers: `change_counter.n` is locked (SELECT … FOR UPDATE) at the start of every writing transaction,
 * so writes are serialised and each takes the next numbers; a reader's snapshot therefore never sees a number
 * while a smaller one is still uncommitted, which makes `pull?since=` gap-free.
 */
import { randomUUID } from 'node:crypto';
import { base64ToBytes } from '../data/base64.ts';
import { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, BACKUP_TABLES, photoRowSchema, type BackupDocument, type BackupTable } from '../data/backup/format.ts';
import { validateBackup } from '../data/backup/validate.ts';
import { CURRENT_SCHEMA_VERSION } from '../data/db.ts';
import { deepEqual } from '../data/equal.ts';
import { BackupError } from '../data/errors.ts';
import { decideElementMerge, decideRecordMerge, decideRevisionMerge, REVISION_CONFLICT_REASON, withoutBlob, type MergeRow } from '../data/mergeRules.ts';
import { makeRevision } from '../data/repo/revisions.ts';
import { VERSIONED_TABLES, type ConflictRecord, type ElementSetRecord, type RevisionRecord, type VersionedTable } from '../data/types.ts';
import { decoyHash, hashPassword, MIN_PASSWORD_LENGTH, newToken, tokenHash, tokenRegister, verifyPassword } from './auth.ts';
import { parsePush, type Batch, type Change, type PushBody, type Row } from './batch.ts';
import type { Database, Sql } from './db.ts';
import { badRequest, READ_ONLY, RegisterError } from './errors.ts';
import { migrate, schemaVersion, setUpGis } from './migrate.ts';
import { sha256Hex, type PhotoStore } from './photoStore.ts';

export const ROLES = ['lead', 'crew', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export interface Member {
  id: string;
  email: string;
  role: Role;
}

export interface Caller {
  member: Member;
  deviceId: string;
  registerId: string;
}

export interface TableReport {
  added: number;
  updated: number;
  unchanged: number;
  localNewer: number;
  conflicts: { table: string; id: string; reason: string }[];
}
export type PushReport = Record<BackupTable, TableReport>;

export interface PushResponse {
  pushId: number;
  duplicate: boolean;
  cursor: number;
  report: PushReport;
  deferredPhotos: string[];
}

export const DEFAULT_TOKEN_TTL_MS = 365 * 86_400_000;
/** A reflector is due for inspection when its last visit is older than this (common practice, no source). */
export const INSPECTION_INTERVAL_MS = 365 * 86_400_000;
/** Author written into the revision when the register renames a clashing site code. */
const REGISTER_AUTHOR = 'team register';

const emptyReport = (): PushReport =>
  Object.fromEntries(BACKUP_TABLES.map((t) => [t, { added: 0, updated: 0, unchanged: 0, localNewer: 0, conflicts: [] }])) as unknown as PushReport;

const EMAIL_RE = /^[^\s@]{1,64}@[^\s@]{1,255}$/;

/** Columns beside `doc` that each record table keeps for its queries. */
function columnsOf(table: VersionedTable, row: Row): Record<string, unknown> {
  const base = { id: row.id, rev: row.rev, updated_at_ms: row.updatedAtMs, deleted_at_ms: row.deletedAtMs };
  switch (table) {
    case 'sites':
      return { ...base, code: row.code };
    case 'reflectors':
      return { ...base, site_id: row.siteId };
    case 'geometries':
      return { ...base, site_id: row.siteId, reflector_id: row.reflectorId };
    case 'installations':
      return { ...base, site_id: row.siteId, reflector_id: row.reflectorId, installed_at_ms: row.installedAtMs };
    case 'inspections':
      return { ...base, site_id: row.siteId, reflector_id: row.reflectorId, inspected_at_ms: row.inspectedAtMs };
    case 'photos':
      return { ...base, owner_table: row.ownerTable, owner_id: row.ownerId, sha256: row.sha256, bytes: row.bytes };
  }
}

/** Upsert one record row with its change number. Table and column names come from the fixed list above. */
async function writeRow(tx: Sql, table: VersionedTable, row: Row, changeNo: number): Promise<void> {
  const cols = { ...columnsOf(table, row), doc: JSON.stringify(row), change_no: changeNo };
  const names = Object.keys(cols);
  const values = Object.values(cols);
  const marks = names.map((n, i) => (n === 'doc' ? `$${i + 1}::jsonb` : `$${i + 1}`));
  const set = names.filter((n) => n !== 'id').map((n) => `${n} = EXCLUDED.${n}`);
  await tx.query(`INSERT INTO ${table} (${names.join(', ')}) VALUES (${marks.join(', ')}) ON CONFLICT (id) DO UPDATE SET ${set.join(', ')}`, values);
}

const assertTable = (t: string): VersionedTable => {
  if (!(VERSIONED_TABLES as readonly string[]).includes(t)) throw new Error(`not a record table: ${t}`);
  return t as VersionedTable;
};

export interface RegisterOptions {
  photos: PhotoStore;
  /** Name given to a new register. */
  name?: string;
  tokenTtlMs?: number;
  nowMs?: () => number;
  /** Fault testing only: pause inside (before-commit) or right after (after-commit) a push's transaction. */
  faultPause?: { phase: 'before-commit' | 'after-commit'; ms: number };
}

export class Register {
  readonly photos: PhotoStore;
  private readonly now: () => number;
  private readonly tokenTtlMs: number;
  gis = false;

  private constructor(
    readonly db: Database,
    readonly id: string,
    readonly name: string,
    private readonly opts: RegisterOptions,
  ) {
    this.photos = opts.photos;
    this.now = opts.nowMs ?? Date.now;
    this.tokenTtlMs = opts.tokenTtlMs ?? DEFAULT_TOKEN_TTL_MS;
  }

  /** Apply migrations, create the register row on first start, set up PostGIS where present. */
  static async open(db: Database, opts: RegisterOptions): Promise<Register> {
    await migrate(db);
    const row = await db.transaction(async (tx) => {
      await tx.query('INSERT INTO register (id, name, created_at_ms) VALUES ($1, $2, $3) ON CONFLICT DO NOTHING', [randomUUID(), opts.name ?? 'Team register', Date.now()]);
      return (await tx.query<{ id: string; name: string }>('SELECT id, name FROM register')).rows[0];
    });
    const reg = new Register(db, row.id, row.name, opts);
    reg.gis = await setUpGis(db);
    return reg;
  }

  async info() {
    return { id: this.id, name: this.name, schemaVersion: await schemaVersion(this.db), serverTimeMs: this.now() };
  }

  // ---------------------------------------------------------------- members and devices

  async addMember(email: string, role: string, password: string): Promise<Member> {
    const e = email.trim();
    if (!EMAIL_RE.test(e)) throw badRequest('invalid-email', `"${email}" is not an email address.`);
    if (!(ROLES as readonly string[]).includes(role)) throw badRequest('invalid-role', `The role must be lead, crew or viewer, not "${role}".`);
    if (password.length < MIN_PASSWORD_LENGTH) throw badRequest('weak-password', `The password must have at least ${MIN_PASSWORD_LENGTH} characters.`);
    const hash = await hashPassword(password);
    return this.db.transaction(async (tx) => {
      await tx.query('SELECT n FROM change_counter FOR UPDATE');
      const leads = await tx.query<{ n: number }>("SELECT count(*)::int AS n FROM members WHERE removed_at_ms IS NULL AND role = 'lead'");
      if (leads.rows[0].n === 0 && role !== 'lead') throw new RegisterError(409, 'first-member-lead', 'The first member of a register must be a lead (who can then add crew and viewers).');
      const dup = await tx.query('SELECT id FROM members WHERE lower(email) = lower($1) AND removed_at_ms IS NULL', [e]);
      if (dup.rows.length) throw new RegisterError(409, 'member-exists', `${e} is already a member of this register.`);
      const m: Member = { id: randomUUID(), email: e, role: role as Role };
      await tx.query('INSERT INTO members (id, email, role, password_hash, created_at_ms) VALUES ($1, $2, $3, $4, $5)', [m.id, m.email, m.role, hash, this.now()]);
      return m;
    });
  }

  async listMembers(): Promise<(Member & { createdAtMs: number })[]> {
    const r = await this.db.query<{ id: string; email: string; role: Role; created_at_ms: number }>(
      'SELECT id, email, role, created_at_ms FROM members WHERE removed_at_ms IS NULL ORDER BY created_at_ms, email',
    );
    return r.rows.map((x) => ({ id: x.id, email: x.email, role: x.role, createdAtMs: Number(x.created_at_ms) }));
  }

  /** Remove a member and revoke every device token of theirs. The last lead cannot be removed. */
  async removeMember(id: string): Promise<void> {
    await this.db.transaction(async (tx) => {
      const m = await tx.query<{ role: Role }>('SELECT role FROM members WHERE id = $1 AND removed_at_ms IS NULL FOR UPDATE', [id]);
      if (!m.rows.length) throw new RegisterError(404, 'no-member', 'No such member in this register.');
      if (m.rows[0].role === 'lead') {
        const leads = await tx.query<{ n: number }>("SELECT count(*)::int AS n FROM members WHERE removed_at_ms IS NULL AND role = 'lead'");
        if (leads.rows[0].n <= 1) throw new RegisterError(409, 'last-lead', 'This is the register\'s only lead; add another lead before removing this one.');
      }
      const now = this.now();
      await tx.query('UPDATE members SET removed_at_ms = $2 WHERE id = $1', [id, now]);
      await tx.query('UPDATE devices SET revoked_at_ms = $2 WHERE member_id = $1 AND revoked_at_ms IS NULL', [id, now]);
    });
  }

  async signIn(email: string, password: string, deviceName: string, address: string) {
    const r = await this.db.query<{ id: string; email: string; role: Role; password_hash: string }>(
      'SELECT id, email, role, password_hash FROM members WHERE lower(email) = lower($1) AND removed_at_ms IS NULL',
      [email.trim()],
    );
    const m = r.rows[0];
    const ok = await verifyPassword(password, m?.password_hash ?? (await decoyHash()));
    if (!m || !ok) return null;
    const token = newToken(this.id);
    const device = { id: randomUUID(), name: deviceName };
    const now = this.now();
    await this.db.query(
      'INSERT INTO devices (id, member_id, name, token_sha256, created_at_ms, last_seen_at_ms, expires_at_ms, last_seen_address) VALUES ($1, $2, $3, $4, $5, $5, $6, $7)',
      [device.id, m.id, deviceName, tokenHash(token), now, now + this.tokenTtlMs, address],
    );
    return { token, member: { id: m.id, email: m.email, role: m.role }, device, register: { id: this.id, name: this.name } };
  }

  /** The caller a bearer token stands for; 401 with the contract's codes otherwise. */
  async authenticate(header: string | undefined, address: string): Promise<Caller> {
    const m = /^Bearer\s+(\S+)\s*$/i.exec(header ?? '');
    if (!m) throw new RegisterError(401, 'no-token', 'Sign in first: this request carries no sign-in token.');
    const token = m[1];
    const reg = tokenRegister(token);
    if (reg !== null && reg !== this.id) throw new RegisterError(401, 'foreign-token', 'This sign-in belongs to another team register.');
    const r = await this.db.query<{ id: string; member_id: string; email: string; role: Role; revoked_at_ms: number | null; expires_at_ms: number; removed_at_ms: number | null; last_seen_at_ms: number }>(
      `SELECT d.id, d.member_id, m.email, m.role, d.revoked_at_ms, d.expires_at_ms, m.removed_at_ms, d.last_seen_at_ms
       FROM devices d JOIN members m ON m.id = d.member_id WHERE d.token_sha256 = $1`,
      [tokenHash(token)],
    );
    const d = r.rows[0];
    if (!d) throw new RegisterError(401, reg === null ? 'no-token' : 'revoked-token', 'This sign-in is not known to the register (it was revoked or never issued). Sign in again.');
    if (d.revoked_at_ms !== null || d.removed_at_ms !== null) throw new RegisterError(401, 'revoked-token', 'This sign-in was revoked. Sign in again, or ask the team lead.');
    const now = this.now();
    if (Number(d.expires_at_ms) <= now) throw new RegisterError(401, 'expired-token', 'This sign-in has expired. Sign in again.');
    if (now - Number(d.last_seen_at_ms) > 60_000) {
      await this.db.query('UPDATE devices SET last_seen_at_ms = $2, last_seen_address = $3 WHERE id = $1', [d.id, now, address]);
    }
    return { member: { id: d.member_id, email: d.email, role: d.role }, deviceId: d.id, registerId: this.id };
  }

  async listDevices(caller: Caller) {
    const all = caller.member.role === 'lead';
    const r = await this.db.query<{ id: string; name: string; member_id: string; email: string; created_at_ms: number; last_seen_at_ms: number; revoked_at_ms: number | null; expires_at_ms: number; last_push_id: number }>(
      `SELECT d.id, d.name, d.member_id, m.email, d.created_at_ms, d.last_seen_at_ms, d.revoked_at_ms, d.expires_at_ms, d.last_push_id
       FROM devices d JOIN members m ON m.id = d.member_id WHERE ($1 OR d.member_id = $2) ORDER BY d.created_at_ms`,
      [all, caller.member.id],
    );
    return r.rows.map((d) => ({
      id: d.id,
      name: d.name,
      memberId: d.member_id,
      email: d.email,
      createdAtMs: Number(d.created_at_ms),
      lastSeenAtMs: Number(d.last_seen_at_ms),
      expiresAtMs: Number(d.expires_at_ms),
      revokedAtMs: d.revoked_at_ms === null ? null : Number(d.revoked_at_ms),
      lastPushId: Number(d.last_push_id),
      current: d.id === caller.deviceId,
    }));
  }

  async revokeDevice(caller: Caller, id: string): Promise<void> {
    const r = await this.db.query<{ member_id: string }>('SELECT member_id FROM devices WHERE id = $1', [id]);
    const d = r.rows[0];
    if (!d || (caller.member.role !== 'lead' && d.member_id !== caller.member.id)) throw new RegisterError(404, 'no-device', 'No such device among your sign-ins.');
    await this.db.query('UPDATE devices SET revoked_at_ms = $2 WHERE id = $1 AND revoked_at_ms IS NULL', [id, this.now()]);
  }

  // ---------------------------------------------------------------- push

  /** Apply one phone push exactly once (see the header of docs/register-api.md). */
  async push(caller: Caller, body: unknown): Promise<PushResponse> {
    if (caller.member.role === 'viewer') throw READ_ONLY();
    const push: PushBody = parsePush(body);
    const response = await this.db.transaction(async (tx) => {
      const counter = await tx.query<{ n: number }>('SELECT n FROM change_counter FOR UPDATE');
      const dev = await tx.query<{ last_push_id: number; last_push_response: PushResponse | null }>('SELECT last_push_id, last_push_response FROM devices WHERE id = $1 FOR UPDATE', [caller.deviceId]);
      const last = Number(dev.rows[0].last_push_id);
      if (push.pushId <= last) {
        const stored = dev.rows[0].last_push_response;
        const cursor = Number(counter.rows[0].n);
        return stored ? { ...stored, duplicate: true } : { pushId: push.pushId, duplicate: true, cursor, report: emptyReport(), deferredPhotos: [] };
      }
      const applied = await this.applyBatch(tx, Number(counter.rows[0].n), { ...push, conflicts: [] }, caller);
      const res: PushResponse = { pushId: push.pushId, duplicate: false, cursor: applied.cursor, report: applied.report, deferredPhotos: applied.deferredPhotos };
      await tx.query('UPDATE devices SET last_push_id = $2, last_push_response = $3::jsonb WHERE id = $1', [caller.deviceId, push.pushId, JSON.stringify(res)]);
      if (this.opts.faultPause?.phase === 'before-commit') await new Promise((r) => setTimeout(r, this.opts.faultPause?.ms));
      return res;
    });
    if (this.opts.faultPause?.phase === 'after-commit') await new Promise((r) => setTimeout(r, this.opts.faultPause?.ms));
    return response;
  }

  /**
   * The file-merge rules applied to a batch inside the caller's transaction (the counter row already locked at
   * `n`). Returns the report, the new counter value and the photo rows deferred for want of their bytes.
   */
  private async applyBatch(tx: Sql, n: number, batch: Batch, caller: Caller) {
    let next = n;
    const report = emptyReport();
    const now = this.now();
    const deferredPhotos: string[] = [];
    const changes: Change[] = [];
    for (const c of batch.changes) {
      if (c.table === 'photos' && !(await this.photos.has(String(c.row.sha256)))) deferredPhotos.push(c.row.id);
      else changes.push(c);
    }
    await this.checkReferences(tx, changes);

    const bumped = new Map<string, number>(); // "table:id" → change number given in this batch
    const bump = async (table: VersionedTable, row: Row) => {
      const key = `${table}:${row.id}`;
      const no = bumped.get(key) ?? ++next;
      bumped.set(key, no);
      await writeRow(tx, table, row, no);
    };
    const keepConflict = async (table: VersionedTable, recordId: string, kept: 'local' | 'incoming', other: Record<string, unknown>, otherRevisions: RevisionRecord[], reason: string) => {
      const existing = await tx.query<{ doc: ConflictRecord }>('SELECT doc FROM conflicts WHERE tbl = $1 AND record_id = $2', [table, recordId]);
      if (!existing.rows.some((c) => deepEqual(withoutBlob(c.doc.other), withoutBlob(other)))) {
        const c: ConflictRecord = { id: randomUUID(), table, recordId, reason, kept, other, otherRevisions, detectedAtMs: now, resolvedAtMs: null };
        await tx.query('INSERT INTO conflicts (id, tbl, record_id, doc, resolved_at_ms, change_no) VALUES ($1, $2, $3, $4::jsonb, NULL, $5)', [c.id, table, recordId, JSON.stringify(c), ++next]);
      }
      report[table].conflicts.push({ table, id: recordId, reason });
    };
    const freeCode = async (site: Row): Promise<Row> => {
      if (site.deletedAtMs !== null) return site;
      const code = String(site.code);
      const taken = async (c: string) =>
        (await tx.query<{ id: string }>('SELECT id FROM sites WHERE lower(code) = lower($1) AND deleted_at_ms IS NULL AND id <> $2 LIMIT 1', [c, site.id])).rows[0]?.id;
      const other = await taken(code);
      if (!other) return site;
      let k = 2;
      let candidate = `${code.slice(0, 28)}~${k}`;
      while (await taken(candidate)) candidate = `${code.slice(0, 28)}~${++k}`;
      const renamed = { ...site, code: candidate, rev: site.rev + 1, updatedAtMs: now };
      const rev = makeRevision({ table: 'sites', recordId: site.id, rev: renamed.rev, atMs: now, by: REGISTER_AUTHOR, kind: 'update', changes: [{ field: 'code', before: code, after: candidate }] });
      await this.insertRevision(tx, rev, caller, now);
      await keepConflict('sites', site.id, 'incoming', site, [], `site code "${code}" is already used by site ${other}; the incoming site was saved as "${candidate}". Rename or combine them.`);
      return renamed;
    };

    const skipRevisionsOf = new Set<string>();
    for (const table of VERSIONED_TABLES) {
      const mine = new Map<string, Row>();
      const ofTable = changes.filter((c) => c.table === table);
      if (!ofTable.length) continue;
      const ids = ofTable.map((c) => c.row.id);
      for (const r of (await tx.query<{ doc: Row }>(`SELECT doc FROM ${table} WHERE id = ANY($1::uuid[]) FOR UPDATE`, [ids])).rows) mine.set(r.doc.id, r.doc);
      const myRevs = new Map<string, RevisionRecord[]>();
      for (const r of (await tx.query<{ doc: RevisionRecord }>('SELECT doc FROM revisions WHERE tbl = $1 AND record_id = ANY($2::uuid[])', [table, ids])).rows) {
        myRevs.set(r.doc.recordId, [...(myRevs.get(r.doc.recordId) ?? []), r.doc]);
      }
      for (const c of ofTable) {
        const theirRevs = [...c.revisions].sort((x, y) => x.rev - y.rev || x.atMs - y.atMs || x.id.localeCompare(y.id));
        const m = mine.get(c.row.id);
        const d = decideRecordMerge(m as MergeRow | undefined, c.row as MergeRow, myRevs.get(c.row.id) ?? [], theirRevs);
        const r = report[table];
        if (d.action === 'add') {
          await bump(table, table === 'sites' ? await freeCode(c.row) : c.row);
          r.added++;
        } else if (d.action === 'unchanged') r.unchanged++;
        else if (d.action === 'replace') {
          await bump(table, table === 'sites' ? await freeCode(c.row) : c.row);
          r.updated++;
          if (d.conflict && m) await keepConflict(table, c.row.id, 'incoming', m, [], d.conflict.reason);
        } else if (d.action === 'local-newer') r.localNewer++;
        else {
          skipRevisionsOf.add(`${table}:${c.row.id}`);
          await keepConflict(table, c.row.id, 'local', c.row, theirRevs, d.conflict.reason);
        }
      }
    }

    // History rows: immutable, added when missing; who sent them is recorded beside them.
    const revs = changes.flatMap((c) => (skipRevisionsOf.has(`${c.table}:${c.row.id}`) ? [] : c.revisions));
    const existing = new Map<string, RevisionRecord>();
    for (let i = 0; i < revs.length; i += 1000) {
      const ids = revs.slice(i, i + 1000).map((r) => r.id);
      for (const r of (await tx.query<{ doc: RevisionRecord }>('SELECT doc FROM revisions WHERE id = ANY($1::uuid[])', [ids])).rows) existing.set(r.doc.id, r.doc);
    }
    const newHistoryOf = new Set<string>();
    for (const rev of revs) {
      const d = decideRevisionMerge(existing.get(rev.id), rev);
      if (d === 'add') {
        await this.insertRevision(tx, rev, caller, now);
        report.revisions.added++;
        newHistoryOf.add(`${rev.table}:${rev.recordId}`);
      } else if (d === 'unchanged') report.revisions.unchanged++;
      else report.revisions.conflicts.push({ table: 'revisions', id: rev.id, reason: REVISION_CONFLICT_REASON });
    }
    // A record whose history grew is sent again on pull, so every phone gets the new history rows.
    for (const key of newHistoryOf) {
      if (bumped.has(key)) continue;
      const [t, id] = key.split(':');
      const no = ++next;
      bumped.set(key, no);
      await tx.query(`UPDATE ${assertTable(t)} SET change_no = $2 WHERE id = $1`, [id, no]);
    }

    for (const c of batch.conflicts) {
      const got = await tx.query('SELECT id FROM conflicts WHERE id = $1', [c.id]);
      if (got.rows.length) report.conflicts.unchanged++;
      else {
        await tx.query('INSERT INTO conflicts (id, tbl, record_id, doc, resolved_at_ms, change_no) VALUES ($1, $2, $3, $4::jsonb, $5, $6)', [c.id, c.table, c.recordId, JSON.stringify(c), c.resolvedAtMs ?? null, ++next]);
        report.conflicts.added++;
      }
    }
    for (const rc of batch.resolvedConflicts) {
      const r = await tx.query('UPDATE conflicts SET resolved_at_ms = $2, doc = jsonb_set(doc, \'{resolvedAtMs}\', to_jsonb($2::bigint)), change_no = $3 WHERE id = $1 AND resolved_at_ms IS NULL RETURNING id', [rc.conflictId, rc.resolvedAtMs, next + 1]);
      if (r.rows.length) next++;
    }
    next = await this.mergeElements(tx, batch.elements, report.elements, next, now);
    await tx.query('UPDATE change_counter SET n = $1', [next]);
    return { report, cursor: next, deferredPhotos };
  }

  private async insertRevision(tx: Sql, rev: RevisionRecord, caller: Caller, now: number): Promise<void> {
    await tx.query(
      'INSERT INTO revisions (id, tbl, record_id, rev, at_ms, doc, received_from_member_id, received_from_device_id, received_at_ms) VALUES ($1, $2, $3, $4, $5, $6::jsonb, $7, $8, $9)',
      [rev.id, rev.table, rev.recordId, rev.rev, rev.atMs, JSON.stringify(rev), caller.member.id, caller.deviceId, now],
    );
  }

  /** Parents named by the batch must be in the batch or in the register (photo ids may still be on their way). */
  private async checkReferences(tx: Sql, changes: Change[]): Promise<void> {
    const inBatch = new Set(changes.map((c) => `${c.table}:${c.row.id}`));
    const need = new Map<VersionedTable, Map<string, string>>(); // table → id → path
    const want = (t: VersionedTable, id: unknown, path: string) => {
      if (typeof id !== 'string' || inBatch.has(`${t}:${id}`)) return;
      if (!need.has(t)) need.set(t, new Map());
      need.get(t)?.set(id, path);
    };
    changes.forEach((c, i) => {
      const r = c.row;
      const p = `changes[${i}] (${c.table} ${r.id})`;
      if (c.table === 'photos') want(r.ownerTable as VersionedTable, r.ownerId, `${p}.ownerId`);
      if (c.table !== 'sites' && c.table !== 'photos') want('sites', r.siteId, `${p}.siteId`);
      if (c.table === 'installations' || c.table === 'inspections' || c.table === 'geometries') if (r.reflectorId !== null) want('reflectors', r.reflectorId, `${p}.reflectorId`);
      if (c.table === 'installations') (r.geometryIds as string[]).forEach((g, k) => want('geometries', g, `${p}.geometryIds[${k}]`));
    });
    const issues: { path: string; message: string }[] = [];
    for (const [t, ids] of need) {
      const found = new Set((await tx.query<{ id: string }>(`SELECT id FROM ${t} WHERE id = ANY($1::uuid[])`, [[...ids.keys()]])).rows.map((r) => r.id));
      for (const [id, path] of ids) if (!found.has(id)) issues.push({ path, message: `points to ${t} ${id}, which is neither in this push nor in the register` });
    }
    if (issues.length) throw badRequest('dangling-reference', `Nothing was stored: ${issues.slice(0, 5).map((i) => `${i.path} ${i.message}`).join('; ')}.`, issues);
  }

  /** mergeElements.ts's rules, then one live set per catalogue number touched. Returns the counter. */
  private async mergeElements(tx: Sql, incoming: ElementSetRecord[], report: TableReport, n: number, now: number): Promise<number> {
    let next = n;
    const write = async (e: ElementSetRecord) =>
      tx.query(
        'INSERT INTO elements (id, rev, catalog_number, deleted_at_ms, doc, change_no) VALUES ($1, $2, $3, $4, $5::jsonb, $6) ON CONFLICT (id) DO UPDATE SET rev = EXCLUDED.rev, catalog_number = EXCLUDED.catalog_number, deleted_at_ms = EXCLUDED.deleted_at_ms, doc = EXCLUDED.doc, change_no = EXCLUDED.change_no',
        [e.id, e.rev, e.catalogNumber, e.deletedAtMs, JSON.stringify(e), ++next],
      );
    const touched = new Set<string>();
    for (const theirs of incoming) {
      const mine = (await tx.query<{ doc: ElementSetRecord }>('SELECT doc FROM elements WHERE id = $1 FOR UPDATE', [theirs.id])).rows[0]?.doc;
      touched.add(theirs.catalogNumber);
      const d = decideElementMerge(mine as (MergeRow & ElementSetRecord) | undefined, theirs as MergeRow & ElementSetRecord);
      if (d === 'add') {
        await write(theirs);
        report.added++;
      } else if (d === 'unchanged') report.unchanged++;
      else if (d === 'replace') {
        await write(theirs);
        if (mine) touched.add(mine.catalogNumber);
        report.updated++;
      } else if (d === 'local-newer') report.localNewer++;
      else {
        if (d === 'conflict-take-incoming') {
          await write(theirs);
          if (mine) touched.add(mine.catalogNumber);
        }
        const kept = d === 'conflict-take-incoming' ? 'the incoming set (later epoch)' : 'the local set';
        report.conflicts.push({ table: 'elements', id: theirs.id, reason: `element set ${theirs.catalogNumber} revision ${theirs.rev} differs between the phones; ${kept} is kept` });
      }
    }
    const better = (a: ElementSetRecord, b: ElementSetRecord) =>
      a.epochMs !== b.epochMs ? (a.epochMs > b.epochMs ? a : b) : a.updatedAtMs !== b.updatedAtMs ? (a.updatedAtMs > b.updatedAtMs ? a : b) : a.id < b.id ? a : b;
    for (const cat of touched) {
      const live = (await tx.query<{ doc: ElementSetRecord }>('SELECT doc FROM elements WHERE catalog_number = $1 AND deleted_at_ms IS NULL', [cat])).rows.map((r) => r.doc);
      if (live.length < 2) continue;
      const keep = live.reduce(better);
      for (const r of live) if (r.id !== keep.id) await write({ ...r, rev: r.rev + 1, updatedAtMs: now, deletedAtMs: now });
    }
    return next;
  }

  // ---------------------------------------------------------------- pull

  async pull(since: number, limit: number) {
    return this.db.transaction(
      async (tx) => {
        const n = Number((await tx.query<{ n: number }>('SELECT n FROM change_counter')).rows[0].n);
        const parts = [...VERSIONED_TABLES, 'conflicts', 'elements'].map((t) => `SELECT '${t}' AS t, doc, change_no FROM ${t} WHERE change_no > $1`);
        const rows = (await tx.query<{ t: string; doc: Record<string, unknown>; change_no: number }>(`${parts.join(' UNION ALL ')} ORDER BY change_no LIMIT $2`, [since, limit + 1])).rows;
        const more = rows.length > limit;
        const page = rows.slice(0, limit);
        const records = page.filter((r) => r.t !== 'conflicts' && r.t !== 'elements');
        const revsOf = new Map<string, RevisionRecord[]>();
        if (records.length) {
          const ids = records.map((r) => r.doc.id as string);
          for (const r of (await tx.query<{ doc: RevisionRecord }>('SELECT doc FROM revisions WHERE record_id = ANY($1::uuid[]) ORDER BY rev, at_ms, id', [ids])).rows) {
            const k = `${r.doc.table}:${r.doc.recordId}`;
            revsOf.set(k, [...(revsOf.get(k) ?? []), r.doc]);
          }
        }
        return {
          changes: records.map((r) => ({ table: r.t, row: r.doc, revisions: revsOf.get(`${r.t}:${String(r.doc.id)}`) ?? [] })),
          conflicts: page.filter((r) => r.t === 'conflicts').map((r) => r.doc),
          elements: page.filter((r) => r.t === 'elements').map((r) => r.doc),
          cursor: more ? Number(page[page.length - 1].change_no) : Math.max(n, since),
          more,
        };
      },
      { readOnly: true },
    );
  }

  // ---------------------------------------------------------------- office: backup in and out

  /** Merge a whole phone backup document (all or nothing); photo bytes go to the store first. */
  async importBackup(caller: Caller, input: unknown): Promise<PushReport> {
    if (caller.member.role === 'viewer') throw READ_ONLY();
    let doc: BackupDocument;
    try {
      doc = validateBackup(input, { checkReferences: false });
    } catch (e) {
      if (e instanceof BackupError) throw new RegisterError(400, e.kind, e.message, e.issues);
      throw e;
    }
    const revsOf = new Map<string, RevisionRecord[]>();
    for (const r of doc.tables.revisions) revsOf.set(`${r.table}:${r.recordId}`, [...(revsOf.get(`${r.table}:${r.recordId}`) ?? []), r]);
    const changes: Change[] = [];
    for (const t of VERSIONED_TABLES) {
      for (const raw of doc.tables[t] as unknown as Row[]) {
        let row = raw;
        if (t === 'photos') {
          const { dataBase64, ...rest } = raw as Row & { dataBase64: string };
          const bytes = base64ToBytes(dataBase64);
          const sha = sha256Hex(bytes);
          await this.photos.put(sha, bytes);
          row = { ...rest, sha256: sha } as Row;
        }
        changes.push({ table: t, row, revisions: revsOf.get(`${t}:${raw.id}`) ?? [] });
      }
    }
    const known = new Set(changes.map((c) => `${c.table}:${c.row.id}`));
    const orphans = doc.tables.revisions.filter((r) => !known.has(`${r.table}:${r.recordId}`));
    if (orphans.length) throw badRequest('dangling-reference', `Nothing was stored: ${orphans.length} history row(s) belong to records the backup does not hold (e.g. ${orphans[0].table} ${orphans[0].recordId}).`);
    const conflicts: Record<string, unknown>[] = [];
    for (const c of doc.tables.conflicts as unknown as Record<string, unknown>[]) conflicts.push({ ...c, other: await this.photoVersionIn(c.other as Record<string, unknown>) });
    return this.db.transaction(async (tx) => {
      const counter = await tx.query<{ n: number }>('SELECT n FROM change_counter FOR UPDATE');
      const applied = await this.applyBatch(tx, Number(counter.rows[0].n), { changes, resolvedConflicts: [], elements: doc.tables.elements, conflicts }, caller);
      return applied.report;
    });
  }

  /** A photo version kept in a conflict: bytes in a backup travel as base64; the register names them by hash. */
  private async photoVersionIn(other: Record<string, unknown>): Promise<Record<string, unknown>> {
    if (typeof other.dataBase64 !== 'string') return other;
    const { dataBase64, ...rest } = other;
    const bytes = base64ToBytes(dataBase64);
    const sha = sha256Hex(bytes);
    await this.photos.put(sha, bytes);
    return { ...rest, sha256: sha };
  }

  /** The whole register as a phone backup document (photo bytes included), from one consistent snapshot. */
  async exportBackup(appVersion: string): Promise<BackupDocument> {
    const tables = await this.db.transaction(
      async (tx) => {
        const out: Record<string, Record<string, unknown>[]> = {};
        for (const t of [...VERSIONED_TABLES, 'conflicts', 'elements']) out[t] = (await tx.query<{ doc: Record<string, unknown> }>(`SELECT doc FROM ${t} ORDER BY change_no`)).rows.map((r) => r.doc);
        out.revisions = (await tx.query<{ doc: Record<string, unknown> }>('SELECT doc FROM revisions ORDER BY tbl, record_id, rev, at_ms, id')).rows.map((r) => r.doc);
        return out;
      },
      { readOnly: true },
    );
    const keepSha = 'sha256' in photoRowSchema.entries;
    const photoOut = async (p: Record<string, unknown>) => {
      const { sha256, ...rest } = p;
      const bytes = await this.photos.get(String(sha256));
      return { ...rest, ...(keepSha ? { sha256 } : {}), dataBase64: Buffer.from(bytes).toString('base64') };
    };
    tables.photos = await Promise.all(tables.photos.map(photoOut));
    tables.conflicts = await Promise.all(
      tables.conflicts.map(async (c) => {
        const o = c.other as Record<string, unknown>;
        return typeof o.sha256 === 'string' && c.table === 'photos' && (await this.photos.has(o.sha256)) ? { ...c, other: await photoOut(o) } : c;
      }),
    );
    return {
      format: BACKUP_FORMAT,
      formatVersion: BACKUP_FORMAT_VERSION,
      exportedAtUtc: new Date(this.now()).toISOString(),
      app: { name: 'glintmark', version: appVersion, schemaVersion: CURRENT_SCHEMA_VERSION },
      tables: tables as unknown as BackupDocument['tables'],
    };
  }

  // ---------------------------------------------------------------- overview for the register page

  async overview() {
    return this.db.transaction(
      async (tx) => {
        const sites = (await tx.query<{ doc: Record<string, unknown> }>('SELECT doc FROM sites WHERE deleted_at_ms IS NULL ORDER BY code')).rows.map((r) => r.doc);
        const reflectors = (await tx.query<{ doc: Record<string, unknown> }>('SELECT doc FROM reflectors WHERE deleted_at_ms IS NULL ORDER BY site_id, doc->>\'label\'')).rows.map((r) => r.doc);
        const latestInst = new Map(
          (await tx.query<{ reflector_id: string; doc: Record<string, unknown> }>('SELECT DISTINCT ON (reflector_id) reflector_id, doc FROM installations WHERE deleted_at_ms IS NULL ORDER BY reflector_id, installed_at_ms DESC, id')).rows.map((r) => [r.reflector_id, r.doc]),
        );
        const latestInsp = new Map(
          (await tx.query<{ reflector_id: string; doc: Record<string, unknown> }>('SELECT DISTINCT ON (reflector_id) reflector_id, doc FROM inspections WHERE deleted_at_ms IS NULL ORDER BY reflector_id, inspected_at_ms DESC, id')).rows.map((r) => [r.reflector_id, r.doc]),
        );
        const openConflicts = (await tx.query<{ doc: Record<string, unknown> }>('SELECT doc FROM conflicts WHERE resolved_at_ms IS NULL ORDER BY change_no')).rows.map((r) => r.doc);
        const now = this.now();
        return {
          sites: sites.map((site) => ({
            site,
            reflectors: reflectors
              .filter((r) => r.siteId === site.id)
              .map((reflector) => {
                const latestInstallation = latestInst.get(reflector.id as string) ?? null;
                const latestInspection = latestInsp.get(reflector.id as string) ?? null;
                const lastVisit = Math.max(Number(latestInstallation?.installedAtMs ?? -Infinity), Number(latestInspection?.inspectedAtMs ?? -Infinity));
                return { reflector, latestInstallation, latestInspection, inspectionDue: latestInstallation !== null && now - lastVisit > INSPECTION_INTERVAL_MS };
              }),
          })),
          openConflicts,
        };
      },
      { readOnly: true },
    );
  }

  /** Live rows of one record table (for the exports). */
  async liveRows(table: VersionedTable): Promise<Record<string, unknown>[]> {
    return (await this.db.query<{ doc: Record<string, unknown> }>(`SELECT doc FROM ${assertTable(table)} WHERE deleted_at_ms IS NULL ORDER BY change_no`)).rows.map((r) => r.doc);
  }

  async close(): Promise<void> {
    await this.db.close();
  }
}
