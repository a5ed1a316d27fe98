/** Start a register server: open the database, migrate, listen. Used by `glintmark serve` and the tests. */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { FastifyInstance } from 'fastify';
import { buildApp } from './app.ts';
import { openDatabase } from './db.ts';
import { PhotoStore } from './photoStore.ts';
import { Register, type RegisterOptions } from './register.ts';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const DEFAULT_WEB_DIR = path.join(ROOT, 'dist');
export const APP_VERSION = (JSON.parse(readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as { version: string }).version;

export interface StartOptions {
  host: string;
  port: number;
  databaseUrl?: string;
  dataDir: string;
  photosDir?: string;
  webDir?: string;
  tls?: { cert: Buffer; key: Buffer };
  name?: string;
  faultPause?: RegisterOptions['faultPause'];
  logger?: boolean;
}

export interface RunningRegister {
  app: FastifyInstance;
  register: Register;
  url: string;
  close(): Promise<void>;
}

export async function startRegister(o: StartOptions): Promise<RunningRegister> {
  const db = await openDatabase({ databaseUrl: o.databaseUrl, dataDir: o.dataDir });
  let register: Register;
  try {
    register = await Register.open(db, { photos: new PhotoStore(o.photosDir ?? path.join(o.dataDir, 'photos')), name: o.name, faultPause: o.faultPause });
  } catch (e) {
    await db.close();
    throw e;
  }
  const app = await buildApp({ register, webDir: o.webDir ?? DEFAULT_WEB_DIR, appVersion: APP_VERSION, https: o.tls, logger: o.logger });
  await app.listen({ host: o.host, port: o.port });
  const addr = app.server.address();
  const port = typeof addr === 'object' && addr ? addr.port : o.port;
  const host = o.host.includes(':') ? `[${o.host}]` : o.host;
  return {
    app,
    register,
    url: `${o.tls ? 'https' : 'http'}://${host}:${port}`,
    async close() {
      await app.close();
      await register.close();
    },
  };
}
