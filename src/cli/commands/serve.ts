import { readFileSync } from 'node:fs';
import path from 'node:path';
import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';
import { readLocation } from '../register.ts';

export const DEFAULT_PORT = 7100;

/** GLINTMARK_FAULT_PAUSE=before-commit:MS | after-commit:MS (fault tests only). */
function faultPause(): { phase: 'before-commit' | 'after-commit'; ms: number } | undefined {
  const m = /^(before-commit|after-commit):(\d+)$/.exec(process.env.GLINTMARK_FAULT_PAUSE ?? '');
  return m ? { phase: m[1] as 'before-commit' | 'after-commit', ms: Number(m[2]) } : undefined;
}

export const command: Command = {
  name: 'serve',
  summary: 'run the team register: the HTTP API for phones and the planner, and the web app, on PostgreSQL',
  usage:
    '[--host ADDR] [--port N] (--data DIR | --database-url URL) [--photos DIR] [--tls-cert FILE --tls-key FILE] [--web DIR] [--name TEXT]\n' +
    `  default host 127.0.0.1, port ${DEFAULT_PORT}; without --database-url or DATABASE_URL the register lives in --data DIR\n` +
    '  (default ./glintmark-register) on an embedded PostgreSQL engine; photos default to DATA/photos',
  async run(args, out) {
    const host = args.optString('host') ?? '127.0.0.1';
    const port = args.optNumber('port') ?? DEFAULT_PORT;
    if (!Number.isInteger(port) || port < 0 || port > 65535) throw new UsageError(`--port must be a whole number from 0 to 65535, got ${port}`);
    const loc = readLocation(args);
    const photos = args.optString('photos');
    const cert = args.optString('tls-cert');
    const key = args.optString('tls-key');
    if ((cert === undefined) !== (key === undefined)) throw new UsageError('give both --tls-cert and --tls-key, or neither');
    const web = args.optString('web');
    const name = args.optString('name');
    args.assertNoUnknown();
    const tls = cert && key ? { cert: readFileSync(cert), key: readFileSync(key) } : undefined;

    const { startRegister } = await import('../../server/start.ts');
    const running = await startRegister({
      host,
      port,
      ...loc,
      photosDir: photos ? path.resolve(photos) : undefined,
      webDir: web ? path.resolve(web) : undefined,
      tls,
      name,
      faultPause: faultPause(),
    });
    const where = loc.databaseUrl ? 'PostgreSQL server' : `embedded engine in ${loc.dataDir}`;
    out.stdout(`Glintmark register "${running.register.name}" listening on ${running.url} (${where}; photos in ${running.register.photos.dir}${running.register.gis ? '; PostGIS view gis_live_sites' : ''})\n`);
    const stop = () => {
      void running.close().then(() => process.exit(0));
    };
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
    return 0;
  },
};
