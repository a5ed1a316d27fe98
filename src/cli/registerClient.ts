/** A small HTTP client of the team register for the planner's push and pull (sign in, call, sign out). */
import os from 'node:os';

export class RegisterRefusal extends Error {
  override readonly name = 'RegisterRefusal';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

async function call(url: string, init: RequestInit): Promise<Response> {
  let res: Response;
  try {
    res = await fetch(url, init);
  } catch (e) {
    const cause = (e as { cause?: { code?: string } }).cause?.code;
    throw new Error(`could not reach the register at ${new URL(url).origin}${cause ? ` (${cause})` : ''}`);
  }
  if (!res.ok) {
    let code = 'http-' + res.status;
    let message = `the register answered ${res.status} ${res.statusText}`;
    try {
      const b = (await res.json()) as { error?: { code?: string; message?: string } };
      if (b.error?.code) code = b.error.code;
      if (b.error?.message) message = b.error.message;
    } catch {
      /* not JSON: keep the status line */
    }
    throw new RegisterRefusal(res.status, code, message);
  }
  return res;
}

export async function withSession<T>(server: string, email: string, password: string, purpose: string, fn: (authed: (p: string, init?: RequestInit) => Promise<Response>) => Promise<T>): Promise<T> {
  const res = await call(`${server}/api/v1/session`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password, deviceName: `planner ${purpose} on ${os.hostname()}` }),
  });
  const { token } = (await res.json()) as { token: string };
  const authed = (p: string, init: RequestInit = {}) => call(`${server}/api/v1${p}`, { ...init, headers: { ...(init.headers as Record<string, string>), Authorization: `Bearer ${token}` } });
  try {
    return await fn(authed);
  } finally {
    await authed('/session', { method: 'DELETE' }).catch(() => undefined);
  }
}
