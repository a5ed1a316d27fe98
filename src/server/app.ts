/**
 * The register's HTTP API v1 (docs/register-api.md) on Fastify, plus the built web app from the same origin.
 * Handlers are thin: check the caller and the body's shape, call one Register method, map its typed errors.
 */
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import fastifyStatic from '@fastify/static';
import Fastify, { type FastifyInstance, type FastifyReply, type FastifyRequest } from 'fastify';
import { toCsv } from '../core/text/csv.ts';
import { SignInLimiter } from './auth.ts';
import { RegisterError, READ_ONLY } from './errors.ts';
import { openApiDocument } from './openapi.ts';
import { MAX_PHOTO_UPLOAD_BYTES, SHA256_RE } from './photoStore.ts';
import type { Caller, Register } from './register.ts';

export const MAX_JSON_BYTES = 16 * 1024 * 1024;
/** A whole backup sent by the planner (JSON text; photos inline as base64). */
export const MAX_BACKUP_BYTES = 1024 * 1024 * 1024;

export interface AppOptions {
  register: Register;
  /** Folder of the built web app (vite build → dist/); not served when absent. */
  webDir?: string;
  appVersion?: string;
  https?: { cert: Buffer; key: Buffer };
  logger?: boolean;
}

declare module 'fastify' {
  interface FastifyRequest {
    caller?: Caller;
  }
}

const errorBody = (code: string, message: string) => ({ error: { code, message } });

