/**
 * Vitest globalSetup for test/server: a throwaway PostgreSQL 15 cluster on 127.0.0.1:GLINTMARK_PG_PORT (default
 * 55432), run as the `postgres` user from Debian's binaries, in a temporary folder removed afterwards.
 */
import { execFileSync } from 'node:child_process';
import { chmodSync, chownSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';

const BIN = '/usr/lib/postgresql/15/bin';

declare module 'vitest' {
  export interface ProvidedContext {
    pgPort: number;
  }
}

/** The first port from `from` on with nothing listening on 127.0.0.1 (a cluster left by a killed run keeps its port). */
function freePort(from: number): number {
  for (let p = from; p < from + 50; p++) {
    const busy = execFileSync('sh', ['-c', `ss -Hltn 'sport = :${p}' | wc -l`]).toString().trim() !== '0';
    if (!busy) return p;
  }
  throw new Error(`no free port in ${from}…${from + 49} for the test cluster`);
}

export default function setup(project: TestProject) {
  const port = freePort(Number(process.env.GLINTMARK_PG_PORT ?? 55432));
  const dir = mkdtempSync(path.join(os.tmpdir(), 'glintmark-pg-'));
  const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
  const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
  chownSync(dir, uid, gid);
  chmodSync(dir, 0o700);
  const asPg = (cmd: string, args: string[]) => execFileSync('runuser', ['-u', 'postgres', '--', path.join(BIN, cmd), ...args], { stdio: 'pipe' });
  asPg('initdb', ['-D', path.join(dir, 'data'), '-A', 'trust', '-U', 'postgres', '--no-sync']);
  asPg('pg_ctl', ['-D', path.join(dir, 'data'), '-l', path.join(dir, 'log'), '-w', '-o', `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off`, 'start']);
  project.provide('pgPort', port);
  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    try {
      asPg('pg_ctl', ['-D', path.join(dir, 'data'), '-m', 'immediate', '-w', 'stop']);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  };
  // Also when the run ends without calling the teardown (an interrupted run), so no cluster is left behind.
  process.once('exit', stop);
  return stop;
}
