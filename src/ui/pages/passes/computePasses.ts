/**
 * What the Passes screen shows, computed without a DOM: the site and window forms checked field by field, the
 * passes of every stored element set grouped into tracks, the geometry handed to the Plan screen, and the
 * countdown text. The orbit maths is the core's (findPasses, groupTracks); this file only arranges it.
 */
import type { ReflectorOrientation } from '../../../core/geometry/orientation.ts';
import type { LookSide } from '../../../core/geometry/pointing.ts';
import { findPasses, type Pass, type PassDirection } from '../../../core/orbit/passes.ts';
import { tleAgeWarning, tleLabel } from '../../../core/orbit/tle.ts';
import { parseIsoUtcMs } from '../../../core/time.ts';
import { groupTracks, type Track } from '../../../core/orbit/tracks.ts';
import type { TrihedralShapeName } from '../../../core/radar/shapes.ts';
import { misalignment } from '../../../core/reflector/misalignment.ts';
import { requireIncidenceDeg, requireInRange, requireLatDeg, requireLonDeg } from '../../../core/validate.ts';
import { parseField } from '../../components/fields.tsx';
import { isLegacyExample, type GeometryInput } from '../../state/workflow.ts';
import type { StoredElementSet } from './elementsStore.ts';

export const MS_PER_DAY = 86_400_000;

export interface SiteForm {
  latDeg: string;
  lonDeg: string;
  heightM: string;
}

export interface SitePosition {
  latDeg: number;
  /** Wrapped into [−180, 180). */
  lonDeg: number;
  heightEllM: number;
}

/** Same bounds as the pass search (lowest dry land to the highest summit, with margin), m ellipsoidal. */
const HEIGHT_RANGE_M = { min: -1000, max: 10_000, unit: 'm' };

/** Check typed coordinates; each bad field gets its own message, the site is null until all are good. */
export function parseSiteForm(f: SiteForm): { errors: Partial<Record<keyof SiteForm, string>>; site: SitePosition | null } {
  const lat = parseField('Latitude', f.latDeg, requireLatDeg);
  const lon = parseField('Longitude', f.lonDeg, requireLonDeg);
  const h = parseField('Height', f.heightM, (n, v) => requireInRange(n, v, HEIGHT_RANGE_M));
  const errors = { latDeg: lat.error, lonDeg: lon.error, heightM: h.error };
  if (lat.value === undefined || lon.value === undefined || h.value === undefined) return { errors, site: null };
  const lonDeg = lon.value >= 180 ? lon.value - 360 : lon.value;
  return { errors, site: { latDeg: lat.value, lonDeg, heightEllM: h.value } };
}

export interface WindowForm {
  /** ISO 8601 UTC, "2026-12-01T06:00Z"; a missing zone is read as UTC (the field says UTC). */
  startUtc: string;
  days: string;
  incidenceMinDeg: string;
  incidenceMaxDeg: string;
  look: LookSide;
}

export interface PassQuery {
  startMs: number;
  days: number;
  incidenceMinDeg: number;
  incidenceMaxDeg: number;
  look: LookSide;
}

/** "2026-12-02T04:14Z": the start field's text for an instant (minutes, UTC). */
export const utcMinuteText = (timeMs: number): string => new Date(timeMs).toISOString().slice(0, 16) + 'Z';

export function parseWindowForm(f: WindowForm): { errors: Partial<Record<Exclude<keyof WindowForm, 'look'>, string>>; query: PassQuery | null } {
  const errors: Partial<Record<Exclude<keyof WindowForm, 'look'>, string>> = {};
  let startMs: number | undefined;
  const t = f.startUtc.trim().replace(' ', 'T');
  if (t === '') errors.startUtc = 'Start is empty';
  else {
    try {
      startMs = parseIsoUtcMs(/T\d{2}:\d{2}(:\d{2}(\.\d+)?)?$/.test(t) ? t + 'Z' : t, 'Start');
    } catch (e) {
      errors.startUtc = e instanceof Error ? e.message : String(e);
    }
  }
  const days = parseField('Days', f.days, (n, v) => requireInRange(n, v, { min: 0, max: 366, minInclusive: false, unit: 'days' }));
  const lo = parseField('Smallest incidence', f.incidenceMinDeg, requireIncidenceDeg);
  const hi = parseField('Largest incidence', f.incidenceMaxDeg, requireIncidenceDeg);
  errors.days = days.error;
  errors.incidenceMinDeg = lo.error;
  errors.incidenceMaxDeg = hi.error;
  if (lo.value !== undefined && hi.value !== undefined && !(lo.value < hi.value)) {
    errors.incidenceMaxDeg = `Largest incidence must be more than the smallest (${lo.value}°), got ${hi.value}°`;
  }
  if (startMs === undefined || days.value === undefined || lo.value === undefined || hi.value === undefined || errors.incidenceMaxDeg) {
    return { errors, query: null };
  }
  return { errors, query: { startMs, days: days.value, incidenceMinDeg: lo.value, incidenceMaxDeg: hi.value, look: f.look } };
}

