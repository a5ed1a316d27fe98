import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { aimForPass } from '../../../src/core/geometry/pointing.ts';
import { parseTle } from '../../../src/core/orbit/tle.ts';
import { wrapSignedDeg } from '../../../src/core/units.ts';
import { DEMO_TLE, DEMO_TLE_B } from '../../../src/demo/elements.ts';
import {
  appendGeometry,
  computePasses,
  elementsAgeDays,
  elementsAgeWarning,
  formatCountdown,
  formatDays,
  geometryFromTrack,
  MS_PER_DAY,
  nextPassAfter,
  parseSiteForm,
  parseWindowForm,
  trackLabel,
  trackLossesDb,
  trackNextAfterMs,
  utcMinuteText,
  type PassQuery,
} from '../../../src/ui/pages/passes/computePasses.ts';
import type { StoredElementSet } from '../../../src/ui/pages/passes/elementsStore.ts';
import { DEFAULT_WORKFLOW } from '../../../src/ui/state/workflow.ts';

/** toFixed(2) on the handed-over heading moves the aim by at most 0.005°; 0.006° covers float noise. */
const TOL_HANDOVER_DEG = 0.006;

const stored = (text: string, demo = true): StoredElementSet => ({ ...parseTle(text).sets[0], demo, addedAtMs: 0 });
const GLINT_A = stored(DEMO_TLE);
const GLINT_B = stored(DEMO_TLE_B);
/** Invented site near an invented fen; mid-latitude. */
const SITE = { latDeg: 52.31, lonDeg: 5.12, heightEllM: 12 };
const QUERY: PassQuery = { startMs: Date.UTC(2026, 11, 1), days: 24, incidenceMinDeg: 20, incidenceMaxDeg: 46, look: 'right' };

describe('parseSiteForm', () => {
  it('accepts a typed site, with a decimal comma, and wraps east longitudes past 180°', () => {
    expect(parseSiteForm({ latDeg: '52,31', lonDeg: '5.12', heightM: '12' }).site).toEqual({ latDeg: 52.31, lonDeg: 5.12, heightEllM: 12 });
    expect(parseSiteForm({ latDeg: '-33', lonDeg: '359', heightM: '0' }).site?.lonDeg).toBe(-1);
  });
  it('names each bad field and gives no site', () => {
    const r = parseSiteForm({ latDeg: '95', lonDeg: 'abc', heightM: '' });
    expect(r.site).toBeNull();
    expect(r.errors.latDeg).toMatch(/Latitude must be in \[-90, 90\]°, got 95/);
    expect(r.errors.lonDeg).toMatch(/Longitude must be a number/);
    expect(r.errors.heightM).toMatch(/Height is empty/);
    expect(parseSiteForm({ latDeg: '10', lonDeg: '10', heightM: '20000' }).errors.heightM).toMatch(/Height must be in \[-1000, 10000\] m/);
  });
});

describe('parseWindowForm', () => {
  const form = { startUtc: '2026-12-01T00:00Z', days: '24', incidenceMinDeg: '20', incidenceMaxDeg: '46', look: 'right' as const };
  it('reads the default window', () => {
    expect(parseWindowForm(form).query).toEqual(QUERY);
  });
  it('reads a start without a zone as UTC (the field says UTC), and a space for the T', () => {
    expect(parseWindowForm({ ...form, startUtc: '2026-12-01 06:30' }).query?.startMs).toBe(Date.UTC(2026, 11, 1, 6, 30));
    expect(parseWindowForm({ ...form, startUtc: '2026-12-01T06:30+02:00' }).query?.startMs).toBe(Date.UTC(2026, 11, 1, 4, 30));
  });
  it('round-trips the start text it writes', () => {
    fc.assert(
      fc.property(fc.integer({ min: Date.UTC(2000, 0, 1), max: Date.UTC(2050, 0, 1) }), (t) => {
        const minute = Math.floor(t / 60_000) * 60_000;
        expect(parseWindowForm({ ...form, startUtc: utcMinuteText(t) }).query?.startMs).toBe(minute);
      }),
    );
  });
  it('marks bad fields in place', () => {
    expect(parseWindowForm({ ...form, startUtc: '2026-02-30' }).errors.startUtc).toMatch(/not a real date/);
    expect(parseWindowForm({ ...form, startUtc: ' ' }).errors.startUtc).toBe('Start is empty');
    expect(parseWindowForm({ ...form, days: '0' }).errors.days).toMatch(/Days must be in \(0, 366\] days, got 0/);
    const r = parseWindowForm({ ...form, incidenceMinDeg: '40', incidenceMaxDeg: '30' });
    expect(r.query).toBeNull();
    expect(r.errors.incidenceMaxDeg).toMatch(/more than the smallest \(40°\), got 30°/);
    expect(parseWindowForm({ ...form, incidenceMaxDeg: '90' }).errors.incidenceMaxDeg).toMatch(/\(0, 90\)°/);
  });
});

