/** The planner's sites file: CSV with header `code,latitude,longitude,height_m` (degrees WGS84, metres ellipsoidal). */
import { CsvSyntaxError, parseCsv } from '../core/text/csv.ts';
import { UsageError } from './args.ts';

export interface PlannerSite {
  code: string;
  latDeg: number;
  lonDeg: number;
  heightM: number;
  line: number;
}

const REQUIRED = ['code', 'latitude', 'longitude', 'height_m'] as const;
const NUM = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Parse and check every row; any problem is a UsageError naming the file and line, and nothing is returned. */
export function parseSitesCsv(fileLabel: string, text: string): PlannerSite[] {
  let records;
  try {
    records = parseCsv(text);
  } catch (e) {
    if (e instanceof CsvSyntaxError) throw new UsageError(`${fileLabel} ${e.message}`);
    throw e;
  }
  if (records.length === 0) throw new UsageError(`${fileLabel} is empty; expected a header code,latitude,longitude,height_m`);
  const header = records[0].fields.map((h) => h.trim().toLowerCase());
  const missing = REQUIRED.filter((c) => !header.includes(c));
  if (missing.length) {
    throw new UsageError(`${fileLabel} line 1: missing column ${missing.join(', ')}; the header must name code,latitude,longitude,height_m`);
  }
  const col = Object.fromEntries(REQUIRED.map((c) => [c, header.indexOf(c)])) as Record<(typeof REQUIRED)[number], number>;
  const problems: string[] = [];
  const seen = new Map<string, number>();
  const sites: PlannerSite[] = [];
  for (const r of records.slice(1)) {
    const get = (c: (typeof REQUIRED)[number]) => (r.fields[col[c]] ?? '').trim();
    const where = `${fileLabel} line ${r.line}`;
    const code = get('code');
    if (!code) {
      problems.push(`${where}: the site code is empty`);
      continue;
    }
    if (seen.has(code)) {
      problems.push(`${where}: site code "${code}" is already used on line ${seen.get(code)}`);
      continue;
    }
    seen.set(code, r.line);
    const num = (c: (typeof REQUIRED)[number], min: number, max: number, unit: string): number | undefined => {
      const s = get(c);
      if (!NUM.test(s)) {
        problems.push(`${where}: ${c} must be a number, got "${s}"`);
        return undefined;
      }
      const v = Number(s);
      if (v < min || v > max) {
        problems.push(`${where}: ${c} ${v} is out of range [${min}, ${max}]${unit}`);
        return undefined;
      }
      return v;
    };
    const latDeg = num('latitude', -90, 90, '°');
    const lonDeg = num('longitude', -180, 360, '°');
    const heightM = num('height_m', -500, 9000, ' m');
    if (latDeg === undefined || lonDeg === undefined || heightM === undefined) continue;
    sites.push({ code, latDeg, lonDeg: lonDeg >= 180 ? lonDeg - 360 : lonDeg, heightM, line: r.line });
  }
  if (problems.length) {
    throw new UsageError(problems[0] + (problems.length > 1 ? ` (and ${problems.length - 1} more problem${problems.length > 2 ? 's' : ''}); nothing was written` : '; nothing was written'));
  }
  if (sites.length === 0) throw new UsageError(`${fileLabel} has a header but no sites`);
  return sites;
}
