/**
 * Record shapes of the Logbook store (schema version 6). Every figure carries its unit in its name
 * because IndexedDB rows and JSON exports keep nothing else. Conventions follow src/core/CONVENTIONS.md:
 * WGS84 degrees, ellipsoidal heights, azimuths clockwise from true north in [0, 360), declination east-positive,
 * instants in ms since 1970-01-01T00:00Z (`…AtMs`); exports add ISO 8601 UTC strings.
 */

/** Bookkeeping carried by every versioned row (sites … inspections, photos). */
export interface RecordMeta {
  /** Random UUID (crypto.randomUUID). */
  id: string;
  /** 1 on creation, +1 on every edit, delete or undelete. */
  rev: number;
  createdAtMs: number;
  updatedAtMs: number;
  /** Set by a soft delete; null while the record is live. */
  deletedAtMs: number | null;
}

export const POSITION_SOURCES = ['gnss-phone', 'gnss-survey', 'typed', 'imported'] as const;
export type PositionSource = (typeof POSITION_SOURCES)[number];

export interface SiteFields {
  /** Short field code, unique (case-insensitively) among live sites, e.g. "MF-01". */
  code: string;
  name: string;
  latDeg: number;
  lonDeg: number;
  /**
   * Height above the WGS84 ellipsoid; null when unknown ("to be surveyed"), or when only a height above
   * mean sea level is known (then in `heightMslM`).
   */
  heightEllM: number | null;
  /**
   * Height above mean sea level, kept only when that is what the position source gave (a phone whose platform
   * reports sea-level altitude); null or absent otherwise. Never converted to ellipsoidal (no geoid model here).
   */
  heightMslM?: number | null;
  positionSource: PositionSource;
  /** Horizontal 1-sigma accuracy of the position; null when unknown (typed or imported). */
  positionAccuracyM: number | null;
  /** Reference frame of the coordinates, e.g. 'ITRF2020' or 'WGS84'. */
  referenceFrame: string;
  /** Epoch of the coordinates as a decimal year (e.g. 2027.5), or null. */
  frameEpoch: number | null;
  notes: string;
  demo: boolean;
}
export type SiteRecord = RecordMeta & SiteFields;

export const REFLECTOR_SHAPES = ['triangular', 'square'] as const;
export type ReflectorShape = (typeof REFLECTOR_SHAPES)[number];

export interface ReflectorConstruction {
  panels: 'solid' | 'mesh';
  /** Mesh opening, only for mesh panels. */
  meshOpeningMm?: number;
  /** Free text: how water leaves the corner (e.g. "three 20 mm holes at the apex"). */
  drainage: string;
  /** Free text: what the reflector stands on (e.g. "concrete pillar 0.6 m deep"). */
  foundation: string;
}

export interface GeodeticPoint {
  latDeg: number;
  lonDeg: number;
  heightEllM: number;
}

/** Offset of the GNSS antenna reference point from the reflector apex, local east/north/up. */
export interface EnuOffsetM {
  eastM: number;
  northM: number;
  upM: number;
}

export interface ReflectorFields {
  siteId: string;
  label: string;
  shape: ReflectorShape;
  /** Inner edge length a. */
  edgeM: number;
  construction: ReflectorConstruction;
  /** Surveyed apex (inner corner) position, or null before the survey. */
  apex: GeodeticPoint | null;
  /** Height of the apex above the ground mark. */
  apexHeightAboveMarkM: number;
  gnssArpOffsetM: EnuOffsetM | null;
  notes: string;
  demo: boolean;
}
export type ReflectorRecord = RecordMeta & ReflectorFields;

export const GEOMETRY_SOURCES = ['typed', 'orbital-elements', 'circular-approximation'] as const;
export type GeometrySource = (typeof GEOMETRY_SOURCES)[number];

/** A planned viewing geometry (one pass family) the reflector should serve. */
export interface GeometryFields {
  siteId: string;
  reflectorId: string | null;
  /** Incidence at the site from the local vertical, (0, 90). */
  incidenceDeg: number;
  /** Azimuth of the Earth-fixed ground-track velocity, [0, 360). */
  headingDeg: number;
  look: 'right' | 'left';
  direction: 'ascending' | 'descending' | null;
  /** Band name as typed by the planner, e.g. 'C' or 'X'. */
  band: string;
  wavelengthM: number;
  source: GeometrySource;
  /** Invented demo names only (e.g. 'GLINT-A'); null when typed without one. */
  satellite: string | null;
  elementsEpochMs: number | null;
  demo: boolean;
}
export type GeometryRecord = RecordMeta & GeometryFields;

export const AZIMUTH_METHODS = ['sun-shadow', 'reference-bearing', 'compass', 'other-instrument'] as const;
export type AzimuthMethod = (typeof AZIMUTH_METHODS)[number];

export interface PositionFix {
  latDeg: number;
  lonDeg: number;
  accuracyM: number;
  atMs: number;
}

export interface InstallationFields {
  reflectorId: string;
  siteId: string;
  geometryIds: string[];
  plannedAzimuthDeg: number;
  plannedTiltDeg: number;
  measuredAzimuthDeg: number;
  measuredTiltDeg: number;
  measuredRollDeg: number;
  azimuthMethod: AzimuthMethod;
  /** East-positive magnetic declination used with a compass, or null. */
  declinationDeg: number | null;
  /** Model that gave declinationDeg, e.g. 'WMM2025'; null when none was used. */
  declinationModel: string | null;
  fix: PositionFix | null;
  /** Predicted loss below peak RCS for the planned geometries, positive dB. */
  predictedLossDb: number | null;
  crew: string[];
  installedAtMs: number;
  notes: string;
  photoIds: string[];
  demo: boolean;
}
export type InstallationRecord = RecordMeta & InstallationFields;

