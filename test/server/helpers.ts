/** A fresh database per test file on the harness's cluster, and a running register server on an ephemeral port. */
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { inject } from 'vitest';
import { startRegister, type RunningRegister } from '../../src/server/start.ts';

export async function freshDatabaseUrl(): Promise<string> {
  const port = inject('pgPort');
  const name = `t_${Math.random().toString(36).slice(2, 10)}`;
  const admin = new pg.Client({ host: '127.0.0.1', port, user: 'postgres', database: 'postgres' });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name}`);
  await admin.end();
  return `postgres://postgres@127.0.0.1:${port}/${name}`;
}

export async function startTestRegister(databaseUrl: string): Promise<RunningRegister> {
  const dataDir = mkdtempSync(path.join(os.tmpdir(), 'glintmark-reg-'));
  return startRegister({ host: '127.0.0.1', port: 0, databaseUrl, dataDir, webDir: path.join(dataDir, 'no-web') });
}

export const PASSWORD = 'correct horse battery';

export async function api(base: string, p: string, init: { method?: string; token?: string; body?: unknown; raw?: Uint8Array; type?: string } = {}) {
  const headers: Record<string, string> = {};
  if (init.token) headers.Authorization = `Bearer ${init.token}`;
  let body: BodyInit | undefined;
  if (init.raw) {
    body = new Uint8Array(init.raw);
    headers['Content-Type'] = init.type ?? 'image/jpeg';
  } else if (init.body !== undefined) {
    body = typeof init.body === 'string' ? init.body : JSON.stringify(init.body);
    headers['Content-Type'] = 'application/json';
  }
  const res = await fetch(`${base}/api/v1${p}`, { method: init.method ?? (body ? 'POST' : 'GET'), headers, body });
  const text = await res.text();
  let json: unknown = null;
  try {
    json = JSON.parse(text);
  } catch {
    json = null;
  }
  return { status: res.status, json: json as Record<string, unknown> & { error?: { code: string } } };
}
