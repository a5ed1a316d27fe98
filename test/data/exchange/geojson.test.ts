import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { openGlintmarkDb } from '../../../src/data/db.ts';
import { exportSitesGeoJson } from '../../../src/data/exchange/geojson.ts';
import { commitSiteImport, previewSiteImport } from '../../../src/data/exchange/siteImport.ts';
import { installationRepo } from '../../../src/data/repo/entities.ts';
import { siteRepo } from '../../../src/data/repo/sites.ts';
import type { SiteRecord } from '../../../src/data/types.ts';
import { BY, T0_MS, installationFields, seedSample, siteFields, useTestDb } from '../helpers.ts';

/**
 * The RFC 7946 rules an exported collection must meet (Butler et al., "The GeoJSON Format", IETF 2016):
 * §3.3 a FeatureCollection has a "features" array; §3.2 each Feature has "geometry" and "properties"
 * (object or null) and an optional string/number "id"; §3.1.2 a Point's coordinates are one position;
 * §3.1.1 a position is [longitude, latitude] or [longitude, latitude, altitude] in that order, WGS84 (§4),
 * longitude in [-180, 180], latitude in [-90, 90]; §4 no "crs" member.
 */
function rfc7946Problems(doc: unknown): string[] {
  const p: string[] = [];
  const d = doc as Record<string, unknown>;
  if (d.type !== 'FeatureCollection') p.push('type is not FeatureCollection');
  if (!Array.isArray(d.features)) return [...p, 'features is not an array'];
  if ('crs' in d) p.push('has a crs member');
  d.features.forEach((f: Record<string, unknown>, i: number) => {
    if (f.type !== 'Feature') p.push(`${i}: type`);
    if (!('properties' in f) || (f.properties !== null && typeof f.properties !== 'object')) p.push(`${i}: properties`);
    if ('id' in f && typeof f.id !== 'string' && typeof f.id !== 'number') p.push(`${i}: id`);
    const g = f.geometry as { type?: string; coordinates?: unknown };
    if (g?.type !== 'Point') p.push(`${i}: geometry type`);
    const c = g?.coordinates;
    if (!Array.isArray(c) || c.length < 2 || c.length > 3 || !c.every((x) => typeof x === 'number' && Number.isFinite(x))) p.push(`${i}: position`);
    else if (c[0] < -180 || c[0] > 180 || c[1] < -90 || c[1] > 90) p.push(`${i}: position out of range`);
  });
  return p;
}

describe('GeoJSON export of sites', () => {
  const db = useTestDb();

  it('meets RFC 7946 and puts longitude first', async () => {
    const ids = await seedSample(db());
    const fc = await exportSitesGeoJson(db(), T0_MS);
    expect(rfc7946Problems(JSON.parse(JSON.stringify(fc)))).toEqual([]);
    const mf02 = fc.features.find((f) => f.properties.code === 'MF-02');
    // MF-02 was typed at latitude -33.5, longitude 151.25: lon first, and the two are not interchangeable.
    expect(mf02?.geometry.coordinates).toEqual([151.25, -33.5, 25]);
    expect(fc.features.map((f) => f.properties.code)).toEqual(['MF-01', 'MF-02']); // MF-03 is deleted
    expect(fc.features[0]).toMatchObject({
      id: ids.site.id,
      properties: {
        height_ell_m: 61.2,
        installation_id: ids.inst.id,
        installation_installed_at_utc: '2027-07-02T12:00:00.000Z',
        installation_measured_azimuth_deg: 256.1,
        installation_reflector_label: 'A',
        updated_at_utc: '2027-07-02T12:00:00.000Z',
      },
    });
    expect(mf02?.properties.installation_id).toBeNull();
  });

  it('carries the latest live installation of each site', async () => {
    const ids = await seedSample(db());
    const later = await installationRepo.create(db(), installationFields(ids.site.id, ids.refl.id, { installedAtMs: T0_MS + 86_400_000, measuredAzimuthDeg: 250 }), BY);
    expect((await exportSitesGeoJson(db())).features[0].properties.installation_id).toBe(later.id);
    await installationRepo.softDelete(db(), later.id, BY);
    expect((await exportSitesGeoJson(db())).features[0].properties.installation_id).toBe(ids.inst.id);
  });

  it('round-trips through the importer: same codes, names, coordinates, frames and notes', async () => {
    await siteRepo.create(db(), siteFields({ code: 'EDGE-W', lonDeg: -180, latDeg: -90, heightEllM: -30.25, notes: 'line one\nline "two", with comma' }), BY);
    await siteRepo.create(db(), siteFields({ code: 'EDGE-E', lonDeg: 179.999999, latDeg: 90, frameEpoch: null, positionAccuracyM: null }), BY);
    const text = JSON.stringify(await exportSitesGeoJson(db()));
    const other = openGlintmarkDb(`import-${crypto.randomUUID()}`);
    try {
      const preview = await previewSiteImport(other, text, 'geojson');
      expect(preview.rejected).toEqual([]);
      await commitSiteImport(other, preview, BY);
      const strip = ({ code, name, latDeg, lonDeg, heightEllM, positionAccuracyM, referenceFrame, frameEpoch, notes }: SiteRecord) =>
        ({ code, name, latDeg, lonDeg, heightEllM, positionAccuracyM, referenceFrame, frameEpoch, notes });
      expect((await siteRepo.list(other)).map(strip)).toEqual((await siteRepo.list(db())).map(strip));
      expect((await siteRepo.list(other)).every((s) => s.positionSource === 'imported')).toBe(true);
    } finally {
      await other.delete();
    }
  });
});
