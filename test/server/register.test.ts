/**
 * The team register against a real PostgreSQL server (throwaway cluster from pg-global-setup.ts): sign-in, push
 * exactly once, pull, photos, refusals that change nothing, and text stored verbatim.
 */
import { createHash, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningRegister } from '../../src/server/start.ts';
import { api, freshDatabaseUrl, PASSWORD, startTestRegister } from './helpers.ts';

let reg: RunningRegister;
let base: string;
const tokens: Record<string, string> = {};

const T0 = Date.UTC(2027, 6, 2, 12);
const INJECTION = `'); DROP TABLE sites; -- <script>alert("x")</script> \\ "quoted" ${'$1'} 😀`;

function site(code: string, extra: Record<string, unknown> = {}) {
  const id = randomUUID();
  const row = {
    id, rev: 1, createdAtMs: T0, updatedAtMs: T0, deletedAtMs: null,
    code, name: 'North field', latDeg: 52.1, lonDeg: -3.4, heightEllM: 310.5, positionSource: 'typed', positionAccuracyM: null,
    referenceFrame: 'WGS84', frameEpoch: null, notes: '', demo: false, ...extra,
  };
  const { id: _i, rev: _r, createdAtMs: _c, updatedAtMs: _u, deletedAtMs: _d, ...snapshot } = row;
  const revision = { id: randomUUID(), table: 'sites', recordId: id, rev: 1, atMs: T0, by: 'crew A', kind: 'create', changes: [], snapshot, cascadeOf: null };
  return { row, revision };
}

/** A 1×1 PNG (ISO/IEC 15948 signature + IHDR … IEND), made by hand. */
const PNG = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000' + '1f15c4890000000d49444154789c6360000000000500010d0a2db40000000049454e44ae426082', 'hex');
const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

async function count(table: string): Promise<number> {
  const r = await reg.register.db.query<{ n: number }>(`SELECT count(*)::int AS n FROM ${table}`);
  return r.rows[0].n;
}

/** A hash of every register table's rows, to show a refused request changed nothing. */
async function registerHash(): Promise<string> {
  const h = createHash('sha256');
  for (const t of ['sites', 'reflectors', 'geometries', 'installations', 'inspections', 'photos', 'revisions', 'conflicts', 'elements', 'change_counter']) {
    const r = await reg.register.db.query(`SELECT to_jsonb(x) AS j FROM ${t} x ORDER BY 1`);
    h.update(JSON.stringify(r.rows));
  }
  return h.digest('hex');
}

beforeAll(async () => {
  reg = await startTestRegister(await freshDatabaseUrl());
  base = reg.url;
  await reg.register.addMember('lead@example.org', 'lead', PASSWORD);
  await reg.register.addMember('crew@example.org', 'crew', PASSWORD);
  await reg.register.addMember('viewer@example.org', 'viewer', PASSWORD);
  for (const who of ['lead', 'crew', 'viewer']) {
    const s = await api(base, '/session', { body: { email: `${who}@example.org`, password: PASSWORD, deviceName: `${who} phone` } });
    tokens[who] = s.json.token as string;
  }
  tokens.crew2 = (await api(base, '/session', { body: { email: 'crew@example.org', password: PASSWORD, deviceName: 'second phone' } })).json.token as string;
});
afterAll(async () => {
  await reg?.close();
});

