/**
 * The register's connection to PostgreSQL: a `pg` pool for a PostgreSQL 15+ server (`--database-url`), or the
 * embedded engine (PGlite, a WebAssembly build of PostgreSQL) in a data folder. Both speak the same SQL with
 * `$1` parameters; every query in the server goes through `Sql.query` with parameters, never spliced text.
 */
import { mkdirSync, openSync, closeSync, readFileSync, writeFileSync, unlinkSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';

export interface Sql {
  query<R = Record<string, unknown>>(text: string, params?: readonly unknown[]): Promise<{ rows: R[] }>;
  /** Several statements without parameters (migration files only). */
  exec(script: string): Promise<void>;
}

export interface Database extends Sql {
  /** Run `fn` in ONE transaction: committed when it resolves, rolled back when it throws. */
  transaction<T>(fn: (tx: Sql) => Promise<T>, opts?: { readOnly?: boolean }): Promise<T>;
  close(): Promise<void>;
  readonly kind: 'postgresql' | 'embedded';
}

// int8 (change numbers, times in ms) as JavaScript numbers: every value we store is below 2^53.
pg.types.setTypeParser(20, (s: string) => Number(s));

export function openPostgres(url: string, max = 10): Database {
  const pool = new pg.Pool({ connectionString: url, max });
  pool.on('error', () => {
    /* a connection that died while idle is replaced by the pool; the next query reports real trouble */
  });
  return {
    kind: 'postgresql',
    query: async (text, params) => {
      const r = await pool.query(text, params as unknown[]);
      return { rows: r.rows };
    },
    async transaction(fn, opts) {
      const client = await pool.connect();
      try {
        await client.query(opts?.readOnly ? 'BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY' : 'BEGIN');
        const tx: Sql = {
          query: async (text, params) => ({ rows: (await client.query(text, params as unknown[])).rows }),
          exec: async (script) => {
            await client.query(script);
          },
        };
        const out = await fn(tx);
        await client.query('COMMIT');
        return out;
      } catch (e) {
        await client.query('ROLLBACK').catch(() => undefined);
        throw e;
      } finally {
        client.release();
      }
    },
    exec: async (script) => {
      await pool.query(script);
    },
    close: () => pool.end(),
  };
}

/** One process at a time may open an embedded data folder: a lock file holding the owner's pid. */
function lockFolder(dir: string): () => void {
  const file = path.join(dir, 'register.lock');
  try {
    const fd = openSync(file, 'wx');
    writeFileSync(fd, String(process.pid));
    closeSync(fd);
  } catch {
    const pid = Number(readFileSync(file, 'utf8'));
    let alive = false;
    try {
      if (pid > 0 && pid !== process.pid) {
        process.kill(pid, 0);
        alive = true;
      }
    } catch {
      alive = false;
    }
    if (alive) throw new Error(`the register in ${dir} is open in another running process (pid ${pid}); stop it first, or use the server's HTTP API`);
    writeFileSync(file, String(process.pid));
  }
  return () => {
    try {
      unlinkSync(file);
    } catch {
      /* already gone */
    }
  };
}

/** The embedded default: PGlite in `<dir>/pg`. Queries and transactions run one at a time (a single session). */
export async function openEmbedded(dir: string): Promise<Database> {
  mkdirSync(dir, { recursive: true });
  const unlock = lockFolder(dir);
  try {
    const { PGlite } = await import('@electric-sql/pglite');
    const db = new PGlite(path.join(dir, 'pg'));
    await db.waitReady;
    let queue: Promise<unknown> = Promise.resolve();
    const serial = <T>(job: () => Promise<T>): Promise<T> => {
      const run = queue.then(job, job);
      queue = run.catch(() => undefined);
      return run;
    };
    return {
      kind: 'embedded',
      query: (text, params) => serial(async () => ({ rows: (await db.query(text, params as unknown[])).rows as never[] })),
      exec: (script) => serial(async () => {
        await db.exec(script);
      }),
      transaction: (fn) =>
        serial(() =>
          db.transaction(async (t) =>
            fn({
              query: async (text, params) => ({ rows: (await t.query(text, params as unknown[])).rows as never[] }),
              exec: async (script) => {
                await t.exec(script);
              },
            }),
          ),
        ),
      async close() {
        await queue;
        await db.close();
        unlock();
      },
    };
  } catch (e) {
    unlock();
    throw e;
  }
}

/** `--database-url` / DATABASE_URL when given, else the embedded engine in `dataDir`. */
export async function openDatabase(opts: { databaseUrl?: string; dataDir: string }): Promise<Database> {
  return opts.databaseUrl ? openPostgres(opts.databaseUrl) : openEmbedded(opts.dataDir);
}
