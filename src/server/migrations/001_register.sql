-- Team register, schema 1: the register, members and their devices, every record table, history and conflicts.
-- Each record row is the phone's backup row (validated) as JSONB in `doc`, plus the columns queries need.
-- `change_no` is the register's gap-free change number of the row's last change (see change_counter).

CREATE TABLE register (
  id uuid PRIMARY KEY,
  name text NOT NULL,
  created_at_ms bigint NOT NULL,
  one_row boolean NOT NULL DEFAULT true UNIQUE CHECK (one_row)
);

CREATE TABLE change_counter (
  one_row boolean PRIMARY KEY DEFAULT true CHECK (one_row),
  n bigint NOT NULL
);
INSERT INTO change_counter (one_row, n) VALUES (true, 0);

CREATE TABLE members (
  id uuid PRIMARY KEY,
  email text NOT NULL,
  role text NOT NULL CHECK (role IN ('lead', 'crew', 'viewer')),
  password_hash text NOT NULL,
  created_at_ms bigint NOT NULL,
  removed_at_ms bigint
);
CREATE UNIQUE INDEX members_live_email ON members (lower(email)) WHERE removed_at_ms IS NULL;

CREATE TABLE devices (
  id uuid PRIMARY KEY,
  member_id uuid NOT NULL REFERENCES members (id),
  name text NOT NULL,
  token_sha256 text NOT NULL UNIQUE,
  created_at_ms bigint NOT NULL,
  last_seen_at_ms bigint NOT NULL,
  revoked_at_ms bigint,
  last_push_id bigint NOT NULL DEFAULT 0,
  last_push_response jsonb
);
CREATE INDEX devices_member ON devices (member_id);

CREATE TABLE sites (
  id uuid PRIMARY KEY, rev integer NOT NULL, updated_at_ms bigint NOT NULL, deleted_at_ms bigint,
  code text NOT NULL, doc jsonb NOT NULL, change_no bigint NOT NULL
);
CREATE TABLE reflectors (
  id uuid PRIMARY KEY, rev integer NOT NULL, updated_at_ms bigint NOT NULL, deleted_at_ms bigint,
  site_id uuid NOT NULL, doc jsonb NOT NULL, change_no bigint NOT NULL
);
CREATE TABLE geometries (
  id uuid PRIMARY KEY, rev integer NOT NULL, updated_at_ms bigint NOT NULL, deleted_at_ms bigint,
  site_id uuid NOT NULL, reflector_id uuid, doc jsonb NOT NULL, change_no bigint NOT NULL
);
CREATE TABLE installations (
  id uuid PRIMARY KEY, rev integer NOT NULL, updated_at_ms bigint NOT NULL, deleted_at_ms bigint,
  site_id uuid NOT NULL, reflector_id uuid NOT NULL, installed_at_ms bigint NOT NULL, doc jsonb NOT NULL, change_no bigint NOT NULL
);
CREATE TABLE inspections (
  id uuid PRIMARY KEY, rev integer NOT NULL, updated_at_ms bigint NOT NULL, deleted_at_ms bigint,
  site_id uuid NOT NULL, reflector_id uuid NOT NULL, inspected_at_ms bigint NOT NULL, doc jsonb NOT NULL, change_no bigint NOT NULL
);
-- Photo metadata only; the bytes live in the content-addressed photo store, named by sha256.
CREATE TABLE photos (
  id uuid PRIMARY KEY, rev integer NOT NULL, updated_at_ms bigint NOT NULL, deleted_at_ms bigint,
  owner_table text NOT NULL, owner_id uuid NOT NULL, sha256 text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
  bytes bigint NOT NULL, doc jsonb NOT NULL, change_no bigint NOT NULL
);
CREATE INDEX sites_change ON sites (change_no);
CREATE INDEX reflectors_change ON reflectors (change_no);
CREATE INDEX geometries_change ON geometries (change_no);
CREATE INDEX installations_change ON installations (change_no);
CREATE INDEX inspections_change ON inspections (change_no);
CREATE INDEX photos_change ON photos (change_no);
CREATE INDEX reflectors_site ON reflectors (site_id);
CREATE INDEX installations_reflector ON installations (reflector_id, installed_at_ms);
CREATE INDEX inspections_reflector ON inspections (reflector_id, inspected_at_ms);
CREATE INDEX photos_sha ON photos (sha256);

-- Every revision ever received; immutable. Who sent it is recorded here, whatever the row itself claims.
CREATE TABLE revisions (
  id uuid PRIMARY KEY,
  tbl text NOT NULL,
  record_id uuid NOT NULL,
  rev integer NOT NULL,
  at_ms bigint NOT NULL,
  doc jsonb NOT NULL,
  received_from_member_id uuid NOT NULL REFERENCES members (id),
  received_from_device_id uuid NOT NULL REFERENCES devices (id),
  received_at_ms bigint NOT NULL
);
CREATE INDEX revisions_record ON revisions (tbl, record_id);

CREATE TABLE conflicts (
  id uuid PRIMARY KEY,
  tbl text NOT NULL,
  record_id uuid NOT NULL,
  doc jsonb NOT NULL,
  resolved_at_ms bigint,
  change_no bigint NOT NULL
);
CREATE INDEX conflicts_record ON conflicts (tbl, record_id);
CREATE INDEX conflicts_change ON conflicts (change_no);

CREATE TABLE elements (
  id uuid PRIMARY KEY, rev integer NOT NULL, catalog_number text NOT NULL, deleted_at_ms bigint,
  doc jsonb NOT NULL, change_no bigint NOT NULL
);
CREATE INDEX elements_change ON elements (change_no);
CREATE INDEX elements_catalog ON elements (catalog_number);
