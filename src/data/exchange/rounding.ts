/**
 * How exports round their numbers: to the precision the value was measured or planned with, so a spreadsheet shows
 * 256.1, not 256.10000000000002. The stored records (and the JSON backup) keep every digit; exports are for people
 * and office tools. One table, used by every CSV and GeoJSON export and stated in src/data/README.md:
 *
 * | quantity | decimals | resolution | why (common practice, no source) |
 * |---|---|---|---|
 * | latitude, longitude | 8 | about 1 mm | survey GNSS gives mm; phone fixes are far coarser |
 * | heights, edge, apex offsets | 3 | 1 mm | survey GNSS and tape measures |
 * | position and fix accuracy | 2 | 1 cm | |
 * | azimuth, tilt, roll, declination, incidence, heading | 2 | 0.01° | phone sensors resolve about 0.1°; planned values keep one more digit |
 * | predicted loss | 2 | 0.01 dB | |
 * | frame epoch | 3 | about 9 hours | decimal year |
 */
export const EXPORT_DECIMALS = {
  latLonDeg: 8,
  lengthM: 3,
  accuracyM: 2,
  angleDeg: 2,
  lossDb: 2,
  epochYear: 3,
} as const;
export type ExportQuantity = keyof typeof EXPORT_DECIMALS;

/** x rounded to the export precision of its quantity, as a number (shortest form); null/undefined pass through. */
export function rounded(x: number | null | undefined, q: ExportQuantity): number | null {
  if (x === null || x === undefined) return null;
  if (!Number.isFinite(x)) return x;
  const r = Number(x.toFixed(EXPORT_DECIMALS[q]));
  return Object.is(r, -0) ? 0 : r;
}
