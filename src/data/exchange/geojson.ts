/**
 * Sites with their reflectors and installations as a GeoJSON FeatureCollection, per RFC 7946
 * (Butler et al., "The GeoJSON Format", IETF 2016): one Point feature per live site, coordinates
 * [longitude, latitude, height] in that order (§3.1.1), WGS84 degrees and metres above the ellipsoid (§4), or
 * [longitude, latitude] when the ellipsoidal height is unknown; no "crs" member (§4). Numbers are rounded as
 * rounding.ts states (8 decimals of a degree is about 1 mm, finer than the 6 §11.2 suggests, for surveyed marks).
 * Property names carry units; times are ISO 8601 UTC. A site's referenceFrame (e.g. ITRF2020) is reported as a
 * property; coordinates are not transformed.
 *
 * Each feature stands alone: `reflectors` lists every live reflector of the site (label, shape, edge) with its
 * latest live installation and the geometries that installation serves; the flat installation_* properties keep
 * the site's latest installation of any reflector, as before.
 */
import type { GlintmarkDb } from '../db.ts';
import type { GeometryRecord, InstallationRecord, ReflectorRecord, SiteRecord } from '../types.ts';
import { AZIMUTH_METHOD_LABELS } from '../words.ts';
import { isoUtc } from '../../core/time.ts';
import { rounded } from './rounding.ts';

export type JsonValue = string | number | boolean | null | JsonValue[] | { [k: string]: JsonValue };

export interface PointFeature {
  type: 'Feature';
  id: string;
  geometry: { type: 'Point'; coordinates: [number, number, number] | [number, number] };
  properties: Record<string, JsonValue>;
}

export interface SitesFeatureCollection {
  type: 'FeatureCollection';
  features: PointFeature[];
  /** Foreign member (RFC 7946 §6.1) stating the conventions of the properties. */
  glintmark: { exportedAtUtc: string; azimuths: string; heights: string; rounding: string };
}

/** Latest live installation per key (site id or reflector id). */
function latestBy(installations: readonly InstallationRecord[], key: (i: InstallationRecord) => string): Map<string, InstallationRecord> {
  const out = new Map<string, InstallationRecord>();
  for (const i of installations) {
    if (i.deletedAtMs !== null) continue;
    const cur = out.get(key(i));
    if (!cur || i.installedAtMs > cur.installedAtMs || (i.installedAtMs === cur.installedAtMs && i.id > cur.id)) out.set(key(i), i);
  }
  return out;
}

const angle = (x: number | null | undefined) => rounded(x, 'angleDeg');

function installationObject(i: InstallationRecord, geometries: ReadonlyMap<string, GeometryRecord>): JsonValue {
  return {
    installation_id: i.id,
    installed_at_utc: isoUtc(i.installedAtMs),
    planned_azimuth_deg: angle(i.plannedAzimuthDeg),
    planned_tilt_deg: angle(i.plannedTiltDeg),
    measured_azimuth_deg: angle(i.measuredAzimuthDeg),
    measured_tilt_deg: angle(i.measuredTiltDeg),
    measured_roll_deg: angle(i.measuredRollDeg),
    azimuth_method: i.azimuthMethod,
    azimuth_method_label: AZIMUTH_METHOD_LABELS[i.azimuthMethod],
    declination_deg: angle(i.declinationDeg),
    declination_model: i.declinationModel,
    predicted_loss_db: rounded(i.predictedLossDb, 'lossDb'),
    crew: i.crew,
    geometries: i.geometryIds.map((id): JsonValue => {
      const g = geometries.get(id);
      if (!g) return { geometry_id: id };
      return {
        geometry_id: id, satellite: g.satellite, direction: g.direction, incidence_deg: angle(g.incidenceDeg), heading_deg: angle(g.headingDeg),
        look: g.look, band: g.band,
      };
    }),
  };
}

interface Related {
  reflectors: readonly ReflectorRecord[];
  latestByReflector: ReadonlyMap<string, InstallationRecord>;
  geometries: ReadonlyMap<string, GeometryRecord>;
}

