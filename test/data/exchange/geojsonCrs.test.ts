/**
 * RFC 7946 (Butler et al., "The GeoJSON Format", IETF 2016) §4: coordinates are longitude, latitude and optional
 * height in WGS84 (OGC CRS84); the `crs` member of the 2008 draft was removed. A file whose crs names another
 * system is refused, naming it, rather than read with coordinates in the wrong place or swapped.
 */
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { previewSiteImport } from '../../../src/data/exchange/siteImport.ts';
import { useTestDb } from '../helpers.ts';

const collection = (crs: unknown, coordinates = [-1.2345, 52.4123, 61.2]) =>
  JSON.stringify({
    type: 'FeatureCollection',
    ...(crs === undefined ? {} : { crs }),
    features: [{ type: 'Feature', geometry: { type: 'Point', coordinates }, properties: { code: 'MF-01', name: 'north bank' } }],
  });
const named = (name: string) => ({ type: 'name', properties: { name } });

describe('GeoJSON import and the crs member', () => {
  const db = useTestDb();

  it('no crs, or OGC CRS84 named: read as longitude, latitude', async () => {
    for (const crs of [undefined, named('urn:ogc:def:crs:OGC:1.3:CRS84'), named('urn:ogc:def:crs:OGC::CRS84'), named('http://www.opengis.net/def/crs/OGC/1.3/CRS84')]) {
      const p = await previewSiteImport(db(), collection(crs), 'geojson');
      expect(p.rejected).toEqual([]);
      expect(p.accepted[0].fields).toMatchObject({ latDeg: 52.4123, lonDeg: -1.2345 });
    }
  });

  it('the legacy EPSG:4326 urn is refused, saying that it puts latitude first', async () => {
    const p = await previewSiteImport(db(), collection(named('urn:ogc:def:crs:EPSG::4326'), [52.4123, -1.2345, 61.2]), 'geojson');
    expect(p.accepted).toEqual([]);
    expect(p.rejected).toEqual([{ row: 0, reason: expect.stringMatching(/urn:ogc:def:crs:EPSG::4326.*latitude first/) }]);
  });

  it('a projected system, a link, or a crs on one feature is refused naming it', async () => {
    const projected = await previewSiteImport(db(), collection(named('urn:ogc:def:crs:EPSG::27700'), [445000, 290000]), 'geojson');
    expect(projected.accepted).toEqual([]);
    expect(projected.rejected[0]).toEqual({ row: 0, reason: expect.stringMatching(/"urn:ogc:def:crs:EPSG::27700".*WGS84 longitude, latitude/) });
    const link = await previewSiteImport(db(), collection({ type: 'link', properties: { href: 'http://example.org/crs', type: 'proj4' } }), 'geojson');
    expect(link.rejected[0].reason).toMatch(/http:\/\/example\.org\/crs/);
    const inner = JSON.parse(collection(undefined)) as { features: Record<string, unknown>[] };
    inner.features[0].crs = named('EPSG:3857');
    const onFeature = await previewSiteImport(db(), JSON.stringify(inner), 'geojson');
    expect(onFeature.accepted).toEqual([]);
    expect(onFeature.rejected[0].reason).toMatch(/EPSG:3857/);
  });
});
