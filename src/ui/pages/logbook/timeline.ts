/**
 * A site's history as a timeline: creations, edits, installations, inspections, deletions and restorations by
 * date, who made them and what changed (from the revisions the repositories write). Changes done by a cascade
 * (deleting a site deletes its reflectors …) are folded into the entry that started them. Pure, except
 * loadSiteTimeline, which reads the records through the repositories.
 */
import { wordDiff, type DiffSegment } from '../../../core/text/wordDiff.ts';
import {
  geometryRepo,
  history,
  inspectionRepo,
  installationRepo,
  reflectorRepo,
  siteRepo,
  type FieldChange,
  type GlintmarkDb,
  type RevisionKind,
  type RevisionRecord,
  type VersionedTable,
} from '../../../data/index.ts';
import { describeGeometry } from './geometryPlan.ts';
import { fmtUtc, METHOD_WORDS, POSITION_SOURCE_WORDS } from './words.ts';

export interface TimelineSource {
  table: VersionedTable;
  recordId: string;
  /** How the record is named in sentences: "site MF-01", "installation of reflector A". */
  label: string;
  revisions: readonly RevisionRecord[];
}

export interface TimelineEntry {
  id: string;
  atMs: number;
  by: string;
  kind: RevisionKind;
  table: VersionedTable;
  recordId: string;
  rev: number;
  title: string;
  /** One line per changed field: "measured azimuth (° true): 100.2 → 101.0". */
  details: string[];
  /**
   * Beside each detail: for edited text (notes, names …), the field's label and its word-level difference, so the
   * screen shows what changed rather than two cut-off starts; null for other fields.
   */
  textDiffs: ({ label: string; segments: DiffSegment[] } | null)[];
  /** Records changed by the same action (cascade): "reflector A", … */
  alsoChanged: string[];
}

const FIELD_LABELS: Record<string, string> = {
  code: 'code',
  name: 'name',
  latDeg: 'latitude (°)',
  lonDeg: 'longitude (°)',
  heightEllM: 'ellipsoidal height (m)',
  positionSource: 'position source',
  positionAccuracyM: 'position accuracy (m)',
  referenceFrame: 'reference frame',
  frameEpoch: 'frame epoch (decimal year)',
  notes: 'notes',
  label: 'label',
  shape: 'shape',
  edgeM: 'inner edge (m)',
  construction: 'construction',
  apex: 'apex position (°, °, m)',
  apexHeightAboveMarkM: 'apex height above mark (m)',
  gnssArpOffsetM: 'GNSS antenna offset east/north/up (m)',
  incidenceDeg: 'incidence (°)',
  headingDeg: 'heading (° true)',
  look: 'look side',
  direction: 'pass direction',
  band: 'band',
  wavelengthM: 'wavelength (m)',
  plannedAzimuthDeg: 'planned azimuth (° true)',
  plannedTiltDeg: 'planned tilt (°)',
  measuredAzimuthDeg: 'measured azimuth (° true)',
  measuredTiltDeg: 'measured tilt (°)',
  measuredRollDeg: 'measured roll (°)',
  azimuthMethod: 'azimuth method',
  declinationDeg: 'declination (°, east +)',
  declinationModel: 'declination model',
  fix: 'GPS fix',
  predictedLossDb: 'predicted loss (dB)',
  crew: 'crew',
  installedAtMs: 'installed at',
  inspectedAtMs: 'inspected at',
  checklist: 'checklist',
  remeasured: 're-measured orientation (°)',
  photoIds: 'photos',
  geometryIds: 'planned geometries',
  reflectorId: 'reflector',
  siteId: 'site',
  role: 'photo role',
  demo: 'demo record',
};

const clip = (s: string, n = 60) => (s.length > n ? `${s.slice(0, n)}…` : s);
const numText = (x: number) => String(Number(x.toFixed(6)));

/** A stored value as short text for a change line. */
export function valueText(field: string, v: unknown): string {
  if (v === null || v === undefined) return 'none';
  if (field.endsWith('AtMs') && typeof v === 'number') return fmtUtc(v);
  if (field === 'positionSource' && typeof v === 'string') return POSITION_SOURCE_WORDS[v as keyof typeof POSITION_SOURCE_WORDS] ?? v;
  if (field === 'azimuthMethod' && typeof v === 'string') return METHOD_WORDS[v as keyof typeof METHOD_WORDS] ?? v;
  if (typeof v === 'number') return numText(v);
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'string') return v === '' ? 'empty' : `“${clip(v)}”`;
  if (Array.isArray(v)) {
    if (field === 'photoIds' || field === 'geometryIds') return String(v.length);
    return v.length === 0 ? 'none' : clip(v.map((x) => (typeof x === 'string' ? x : JSON.stringify(x))).join(', '));
  }
  if (typeof v === 'object') {
    return clip(
      Object.entries(v as Record<string, unknown>)
        .map(([k, x]) => `${k} ${typeof x === 'number' ? numText(x) : typeof x === 'string' ? (x === '' ? 'empty' : clip(x, 20)) : String(x)}`)
        .join(', '),
      120,
    );
  }
  return String(v);
}

