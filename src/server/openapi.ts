/**
 * The OpenAPI 3.1 description of the register's HTTP API v1, served at /api/v1/openapi.json. Written by hand to
 * match docs/register-api.md; record rows are described as objects because their one schema is the backup
 * format's (src/data/schema, src/data/backup), which the server applies to every row.
 */
const error = { $ref: '#/components/responses/Error' };
const errors = (...codes: number[]) => Object.fromEntries(codes.map((c) => [String(c), error]));
const json = (schema: unknown) => ({ content: { 'application/json': { schema } } });
const obj = (properties: Record<string, unknown>, required: string[] = Object.keys(properties)) => ({ type: 'object', additionalProperties: false, properties, required });
const str = { type: 'string' };
const int = { type: 'integer' };
const sha = { name: 'sha256', in: 'path', required: true, schema: { type: 'string', pattern: '^[0-9a-f]{64}$' } };
const idParam = { name: 'id', in: 'path', required: true, schema: { type: 'string', format: 'uuid' } };
const tables = ['sites', 'reflectors', 'geometries', 'installations', 'inspections', 'photos'];
const change = obj({ table: { type: 'string', enum: tables }, row: { type: 'object' }, revisions: { type: 'array', items: { $ref: '#/components/schemas/Revision' } } });
const tableReport = obj({ added: int, updated: int, unchanged: int, localNewer: int, conflicts: { type: 'array', items: obj({ table: str, id: str, reason: str }) } });
const report = { type: 'object', additionalProperties: tableReport };
const secured = { security: [{ token: [] }] };

