import { declination } from '../../core/magnetic/declination.ts';
import { requireInRange, requireLatDeg, requireLonDeg } from '../../core/validate.ts';
import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';
import { fmt, keyValueTable } from '../output.ts';

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const isLeap = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
const ISO = /^(\d{4})-(\d{2})-(\d{2})(?:T(\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,9}))?)?(Z|[+-]\d{2}:\d{2}))?$/;

/**
 * Strict ISO 8601 instant → ms since 1970 UTC. Accepts `YYYY-MM-DD` (midnight UTC, unless `requireTime`) and
 * `YYYY-MM-DDTHH:MM[:SS[.fff]]` with `Z` or `±HH:MM`. The calendar is checked (no 2027-02-30, no 24:00, no leap
 * second); anything else is a UsageError naming the option. Date.parse alone would accept "2027-02-30" and
 * engine-specific forms such as "July 2 2027".
 */
export function parseIsoInstantMs(label: string, text: string, opts: { requireTime?: boolean } = {}): number {
  const example = opts.requireTime ? '2027-07-02T12:00:00Z' : '2027-07-02 or 2027-07-02T12:00:00Z';
  const m = ISO.exec(text.trim());
  if (!m) throw new UsageError(`${label} must be an ISO 8601 ${opts.requireTime ? 'date and time with a zone' : 'date or date-time'}, e.g. ${example}; got "${text}"`);
  const [, ys, mos, ds, hs, mis, ss, frac, zone] = m;
  if (opts.requireTime && hs === undefined) throw new UsageError(`${label} needs a time of day and zone, e.g. ${example}; got "${text}"`);
  const [y, mo, d, h, mi, s] = [ys, mos, ds, hs ?? '0', mis ?? '0', ss ?? '0'].map(Number);
  const daysInMonth = mo < 1 || mo > 12 ? 0 : mo === 2 && isLeap(y) ? 29 : DAYS_IN_MONTH[mo - 1];
  if (d < 1 || d > daysInMonth || h > 23 || mi > 59 || s > 59) throw new UsageError(`${label} "${text}" is not a real date and time`);
  let offsetMin = 0;
  if (zone && zone !== 'Z') {
    const oh = Number(zone.slice(1, 3)), om = Number(zone.slice(4, 6));
    if (oh > 18 || om > 59) throw new UsageError(`${label} "${text}" has an impossible UTC offset ${zone}`);
    offsetMin = (zone[0] === '-' ? -1 : 1) * (oh * 60 + om);
  }
  const t = new Date(0);
  t.setUTCFullYear(y, mo - 1, d); // setUTCFullYear keeps years 0–99 literal, unlike Date.UTC
  t.setUTCHours(h, mi, s, 0);
  return t.getTime() + (frac ? Math.round(Number(`0.${frac}`) * 1000) : 0) - offsetMin * 60_000;
}


export const command: Command = {
  name: 'declination',
  summary: 'magnetic declination, dip and field strength from WMM2025 (valid 2025-01-01 to 2030-01-01)',
  usage: '--lat DEG --lon DEG [--height M] --date ISO [--json]',
  run(args, out) {
    const json = args.flag('json');
    const latDeg = requireLatDeg('--lat', args.number('lat'));
    const lonDeg = requireLonDeg('--lon', args.number('lon'));
    const heightM = requireInRange('--height', args.optNumber('height') ?? 0, { min: -1000, max: 850_000, unit: 'm' });
    const timeMs = parseIsoInstantMs('--date', args.string('date'));
    args.assertNoUnknown();

    const r = declination({ latDeg, lonDeg, heightM, timeMs });
    if (!r.ok) {
      out.stderr(`glintmark declination: ${r.error.message}\n`);
      return 2;
    }
    const f = r.value;
    const result = {
      declinationDeg: f.declinationDeg,
      inclinationDeg: f.inclinationDeg,
      totalIntensityNt: f.totalIntensityNt,
      model: f.model,
    };
    if (json) out.stdout(JSON.stringify(result, null, 2) + '\n');
    else
      out.stdout(
        keyValueTable([
          ['declination', `${fmt(Math.abs(f.declinationDeg), 2)}° ${f.declinationDeg >= 0 ? 'E' : 'W'} (true = magnetic + declination)`],
          ['inclination', `${fmt(f.inclinationDeg, 2)}° (positive down)`],
          ['total field', `${fmt(f.totalIntensityNt, 0)} nT`],
          ['model', `${f.model}, valid 2025-01-01 to 2030-01-01`],
        ]),
      );
    return 0;
  },
};
