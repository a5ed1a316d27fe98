/** Shared by the planner's register commands: the password from standard input and the register's location. */
import path from 'node:path';
import type { Args } from './args.ts';
import { UsageError } from './args.ts';

/** Read all of standard input; one trailing line break is not part of the password. */
export async function readPasswordStdin(stdin: NodeJS.ReadableStream = process.stdin): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const c of stdin) chunks.push(Buffer.isBuffer(c) ? c : Buffer.from(String(c)));
  const text = Buffer.concat(chunks).toString('utf8').replace(/\r?\n$/, '');
  if (!text) throw new UsageError('no password on standard input (pipe it in: printf %s "$PASSWORD" | glintmark …)');
  return text;
}

export interface RegisterLocation {
  databaseUrl?: string;
  dataDir: string;
}

export const DEFAULT_DATA_DIR = './glintmark-register';

/** --database-url (or DATABASE_URL) for a PostgreSQL server, else --data DIR for the embedded engine. */
export function readLocation(args: Args): RegisterLocation {
  const databaseUrl = args.optString('database-url') ?? (process.env.DATABASE_URL || undefined);
  const data = args.optString('data');
  if (args.has('database-url') && data !== undefined) throw new UsageError('give either --database-url or --data, not both');
  if (databaseUrl !== undefined && !/^postgres(ql)?:\/\//.test(databaseUrl)) throw new UsageError('--database-url must start with postgres:// or postgresql://');
  return { databaseUrl, dataDir: path.resolve(data ?? DEFAULT_DATA_DIR) };
}

/** The base address of a register server, checked (http or https, no path beyond /). */
export function readServer(args: Args): string {
  const s = args.string('server');
  let u: URL;
  try {
    u = new URL(s);
  } catch {
    throw new UsageError(`--server must be an address such as http://192.168.1.20:7100, got "${s}"`);
  }
  if (u.protocol !== 'http:' && u.protocol !== 'https:') throw new UsageError('--server must start with http:// or https://');
  return u.origin;
}