describe('sign-in', () => {
  it('refuses a wrong password and an unknown email with the same answer', async () => {
    const a = await api(base, '/session', { body: { email: 'crew@example.org', password: 'wrong password!', deviceName: 'x' } });
    const b = await api(base, '/session', { body: { email: 'nobody@example.org', password: 'wrong password!', deviceName: 'x' } });
    expect(a.status).toBe(401);
    expect(b.status).toBe(401);
    expect(a.json.error).toEqual(b.json.error);
  });
  it('refuses missing, foreign and revoked tokens', async () => {
    expect((await api(base, '/pull')).json.error?.code).toBe('no-token');
    const foreign = `gmr1.${randomUUID()}.${'A'.repeat(43)}`;
    expect((await api(base, '/pull', { token: foreign })).json.error?.code).toBe('foreign-token');
    const s = await api(base, '/session', { body: { email: 'crew@example.org', password: PASSWORD, deviceName: 'lost phone' } });
    const t = s.json.token as string;
    expect((await api(base, '/session', { method: 'DELETE', token: t })).status).toBe(200);
    const after = await api(base, '/pull', { token: t });
    expect(after.status).toBe(401);
    expect(after.json.error?.code).toBe('revoked-token');
  });
  it('rate-limits repeated failures with Retry-After', async () => {
    let last = 0;
    for (let i = 0; i < 6; i++) last = (await api(base, '/session', { body: { email: 'lead@example.org', password: 'not the password', deviceName: 'x' } })).status;
    expect(last).toBe(429);
  });
});

describe('push and pull', () => {
  it('stores a push once, answers a repeat from the stored response, and pull returns row and history', async () => {
    const s = site('MF-01');
    const body = { pushId: 1, changes: [{ table: 'sites', row: s.row, revisions: [s.revision] }] };
    const first = await api(base, '/push', { token: tokens.crew, body });
    expect(first.status).toBe(200);
    expect((first.json.report as Record<string, { added: number }>).sites.added).toBe(1);
    const before = await registerHash();
    const again = await api(base, '/push', { token: tokens.crew, body });
    expect(again.json.duplicate).toBe(true);
    expect(again.json.report).toEqual(first.json.report);
    expect(await registerHash()).toBe(before);
    const p = await api(base, '/pull?since=0', { token: tokens.viewer });
    const changes = p.json.changes as { table: string; row: { id: string }; revisions: unknown[] }[];
    const got = changes.find((c) => c.row.id === s.row.id);
    expect(got?.row).toEqual(s.row);
    expect(got?.revisions).toEqual([s.revision]);
    const r = await reg.register.db.query<{ received_from_device_id: string }>('SELECT received_from_device_id FROM revisions WHERE id = $1', [s.revision.id]);
    expect(r.rows).toHaveLength(1);
    const later = await api(base, `/pull?since=${String(p.json.cursor)}`, { token: tokens.viewer });
    expect(later.json.changes).toEqual([]);
  });

  it('keeps diverged edits from two phones as a conflict with a stable id', async () => {
    const s = site('MF-02');
    await api(base, '/push', { token: tokens.crew, body: { pushId: 2, changes: [{ table: 'sites', row: s.row, revisions: [s.revision] }] } });
    const edit = (name: string) => {
      const row = { ...s.row, rev: 2, updatedAtMs: T0 + 1000, name };
      const rev = { id: randomUUID(), table: 'sites', recordId: s.row.id, rev: 2, atMs: T0 + 1000, by: 'crew', kind: 'update', changes: [{ field: 'name', before: s.row.name, after: name }], snapshot: null, cascadeOf: null };
      return { table: 'sites', row, revisions: [s.revision, rev] };
    };
    await api(base, '/push', { token: tokens.crew, body: { pushId: 3, changes: [edit('Edited on phone one')] } });
    const second = await api(base, '/push', { token: tokens.crew2, body: { pushId: 1, changes: [edit('Edited on phone two')] } });
    const rep = second.json.report as Record<string, { conflicts: unknown[] }>;
    expect(rep.sites.conflicts).toHaveLength(1);
    const p = await api(base, '/pull?since=0', { token: tokens.crew });
    const conflicts = p.json.conflicts as { id: string; recordId: string; other: { name: string } }[];
    const c = conflicts.find((x) => x.recordId === s.row.id);
    expect(c?.other.name).toBe('Edited on phone two');
    await api(base, '/push', { token: tokens.crew, body: { pushId: 4, changes: [], resolvedConflicts: [{ conflictId: c?.id, resolvedAtMs: T0 + 5000 }] } });
    const open = (await api(base, '/overview', { token: tokens.viewer })).json.openConflicts as { id: string }[];
    expect(open.map((x) => x.id)).not.toContain(c?.id);
  });

  it('stores injection strings verbatim in text fields', async () => {
    const s = site('MF-03', { name: INJECTION, notes: INJECTION, referenceFrame: 'ITRF2020' });
    const r = await api(base, '/push', { token: tokens.crew, body: { pushId: 5, changes: [{ table: 'sites', row: s.row, revisions: [{ ...s.revision, by: INJECTION }] }] } });
    expect(r.status).toBe(200);
    const row = (await reg.register.db.query<{ doc: { name: string; notes: string } }>('SELECT doc FROM sites WHERE id = $1', [s.row.id])).rows[0].doc;
    expect(row.name).toBe(INJECTION);
    expect(row.notes).toBe(INJECTION);
    expect(await count('sites')).toBe(3);
  });
});

