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