/** A track as the screen lists it: the core's Track plus where it came from and its label. */
export interface DisplayTrack extends Track {
  /** Position in the list (used in test ids). */
  index: number;
  /** "GLINT-A descending 37.1°, every 12 days". */
  label: string;
  elementsEpochMs: number;
  demo: boolean;
  nextTimeMs: number;
}

export interface PassesOutcome {
  /** Every pass of every set, in time order. */
  passes: Pass[];
  /** Tracks of every set, by next pass time. */
  tracks: DisplayTrack[];
  /** Stale elements and propagation stops, one sentence each. */
  warnings: string[];
  /** A set whose search failed outright: "GLINT-A: <message>". */
  errors: string[];
}

const DIRECTION_WORD: Record<PassDirection, string> = { ascending: 'ascending', descending: 'descending' };

export function trackLabel(t: Pick<Track, 'satellite' | 'direction' | 'incidenceDeg' | 'repeatDays'>): string {
  const every = t.repeatDays === null ? 'one pass in the window' : `every ${formatDays(t.repeatDays)}`;
  return `${t.satellite} ${DIRECTION_WORD[t.direction]} ${t.incidenceDeg.toFixed(1)}°, ${every}`;
}

/** "12 days", "1 day", "11.5 days": repeat intervals are whole days for a repeat orbit, but say so only if they are. */
export function formatDays(days: number): string {
  const r = Math.round(days * 10) / 10;
  const s = Number.isInteger(r) ? String(r) : r.toFixed(1);
  return `${s} ${r === 1 ? 'day' : 'days'}`;
}

/**
 * Passes and tracks of every set over `site` for `q`. A set that throws (bad elements, odd input) becomes one
 * message in `errors`; the other sets still count.
 */
export function computePasses(sets: readonly StoredElementSet[], site: SitePosition, q: PassQuery): PassesOutcome {
  const passes: Pass[] = [];
  const tracks: Omit<DisplayTrack, 'index'>[] = [];
  const warnings: string[] = [];
  const errors: string[] = [];
  for (const set of sets) {
    try {
      const r = findPasses(set, { latDeg: site.latDeg, lonDeg: site.lonDeg, heightM: site.heightEllM }, { startMs: q.startMs, days: q.days }, {
        incidenceMinDeg: q.incidenceMinDeg,
        incidenceMaxDeg: q.incidenceMaxDeg,
        look: q.look,
      });
      passes.push(...r.passes);
      warnings.push(...r.warnings);
      for (const t of groupTracks(r.passes)) {
        tracks.push({ ...t, label: trackLabel(t), elementsEpochMs: set.epochMs, demo: set.demo, nextTimeMs: Date.parse(t.nextTimeUtc) });
      }
    } catch (e) {
      errors.push(`${tleLabel(set)}: ${e instanceof Error ? e.message : String(e)}`);
    }
  }
  passes.sort((a, b) => a.timeMs - b.timeMs);
  tracks.sort((a, b) => a.nextTimeMs - b.nextTimeMs);
  return { passes, tracks: tracks.map((t, index) => ({ ...t, index })), warnings, errors };
}