describe('refusals change nothing', () => {
  it('viewer, unknown field, out-of-range value, malformed JSON, oversized body', async () => {
    const before = await registerHash();
    const s = site('MF-09');
    const ok = { pushId: 50, changes: [{ table: 'sites', row: s.row, revisions: [s.revision] }] };
    const viewer = await api(base, '/push', { token: tokens.viewer, body: ok });
    expect([viewer.status, viewer.json.error?.code]).toEqual([403, 'read-only-member']);
    const unknown = await api(base, '/push', { token: tokens.crew, body: { ...ok, extra: 1 } });
    expect(unknown.status).toBe(400);
    const unknownRowField = await api(base, '/push', { token: tokens.crew, body: { pushId: 50, changes: [{ table: 'sites', row: { ...s.row, colour: 'red' }, revisions: [] }] } });
    expect(unknownRowField.status).toBe(400);
    const range = await api(base, '/push', { token: tokens.crew, body: { pushId: 50, changes: [{ table: 'sites', row: { ...s.row, latDeg: 95 }, revisions: [] }] } });
    expect(range.status).toBe(400);
    const malformed = await api(base, '/push', { token: tokens.crew, body: '{"pushId": 50, "changes": [' });
    expect([malformed.status, malformed.json.error?.code]).toEqual([400, 'malformed-json']);
    const big = await api(base, '/push', { token: tokens.crew, body: JSON.stringify({ pushId: 50, changes: [], pad: 'x'.repeat(17 * 1024 * 1024) }) });
    expect(big.status).toBe(413);
    expect(await registerHash()).toBe(before);
  });
});

describe('photos', () => {
  it('refuses non-images and wrong hashes, stores by hash, and defers rows whose bytes are missing', async () => {
    const text = Buffer.from('not a picture at all');
    expect((await api(base, `/photos/${sha(text)}`, { method: 'PUT', token: tokens.crew, raw: text })).status).toBe(415);
    expect((await api(base, `/photos/${sha(text)}`, { method: 'PUT', token: tokens.crew, raw: PNG, type: 'image/png' })).status).toBe(422);
    expect((await api(base, `/photos/${sha(PNG)}`, { method: 'HEAD', token: tokens.crew })).status).toBe(404);
    expect((await api(base, `/photos/${sha(PNG)}`, { method: 'PUT', token: tokens.crew, raw: PNG, type: 'image/png' })).status).toBe(201);
    expect((await api(base, `/photos/${sha(PNG)}`, { method: 'PUT', token: tokens.crew, raw: PNG, type: 'image/png' })).status).toBe(200);
    const res = await fetch(`${base}/api/v1/photos/${sha(PNG)}`, { headers: { Authorization: `Bearer ${tokens.viewer}` } });
    expect(Buffer.from(await res.arrayBuffer()).equals(PNG)).toBe(true);
  });
});
