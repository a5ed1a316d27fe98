/**
 * CSV exports of installations, inspections and sites (live rows only; ids kept so rows can be traced back).
 * Column names carry units; azimuths are degrees clockwise from true north in [0, 360); times are
 * ISO 8601 UTC; lists (geometry ids, crew) are joined with "; ". A text cell that a spreadsheet would run as a
 * formula (starting with =, +, -, @, TAB or CR) is prefixed with a quote (core/text/csv.ts protectCsvCell); the
 * site import removes it again. Numbers are written as numbers.
 */
import type { GlintmarkDb } from '../db.ts';
import type { InspectionRecord, InstallationRecord, ReflectorRecord, SiteRecord } from '../types.ts';
import { toCsv, type CsvValue } from '../../core/text/csv.ts';
import { isoUtc } from '../../core/time.ts';

export const INSTALLATION_COLUMNS = [
  'installation_id', 'site_id', 'site_code', 'reflector_id', 'reflector_label', 'installed_at_utc',
  'planned_azimuth_deg', 'planned_tilt_deg', 'measured_azimuth_deg', 'measured_tilt_deg', 'measured_roll_deg',
  'azimuth_method', 'declination_deg', 'declination_model', 'fix_lat_deg', 'fix_lon_deg', 'fix_accuracy_m', 'fix_at_utc',
  'predicted_loss_db', 'geometry_ids', 'crew', 'photo_count', 'notes', 'rev', 'updated_at_utc', 'demo',
] as const;

export const INSPECTION_COLUMNS = [
  'inspection_id', 'site_id', 'site_code', 'reflector_id', 'reflector_label', 'inspected_at_utc',
  'debris', 'standing_water', 'snow_ice', 'vegetation', 'damage', 'movement',
  'remeasured_azimuth_deg', 'remeasured_tilt_deg', 'remeasured_roll_deg', 'crew', 'photo_count', 'notes', 'rev', 'updated_at_utc', 'demo',
] as const;

/** Readable by previewSiteImport (which also accepts the plainer latitude/longitude/height_m names). */
export const SITE_COLUMNS = [
  'code', 'name', 'latitude_deg', 'longitude_deg', 'height_ell_m', 'position_source', 'position_accuracy_m',
  'reference_frame', 'frame_epoch', 'notes', 'site_id', 'updated_at_utc', 'demo',
] as const;

interface Lookups {
  sites: ReadonlyMap<string, SiteRecord>;
  reflectors: ReadonlyMap<string, ReflectorRecord>;
}

function installationsToCsv(rows: readonly InstallationRecord[], l: Lookups): string {
  return toCsv(
    INSTALLATION_COLUMNS,
    rows.map((i): CsvValue[] => [
      i.id, i.siteId, l.sites.get(i.siteId)?.code, i.reflectorId, l.reflectors.get(i.reflectorId)?.label, isoUtc(i.installedAtMs),
      i.plannedAzimuthDeg, i.plannedTiltDeg, i.measuredAzimuthDeg, i.measuredTiltDeg, i.measuredRollDeg,
      i.azimuthMethod, i.declinationDeg, i.declinationModel, i.fix?.latDeg, i.fix?.lonDeg, i.fix?.accuracyM, isoUtc(i.fix?.atMs),
      i.predictedLossDb, i.geometryIds.join('; '), i.crew.join('; '), i.photoIds.length, i.notes, i.rev, isoUtc(i.updatedAtMs), i.demo,
    ]),
  );
}

function inspectionsToCsv(rows: readonly InspectionRecord[], l: Lookups): string {
  return toCsv(
    INSPECTION_COLUMNS,
    rows.map((x): CsvValue[] => [
      x.id, x.siteId, l.sites.get(x.siteId)?.code, x.reflectorId, l.reflectors.get(x.reflectorId)?.label, isoUtc(x.inspectedAtMs),
      x.checklist.debris, x.checklist.standingWater, x.checklist.snowIce, x.checklist.vegetation, x.checklist.damage, x.checklist.movement,
      x.remeasured?.azimuthDeg, x.remeasured?.tiltDeg, x.remeasured?.rollDeg, x.crew.join('; '), x.photoIds.length, x.notes, x.rev,
      isoUtc(x.updatedAtMs), x.demo,
    ]),
  );
}

function sitesToCsv(rows: readonly SiteRecord[]): string {
  return toCsv(
    SITE_COLUMNS,
    rows.map((s): CsvValue[] => [
      s.code, s.name, s.latDeg, s.lonDeg, s.heightEllM, s.positionSource, s.positionAccuracyM, s.referenceFrame, s.frameEpoch,
      s.notes, s.id, isoUtc(s.updatedAtMs), s.demo,
    ]),
  );
}

const live = <T extends { deletedAtMs: number | null }>(rows: T[]) => rows.filter((r) => r.deletedAtMs === null);
const byId = <T extends { id: string }>(rows: T[]) => new Map(rows.map((r) => [r.id, r]));

/** The rows of `table` with the site and reflector lookups, read in one consistent transaction. */
async function withLookups<T>(db: GlintmarkDb, table: 'installations' | 'inspections'): Promise<[T[], Lookups]> {
  return db.transaction('r', [table, 'sites', 'reflectors'], async () => {
    const [rows, sites, reflectors] = await Promise.all([db.table<T>(table).toArray(), db.sites.toArray(), db.reflectors.toArray()]);
    return [rows, { sites: byId(sites), reflectors: byId(reflectors) }];
  });
}

/** Live installations, oldest first, as CSV text. */
export async function exportInstallationsCsv(db: GlintmarkDb): Promise<string> {
  const [rows, l] = await withLookups<InstallationRecord>(db, 'installations');
  return installationsToCsv(live(rows).sort((a, b) => a.installedAtMs - b.installedAtMs || a.id.localeCompare(b.id)), l);
}

/** Live inspections, oldest first, as CSV text. */
export async function exportInspectionsCsv(db: GlintmarkDb): Promise<string> {
  const [rows, l] = await withLookups<InspectionRecord>(db, 'inspections');
  return inspectionsToCsv(live(rows).sort((a, b) => a.inspectedAtMs - b.inspectedAtMs || a.id.localeCompare(b.id)), l);
}

/** Live sites by code, as CSV text that previewSiteImport reads back. */
export async function exportSitesCsv(db: GlintmarkDb): Promise<string> {
  const rows = live(await db.sites.toArray()).sort((a, b) => a.code.localeCompare(b.code, undefined, { numeric: true }));
  return sitesToCsv(rows);
}