describe('computePasses over the invented GLINT-A and GLINT-B', () => {
  const out = computePasses([GLINT_A, GLINT_B], SITE, QUERY);
  it('finds tracks inside the incidence range on the chosen look side, repeating every 12 days', () => {
    expect(out.errors).toEqual([]);
    expect(out.tracks.length).toBeGreaterThan(0);
    for (const t of out.tracks) {
      expect(t.incidenceDeg).toBeGreaterThanOrEqual(QUERY.incidenceMinDeg);
      expect(t.incidenceDeg).toBeLessThanOrEqual(QUERY.incidenceMaxDeg);
      expect(t.look).toBe('right');
    }
    // DEMO_REPEAT_DAYS = 12 (src/demo/elements.ts): in a 24-day window a track whose first pass falls in the first
    // 12 days has a second pass and repeats after 12 days; one whose first pass is later has only that pass.
    const DAY_MS = 86_400_000;
    const repeating = out.tracks.filter((t) => t.passTimesUtc.length >= 2);
    const single = out.tracks.filter((t) => t.passTimesUtc.length < 2);
    expect(repeating.length).toBeGreaterThan(0);
    for (const t of repeating) {
      expect(t.repeatDays as number).toBeCloseTo(12, 3);
      expect(t.label).toMatch(/every 12 days$/);
    }
    for (const t of single) {
      expect(t.repeatDays).toBeNull();
      expect(t.nextTimeMs).toBeGreaterThan(QUERY.startMs + 12 * DAY_MS);
      expect(t.label).toMatch(/one pass in the window$/);
    }
    expect(new Set(out.tracks.map((t) => t.satellite))).toEqual(new Set(['GLINT-A', 'GLINT-B']));
  });
  it('lists tracks by next pass and indexes them in that order; passes in time order', () => {
    out.tracks.forEach((t, i) => {
      expect(t.index).toBe(i);
      expect(t.nextTimeMs).toBe(Date.parse(t.passTimesUtc[0]));
    });
    for (let i = 1; i < out.tracks.length; i++) expect(out.tracks[i].nextTimeMs).toBeGreaterThanOrEqual(out.tracks[i - 1].nextTimeMs);
    for (let i = 1; i < out.passes.length; i++) expect(out.passes[i].timeMs).toBeGreaterThanOrEqual(out.passes[i - 1].timeMs);
    const inTracks = out.tracks.reduce((n, t) => n + t.passTimesUtc.length, 0);
    expect(inTracks).toBe(out.passes.length);
  });
  it('turns a set that the search rejects into a message, keeping the others', () => {
    const bad = computePasses([GLINT_A], { ...SITE, heightEllM: 20_000 }, QUERY);
    expect(bad.tracks).toEqual([]);
    expect(bad.errors[0]).toMatch(/^GLINT-A: heightM must be in/);
  });
  it('keeps only tracks inside a narrow incidence range, without errors', () => {
    const narrow = computePasses([GLINT_A], SITE, { ...QUERY, days: 1, incidenceMinDeg: 44, incidenceMaxDeg: 45 });
    expect(narrow.errors).toEqual([]);
    for (const t of narrow.tracks) expect(t.incidenceDeg).toBeGreaterThanOrEqual(44);
  });
});

describe('hand-over to the Plan screen', () => {
  const track = computePasses([GLINT_A], SITE, QUERY).tracks[0];
  it('copies the track with text fields and its provenance', () => {
    const g = geometryFromTrack(track);
    expect(g).toMatchObject({ look: 'right', source: 'orbital-elements', satellite: 'GLINT-A', direction: track.direction, elementsEpochMs: GLINT_A.epochMs });
    expect(g.incidenceDeg).toBe(track.incidenceDeg.toFixed(2));
    expect(g.label).toBe(track.label);
  });
  it('hands Plan the track’s own heading and its exact line of sight, so the aim faces the satellite', () => {
    const g = geometryFromTrack(track);
    expect(Number(g.headingDeg)).toBeCloseTo(track.headingDeg, 2);
    const aim = aimForPass({ incidenceDeg: Number(g.incidenceDeg), headingDeg: Number(g.headingDeg), look: g.look, losAzimuthDeg: g.losAzimuthDeg });
    expect(Math.abs(wrapSignedDeg(aim.reflectorAzimuthDeg - track.reflectorAzimuthDeg))).toBeLessThanOrEqual(TOL_HANDOVER_DEG);
    expect(Math.abs(aim.baseTiltDeg - track.baseTiltDeg)).toBeLessThanOrEqual(TOL_HANDOVER_DEG);
  });
  it('appends a second track but not the same one twice', () => {
    const a = geometryFromTrack(track);
    const b = { ...a, direction: 'ascending' as const, incidenceDeg: '30.00' };
    expect(appendGeometry([a], b)).toEqual([a, b]);
    expect(appendGeometry([a, b], { ...a })).toEqual([a, b]);
  });
  it('drops the Plan screen’s untouched starting example when adding, but keeps a typed geometry', () => {
    const a = geometryFromTrack(track);
    expect(appendGeometry(DEFAULT_WORKFLOW.geometries, a)).toEqual([a]);
    const typed = { ...DEFAULT_WORKFLOW.geometries[0], incidenceDeg: '38' };
    expect(appendGeometry([typed], a)).toEqual([typed, a]);
  });
  it('loss at the track’s own aim is zero and grows away from it', () => {
    const aim = aimForPass({ incidenceDeg: track.incidenceDeg, headingDeg: track.headingDeg, look: track.look, losAzimuthDeg: track.reflectorAzimuthDeg });
    const target = { azimuthDeg: aim.reflectorAzimuthDeg, tiltDeg: aim.baseTiltDeg, rollDeg: 0 };
    const [at] = trackLossesDb([track], target, 'triangular');
    expect(at).toBeCloseTo(0, 6);
    const [off] = trackLossesDb([track], { ...target, azimuthDeg: target.azimuthDeg + 10 }, 'triangular');
    expect(off).toBeGreaterThan(0.1);
    expect(trackLossesDb([track], null, 'triangular')).toEqual([null]);
  });
});

