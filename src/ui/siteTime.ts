/**
 * The site's own time: its IANA time zone found offline from the coordinates (@photostructure/tz-lookup, a pure
 * lookup over a compact map of the zone boundaries), and instants written in that zone by Intl.DateTimeFormat.
 * Records keep UTC (CONVENTIONS.md); this only shapes what the crew reads and types.
 */
import tzLookup from '@photostructure/tz-lookup';

/** The IANA zone at a position ("Europe/London"), or null when the lookup refuses the coordinates. */
export function siteTimeZone(latDeg: number, lonDeg: number): string | null {
  if (!Number.isFinite(latDeg) || !Number.isFinite(lonDeg)) return null;
  try {
    const z = tzLookup(latDeg, lonDeg);
    // Reject a name this JavaScript engine cannot format (it would throw later).
    new Intl.DateTimeFormat('en-GB', { timeZone: z });
    return z;
  } catch {
    return null;
  }
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function parts(ms: number, zone: string): Record<string, string> {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23', weekday: 'short', timeZoneName: 'shortOffset',
    });
    formatters.set(zone, f);
  }
  const out: Record<string, string> = {};
  for (const p of f.formatToParts(new Date(ms))) out[p.type] = p.value;
  return out;
}

/** Offset of `zone` from UTC at the instant, minutes (east positive). */
export function zoneOffsetMin(ms: number, zone: string): number {
  const p = parts(ms, zone);
  const asUtc = Date.UTC(Number(p.year), Number(p.month) - 1, Number(p.day), Number(p.hour), Number(p.minute), Number(p.second));
  return Math.round((asUtc - Math.floor(ms / 1000) * 1000) / 60_000);
}

/** "GMT+1", "GMT−3:30", "GMT" for an offset in minutes. */
export function offsetName(min: number): string {
  if (min === 0) return 'GMT';
  const a = Math.abs(min);
  return `GMT${min > 0 ? '+' : '−'}${Math.floor(a / 60)}${a % 60 ? ':' + String(a % 60).padStart(2, '0') : ''}`;
}

/** The site's calendar day of an instant, "2026-12-03" (for grouping passes by the site's day). */
export function siteDay(ms: number, zone: string): string {
  const p = parts(ms, zone);
  return `${p.year}-${p.month}-${p.day}`;
}

/** "Thu 2026-12-03 06:43 Europe/London (GMT)": the instant in the site's zone, the zone named. */
export function fmtSiteTime(ms: number, zone: string, opts: { seconds?: boolean; weekday?: boolean } = {}): string {
  const p = parts(ms, zone);
  const time = `${p.hour}:${p.minute}${opts.seconds ? ':' + p.second : ''}`;
  return `${opts.weekday === false ? '' : p.weekday + ' '}${p.year}-${p.month}-${p.day} ${time} ${zone} (${offsetName(zoneOffsetMin(ms, zone))})`;
}

/** "2026-12-03 05:43 UTC · 06:43 Europe/London (GMT+1)" — UTC first, as stored, then the site's time. */
export function fmtUtcAndSite(ms: number, zone: string | null): string {
  const utc = new Date(ms).toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
  return zone ? `${utc} · ${fmtSiteTime(ms, zone, { weekday: false })}` : utc;
}

/** "2026-12-01T06:00" as a wall-clock time in `zone` → ms; RangeError naming `name` otherwise. */
export function parseSiteLocalMs(text: string, zone: string, name = 'Start'): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2}))?$/.exec(text.trim());
  if (!m) throw new RangeError(`${name} must be a date and time in the site's zone, e.g. 2026-12-01T06:00; got "${text}"`);
  const [y, mo, d, h, mi] = [Number(m[1]), Number(m[2]), Number(m[3]), Number(m[4] ?? 0), Number(m[5] ?? 0)];
  const daysInMonth = mo >= 1 && mo <= 12 ? new Date(Date.UTC(y, mo, 0)).getUTCDate() : 0;
  if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth || h > 23 || mi > 59) throw new RangeError(`${name} "${text}" is not a real date and time`);
  const wall = Date.UTC(y, mo - 1, d, h, mi);
  // Two rounds settle the offset (it changes at most once near the instant); in a skipped hour the later offset wins.
  let t = wall - zoneOffsetMin(wall, zone) * 60_000;
  t = wall - zoneOffsetMin(t, zone) * 60_000;
  return t;
}

/** "2026-12-01T06:00" for an instant, as the site's wall clock reads it (the start field's text in site time). */
export function siteMinuteText(ms: number, zone: string): string {
  const p = parts(ms, zone);
  return `${p.year}-${p.month}-${p.day}T${p.hour}:${p.minute}`;
}
