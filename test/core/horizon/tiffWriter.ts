/**
 * A tiny GeoTIFF writer for tests: one strip, little-endian, one band of 32-bit floats, uncompressed.
 * Baseline TIFF 6.0 (Adobe, 1992: header §2, IFD §2, tags 256–339) plus GeoTIFF 1.1 (OGC 19-008r4, 2019)
 * tags ModelPixelScale 33550, ModelTiepoint 33922, GeoKeyDirectory 34735, and GDAL_NODATA 42113 (ASCII).
 * geotiff.js's own writer stores only 8-bit samples, hence this one.
 */
export interface TiffSpec {
  width: number;
  height: number;
  values: Float32Array;
  /** (i, j, 0, x, y, 0) */
  tiepoint: [number, number, number, number, number, number];
  pixelScale: [number, number, number];
  /** GeoKey entries [keyId, value] (SHORT values stored in the directory). */
  geoKeys: [number, number][];
  noData?: string;
  /** Add ModelTransformation (to test the refusal). */
  transformation?: boolean;
}

export const GEOKEY = { GTModelType: 1024, GTRasterType: 1025, GeographicType: 2048, ProjectedCSType: 3072 } as const;

export function writeTiff(s: TiffSpec): ArrayBuffer {
  type Entry = { tag: number; type: 2 | 3 | 4 | 12; values: number[] | string };
  const dir: [number, number, number, number][] = s.geoKeys.map(([k, v]) => [k, 0, 1, v]);
  const geoDir = [1, 1, 0, dir.length, ...dir.flat()];
  const entries: Entry[] = [
    { tag: 256, type: 4, values: [s.width] },
    { tag: 257, type: 4, values: [s.height] },
    { tag: 258, type: 3, values: [32] },
    { tag: 259, type: 3, values: [1] },
    { tag: 262, type: 3, values: [1] },
    { tag: 273, type: 4, values: [0] }, // patched below
    { tag: 277, type: 3, values: [1] },
    { tag: 278, type: 4, values: [s.height] },
    { tag: 279, type: 4, values: [s.width * s.height * 4] },
    { tag: 284, type: 3, values: [1] },
    { tag: 339, type: 3, values: [3] },
    { tag: 33550, type: 12, values: s.pixelScale },
    { tag: 33922, type: 12, values: s.tiepoint },
    { tag: 34735, type: 3, values: geoDir },
  ];
  if (s.transformation) entries.push({ tag: 34264, type: 12, values: [1, 0, 0, 0, 0, -1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1] });
  if (s.noData !== undefined) entries.push({ tag: 42113, type: 2, values: s.noData + '\0' });
  entries.sort((a, b) => a.tag - b.tag);
  const size = { 2: 1, 3: 2, 4: 4, 12: 8 } as const;
  const count = (e: Entry) => (typeof e.values === 'string' ? e.values.length : e.values.length);
  const ifdSize = 2 + entries.length * 12 + 4;
  let extra = 8 + ifdSize;
  const offsets = entries.map((e) => {
    const bytes = count(e) * size[e.type];
    if (bytes <= 4) return -1;
    const o = extra;
    extra += bytes + (bytes % 2);
    return o;
  });
  const dataOffset = Math.ceil(extra / 4) * 4; // Float32Array needs 4-byte alignment
  (entries.find((e) => e.tag === 273) as Entry).values = [dataOffset];
  const buf = new ArrayBuffer(dataOffset + s.values.length * 4);
  const dv = new DataView(buf);
  dv.setUint8(0, 0x49);
  dv.setUint8(1, 0x49);
  dv.setUint16(2, 42, true);
  dv.setUint32(4, 8, true);
  dv.setUint16(8, entries.length, true);
  const put = (e: Entry, at: number) => {
    const vals = typeof e.values === 'string' ? [...e.values].map((c) => c.charCodeAt(0)) : e.values;
    vals.forEach((v, k) => {
      const p = at + k * size[e.type];
      if (e.type === 2) dv.setUint8(p, v);
      else if (e.type === 3) dv.setUint16(p, v, true);
      else if (e.type === 4) dv.setUint32(p, v, true);
      else dv.setFloat64(p, v, true);
    });
  };
  entries.forEach((e, k) => {
    const p = 10 + k * 12;
    dv.setUint16(p, e.tag, true);
    dv.setUint16(p + 2, e.type, true);
    dv.setUint32(p + 4, count(e), true);
    if (offsets[k] < 0) put(e, p + 8);
    else {
      dv.setUint32(p + 8, offsets[k], true);
      put(e, offsets[k]);
    }
  });
  dv.setUint32(10 + entries.length * 12, 0, true);
  new Float32Array(buf, dataOffset, s.values.length).set(s.values);
  return buf;
}