describe('labels, ages and the countdown', () => {
  it('labels a track as the crew says it', () => {
    expect(trackLabel({ satellite: 'GLINT-A', direction: 'descending', incidenceDeg: 37.06, repeatDays: 11.99998 })).toBe('GLINT-A descending 37.1°, every 12 days');
    expect(trackLabel({ satellite: 'GLINT-A', direction: 'ascending', incidenceDeg: 21, repeatDays: null })).toBe('GLINT-A ascending 21.0°, one pass in the window');
    expect(formatDays(1)).toBe('1 day');
    expect(formatDays(11.5)).toBe('11.5 days');
  });
  it('ages element sets in days and warns when the epoch is over 14 days from the window', () => {
    expect(elementsAgeDays(GLINT_A.epochMs, GLINT_A.epochMs + 3 * MS_PER_DAY)).toBeCloseTo(3, 12);
    expect(elementsAgeWarning(GLINT_A, { startMs: GLINT_A.epochMs + MS_PER_DAY, days: 10 })).toBeNull();
    expect(elementsAgeWarning(GLINT_A, { startMs: GLINT_A.epochMs + 20 * MS_PER_DAY, days: 10 })).toMatch(/days before the planning window/);
    expect(elementsAgeWarning(GLINT_A, null)).toBeNull();
  });
  it('formats the countdown', () => {
    expect(formatCountdown(0)).toBe('now');
    expect(formatCountdown(-5)).toBe('now');
    expect(formatCountdown(1)).toBe('00:00:01');
    expect(formatCountdown(59_000)).toBe('00:00:59');
    expect(formatCountdown(3_600_000)).toBe('01:00:00');
    expect(formatCountdown(MS_PER_DAY + 3_723_000)).toBe('1 d 01:02:03');
    expect(formatCountdown(NaN)).toBe('—');
  });
  it('countdown text reads back to the whole seconds left, rounded up', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 400 * MS_PER_DAY }), (ms) => {
        const m = /^(?:(\d+) d )?(\d{2}):(\d{2}):(\d{2})$/.exec(formatCountdown(ms));
        expect(m).not.toBeNull();
        const [, d, h, mi, s] = m!;
        expect(Number(h)).toBeLessThan(24);
        expect(Number(d ?? 0) * 86_400 + Number(h) * 3600 + Number(mi) * 60 + Number(s)).toBe(Math.ceil(ms / 1000));
      }),
    );
  });
  it('gives a track’s next pass after now, or null once its passes are over', () => {
    const t = { passTimesUtc: ['2026-12-01T17:10:28.000Z', '2026-12-13T17:10:27.000Z'] };
    expect(trackNextAfterMs(t, Date.UTC(2026, 11, 2))).toBe(Date.UTC(2026, 11, 13, 17, 10, 27));
    expect(trackNextAfterMs(t, Date.UTC(2026, 11, 1))).toBe(Date.UTC(2026, 11, 1, 17, 10, 28));
    expect(trackNextAfterMs(t, Date.UTC(2026, 11, 14))).toBeNull();
  });
  it('picks the next pass strictly after now', () => {
    const ps = [{ timeMs: 10 }, { timeMs: 20 }, { timeMs: 30 }];
    expect(nextPassAfter(ps, 5)).toBe(ps[0]);
    expect(nextPassAfter(ps, 20)).toBe(ps[2]);
    expect(nextPassAfter(ps, 30)).toBeNull();
  });
});
