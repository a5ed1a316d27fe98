/**
 * The planner's sites file (`--sites`): a site CSV (header set in src/data/exchange/siteFile.ts, minimal
 * `code,latitude,longitude,height_m`; comma, semicolon or tab separated) or a GeoJSON FeatureCollection of Points, read by
 * the same reader as the app's import, so the app's exports are planner input and the planner's files import.
 */
import { readSiteFile, siteFileWhere } from '../data/exchange/siteFile.ts';
import { UsageError } from './args.ts';

export interface PlannerSite {
  code: string;
  latDeg: number;
  lonDeg: number;
  /** Metres above the WGS84 ellipsoid; null when the file leaves it empty (unknown, to be surveyed). */
  heightM: number | null;
  /** CSV line number or GeoJSON feature index. */
  line: number;
}

/** Parse and check every row; any problem is a UsageError naming the file and line, and nothing is returned. */
export function parseSitesCsv(fileLabel: string, text: string): PlannerSite[] {
  const read = readSiteFile(text);
  if (read.rejected.length) {
    const [first] = read.rejected;
    const more = read.rejected.length - 1;
    const where = siteFileWhere(read.kind, first);
    throw new UsageError(
      `${fileLabel}${where === 'whole file' ? '' : ` ${where}`}: ${first.reason}` +
        (more > 0 ? ` (and ${more} more problem${more > 1 ? 's' : ''}); nothing was written` : '; nothing was written'),
    );
  }
  if (read.sites.length === 0) throw new UsageError(`${fileLabel} has a header but no sites`);
  return read.sites.map(({ row, fields: f }) => ({ code: f.code, latDeg: f.latDeg, lonDeg: f.lonDeg, heightM: f.heightEllM, line: row }));
}
