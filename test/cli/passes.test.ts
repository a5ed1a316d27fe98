import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO_TLE, DEMO_TLE_B } from '../../src/demo/elements.ts';
import { runCli } from './run.ts';

const dir = mkdtempSync(join(tmpdir(), 'glintmark-passes-'));
const file = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};
const [NAME, L1, L2] = DEMO_TLE.trim().split('\n');
const GOOD = file('glint-a.tle', DEMO_TLE);
// Marrowby Fen (invented site), two weeks from the demo epoch.
const SITE = ['--lat', '52.3', '--lon', '5.1', '--height', '10'];
const WINDOW = ['--start', '2026-12-01', '--days', '14'];
const BASE = ['passes', '--tle', GOOD, ...SITE, ...WINDOW];

/** Contract: field names of one JSON pass (never renamed; fields may be added). */
const PASS_FIELDS = ['timeUtc', 'direction', 'incidenceDeg', 'headingDeg', 'reflectorAzimuthDeg', 'baseTiltDeg', 'slantRangeKm', 'satellite'];

describe('glintmark passes', () => {
  it('--json prints one JSON array of passes with the contract fields', async () => {
    const r = await runCli([...BASE, '--json']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    const passes = r.json() as Record<string, unknown>[];
    expect(Array.isArray(passes)).toBe(true);
    expect(passes.length).toBeGreaterThanOrEqual(4);
    for (const p of passes) {
      for (const k of PASS_FIELDS) expect(p).toHaveProperty(k);
      expect(p.timeUtc).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
      expect(['ascending', 'descending']).toContain(p.direction);
      expect(p.satellite).toBe('GLINT-A');
      expect(p.incidenceDeg as number).toBeGreaterThanOrEqual(20);
      expect(p.incidenceDeg as number).toBeLessThanOrEqual(46);
    }
    const times = passes.map((p) => Date.parse(p.timeUtc as string));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    expect(r.stdout.endsWith('\n')).toBe(true);
  });

  it('prints a readable table without --json', async () => {
    const r = await runCli(BASE);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toMatch(/^time \(UTC\)\s+satellite\s+dir\s+incidence°\s+heading°\s+reflector az°\s+base tilt°\s+slant km$/);
    expect(lines[2]).toMatch(/^2026-12-\d\dT\d\d:\d\d:\d\dZ\s+GLINT-A\s+(asc|desc)\s+\d/);
  });

  it('--tracks --json groups the passes into tracks', async () => {
    const r = await runCli(['passes', '--tle', GOOD, ...SITE, '--start', '2026-12-01', '--days', '30', '--tracks', '--json']);
    expect(r.code).toBe(0);
    const tracks = r.json() as { id: string; repeatDays: number | null; passTimesUtc: string[]; nextTimeUtc: string }[];
    expect(tracks.length).toBeGreaterThanOrEqual(4);
    for (const t of tracks) {
      expect(t.passTimesUtc[0]).toBe(t.nextTimeUtc);
      // A 12-day repeat (src/demo/elements.ts) puts every track's first pass in the first 12 days of a 30-day
      // window, so every track has at least two passes and repeats after 12 days.
      expect(t.passTimesUtc.length).toBeGreaterThanOrEqual(2);
      expect(t.repeatDays as number).toBeCloseTo(12, 3);
    }
  });

  it('--tracks without --json prints a track table', async () => {
    const r = await runCli([...BASE, '--tracks']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^track\s+dir\s+incidence°/);
    expect(r.stdout).toMatch(/99001-(asc|desc)-R-\d+\.\d/);
  });

  it('honours --look, --incidence-min and --incidence-max', async () => {
    const r = await runCli([...BASE, '--look', 'left', '--incidence-min', '25', '--incidence-max', '40', '--json']);
    expect(r.code).toBe(0);
    for (const p of r.json() as { incidenceDeg: number; look: string }[]) {
      expect(p.look).toBe('left');
      expect(p.incidenceDeg).toBeGreaterThanOrEqual(25);
      expect(p.incidenceDeg).toBeLessThanOrEqual(40);
    }
  });

  it('--height defaults to 0 m', async () => {
    const a = await runCli(['passes', '--tle', GOOD, '--lat', '52.3', '--lon', '5.1', ...WINDOW, '--json']);
    const b = await runCli(['passes', '--tle', GOOD, '--lat', '52.3', '--lon', '5.1', '--height', '0', ...WINDOW, '--json']);
    expect(a.code).toBe(0);
    expect(a.stdout).toBe(b.stdout);
  });

  it('reads every good set of a multi-satellite file', async () => {
    const both = file('both.tle', DEMO_TLE + DEMO_TLE_B);
    const r = await runCli(['passes', '--tle', both, ...SITE, ...WINDOW, '--json']);
    expect(new Set((r.json() as { satellite: string }[]).map((p) => p.satellite))).toEqual(new Set(['GLINT-A', 'GLINT-B']));
  });

  it('warns about stale elements on stderr and still answers', async () => {
    const r = await runCli(['passes', '--tle', GOOD, ...SITE, '--start', '2027-02-01', '--days', '2', '--json']);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/^warning: GLINT-A: elements are from 2026-11-28T12:00Z, 64\.5 days before the planning window/);
    expect(Array.isArray(r.json())).toBe(true);
  });

  it('prints an empty array, not an error, when nothing passes', async () => {
    const r = await runCli(['passes', '--tle', GOOD, ...SITE, '--start', '2026-12-01', '--days', '0.1', '--json']);
    expect(r.code).toBe(0);
    expect(r.json()).toEqual([]);
    const t = await runCli(['passes', '--tle', GOOD, ...SITE, '--start', '2026-12-01', '--days', '0.1']);
    expect(t.stdout).toMatch(/^no passes in the window/);
  });
});