export async function buildApp(opts: AppOptions): Promise<FastifyInstance> {
  const reg = opts.register;
  const app = Fastify({
    logger: opts.logger ?? false,
    bodyLimit: MAX_JSON_BYTES,
    ...(opts.https ? { https: opts.https } : {}),
  } as never) as unknown as FastifyInstance;
  const limiter = new SignInLimiter();

  // Photo bytes arrive raw; the store checks the magic bytes and the hash.
  app.addContentTypeParser(/^(image\/[a-z0-9.+-]+|application\/octet-stream)$/, { parseAs: 'buffer', bodyLimit: MAX_PHOTO_UPLOAD_BYTES }, (_req, body, done) => done(null, body));
  app.addContentTypeParser('application/zip', { parseAs: 'buffer', bodyLimit: MAX_BACKUP_BYTES }, (_req, body, done) => done(null, body));

  app.setErrorHandler((err: Error & { statusCode?: number; code?: string }, _req, reply) => {
    if (err instanceof RegisterError) {
      for (const [k, v] of Object.entries(err.headers)) void reply.header(k, v);
      return reply.status(err.status).send({ error: { code: err.code, message: err.message, ...(err.issues.length ? { issues: err.issues.slice(0, 50) } : {}) } });
    }
    const s = err.statusCode ?? 500;
    if (s === 413) return reply.status(413).send(errorBody('body-too-large', 'The request is too large for the register; send fewer records at a time.'));
    if (s === 415) return reply.status(415).send(errorBody('wrong-content-type', 'The register does not accept this kind of content here.'));
    if (s === 400 && err.code === 'FST_ERR_CTP_INVALID_JSON_BODY') return reply.status(400).send(errorBody('malformed-json', 'The request is not valid JSON; nothing was stored.'));
    if (s >= 400 && s < 500) return reply.status(s).send(errorBody('bad-request', `The request was refused: ${err.message}`));
    app.log.error(err);
    return reply.status(500).send(errorBody('internal', 'The register hit an unexpected problem; nothing was stored by this request. Try again, and tell the team lead if it persists.'));
  });

  // Tokens travel in the Authorization header, never in cookies, so any origin may call the API (a phone app
  // served by vite preview or a native WebView has another origin than the register).
  app.addHook('onRequest', async (req, reply) => {
    if (!req.url.startsWith('/api/')) return;
    void reply.header('Access-Control-Allow-Origin', '*');
    if (req.method === 'OPTIONS') {
      return reply
        .header('Access-Control-Allow-Methods', 'GET, HEAD, POST, PUT, DELETE')
        .header('Access-Control-Allow-Headers', 'Authorization, Content-Type')
        .header('Access-Control-Max-Age', '600')
        .status(204)
        .send();
    }
  });

  const addressOf = (req: FastifyRequest) => req.ip;
  const auth = async (req: FastifyRequest) => {
    req.caller = await reg.authenticate(req.headers.authorization, addressOf(req));
  };
  const caller = (req: FastifyRequest): Caller => {
    if (!req.caller) throw new RegisterError(401, 'no-token', 'Sign in first.');
    return req.caller;
  };
  const lead = (req: FastifyRequest): Caller => {
    const c = caller(req);
    if (c.member.role !== 'lead') throw new RegisterError(403, 'lead-only', 'Only a team lead can do this.');
    return c;
  };
  const writer = (req: FastifyRequest): Caller => {
    const c = caller(req);
    if (c.member.role === 'viewer') throw READ_ONLY();
    return c;
  };
  const objectBody = (req: FastifyRequest, keys: Record<string, 'string'>): Record<string, string> => {
    const b = req.body as Record<string, unknown> | null;
    if (typeof b !== 'object' || b === null || Array.isArray(b)) throw new RegisterError(400, 'invalid-body', 'The request body must be a JSON object.');
    for (const k of Object.keys(b)) if (!(k in keys)) throw new RegisterError(400, 'unknown-field', `The field "${k}" is not known here.`);
    for (const k of Object.keys(keys)) if (typeof b[k] !== 'string' || (b[k] as string).length > 500) throw new RegisterError(400, 'invalid-field', `"${k}" must be text of at most 500 characters.`);
    return b as Record<string, string>;
  };

  await app.register(
    async (api) => {
      api.get('/health', async () => ({ ok: true }));
      api.get('/openapi.json', async () => openApiDocument);

      api.post('/session', async (req, reply) => {
        const b = objectBody(req, { email: 'string', password: 'string', deviceName: 'string' });
        const now = Date.now();
        const keys = [`email:${b.email.trim().toLowerCase()}`, `addr:${addressOf(req)}`];
        const wait = limiter.retryAfterS(keys, now);
        if (wait > 0) throw new RegisterError(429, 'too-many-attempts', `Too many failed sign-ins; wait ${wait} seconds and try again.`, [], { 'Retry-After': String(wait) });
        const s = await reg.signIn(b.email, b.password, b.deviceName.trim() || 'unnamed device', addressOf(req));
        if (!s) {
          limiter.fail(keys, now);
          throw new RegisterError(401, 'wrong-credentials', 'The email or the password is wrong.');
        }
        limiter.succeed(keys[0]);
        return reply.status(200).send(s);
      });

      api.register(async (authed) => {
        authed.addHook('preHandler', auth);

        authed.delete('/session', async (req) => {
          const c = caller(req);
          await reg.revokeDevice(c, c.deviceId);
          return { ok: true };
        });
        authed.get('/register', async () => reg.info());
        authed.get('/devices', async (req) => ({ devices: await reg.listDevices(caller(req)) }));
        authed.delete<{ Params: { id: string } }>('/devices/:id', async (req) => {
          await reg.revokeDevice(caller(req), req.params.id);
          return { ok: true };
        });
        authed.get('/members', async (req) => {
          lead(req);
          return { members: await reg.listMembers() };
        });
        authed.post('/members', async (req, reply) => {
          lead(req);
          const b = objectBody(req, { email: 'string', role: 'string', password: 'string' });
          return reply.status(201).send({ member: await reg.addMember(b.email, b.role, b.password) });
        });
        authed.delete<{ Params: { id: string } }>('/members/:id', async (req) => {
          lead(req);
          await reg.removeMember(req.params.id);
          return { ok: true };
        });

        authed.post('/push', async (req) => reg.push(caller(req), req.body));
        authed.get<{ Querystring: { since?: string; limit?: string } }>('/pull', async (req) => {
          caller(req);
          const since = req.query.since === undefined ? 0 : Number(req.query.since);
          const limit = req.query.limit === undefined ? 500 : Number(req.query.limit);
          if (!Number.isSafeInteger(since) || since < 0) throw new RegisterError(400, 'invalid-cursor', 'since must be a whole number, 0 or more.');
          if (!Number.isSafeInteger(limit) || limit < 1 || limit > 2000) throw new RegisterError(400, 'invalid-limit', 'limit must be a whole number from 1 to 2000.');
          return reg.pull(since, limit);
        });

        authed.head<{ Params: { sha: string } }>('/photos/:sha', async (req, reply) => {
          caller(req);
          return reply.status(SHA256_RE.test(req.params.sha) && (await reg.photos.has(req.params.sha)) ? 200 : 404).send();
        });
        authed.get<{ Params: { sha: string } }>('/photos/:sha', async (req, reply) => {
          caller(req);
          if (!SHA256_RE.test(req.params.sha)) throw new RegisterError(404, 'no-photo', 'The register does not hold this photo.');
          const bytes = await reg.photos.get(req.params.sha);
          return reply.type('application/octet-stream').header('Cache-Control', 'private, max-age=31536000, immutable').send(Buffer.from(bytes));
        });
        authed.put<{ Params: { sha: string } }>('/photos/:sha', async (req, reply) => {
          writer(req);
          if (!Buffer.isBuffer(req.body)) throw new RegisterError(415, 'not-an-image', 'Send the photo bytes with an image content type (e.g. image/jpeg).');
          const fresh = await reg.photos.put(req.params.sha, req.body);
          return reply.status(fresh ? 201 : 200).send({ sha256: req.params.sha, stored: fresh });
        });

        authed.post('/backup', { bodyLimit: MAX_BACKUP_BYTES }, async (req) => {
          const c = writer(req);
          if (Buffer.isBuffer(req.body)) {
            throw new RegisterError(415, 'archive-not-supported', 'This register reads JSON backups; save the backup from the app as a JSON file and send that.');
          }
          return { report: await reg.importBackup(c, req.body) };
        });
        authed.get('/backup', async (req, reply) => {
          caller(req);
          const doc = await reg.exportBackup(opts.appVersion ?? '0.0.0');
          return reply.header('Content-Disposition', 'attachment; filename="glintmark-register.json"').send(doc);
        });
        authed.get('/overview', async (req) => {
          caller(req);
          return reg.overview();
        });
        authed.get('/export/sites.geojson', async (req, reply) => {
          caller(req);
          const sites = await reg.liveRows('sites');
          return reply.type('application/geo+json').send({
            type: 'FeatureCollection',
            features: sites.map((s) => ({
              type: 'Feature',
              id: s.id,
              // RFC 7946 section 3.1.1: longitude, latitude, then height (here ellipsoidal, metres).
              geometry: { type: 'Point', coordinates: [s.lonDeg, s.latDeg, s.heightEllM] },
              properties: { code: s.code, name: s.name, referenceFrame: s.referenceFrame, frameEpoch: s.frameEpoch, positionSource: s.positionSource, notes: s.notes },
            })),
          });
        });
        authed.get('/export/installations.csv', async (req, reply) => {
          caller(req);
          const rows = await reg.liveRows('installations');
          const header = ['id', 'siteId', 'reflectorId', 'installedAtUtc', 'plannedAzimuthDeg', 'plannedTiltDeg', 'measuredAzimuthDeg', 'measuredTiltDeg', 'measuredRollDeg', 'azimuthMethod', 'declinationDeg', 'crew', 'notes'];
          const csv = toCsv(
            header,
            rows.map((r) => [r.id, r.siteId, r.reflectorId, new Date(Number(r.installedAtMs)).toISOString(), r.plannedAzimuthDeg, r.plannedTiltDeg, r.measuredAzimuthDeg, r.measuredTiltDeg, r.measuredRollDeg, r.azimuthMethod, r.declinationDeg, (r.crew as string[]).join('; '), r.notes] as never[]),
          );
          return reply.type('text/csv; charset=utf-8').send(csv);
        });
      });
    },
    { prefix: '/api/v1' },
  );

  const web = opts.webDir;
  if (web && existsSync(path.join(web, 'index.html'))) {
    await app.register(fastifyStatic, { root: path.resolve(web), prefix: '/', wildcard: false, index: ['index.html'] });
    const indexHtml = readFileSync(path.join(web, 'index.html'));
    app.setNotFoundHandler((req: FastifyRequest, reply: FastifyReply) => {
      if (req.method === 'GET' && !req.url.startsWith('/api/')) return reply.type('text/html; charset=utf-8').header('Cache-Control', 'no-cache').send(indexHtml);
      return reply.status(404).send(errorBody('not-found', 'There is nothing at this address.'));
    });
  } else {
    app.setNotFoundHandler((_req, reply) => reply.status(404).send(errorBody('not-found', 'There is nothing at this address.')));
  }
  return app;
}
