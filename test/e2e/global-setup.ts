/**
 * Browser-test setup: build the app once, serve dist/ with `vite preview` on 127.0.0.1:4173 (or GLINTMARK_E2E_PORT; a secure context, so
 * geolocation and orientation work), and stop the server afterwards.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { BASE_URL, E2E_PORT } from './browser.ts';

let server: ChildProcess | undefined;

async function waitForServer(url: string, timeoutMs: number): Promise<void> {
  const t0 = Date.now();
  for (;;) {
    try {
      const r = await fetch(url);
      if (r.ok) return;
    } catch {
      /* not up yet */
    }
    if (Date.now() - t0 > timeoutMs) throw new Error(`vite preview did not answer at ${url} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export async function setup(): Promise<void> {
  mkdirSync('test/e2e/artifacts', { recursive: true });
  if (!process.env.GLINTMARK_E2E_SKIP_BUILD || !existsSync('dist/index.html')) {
    // Vitest sets NODE_ENV=test, which would make Vite build a development bundle (no service worker, dev React).
    const b = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { stdio: 'inherit', env: { ...process.env, NODE_ENV: 'production' } });
    if (b.status !== 0) throw new Error('vite build failed');
  }
  server = spawn('npx', ['vite', 'preview', '--host', '127.0.0.1', '--port', String(E2E_PORT), '--strictPort'], { stdio: 'ignore', detached: true });
  await waitForServer(BASE_URL + '/', 30_000);
}

export async function teardown(): Promise<void> {
  if (server?.pid) {
    try {
      process.kill(-server.pid, 'SIGTERM');
    } catch {
      server.kill('SIGTERM');
    }
  }
}
