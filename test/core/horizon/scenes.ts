/**
 * Synthetic elevation grids with closed-form horizons, shared by the core and planner tests.
 * Closed forms: an obstacle top at ground distance D and height H seen from height h₀ stands at
 *   ε = atan((H − h₀ − D²/2R) / D),  R = 6 371 008.8 m,
 * and over flat ground the horizon dips by ε = −√(2h₀/R) at d = √(2Rh₀) (the geometric dip of the horizon).
 */
import { readFileSync } from 'node:fs';
import { GEOKEY, writeTiff } from './tiffWriter.ts';

export const R_M = 6_371_008.8;
export const K0 = 0.9996;
export const closedFormDeg = (hM: number, h0M: number, dM: number) => (Math.atan((hM - h0M - (dM * dM) / (2 * R_M)) / dM) * 180) / Math.PI;

/** UTM northing of (45° N, 3° E) in zone 31 from PROJ cs2cs (test/fixtures/horizon/proj-utm.txt, first row). */
export function projNorthing45N3E(): number {
  const t = readFileSync(new URL('../../fixtures/horizon/proj-utm.txt', import.meta.url), 'utf8').split('\n');
  return Number(t[1].trim().split(/\s+/)[1]);
}

/**
 * UTM zone 31 N grid, 20 m cells, observer (45° N, 3° E) on the central meridian at a cell centre.
 * Ridge: east-west tent, crest 8 000 m grid north of the observer, 80 m high, 1 000 m half-width.
 * Wall: everything 3 000 m grid south and beyond stands 40 m high (full height from the centre row at 3 000 m).
 * On the central meridian grid north is true north and a grid metre is k₀ = 0.9996 ground metres.
 */
export function utmScene(): { tiff: ArrayBuffer; ridgeGridM: number; wallGridM: number; ridgeM: number; wallM: number } {
  const n0 = projNorthing45N3E();
  const cell = 20, west = 6000, east = 6000, south = 6000, north = 10000;
  const width = (west + east) / cell + 1, height = (north + south) / cell + 1;
  const values = new Float32Array(width * height);
  for (let r = 0; r < height; r++) {
    const dy = north - r * cell; // grid metres north of the observer (cell centre)
    const z = dy <= -3000 ? 40 : Math.max(0, 80 * (1 - Math.abs(dy - 8000) / 1000));
    values.fill(z, r * width, (r + 1) * width);
  }
  const tiff = writeTiff({
    width,
    height,
    values,
    tiepoint: [0, 0, 0, 500_000 - west - cell / 2, n0 + north + cell / 2, 0],
    pixelScale: [cell, cell, 0],
    geoKeys: [[GEOKEY.GTModelType, 1], [GEOKEY.GTRasterType, 1], [GEOKEY.ProjectedCSType, 32631]],
  });
  return { tiff, ridgeGridM: 8000, wallGridM: 3000, ridgeM: 8000 / K0, wallM: 3000 / K0 };
}

/** Meridian radius of curvature M(φ) = a(1−e²)/(1−e² sin²φ)^{3/2}, WGS84. */
const meridianRadiusM = (latDeg: number) => {
  const a = 6378137, f = 1 / 298.257223563, e2 = f * (2 - f), s = Math.sin((latDeg * Math.PI) / 180);
  return (a * (1 - e2)) / (1 - e2 * s * s) ** 1.5;
};

/**
 * Geographic WGS84 grid, 0.0002° × 0.0003° cells, observer (45° N, 3° E) at a cell centre; a 60 m wall from
 * latitude 45.036° northward (full height from that centre row). Its ground distance north is the meridian arc
 * M(45.018°)·0.036° (mid-latitude radius; the error of that is below 1 mm here).
 */
export function geographicScene(noData?: number): { tiff: ArrayBuffer; wallM: number } {
  const dLat = 0.0002, dLon = 0.0003;
  const rowsN = 300, rowsS = 100, colsW = 100, colsE = 100;
  const width = colsW + colsE + 1, height = rowsN + rowsS + 1;
  const values = new Float32Array(width * height);
  for (let r = 0; r < height; r++) {
    const rowsNorth = rowsN - r;
    values.fill(rowsNorth >= 180 ? 60 : 0, r * width, (r + 1) * width);
  }
  if (noData !== undefined) values.fill(noData, 0, width * 20); // the far north strip carries no height
  const tiff = writeTiff({
    width,
    height,
    values,
    tiepoint: [0, 0, 0, 3 - colsW * dLon - dLon / 2, 45 + rowsN * dLat + dLat / 2, 0],
    pixelScale: [dLon, dLat, 0],
    geoKeys: [[GEOKEY.GTModelType, 2], [GEOKEY.GTRasterType, 1], [GEOKEY.GeographicType, 4326]],
    ...(noData !== undefined ? { noData: String(noData) } : {}),
  });
  return { tiff, wallM: meridianRadiusM(45.018) * ((180 * dLat * Math.PI) / 180) };
}