describe('glintmark passes: TLE problems', () => {
  it('uses the good sets of a mixed file and warns about the bad one with line and column', async () => {
    const mixed = file('mixed.tle', `${DEMO_TLE}GLINT-X\n${L1}\n${L2.slice(0, 68)}0\n`);
    const r = await runCli(['passes', '--tle', mixed, ...SITE, ...WINDOW, '--json']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe(`warning: ${mixed} line 6, column 69: checksum is 0 but the line adds up to 2 — the line was probably mistyped or cut; that part was skipped\n`);
    expect((r.json() as unknown[]).length).toBeGreaterThan(0);
  });

  it.each([
    ['wrong checksum', `${NAME}\n${L1}\n${L2.slice(0, 68)}7\n`, /line 3, column 69: checksum is 7 but the line adds up to 2/],
    ['truncated line', `${NAME}\n${L1.slice(0, 50)}\n${L2}\n`, /line 2, column 51: line 1 of the element set has 50 characters but needs 69/],
    ['mismatched catalogue numbers', `${L1}\n${DEMO_TLE_B.trim().split('\n')[2]}\n`, /line 2, column 3: catalogue number 99002 does not match 99001/],
    ['wrong line number', `${NAME}\n${L1}\n3${L2.slice(1)}\n`, /line 3, column 1: line 2 of the element set must start with "2", found "3"/],
    ['garbage text', 'these are not orbital elements\n', /line 1, column 1: "these are not orbital el…" is not followed by an element set/],
  ])('%s: exit 2 with one line naming line and column', async (_label, text, message) => {
    const p = file('bad.tle', text);
    const r = await runCli(['passes', '--tle', p, ...SITE, ...WINDOW]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.split('\n')).toHaveLength(2); // one line + final newline
    expect(r.stderr).toMatch(/^glintmark passes: no usable element set in /);
    expect(r.stderr).toMatch(message);
  });

  it('empty file: exit 2 (bad input); missing file: exit 1 (the work failed), each with one line', async () => {
    const empty = await runCli(['passes', '--tle', file('empty.tle', '\n\n'), ...SITE, ...WINDOW]);
    expect(empty.code).toBe(2);
    expect(empty.stderr).toMatch(/^glintmark passes: no element set found in .*: the file is empty\n$/);
    const missing = await runCli(['passes', '--tle', join(dir, 'nope.tle'), ...SITE, ...WINDOW]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toMatch(/^glintmark passes: cannot read --tle file ".*nope\.tle": no such file\n$/);
  });
});

describe('glintmark passes: bad arguments exit 2 with one line on stderr', () => {
  const without = (flag: string) => {
    const i = BASE.indexOf(flag);
    return [...BASE.slice(0, i), ...BASE.slice(i + 2)];
  };
  it.each([
    ['missing --tle', without('--tle'), /missing --tle/],
    ['missing --lat', without('--lat'), /missing --lat/],
    ['missing --start', without('--start'), /missing --start/],
    ['missing --days', without('--days'), /missing --days/],
    ['non-numeric --lat', [...without('--lat'), '--lat', 'north'], /--lat must be a number, got "north"/],
    ['out-of-range --lat', [...without('--lat'), '--lat', '91'], /--lat must be in \[-90, 90\] degrees, got 91/],
    ['out-of-range --lon', [...without('--lon'), '--lon', '400'], /--lon must be in \[-180, 360\]/],
    ['out-of-range --height', [...without('--height'), '--height', '20000'], /--height must be in \[-1000, 10000\] m/],
    ['zero --days', [...without('--days'), '--days', '0'], /--days must be in \(0, 366\] days, got 0/],
    ['too many --days', [...without('--days'), '--days', '400'], /--days must be in \(0, 366\]/],
    ['loose --start', [...without('--start'), '--start', 'yesterday'], /--start must be an ISO 8601 date or time .*got "yesterday"/],
    ['--start without zone', [...without('--start'), '--start', '2026-12-01T06:00'], /no time zone; add Z for UTC/],
    ['impossible --start', [...without('--start'), '--start', '2026-02-30'], /not a real date/],
    ['out-of-range incidence', [...BASE, '--incidence-max', '95'], /--incidence-max must be in \(0, 90\)/],
    ['inverted incidence range', [...BASE, '--incidence-min', '40', '--incidence-max', '30'], /--incidence-min \(40\) must be less than --incidence-max \(30\)/],
    ['bad --look', [...BASE, '--look', 'down'], /--look must be one of right, left, got "down"/],
    ['unknown option', [...BASE, '--satellite', 'GLINT-A'], /unknown option --satellite/],
    ['repeated option', [...BASE, '--days', '3'], /--days given 2 times/],
  ])('%s', async (_label, argv, message) => {
    const r = await runCli(argv);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.split('\n')).toHaveLength(2);
    expect(r.stderr).toMatch(/^glintmark passes: /);
    expect(r.stderr).toMatch(message);
  });

  it('--help shows the options', async () => {
    const r = await runCli(['passes', '--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/--tle FILE --lat DEG --lon DEG \[--height M\] --start ISO --days N/);
    expect(r.stdout).toMatch(/default 0/);
  });
});
