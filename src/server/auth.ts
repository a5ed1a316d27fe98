/**
 * Passwords and device tokens. Passwords are kept only as scrypt hashes (memory-hard; node:crypto, N=2^15, r=8,
 * p=1, 64-byte key: the parameters recommended for interactive logins in RFC 7914 section 2, Percival and
 * Josefsson 2016). A device token is `gmr1.<registerId>.<32 random bytes, base64url>`; only its SHA-256 is stored.
 */
import { createHash, randomBytes, scrypt, timingSafeEqual } from 'node:crypto';

const N = 2 ** 15;
const R = 8;
const P = 1;
const KEY_LEN = 64;
const MAXMEM = 64 * 1024 * 1024;

const scryptAsync = (password: string, salt: Buffer, n: number, r: number, p: number): Promise<Buffer> =>
  new Promise((resolve, reject) => scrypt(password.normalize('NFC'), salt, KEY_LEN, { N: n, r, p, maxmem: MAXMEM }, (e, k) => (e ? reject(e) : resolve(k))));

/** "scrypt$N$r$p$salt$hash" with base64url salt and hash. */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await scryptAsync(password, salt, N, R, P);
  return ['scrypt', N, R, P, salt.toString('base64url'), key.toString('base64url')].join('$');
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, n, r, p, salt, hash] = stored.split('$');
  if (scheme !== 'scrypt' || !salt || !hash) return false;
  const key = await scryptAsync(password, Buffer.from(salt, 'base64url'), Number(n), Number(r), Number(p));
  const want = Buffer.from(hash, 'base64url');
  return want.length === key.length && timingSafeEqual(want, key);
}

/** A hash to compare against when the email is unknown, so both failures take the same time. */
let decoy: Promise<string> | undefined;
export const decoyHash = (): Promise<string> => (decoy ??= hashPassword(randomBytes(12).toString('hex')));

export const TOKEN_PREFIX = 'gmr1';

export function newToken(registerId: string): string {
  return `${TOKEN_PREFIX}.${registerId}.${randomBytes(32).toString('base64url')}`;
}

export const tokenHash = (token: string): string => createHash('sha256').update(token, 'utf8').digest('hex');

/** The register a token names, or null when the token is not of this shape. */
export function tokenRegister(token: string): string | null {
  const m = /^gmr1\.([0-9a-f-]{36})\.[A-Za-z0-9_-]{43}$/.exec(token);
  return m ? m[1] : null;
}

export const MIN_PASSWORD_LENGTH = 10;

/** Failed sign-ins per key (email, client address) in a sliding minute; over the limit → wait. */
export class SignInLimiter {
  private readonly failures = new Map<string, number[]>();
  constructor(
    private readonly max = 5,
    private readonly windowMs = 60_000,
  ) {}
  /** Seconds to wait before another attempt, or 0 when allowed. */
  retryAfterS(keys: readonly string[], nowMs: number): number {
    let wait = 0;
    for (const k of keys) {
      const list = (this.failures.get(k) ?? []).filter((t) => t > nowMs - this.windowMs);
      this.failures.set(k, list);
      if (list.length >= this.max) wait = Math.max(wait, Math.ceil((list[0] + this.windowMs - nowMs) / 1000));
    }
    return wait;
  }
  fail(keys: readonly string[], nowMs: number): void {
    for (const k of keys) this.failures.set(k, [...(this.failures.get(k) ?? []), nowMs]);
  }
  succeed(email: string): void {
    this.failures.delete(email);
  }
}
