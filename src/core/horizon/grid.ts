/**
 * An elevation grid (DEM or surface model) as the horizon computation sees it: heights in metres on a regular
 * grid in geographic WGS84 degrees or in a UTM zone, north-up, with bilinear interpolation between cell centres.
 *
 * Georeferencing follows GeoTIFF 1.1 (OGC 19-008r4, 2019): ModelTiepoint and ModelPixelScale, raster space
 * "PixelIsArea" (the tiepoint is the outer corner of the top-left cell) or "PixelIsPoint" (its centre).
 * Bilinear interpolation: e.g. Press et al., "Numerical Recipes", 3rd ed., 2007, §3.6, eq. 3.6.5.
 */
import { requireFinite, requirePositive } from '../validate.ts';
import { utmForward, type UtmZone } from './utm.ts';

export type GridCrs = { kind: 'geographic' } | ({ kind: 'utm' } & UtmZone);

export interface ElevationGrid {
  width: number;
  height: number;
  /** Row-major heights, row 0 at the top (north), m. */
  heightsM: ArrayLike<number>;
  /** CRS coordinate (degrees east or easting m) of the left edge of column 0. */
  originX: number;
  /** CRS coordinate (degrees north or northing m) of the top edge of row 0. */
  originY: number;
  /** Cell size along x and y (positive; y decreases downwards), degrees or m. */
  cellX: number;
  cellY: number;
  crs: GridCrs;
  /** Cells holding this value (or NaN) carry no height. */
  noDataValue?: number;
}

export function validateGrid(g: ElevationGrid): ElevationGrid {
  if (!Number.isInteger(g.width) || !Number.isInteger(g.height) || g.width < 2 || g.height < 2) {
    throw new RangeError(`elevation grid must be at least 2 × 2 cells, got ${g.width} × ${g.height}`);
  }
  if (g.heightsM.length !== g.width * g.height) throw new RangeError(`elevation grid holds ${g.heightsM.length} values for ${g.width} × ${g.height} cells`);
  requireFinite('grid origin x', g.originX);
  requireFinite('grid origin y', g.originY);
  requirePositive('grid cell size x', g.cellX);
  requirePositive('grid cell size y', g.cellY);
  return g;
}

/** CRS coordinates of a geodetic point for this grid. */
export function gridXY(g: ElevationGrid, latDeg: number, lonDeg: number): [number, number] {
  if (g.crs.kind === 'geographic') return [lonDeg, latDeg];
  const p = utmForward(latDeg, lonDeg, g.crs);
  return [p.eastingM, p.northingM];
}

/** Bilinear height at CRS coordinates, or NaN outside the grid's cell centres or next to a no-data cell. */
export function sampleHeightM(g: ElevationGrid, x: number, y: number): number {
  const col = (x - g.originX) / g.cellX - 0.5;
  const row = (g.originY - y) / g.cellY - 0.5;
  if (!(col >= 0 && row >= 0 && col <= g.width - 1 && row <= g.height - 1)) return NaN;
  const c0 = Math.min(Math.floor(col), g.width - 2);
  const r0 = Math.min(Math.floor(row), g.height - 2);
  const fc = col - c0, fr = row - r0;
  const at = (r: number, c: number) => {
    const v = g.heightsM[r * g.width + c];
    return v === g.noDataValue ? NaN : v;
  };
  const top = at(r0, c0) * (1 - fc) + at(r0, c0 + 1) * fc;
  const bottom = at(r0 + 1, c0) * (1 - fc) + at(r0 + 1, c0 + 1) * fc;
  return top * (1 - fr) + bottom * fr;
}

/** The ground size of a cell near a latitude, m (the smaller side), for choosing the ray step. */
export function cellSizeM(g: ElevationGrid, latDeg: number): number {
  if (g.crs.kind === 'utm') return Math.min(g.cellX, g.cellY);
  const mPerDeg = 111_320; // 2πa/360 (WGS84 a), enough to choose a step
  return Math.min(g.cellY * mPerDeg, g.cellX * mPerDeg * Math.cos((latDeg * Math.PI) / 180));
}
