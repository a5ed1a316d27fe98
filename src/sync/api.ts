/**
 * The team register's HTTP API v1 as the phone uses it (docs/register-api.md): request and response shapes, and
 * one small client over `fetch` that turns every failure into a SyncError with a plain sentence for the crew.
 */
import type { ConflictRecord, ElementSetRecord, RevisionRecord, VersionedTable } from '../data/index.ts';

export type Role = 'lead' | 'crew' | 'viewer';

export interface SessionResponse {
  token: string;
  member: { id: string; email: string; role: Role };
  device: { id: string; name: string };
  register: { id: string; name: string };
}

export interface Change {
  table: VersionedTable;
  row: Record<string, unknown>;
  revisions: RevisionRecord[];
}

export interface PushRequest {
  pushId: number;
  changes: Change[];
  resolvedConflicts: { conflictId: string; resolvedAtMs: number }[];
  elements: ElementSetRecord[];
}

export interface TableReport {
  added: number;
  updated: number;
  unchanged: number;
  localNewer: number;
  conflicts: { table: string; id: string; reason: string }[];
}

export interface PushResponse {
  pushId: number;
  duplicate: boolean;
  cursor: number;
  report: Record<string, TableReport>;
  deferredPhotos: string[];
}

export interface PullResponse {
  changes: Change[];
  conflicts: ConflictRecord[];
  elements: ElementSetRecord[];
  cursor: number;
  more: boolean;
}

export type SyncErrorKind =
  | 'offline'
  | 'not-a-register'
  | 'wrong-credentials'
  | 'signed-out'
  | 'revoked'
  | 'foreign-token'
  | 'read-only'
  | 'refused'
  | 'too-large'
  | 'rate-limited'
  | 'server-error'
  | 'bad-response';

/** Why a sync step failed, in words the crew can act on (`message`); `retryable` errors are retried with backoff. */
export class SyncError extends Error {
  override name = 'SyncError';
  constructor(
    readonly kind: SyncErrorKind,
    message: string,
    readonly status: number | null = null,
    readonly code: string | null = null,
    readonly retryAfterMs: number | null = null,
  ) {
    super(message);
  }
  get retryable(): boolean {
    return this.kind === 'offline' || this.kind === 'rate-limited' || this.kind === 'server-error' || this.kind === 'bad-response';
  }
}

export type FetchLike = (url: string, init?: RequestInit) => Promise<Response>;

interface ErrorBody {
  error?: { code?: unknown; message?: unknown };
}

/** Normalise a typed address ("register.example:7206", "http://10.0.0.5:7206/") to an origin without a trailing slash. */
export function normaliseServerUrl(typed: string): string {
  const t = typed.trim().replace(/\/+$/, '');
  if (t === '') throw new SyncError('not-a-register', 'Type the register address, for example http://192.168.1.20:7206.');
  const withScheme = /^[a-z][a-z0-9+.-]*:\/\//i.test(t) ? t : `http://${t}`;
  let u: URL;
  try {
    u = new URL(withScheme);
  } catch {
    throw new SyncError('not-a-register', `"${typed}" is not a web address; type it like http://192.168.1.20:7206.`);
  }
  if (u.protocol !== 'http:' && u.protocol !== 'https:') throw new SyncError('not-a-register', 'The register address must start with http:// or https://.');
  return `${u.origin}${u.pathname.replace(/\/+$/, '')}`;
}