/** The word-level difference of a text field's change (both sides text, at least one non-empty); null otherwise. */
export function textDiffOf(c: FieldChange): { label: string; segments: DiffSegment[] } | null {
  if (typeof c.before !== 'string' || typeof c.after !== 'string' || (c.before === '' && c.after === '')) return null;
  if (c.field.endsWith('Id') || c.field === 'positionSource' || c.field === 'azimuthMethod' || c.field === 'shape' || c.field === 'look') return null;
  return { label: FIELD_LABELS[c.field] ?? c.field, segments: wordDiff(c.before, c.after) };
}

/** "measured azimuth (° true): 100.2 → 101" */
export function describeChange(c: FieldChange): string {
  return `${FIELD_LABELS[c.field] ?? c.field}: ${valueText(c.field, c.before)} → ${valueText(c.field, c.after)}`;
}

const CREATE_VERB: Partial<Record<VersionedTable, string>> = { installations: 'Recorded', inspections: 'Recorded', geometries: 'Planned' };

function titleOf(r: RevisionRecord, label: string): string {
  if (r.kind === 'create') return `${CREATE_VERB[r.table] ?? 'Created'} ${label}`;
  if (r.kind === 'delete') return `Deleted ${label}`;
  if (r.kind === 'undelete') return `Restored ${label}`;
  const only = r.changes.length === 1 ? r.changes[0] : null;
  if (only?.field === 'photoIds' && Array.isArray(only.before) && Array.isArray(only.after)) {
    return only.after.length > only.before.length ? `Added a photo to ${label}` : `Removed a photo from ${label}`;
  }
  return `Edited ${label}`;
}

/**
 * Entries newest first; cascaded revisions folded into the entry whose revision started them. Entries at the same
 * instant keep the input order reversed (sources listed parent first, each source's revisions oldest first).
 */
export function buildTimeline(sources: readonly TimelineSource[]): TimelineEntry[] {
  const entries = new Map<string, TimelineEntry>();
  const seq = new Map<string, number>();
  const cascaded: { of: string; label: string }[] = [];
  for (const s of sources) {
    for (const r of s.revisions) {
      if (r.cascadeOf !== null) {
        cascaded.push({ of: r.cascadeOf, label: s.label });
        continue;
      }
      entries.set(r.id, {
        id: r.id,
        atMs: r.atMs,
        by: r.by,
        kind: r.kind,
        table: r.table,
        recordId: r.recordId,
        rev: r.rev,
        title: titleOf(r, s.label),
        details: r.kind === 'update' ? r.changes.map(describeChange) : [],
        textDiffs: r.kind === 'update' ? r.changes.map(textDiffOf) : [],
        alsoChanged: [],
      });
      seq.set(r.id, seq.size);
    }
  }
  for (const c of cascaded) entries.get(c.of)?.alsoChanged.push(c.label);
  return [...entries.values()].sort((a, b) => b.atMs - a.atMs || (seq.get(b.id) ?? 0) - (seq.get(a.id) ?? 0));
}

/** Everything that happened on a site and to its reflectors, geometries, installations and inspections (deleted ones too). */
export async function loadSiteTimeline(db: GlintmarkDb, siteId: string): Promise<TimelineEntry[]> {
  const site = await siteRepo.get(db, siteId);
  if (!site) return [];
  const all = { siteId, includeDeleted: true };
  const [reflectors, geometries, installations, inspections] = await Promise.all([
    reflectorRepo.list(db, all),
    geometryRepo.list(db, all),
    installationRepo.list(db, all),
    inspectionRepo.list(db, all),
  ]);
  const labelOf = new Map(reflectors.map((r) => [r.id, `reflector ${r.label}`]));
  const refl = (id: string) => labelOf.get(id) ?? 'a reflector';
  const list: { table: VersionedTable; recordId: string; label: string }[] = [
    { table: 'sites', recordId: site.id, label: `site ${site.code}` },
    ...reflectors.map((r) => ({ table: 'reflectors' as const, recordId: r.id, label: `reflector ${r.label}` })),
    ...geometries.map((g) => ({ table: 'geometries' as const, recordId: g.id, label: `geometry (${describeGeometry(g)})` })),
    ...installations.map((i) => ({ table: 'installations' as const, recordId: i.id, label: `installation of ${refl(i.reflectorId)}` })),
    ...inspections.map((i) => ({ table: 'inspections' as const, recordId: i.id, label: `inspection of ${refl(i.reflectorId)}` })),
  ];
  const revisions = await Promise.all(list.map((x) => history(db, x.table, x.recordId)));
  return buildTimeline(list.map((x, i) => ({ ...x, revisions: revisions[i] })));
}
