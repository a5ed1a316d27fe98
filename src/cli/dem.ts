/**
 * Read a GeoTIFF elevation or surface model into the core's ElevationGrid (geotiff.js 2.1.3 reads the file;
 * georeferencing per GeoTIFF 1.1, OGC 19-008r4, 2019). Accepted: one band of heights in metres, north-up
 * (ModelTiepoint + ModelPixelScale, no ModelTransformation), in geographic WGS84 (EPSG:4326) or ETRS89
 * (EPSG:4258, within 1 m of WGS84) or in a WGS84 UTM zone (EPSG:326zz north, 327zz south). Anything else is refused
 * with the reason, so a user can reproject the file first.
 */
import { readFile } from 'node:fs/promises';
import { fromArrayBuffer } from 'geotiff';
import type { ElevationGrid, GridCrs } from '../core/horizon/grid.ts';
import { UsageError, WorkError } from './args.ts';

const GEOGRAPHIC_OK = new Map([
  [4326, 'WGS 84'],
  [4258, 'ETRS89'],
]);

function crsFromKeys(keys: Record<string, number | undefined>, file: string): GridCrs {
  const model = keys.GTModelTypeGeoKey;
  const proj = keys.ProjectedCSTypeGeoKey;
  const geog = keys.GeographicTypeGeoKey;
  if (model === 1 || (proj !== undefined && model !== 2)) {
    if (proj !== undefined && proj >= 32601 && proj <= 32660) return { kind: 'utm', zone: proj - 32600, south: false };
    if (proj !== undefined && proj >= 32701 && proj <= 32760) return { kind: 'utm', zone: proj - 32700, south: true };
    throw new UsageError(
      `${file}: projected CRS ${proj === undefined ? '(not stated)' : `EPSG:${proj}`} is not supported; reproject the grid to WGS 84 (EPSG:4326) or a WGS 84 UTM zone (EPSG:326zz/327zz)`,
    );
  }
  if (geog !== undefined && GEOGRAPHIC_OK.has(geog)) return { kind: 'geographic' };
  throw new UsageError(`${file}: geographic CRS ${geog === undefined ? '(not stated)' : `EPSG:${geog}`} is not supported; use WGS 84 (EPSG:4326)`);
}

/** Parse GeoTIFF bytes. `file` names the source in errors. */
export async function elevationGridFromGeoTiff(bytes: ArrayBuffer, file: string): Promise<ElevationGrid> {
  let tiff;
  try {
    tiff = await fromArrayBuffer(bytes);
  } catch (e) {
    throw new UsageError(`${file} is not a readable TIFF (${(e as Error).message})`);
  }
  const image = await tiff.getImage();
  const fd = image.fileDirectory as Record<string, unknown>;
  if (fd.ModelTransformation) throw new UsageError(`${file}: rotated or sheared grids (ModelTransformation) are not supported; warp the grid north-up first`);
  const tie = fd.ModelTiepoint as number[] | undefined;
  const scale = fd.ModelPixelScale as number[] | undefined;
  if (!tie || !scale || tie.length < 6 || scale.length < 2) throw new UsageError(`${file} carries no georeferencing (ModelTiepoint and ModelPixelScale); it is a plain TIFF, not a GeoTIFF`);
  if (image.getSamplesPerPixel() !== 1) throw new UsageError(`${file} has ${image.getSamplesPerPixel()} bands; an elevation grid has one`);
  const keys = (image.getGeoKeys() ?? {}) as Record<string, number | undefined>;
  const crs = crsFromKeys(keys, file);
  const pixelIsPoint = keys.GTRasterTypeGeoKey === 2;
  const [i, j, , x, y] = tie;
  const [sx, sy] = scale;
  const raster = (await image.readRasters({ interleave: true })) as unknown as ArrayLike<number>;
  const noData = image.getGDALNoData();
  return {
    width: image.getWidth(),
    height: image.getHeight(),
    heightsM: raster,
    // Tiepoint (i, j) ↔ (x, y); PixelIsPoint ties a cell centre, PixelIsArea a cell corner.
    originX: x - i * sx - (pixelIsPoint ? sx / 2 : 0),
    originY: y + j * sy + (pixelIsPoint ? sy / 2 : 0),
    cellX: sx,
    cellY: sy,
    crs,
    ...(noData === null ? {} : { noDataValue: noData }),
  };
}

export async function readElevationGrid(path: string): Promise<ElevationGrid> {
  let buf: Buffer;
  try {
    buf = await readFile(path);
  } catch (e) {
    throw new WorkError(`cannot read --dem ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
  }
  return elevationGridFromGeoTiff(buf.buffer.slice(buf.byteOffset, buf.byteOffset + buf.byteLength) as ArrayBuffer, path);
}