function siteFeature(s: SiteRecord, inst: InstallationRecord | undefined, reflector: ReflectorRecord | undefined, rel: Related): PointFeature {
  const lon = rounded(s.lonDeg, 'latLonDeg')!;
  const lat = rounded(s.latDeg, 'latLonDeg')!;
  const h = rounded(s.heightEllM, 'lengthM');
  return {
    type: 'Feature',
    id: s.id,
    geometry: { type: 'Point', coordinates: h === null ? [lon, lat] : [lon, lat, h] },
    properties: {
      site_id: s.id,
      code: s.code,
      name: s.name,
      height_ell_m: h,
      height_msl_m: rounded(s.heightMslM, 'lengthM'),
      position_source: s.positionSource,
      position_accuracy_m: rounded(s.positionAccuracyM, 'accuracyM'),
      reference_frame: s.referenceFrame,
      frame_epoch_year: rounded(s.frameEpoch, 'epochYear'),
      notes: s.notes,
      updated_at_utc: isoUtc(s.updatedAtMs),
      demo: s.demo,
      installation_id: inst?.id ?? null,
      installation_reflector_label: reflector?.label ?? null,
      installation_installed_at_utc: isoUtc(inst?.installedAtMs),
      installation_planned_azimuth_deg: angle(inst?.plannedAzimuthDeg),
      installation_planned_tilt_deg: angle(inst?.plannedTiltDeg),
      installation_measured_azimuth_deg: angle(inst?.measuredAzimuthDeg),
      installation_measured_tilt_deg: angle(inst?.measuredTiltDeg),
      installation_measured_roll_deg: angle(inst?.measuredRollDeg),
      installation_azimuth_method: inst?.azimuthMethod ?? null,
      installation_azimuth_method_label: inst ? AZIMUTH_METHOD_LABELS[inst.azimuthMethod] : null,
      installation_declination_deg: angle(inst?.declinationDeg),
      installation_declination_model: inst?.declinationModel ?? null,
      installation_predicted_loss_db: rounded(inst?.predictedLossDb, 'lossDb'),
      reflector_count: rel.reflectors.length,
      reflectors: rel.reflectors.map((r): JsonValue => {
        const latest = rel.latestByReflector.get(r.id);
        return {
          reflector_id: r.id,
          label: r.label,
          shape: r.shape,
          edge_m: rounded(r.edgeM, 'lengthM'),
          panels: r.construction.panels,
          latest_installation: latest ? installationObject(latest, rel.geometries) : null,
        };
      }),
    },
  };
}

function sitesToGeoJson(
  sites: readonly SiteRecord[],
  installations: readonly InstallationRecord[],
  reflectorRows: readonly ReflectorRecord[],
  geometries: ReadonlyMap<string, GeometryRecord>,
  nowMs = Date.now(),
): SitesFeatureCollection {
  const reflectors = new Map(reflectorRows.map((r) => [r.id, r]));
  const latest = latestBy(installations, (i) => i.siteId);
  const latestByReflector = latestBy(installations, (i) => i.reflectorId);
  const liveReflectorsBySite = new Map<string, ReflectorRecord[]>();
  for (const r of reflectorRows) {
    if (r.deletedAtMs !== null) continue;
    liveReflectorsBySite.set(r.siteId, [...(liveReflectorsBySite.get(r.siteId) ?? []), r]);
  }
  const features = sites
    .filter((s) => s.deletedAtMs === null)
    .sort((a, b) => a.code.localeCompare(b.code, undefined, { numeric: true }))
    .map((s) => {
      const inst = latest.get(s.id);
      const siteReflectors = (liveReflectorsBySite.get(s.id) ?? []).sort((a, b) => a.label.localeCompare(b.label, undefined, { numeric: true }));
      return siteFeature(s, inst, inst ? reflectors.get(inst.reflectorId) : undefined, { reflectors: siteReflectors, latestByReflector, geometries });
    });
  return {
    type: 'FeatureCollection',
    features,
    glintmark: {
      exportedAtUtc: new Date(nowMs).toISOString(),
      azimuths: 'degrees clockwise from true north, [0, 360)',
      heights: 'metres above the WGS84 ellipsoid (two coordinates and height_ell_m null: unknown; height_msl_m: above mean sea level)',
      rounding: 'latitude/longitude 8 decimals, heights and edges 3 (mm), accuracies 2 (cm), angles 2 (0.01 degree), loss 2 (0.01 dB)',
    },
  };
}

/** Read sites, installations and reflectors in one transaction and build the collection. */
export async function exportSitesGeoJson(db: GlintmarkDb, nowMs = Date.now()): Promise<SitesFeatureCollection> {
  const [sites, installations, reflectors, geometries] = await db.transaction('r', ['sites', 'installations', 'reflectors', 'geometries'], () =>
    Promise.all([db.sites.toArray(), db.installations.toArray(), db.reflectors.toArray(), db.geometries.toArray()]),
  );
  return sitesToGeoJson(sites, installations, reflectors, new Map(geometries.map((g) => [g.id, g])), nowMs);
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
