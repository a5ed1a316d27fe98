/**
 * Strict ISO 8601 instants for the planning window. Only unambiguous forms are accepted:
 *   YYYY-MM-DD                                  (midnight UTC)
 *   YYYY-MM-DDTHH:MM[:SS[.fff…]](Z | ±HH:MM)    (a zone is required: a bare local time is ambiguous)
 * Calendar dates are checked (no 2026-02-30); leap seconds are not accepted (SGP4 time is UTC without them).
 * Date.parse alone is not used because it accepts engine-specific forms ("Dec 1 2026", local times).
 */

const ISO =
  /^(\d{4})-(\d{2})-(\d{2})(?:T(\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,9}))?)?(Z|[+-]\d{2}:\d{2})?)?$/;

/** ms since 1970 UTC for a strict ISO 8601 date or date-time; RangeError naming `name` otherwise. */
export function parseIsoUtcMs(text: string, name = 'time', opts: { requireTime?: boolean } = {}): number {
  const m = ISO.exec(text.trim());
  const example = 'e.g. 2026-12-01 or 2026-12-01T06:00Z';
  if (!m) throw new RangeError(`${name} must be an ISO 8601 date or time (${example}), got "${text}"`);
  const [, ys, mos, ds, hs, mis, ss, frac, zone] = m;
  if (opts.requireTime && hs === undefined) {
    throw new RangeError(`${name} needs a time of day and zone, e.g. 2026-12-01T06:00Z; got "${text}"`);
  }
  if (hs !== undefined && zone === undefined) {
    throw new RangeError(`${name} "${text}" has no time zone; add Z for UTC or an offset like +02:00`);
  }
  const [y, mo, d] = [Number(ys), Number(mos), Number(ds)];
  const [h, mi, s] = [Number(hs ?? 0), Number(mis ?? 0), Number(ss ?? 0)];
  const ms = frac ? Number(`0.${frac}`) * 1000 : 0;
  const daysInMonth = mo >= 1 && mo <= 12 ? new Date(Date.UTC(y, mo, 0)).getUTCDate() : 0;
  if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth || h > 23 || mi > 59 || s > 59) {
    throw new RangeError(`${name} "${text}" is not a real date and time`);
  }
  let offsetMin = 0;
  if (zone && zone !== 'Z') {
    const oh = Number(zone.slice(1, 3)), om = Number(zone.slice(4, 6));
    if (oh > 23 || om > 59) throw new RangeError(`${name} "${text}" has an impossible offset ${zone}`);
    offsetMin = (zone[0] === '-' ? -1 : 1) * (oh * 60 + om);
  }
  const utc = new Date(0);
  utc.setUTCFullYear(y, mo - 1, d);
  utc.setUTCHours(h, mi, s, 0);
  return utc.getTime() + ms - offsetMin * 60_000;
}

/** ISO 8601 UTC text (`…Z`, milliseconds) for a time in ms since 1970, or null for a missing time. */
export function isoUtc(ms: number | null | undefined): string | null {
  if (ms === null || ms === undefined) return null;
  if (!Number.isFinite(ms)) throw new RangeError(`time must be a finite number of ms since 1970, got ${ms}`);
  return new Date(ms).toISOString();
}
