/**
 * Grouping passes into tracks: the passes of one satellite that see the site from the same geometry
 * (same direction and look side, incidence and heading within a tolerance) are one track, repeating every
 * repeat cycle. A reflector aimed for a track serves every pass of it.
 *
 * Means: incidence arithmetic; heading and reflector azimuth circular (atan2 of summed sines and cosines,
 *   Mardia & Jupp, "Directional Statistics", Wiley 2000, §2.2.1). Repeat interval: median of the gaps
 *   between consecutive passes (robust to a missing pass doubling one gap).
 */
import { TRIHEDRAL_BORESIGHT_ELEVATION_DEG, normalizeAzimuthDeg, toDeg, toRad, wrapSignedDeg } from '../units.ts';
import { requirePositive } from '../validate.ts';
import type { LookSide } from '../geometry/pointing.ts';
import type { Pass, PassDirection } from './passes.ts';

export interface Track {
  /** Stable label, e.g. "99001-asc-R-33.4" (catalogue number, direction, look side, mean incidence). */
  id: string;
  satellite: string;
  catalogNumber: string;
  direction: PassDirection;
  look: LookSide;
  /** Mean incidence, degrees. */
  incidenceDeg: number;
  /** Circular mean heading, degrees true, [0, 360). */
  headingDeg: number;
  /** Circular mean reflector azimuth, degrees true, [0, 360). */
  reflectorAzimuthDeg: number;
  /** (90° − mean incidence) − atan(1/√2), degrees. */
  baseTiltDeg: number;
  /** Every pass of the track, ISO 8601 UTC, in time order. */
  passTimesUtc: string[];
  /** Median interval between passes, days; null with a single pass. */
  repeatDays: number | null;
  /** First (earliest) pass of the track in the list given. */
  nextTimeUtc: string;
}

export interface TrackTolerance {
  /** Largest incidence difference from the track's mean, degrees (default 1). */
  incidenceDeg?: number;
  /** Largest heading difference from the track's circular mean, degrees (default 1). */
  headingDeg?: number;
}

const circularMeanDeg = (anglesDeg: number[]): number => {
  let s = 0, c = 0;
  for (const a of anglesDeg) {
    s += Math.sin(toRad(a));
    c += Math.cos(toRad(a));
  }
  return normalizeAzimuthDeg(toDeg(Math.atan2(s, c)));
};

const median = (xs: number[]): number => {
  const v = [...xs].sort((a, b) => a - b);
  const m = v.length >> 1;
  return v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
};

interface Group {
  passes: Pass[];
  incidenceDeg: number;
  headingDeg: number;
}

/** Group passes into tracks (greedy, in time order), sorted by their next (earliest) pass time. */
export function groupTracks(passes: Pass[], tol: TrackTolerance = {}): Track[] {
  const incTol = requirePositive('tol.incidenceDeg', tol.incidenceDeg ?? 1, '°');
  const headTol = requirePositive('tol.headingDeg', tol.headingDeg ?? 1, '°');
  const groups: Group[] = [];
  for (const p of [...passes].sort((a, b) => a.timeMs - b.timeMs)) {
    const g = groups.find(
      (q) =>
        q.passes[0].catalogNumber === p.catalogNumber &&
        q.passes[0].satellite === p.satellite &&
        q.passes[0].direction === p.direction &&
        q.passes[0].look === p.look &&
        Math.abs(p.incidenceDeg - q.incidenceDeg) <= incTol &&
        Math.abs(wrapSignedDeg(p.headingDeg - q.headingDeg)) <= headTol,
    );
    if (g) {
      g.passes.push(p);
      g.incidenceDeg = g.passes.reduce((s, x) => s + x.incidenceDeg, 0) / g.passes.length;
      g.headingDeg = circularMeanDeg(g.passes.map((x) => x.headingDeg));
    } else {
      groups.push({ passes: [p], incidenceDeg: p.incidenceDeg, headingDeg: p.headingDeg });
    }
  }
  const ids = new Map<string, number>();
  return groups.map((g) => {
    const first = g.passes[0];
    const gaps = g.passes.slice(1).map((p, i) => (p.timeMs - g.passes[i].timeMs) / 86_400_000);
    const base = `${first.catalogNumber}-${first.direction === 'ascending' ? 'asc' : 'desc'}-${first.look === 'right' ? 'R' : 'L'}-${g.incidenceDeg.toFixed(1)}`;
    const n = (ids.get(base) ?? 0) + 1;
    ids.set(base, n);
    return {
      id: n === 1 ? base : `${base}-${n}`,
      satellite: first.satellite,
      catalogNumber: first.catalogNumber,
      direction: first.direction,
      look: first.look,
      incidenceDeg: g.incidenceDeg,
      headingDeg: g.headingDeg,
      reflectorAzimuthDeg: circularMeanDeg(g.passes.map((x) => x.reflectorAzimuthDeg)),
      baseTiltDeg: 90 - g.incidenceDeg - TRIHEDRAL_BORESIGHT_ELEVATION_DEG,
      passTimesUtc: g.passes.map((x) => x.timeUtc),
      repeatDays: gaps.length ? median(gaps) : null,
      nextTimeUtc: first.timeUtc,
    };
  });
}