export const openApiDocument = {
  openapi: '3.1.0',
  info: { title: 'Glintmark team register', version: '1', description: 'Phones and the planner push and pull field records; see docs/register-api.md.' },
  servers: [{ url: '/api/v1' }],
  components: {
    securitySchemes: { token: { type: 'http', scheme: 'bearer', description: 'gmr1.<registerId>.<random>, from POST /session' } },
    responses: {
      Error: { description: 'A refusal, with a plain message', ...json(obj({ error: obj({ code: str, message: str, issues: { type: 'array' } }, ['code', 'message']) }, ['error'])) },
    },
    schemas: {
      Revision: { type: 'object', description: 'RevisionRecord of the backup format (src/data/types.ts)', required: ['id', 'table', 'recordId', 'rev', 'atMs', 'by', 'kind', 'changes', 'snapshot', 'cascadeOf'] },
      Conflict: { type: 'object', description: 'ConflictRecord of the backup format; `id` is stable register-wide', required: ['id', 'table', 'recordId', 'kept', 'other', 'otherRevisions', 'reason', 'detectedAtMs', 'resolvedAtMs'] },
      Report: report,
    },
  },
  paths: {
    '/health': { get: { summary: 'Liveness (no sign-in)', responses: { 200: { description: 'up', ...json(obj({ ok: { type: 'boolean' } })) } } } },
    '/openapi.json': { get: { summary: 'This document', responses: { 200: { description: 'OpenAPI 3.1' } } } },
    '/session': {
      post: {
        summary: 'Sign in a device',
        requestBody: { required: true, ...json(obj({ email: str, password: str, deviceName: str })) },
        responses: {
          200: { description: 'token', ...json(obj({ token: str, member: obj({ id: str, email: str, role: { type: 'string', enum: ['lead', 'crew', 'viewer'] } }), device: obj({ id: str, name: str }), register: obj({ id: str, name: str }) })) },
          ...errors(400, 401, 429),
        },
      },
      delete: { summary: "Revoke the caller's own token", ...secured, responses: { 200: { description: 'revoked' }, ...errors(401) } },
    },
    '/register': { get: { summary: 'Register identity', ...secured, responses: { 200: { description: 'register', ...json(obj({ id: str, name: str, schemaVersion: int, serverTimeMs: int })) }, ...errors(401) } } },
    '/devices': { get: { summary: 'Device sign-ins (lead: all; others: own)', ...secured, responses: { 200: { description: 'devices' }, ...errors(401) } } },
    '/devices/{id}': { delete: { summary: 'Revoke a device (lead, or own)', ...secured, parameters: [idParam], responses: { 200: { description: 'revoked' }, ...errors(401, 404) } } },
    '/members': {
      get: { summary: 'Members (lead)', ...secured, responses: { 200: { description: 'members' }, ...errors(401, 403) } },
      post: { summary: 'Add a member (lead)', ...secured, requestBody: { required: true, ...json(obj({ email: str, role: { type: 'string', enum: ['lead', 'crew', 'viewer'] }, password: str })) }, responses: { 201: { description: 'added' }, ...errors(400, 401, 403, 409) } },
    },
    '/members/{id}': { delete: { summary: 'Remove a member and revoke their devices (lead)', ...secured, parameters: [idParam], responses: { 200: { description: 'removed' }, ...errors(401, 403, 404, 409) } } },
    '/push': {
      post: {
        summary: 'Apply a batch exactly once (per-device pushId)',
        ...secured,
        requestBody: {
          required: true,
          ...json(obj({ pushId: { type: 'integer', minimum: 1 }, changes: { type: 'array', items: change }, resolvedConflicts: { type: 'array', items: obj({ conflictId: str, resolvedAtMs: int }) }, elements: { type: 'array', items: { type: 'object' } } }, ['pushId', 'changes'])),
        },
        responses: {
          200: { description: 'applied, or a repeat answered from the stored response', ...json(obj({ pushId: int, duplicate: { type: 'boolean' }, cursor: int, report, deferredPhotos: { type: 'array', items: str } })) },
          ...errors(400, 401, 403, 413, 415),
        },
      },
    },
    '/pull': {
      get: {
        summary: 'Changes since a cursor, in change order',
        ...secured,
        parameters: [
          { name: 'since', in: 'query', schema: { type: 'integer', minimum: 0, default: 0 } },
          { name: 'limit', in: 'query', schema: { type: 'integer', minimum: 1, maximum: 2000, default: 500 } },
        ],
        responses: {
          200: { description: 'a page', ...json(obj({ changes: { type: 'array', items: change }, conflicts: { type: 'array', items: { $ref: '#/components/schemas/Conflict' } }, elements: { type: 'array', items: { type: 'object' } }, cursor: int, more: { type: 'boolean' } })) },
          ...errors(400, 401),
        },
      },
    },
    '/photos/{sha256}': {
      head: { summary: 'Is the photo held?', ...secured, parameters: [sha], responses: { 200: { description: 'held' }, 404: { description: 'not held' } } },
      get: { summary: 'Photo bytes (hash checked on read)', ...secured, parameters: [sha], responses: { 200: { description: 'bytes', content: { 'application/octet-stream': {} } }, ...errors(401, 404, 500) } },
      put: {
        summary: 'Upload photo bytes (crew or lead)',
        ...secured,
        parameters: [sha],
        requestBody: { required: true, content: { 'image/jpeg': {}, 'image/png': {}, 'image/webp': {}, 'image/heic': {} } },
        responses: { 201: { description: 'stored' }, 200: { description: 'already held' }, ...errors(400, 401, 403, 413, 415, 422) },
      },
    },
    '/backup': {
      post: { summary: 'Merge a phone backup (crew or lead; all or nothing)', ...secured, requestBody: { required: true, content: { 'application/json': { schema: { type: 'object' } }, 'application/zip': {} } }, responses: { 200: { description: 'merge report', ...json(obj({ report })) }, ...errors(400, 401, 403, 413, 415) } },
      get: { summary: 'The whole register as a phone backup document (photos included)', ...secured, responses: { 200: { description: 'backup', ...json({ type: 'object' }) }, ...errors(401) } },
    },
    '/export/sites.geojson': { get: { summary: 'Live sites as GeoJSON (RFC 7946)', ...secured, responses: { 200: { description: 'GeoJSON', content: { 'application/geo+json': {} } } } } },
    '/export/installations.csv': { get: { summary: 'Live installations as CSV', ...secured, responses: { 200: { description: 'CSV', content: { 'text/csv': {} } } } } },
    '/overview': { get: { summary: 'Sites with latest installation, inspections due, open conflicts', ...secured, responses: { 200: { description: 'overview' }, ...errors(401) } } },
  },
} as const;