/** The Plan screen's geometry for a track (text fields as the Plan form keeps them). */
export function geometryFromTrack(t: DisplayTrack): GeometryInput {
  return {
    incidenceDeg: String(t.incidenceDeg.toFixed(2)),
    headingDeg: String(t.headingDeg.toFixed(2)),
    look: t.look,
    // The exact line of sight from the orbit: heading ∓ 90° alone would miss it by a few tenths of a degree.
    losAzimuthDeg: t.reflectorAzimuthDeg,
    label: t.label,
    direction: t.direction,
    source: 'orbital-elements',
    satellite: t.satellite,
    elementsEpochMs: t.elementsEpochMs,
  };
}

/**
 * Add a geometry to the plan unless the same track is already there (appending twice would double its weight).
 * The Plan screen's untouched starting example is dropped, so "add" on a fresh plan does not keep a made-up pass.
 */
export function appendGeometry(list: readonly GeometryInput[], g: GeometryInput): GeometryInput[] {
  const same = (a: GeometryInput) =>
    a.source === g.source && a.satellite === g.satellite && a.direction === g.direction && a.look === g.look && a.incidenceDeg === g.incidenceDeg && a.headingDeg === g.headingDeg;
  const isPlaceholder = (a: GeometryInput) => (a.incidenceDeg.trim() === '' && a.headingDeg.trim() === '') || isLegacyExample(a);
  const kept = list.filter((a) => !isPlaceholder(a));
  return kept.some(same) ? kept : [...kept, g];
}

/** Element-set age at `nowMs`, days (negative when the epoch is in the future). */
export const elementsAgeDays = (epochMs: number, nowMs: number): number => (nowMs - epochMs) / MS_PER_DAY;

/** The core's staleness warning for the planning window, or null. Never throws (a bad window gives null). */
export function elementsAgeWarning(set: StoredElementSet, q: Pick<PassQuery, 'startMs' | 'days'> | null): string | null {
  if (!q) return null;
  try {
    return tleAgeWarning(set, q.startMs, q.startMs + q.days * MS_PER_DAY);
  } catch {
    return null;
  }
}

/** The first pass strictly after `nowMs`, or null. `passes` must be in time order. */
export function nextPassAfter<T extends { timeMs: number }>(passes: readonly T[], nowMs: number): T | null {
  return passes.find((p) => p.timeMs > nowMs) ?? null;
}

/** A track's first pass strictly after `nowMs` (ms), or null when all its passes in the window are over. */
export function trackNextAfterMs(t: Pick<Track, 'passTimesUtc'>, nowMs: number): number | null {
  return t.passTimesUtc.map((u) => Date.parse(u)).find((ms) => ms > nowMs) ?? null;
}

/**
 * Time left as the crew reads it: "2 d 03:04:05", "03:04:05", "00:00:09". Whole seconds, rounded up, so the
 * display reaches 00:00:00 only at the pass. Negative or zero → "now".
 */
export function formatCountdown(deltaMs: number): string {
  if (!Number.isFinite(deltaMs)) return '—';
  if (deltaMs <= 0) return 'now';
  const total = Math.ceil(deltaMs / 1000);
  const d = Math.floor(total / 86_400);
  const h = Math.floor((total % 86_400) / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const hms = [h, m, s].map((x) => String(x).padStart(2, '0')).join(':');
  return d > 0 ? `${d} d ${hms}` : hms;
}

/** "2026-12-03 05:43:12 UTC" from an ISO instant. */
export const formatUtc = (timeMs: number): string => new Date(timeMs).toISOString().replace('T', ' ').slice(0, 19) + ' UTC';

/**
 * Loss of each track, dB below peak, for the reflector as currently aimed, along the track's true line of sight
 * (losAzimuthDeg). The pattern depends on the shape only in the optical model, so a unit edge and wavelength
 * stand in. +Infinity: outside the corner. Null: no aim yet.
 */
export function trackLossesDb(tracks: readonly Pick<Track, 'incidenceDeg' | 'headingDeg' | 'reflectorAzimuthDeg' | 'look'>[], target: ReflectorOrientation | null, shape: TrihedralShapeName): (number | null)[] {
  return tracks.map((t) => {
    if (!target) return null;
    try {
      return misalignment({ shape, edgeM: 1, wavelengthM: 0.05 }, target, { incidenceDeg: t.incidenceDeg, headingDeg: t.headingDeg, look: t.look, losAzimuthDeg: t.reflectorAzimuthDeg }).lossDb;
    } catch {
      return null;
    }
  });
}
