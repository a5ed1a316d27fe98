/**
 * Schema migrations: numbered SQL files in ./migrations (NNN_name.sql), never edited once released. On start,
 * the missing ones are applied in order inside ONE transaction and recorded in schema_migrations, so a failed
 * migration leaves the database as it was. Optional features (PostGIS) are set up afterwards, outside it.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Database, Sql } from './db.ts';

const DIR = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

export interface Migration {
  version: number;
  name: string;
  sql: string;
}

export function migrations(): Migration[] {
  return readdirSync(DIR)
    .filter((f) => /^\d{3}_[a-z0-9_]+\.sql$/.test(f))
    .sort()
    .map((f) => ({ version: Number(f.slice(0, 3)), name: f.slice(4, -4), sql: readFileSync(path.join(DIR, f), 'utf8') }));
}

export const LATEST_SCHEMA_VERSION = Math.max(...migrations().map((m) => m.version));

async function appliedVersion(tx: Sql): Promise<number> {
  await tx.query('CREATE TABLE IF NOT EXISTS schema_migrations (version integer PRIMARY KEY, name text NOT NULL, applied_at timestamptz NOT NULL DEFAULT now())');
  const r = await tx.query<{ v: number | null }>('SELECT max(version) AS v FROM schema_migrations');
  return r.rows[0]?.v ?? 0;
}

/** Apply every migration above the recorded version (up to `upTo`, for tests). Returns the versions applied. */
export async function migrate(db: Database, opts: { upTo?: number } = {}): Promise<number[]> {
  return db.transaction(async (tx) => {
    // One migrator at a time, even with two servers starting on the same database.
    await tx.query('SELECT pg_advisory_xact_lock(7206001)');
    const current = await appliedVersion(tx);
    const done: number[] = [];
    for (const m of migrations()) {
      if (m.version <= current || m.version > (opts.upTo ?? Infinity)) continue;
      await tx.exec(m.sql);
      await tx.query('INSERT INTO schema_migrations (version, name) VALUES ($1, $2)', [m.version, m.name]);
      done.push(m.version);
    }
    return done;
  });
}

export async function schemaVersion(db: Sql): Promise<number> {
  const r = await db.query<{ v: number | null }>("SELECT CASE WHEN to_regclass('schema_migrations') IS NULL THEN 0 ELSE (SELECT max(version) FROM schema_migrations) END AS v");
  return r.rows[0]?.v ?? 0;
}

/**
 * Where PostGIS is installed, a view `gis_live_sites` of live sites with their latest installation and a point
 * geometry (EPSG:4979: WGS 84 longitude, latitude, ellipsoidal height) for desktop GIS. Returns whether it exists.
 */
export async function setUpGis(db: Database): Promise<boolean> {
  try {
    await db.transaction(async (tx) => {
      await tx.query('CREATE EXTENSION IF NOT EXISTS postgis');
      await tx.query(`CREATE OR REPLACE VIEW gis_live_sites AS
        SELECT s.id, s.code, s.doc->>'name' AS name,
               (s.doc->>'heightEllM')::float8 AS height_ell_m,
               i.id AS installation_id, i.installed_at_ms,
               (i.doc->>'measuredAzimuthDeg')::float8 AS measured_azimuth_deg,
               (i.doc->>'measuredTiltDeg')::float8 AS measured_tilt_deg,
               ST_SetSRID(ST_MakePoint((s.doc->>'lonDeg')::float8, (s.doc->>'latDeg')::float8, (s.doc->>'heightEllM')::float8), 4979) AS geom
        FROM sites s
        LEFT JOIN LATERAL (
          SELECT * FROM installations x WHERE x.site_id = s.id AND x.deleted_at_ms IS NULL ORDER BY x.installed_at_ms DESC, x.id LIMIT 1
        ) i ON true
        WHERE s.deleted_at_ms IS NULL`);
    });
    return true;
  } catch {
    return false;
  }
}
