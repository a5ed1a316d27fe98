/**
 * Sites with their latest live installation as a GeoJSON FeatureCollection, per RFC 7946
 * (Butler et al., "The GeoJSON Format", IETF 2016): one Point feature per live site, coordinates
 * [longitude, latitude, height] in that order (§3.1.1), WGS84 degrees and metres above the ellipsoid (§4);
 * no "crs" member (§4). Coordinates keep full precision. Property names carry units; times are ISO 8601 UTC.
 * A site's referenceFrame (e.g. ITRF2020) is reported as a property; coordinates are not transformed.
 */
import type { GlintmarkDb } from '../db.ts';
import type { InstallationRecord, ReflectorRecord, SiteRecord } from '../types.ts';
import { isoUtc } from '../../core/time.ts';

export interface PointFeature {
  type: 'Feature';
  id: string;
  geometry: { type: 'Point'; coordinates: [number, number, number] };
  properties: Record<string, string | number | boolean | null>;
}

export interface SitesFeatureCollection {
  type: 'FeatureCollection';
  features: PointFeature[];
  /** Foreign member (RFC 7946 §6.1) stating the conventions of the properties. */
  glintmark: { exportedAtUtc: string; azimuths: string; heights: string };
}

/** Latest live installation per site id. */
function latestInstallationBySite(installations: readonly InstallationRecord[]): Map<string, InstallationRecord> {
  const out = new Map<string, InstallationRecord>();
  for (const i of installations) {
    if (i.deletedAtMs !== null) continue;
    const cur = out.get(i.siteId);
    if (!cur || i.installedAtMs > cur.installedAtMs || (i.installedAtMs === cur.installedAtMs && i.id > cur.id)) out.set(i.siteId, i);
  }
  return out;
}

function siteFeature(s: SiteRecord, inst: InstallationRecord | undefined, reflector: ReflectorRecord | undefined): PointFeature {
  return {
    type: 'Feature',
    id: s.id,
    geometry: { type: 'Point', coordinates: [s.lonDeg, s.latDeg, s.heightEllM] },
    properties: {
      site_id: s.id,
      code: s.code,
      name: s.name,
      height_ell_m: s.heightEllM,
      position_source: s.positionSource,
      position_accuracy_m: s.positionAccuracyM,
      reference_frame: s.referenceFrame,
      frame_epoch_year: s.frameEpoch,
      notes: s.notes,
      updated_at_utc: isoUtc(s.updatedAtMs),
      demo: s.demo,
      installation_id: inst?.id ?? null,
      installation_reflector_label: reflector?.label ?? null,
      installation_installed_at_utc: isoUtc(inst?.installedAtMs),
      installation_planned_azimuth_deg: inst?.plannedAzimuthDeg ?? null,
      installation_planned_tilt_deg: inst?.plannedTiltDeg ?? null,
      installation_measured_azimuth_deg: inst?.measuredAzimuthDeg ?? null,
      installation_measured_tilt_deg: inst?.measuredTiltDeg ?? null,
      installation_measured_roll_deg: inst?.measuredRollDeg ?? null,
      installation_azimuth_method: inst?.azimuthMethod ?? null,
      installation_declination_deg: inst?.declinationDeg ?? null,
      installation_declination_model: inst?.declinationModel ?? null,
      installation_predicted_loss_db: inst?.predictedLossDb ?? null,
    },
  };
}

function sitesToGeoJson(
  sites: readonly SiteRecord[],
  installations: readonly InstallationRecord[],
  reflectors: ReadonlyMap<string, ReflectorRecord>,
  nowMs = Date.now(),
): SitesFeatureCollection {
  const latest = latestInstallationBySite(installations);
  const features = sites
    .filter((s) => s.deletedAtMs === null)
    .sort((a, b) => a.code.localeCompare(b.code, undefined, { numeric: true }))
    .map((s) => {
      const inst = latest.get(s.id);
      return siteFeature(s, inst, inst ? reflectors.get(inst.reflectorId) : undefined);
    });
  return {
    type: 'FeatureCollection',
    features,
    glintmark: {
      exportedAtUtc: new Date(nowMs).toISOString(),
      azimuths: 'degrees clockwise from true north, [0, 360)',
      heights: 'metres above the WGS84 ellipsoid',
    },
  };
}