export const CHECK_STATES = ['ok', 'issue', 'not-checked'] as const;
export type CheckState = (typeof CHECK_STATES)[number];
export const CHECKLIST_ITEMS = ['debris', 'standingWater', 'snowIce', 'vegetation', 'damage', 'movement'] as const;
export type ChecklistItem = (typeof CHECKLIST_ITEMS)[number];
export type Checklist = Record<ChecklistItem, CheckState>;

export interface Remeasured {
  azimuthDeg: number;
  tiltDeg: number;
  rollDeg: number;
}

export interface InspectionFields {
  reflectorId: string;
  siteId: string;
  inspectedAtMs: number;
  checklist: Checklist;
  remeasured: Remeasured | null;
  crew: string[];
  notes: string;
  photoIds: string[];
  demo: boolean;
}
export type InspectionRecord = RecordMeta & InspectionFields;

export const PHOTO_OWNER_TABLES = ['installations', 'inspections'] as const;
export type PhotoOwnerTable = (typeof PHOTO_OWNER_TABLES)[number];

export interface PhotoRecord extends RecordMeta {
  ownerTable: PhotoOwnerTable;
  ownerId: string;
  /** 'boresight', 'north', 'east', 'south', 'west', 'base', 'foundation', 'other' or a short free word. */
  role: string;
  mime: string;
  blob: Blob;
  bytes: number;
  /**
   * SHA-256 of the bytes, 64 lowercase hex digits (schema 5). Null only for a photo stored before schema 5 until
   * the pass after opening (`fillPhotoHashes`) has hashed it; backups and merges fill it in first.
   */
  sha256: string | null;
  takenAtMs: number;
}

/** One field changed by one revision. `before`/`after` are the whole top-level values (JSON-like). */
export interface FieldChange {
  field: string;
  before: unknown;
  after: unknown;
}

export const REVISION_KINDS = ['create', 'update', 'delete', 'undelete'] as const;
export type RevisionKind = (typeof REVISION_KINDS)[number];

/**
 * One entry of a record's history. A 'create' revision holds the full record in `snapshot` and no changes;
 * every later revision holds field-level `changes` and no snapshot, so any version can be rebuilt by
 * replaying changes over the snapshot. Revisions are never edited or removed (except with demo data).
 */
export interface RevisionRecord {
  id: string;
  table: VersionedTable;
  recordId: string;
  rev: number;
  atMs: number;
  /** Crew member who made the change (free text). */
  by: string;
  kind: RevisionKind;
  changes: FieldChange[];
  snapshot: Record<string, unknown> | null;
  /** Set on deletions and undeletions done as part of a site/reflector cascade: the id of the revision that started it. */
  cascadeOf: string | null;
}

export interface DraftRecord {
  key: string;
  value: unknown;
  savedAtMs: number;
}

export interface MetaRecord {
  key: string;
  value: unknown;
}

/**
 * A version of a record that a merge did not apply (or replaced). Kept so nothing is ever dropped;
 * the UI lists open conflicts and lets the crew pick or mark them resolved.
 */
export interface ConflictRecord {
  id: string;
  table: VersionedTable;
  recordId: string;
  reason: string;
  /** Which version is now in the table. */
  kept: 'local' | 'incoming';
  /** The version that is NOT in the table (photo blobs included). */
  other: Record<string, unknown>;
  /** That version's history rows, when they were not merged into the revisions table. */
  otherRevisions: RevisionRecord[];
  detectedAtMs: number;
  resolvedAtMs: number | null;
}

/**
 * An orbital element set (two-line elements) kept on the phone for offline pass prediction (schema version 4).
 * One live set per catalogue number: adding a set for a number already stored replaces it (same row, rev + 1).
 * Element sets are reference data, not field work: rows carry RecordMeta (so merges and removals travel between
 * phones) but no history rows.
 */
export interface ElementSetFields {
  /** Catalogue number, columns 3–7 of both lines, trimmed (e.g. "99001"). */
  catalogNumber: string;
  /** Name from the name line ("" when the set had none). */
  name: string;
  /** The two data lines exactly as checked (69 characters each). */
  line1: string;
  line2: string;
  /** Element-set epoch, ms since 1970-01-01T00:00Z (read from line 1). */
  epochMs: number;
  /** When the set was added on this phone. */
  addedAtMs: number;
  /** True for the invented demonstration satellites: never for real planning. */
  demo: boolean;
}
export type ElementSetRecord = RecordMeta & ElementSetFields;

/** Derived summary per site (see repo/siteVisits.ts); never edited directly, never backed up. */
export interface SiteVisitsRecord {
  siteId: string;
  /** Latest installedAtMs / inspectedAtMs among the site's live installations and inspections. */
  lastVisitAtMs: number | null;
  installationCount: number;
  inspectionCount: number;
}

export const ENTITY_TABLES = ['sites', 'reflectors', 'geometries', 'installations', 'inspections'] as const;
/** Tables edited through the generic repositories. */
export type EntityTable = (typeof ENTITY_TABLES)[number];
/** Tables whose rows carry RecordMeta and a history. */
export type VersionedTable = EntityTable | 'photos';
export const VERSIONED_TABLES: readonly VersionedTable[] = [...ENTITY_TABLES, 'photos'];

export interface EntityFieldsByTable {
  sites: SiteFields;
  reflectors: ReflectorFields;
  geometries: GeometryFields;
  installations: InstallationFields;
  inspections: InspectionFields;
}
export type EntityRecord<T extends EntityTable> = RecordMeta & EntityFieldsByTable[T];