async function errorFrom(res: Response): Promise<SyncError> {
  let code: string | null = null;
  let serverMessage = '';
  try {
    const body = (await res.json()) as ErrorBody;
    if (typeof body.error?.code === 'string') code = body.error.code;
    if (typeof body.error?.message === 'string') serverMessage = body.error.message;
  } catch {
    // not JSON: keep the status only
  }
  const s = res.status;
  const retryAfterS = Number(res.headers.get('Retry-After'));
  const retryAfterMs = Number.isFinite(retryAfterS) && retryAfterS > 0 ? retryAfterS * 1000 : null;
  if (s === 401) {
    if (code === 'wrong-credentials') return new SyncError('wrong-credentials', 'Wrong email or password. Check both and sign in again.', s, code);
    if (code === 'foreign-token') return new SyncError('foreign-token', 'This sign-in belongs to another team register. Sign out and sign in to this one.', s, code);
    if (code === 'revoked-token') return new SyncError('revoked', 'This phone was signed out by the team lead (its sign-in was revoked). Sign in again to keep syncing; nothing on the phone was lost.', s, code);
    return new SyncError('signed-out', 'The register no longer knows this sign-in. Sign in again; nothing on the phone was lost.', s, code);
  }
  if (s === 403) return new SyncError('read-only', 'Your role in the team register is viewer: you can read and export, but this phone’s records are not sent. Ask the team lead for a crew role.', s, code);
  if (s === 400 || s === 422 || s === 415) return new SyncError('refused', `The register refused a record: ${serverMessage || `status ${s}`}`, s, code);
  if (s === 413) return new SyncError('too-large', `The register refused a request as too large${serverMessage ? `: ${serverMessage}` : '.'}`, s, code);
  if (s === 429) return new SyncError('rate-limited', 'Too many attempts; the register asks to wait a moment before trying again.', s, code, retryAfterMs);
  if (s === 404) return new SyncError('not-a-register', 'Nothing at this address answers as a Glintmark team register. Check the address.', s, code);
  return new SyncError('server-error', `The register had a problem (status ${s})${serverMessage ? `: ${serverMessage}` : ''}. It will be tried again.`, s, code);
}

/** A client bound to one register address (and, once signed in, one token). */
export class RegisterClient {
  constructor(
    readonly baseUrl: string,
    private token: string | null = null,
    private readonly fetchFn: FetchLike = (url, init) => fetch(url, init),
  ) {}

  private async request(method: string, path: string, opts: { json?: unknown; body?: BodyInit; contentType?: string; auth?: boolean } = {}): Promise<Response> {
    const headers: Record<string, string> = {};
    if (opts.auth !== false && this.token) headers.Authorization = `Bearer ${this.token}`;
    let body: BodyInit | undefined = opts.body;
    if (opts.json !== undefined) {
      body = JSON.stringify(opts.json);
      headers['Content-Type'] = 'application/json; charset=utf-8';
    } else if (opts.contentType) headers['Content-Type'] = opts.contentType;
    let res: Response;
    try {
      res = await this.fetchFn(`${this.baseUrl}/api/v1${path}`, { method, headers, body });
    } catch {
      throw new SyncError('offline', 'No connection to the register (offline, or the address is not reachable). Records stay on the phone and go when the network is back.');
    }
    return res;
  }

  private async json<T>(res: Response): Promise<T> {
    if (!res.ok) throw await errorFrom(res);
    try {
      return (await res.json()) as T;
    } catch {
      throw new SyncError('bad-response', 'The register sent an answer this app cannot read. It will be tried again; if it keeps happening, check the address.', res.status);
    }
  }

  async signIn(email: string, password: string, deviceName: string): Promise<SessionResponse> {
    const r = await this.json<SessionResponse>(await this.request('POST', '/session', { json: { email, password, deviceName }, auth: false }));
    if (typeof r.token !== 'string' || typeof r.member?.role !== 'string' || typeof r.register?.id !== 'string') {
      throw new SyncError('bad-response', 'The register answered the sign-in in a form this app does not know.');
    }
    this.token = r.token;
    return r;
  }

  async signOut(): Promise<void> {
    const res = await this.request('DELETE', '/session');
    if (!res.ok && res.status !== 401) throw await errorFrom(res);
  }

  push(body: PushRequest): Promise<PushResponse> {
    return this.request('POST', '/push', { json: body }).then((r) => this.json<PushResponse>(r));
  }

  pull(since: number, limit: number): Promise<PullResponse> {
    return this.request('GET', `/pull?since=${since}&limit=${limit}`).then((r) => this.json<PullResponse>(r));
  }

  async hasPhoto(sha256: string): Promise<boolean> {
    const res = await this.request('HEAD', `/photos/${sha256}`);
    if (res.status === 200) return true;
    if (res.status === 404) return false;
    throw await errorFrom(res);
  }

  async putPhoto(sha256: string, blob: Blob, mime: string): Promise<void> {
    const res = await this.request('PUT', `/photos/${sha256}`, { body: blob, contentType: mime });
    if (!res.ok) throw await errorFrom(res);
  }

  async getPhoto(sha256: string): Promise<Blob> {
    const res = await this.request('GET', `/photos/${sha256}`);
    if (!res.ok) throw await errorFrom(res);
    return res.blob();
  }

  async download(path: string): Promise<Blob> {
    const res = await this.request('GET', path);
    if (!res.ok) throw await errorFrom(res);
    return res.blob();
  }
}