/** Read sites, installations and reflectors in one transaction and build the collection. */
export async function exportSitesGeoJson(db: GlintmarkDb, nowMs = Date.now()): Promise<SitesFeatureCollection> {
  const [sites, installations, reflectors] = await db.transaction('r', ['sites', 'installations', 'reflectors'], () =>
    Promise.all([db.sites.toArray(), db.installations.toArray(), db.reflectors.toArray()]),
  );
  return sitesToGeoJson(sites, installations, new Map(reflectors.map((r) => [r.id, r])), nowMs);
}

/** Names of OGC CRS84 (WGS84 longitude, latitude; CRS84h adds ellipsoidal height): what RFC 7946 §4 coordinates are. */
const CRS84 = /^(?:urn:ogc:def:crs:OGC:(?:1\.3)?:CRS84h?|https?:\/\/www\.opengis\.net\/def\/crs\/OGC\/(?:1\.3|0)\/CRS84h?)$/i;
const EPSG_4326 = /(?:^|[:/])(?:EPSG)(?::{1,2}|\/0\/|\/)4326$/i;

/** The problem with one `crs` member (GeoJSON 2008 draft), or null when it names WGS84 longitude/latitude. */
function crsProblem(crs: unknown, where: string): string | null {
  if (crs === undefined) return null;
  const c = (typeof crs === 'object' && crs !== null ? crs : {}) as { type?: unknown; properties?: Record<string, unknown> | null };
  const props = c.properties ?? {};
  if (c.type === 'name' && typeof props.name === 'string') {
    const name = props.name.trim();
    if (CRS84.test(name)) return null;
    if (EPSG_4326.test(name)) {
      return `${where} names the coordinate system ${JSON.stringify(name)}, which lists latitude first; GeoJSON (RFC 7946) coordinates are longitude first, so latitude and longitude may be swapped. Export the file again as RFC 7946 GeoJSON (WGS84 longitude, latitude, no "crs").`;
    }
    return `${where} names the coordinate system ${JSON.stringify(name)}; only WGS84 longitude, latitude (RFC 7946) can be imported. Convert the file to WGS84 longitude/latitude and export it without "crs".`;
  }
  const href = typeof props.href === 'string' ? ` ${JSON.stringify(props.href)}` : '';
  return `${where} has a "crs" member (${c.type === 'link' ? `a link to${href}` : JSON.stringify(crs)}) that is not WGS84 longitude, latitude (RFC 7946); convert the file to WGS84 longitude/latitude and export it without "crs".`;
}

/**
 * For importers: why a parsed GeoJSON document cannot be read as RFC 7946 WGS84 longitude/latitude, or null.
 * RFC 7946 §4 removed `crs`; files in the 2008 form may still carry one, on the collection or on any feature or
 * geometry. Absent, or naming OGC CRS84: fine. Anything else (a projected system, a link, the latitude-first
 * EPSG:4326 urn) is refused, naming it, so coordinates never land in the wrong place.
 */
export function geoJsonCrsProblem(data: unknown): string | null {
  if (typeof data !== 'object' || data === null) return null;
  const o = data as { crs?: unknown; features?: unknown; geometry?: { crs?: unknown } | null };
  const top = crsProblem(o.crs, 'The file');
  if (top) return top;
  const features = Array.isArray(o.features) ? (o.features as unknown[]) : [o];
  for (const [i, f] of features.entries()) {
    if (typeof f !== 'object' || f === null) continue;
    const ft = f as { crs?: unknown; geometry?: { crs?: unknown } | null };
    const p = (f !== o ? crsProblem(ft.crs, `Feature ${i}`) : null) ?? crsProblem(ft.geometry?.crs, `The geometry of feature ${i}`);
    if (p) return p;
  }
  return null;
}
