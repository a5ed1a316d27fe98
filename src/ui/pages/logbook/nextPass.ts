/**
 * The next radar passes that matter to a logbook site: for each geometry the site's reflectors serve, the next pass
 * of that track (same satellite, direction and look side, incidence within SAME_TRACK_INCIDENCE_DEG), from the
 * element sets stored on the phone, over the coming NEXT_PASS_DAYS. The invented demo satellites serve only demo
 * sites. Each element set that fails is named with what failed. Pure: the orbit maths is the core's.
 */
import { DEFAULT_INCIDENCE_MAX_DEG, DEFAULT_INCIDENCE_MIN_DEG, findPasses, type Pass } from '../../../core/orbit/passes.ts';
import { tleLabel, type TleSet } from '../../../core/orbit/tle.ts';
import type { GeometryRecord, ReflectorRecord } from '../../../data/index.ts';

export const NEXT_PASS_DAYS = 14;
/**
 * Passes of one track of a repeat orbit share the incidence to a few hundredths of a degree, while neighbouring
 * tracks differ by several degrees: a pass within this of a geometry's incidence is that geometry's track, degrees
 * (common practice, no source).
 */
export const SAME_TRACK_INCIDENCE_DEG = 1;

type SetLike = TleSet & { demo?: boolean };
type Site = { latDeg: number; lonDeg: number; heightEllM: number; demo?: boolean };

/** The earliest pass of any set after `nowMs` in the default incidence range (kept for callers without geometries). */
export function nextPassOver(sets: readonly TleSet[], site: Site, nowMs: number): Pass | null {
  let best: Pass | null = null;
  for (const set of sets) {
    try {
      const { passes } = findPasses(set, { latDeg: site.latDeg, lonDeg: site.lonDeg, heightM: site.heightEllM }, { startMs: nowMs, days: NEXT_PASS_DAYS });
      const p = passes.find((x) => x.timeMs >= nowMs);
      if (p && (!best || p.timeMs < best.timeMs)) best = p;
    } catch {
      /* reported by siteNextPasses */
    }
  }
  return best;
}

export interface ServedPass {
  reflectorLabel: string;
  geometry: Pick<GeometryRecord, 'incidenceDeg' | 'direction' | 'satellite' | 'look'>;
  /** Null: no pass of this track in the coming NEXT_PASS_DAYS from the usable sets. */
  pass: Pass | null;
}

export interface SiteNextPasses {
  /** One row per geometry served by a live reflector of the site, soonest first. */
  served: ServedPass[];
  /** With no served geometry: the next pass of any track in [incidenceMinDeg, incidenceMaxDeg]. */
  any: Pass | null;
  incidenceMinDeg: number;
  incidenceMaxDeg: number;
  /** Sets that serve this site (demo sets only for a demo site). */
  usable: number;
  /** Demo sets left out because the site is real. */
  demoSkipped: number;
  /** "GLINT-B: <what failed>", one per failed set (a search that threw, a propagation stop, or stale elements). */
  failures: string[];
}

export function siteNextPasses(
  sets: readonly SetLike[],
  site: Site,
  geometries: readonly Pick<GeometryRecord, 'reflectorId' | 'incidenceDeg' | 'direction' | 'satellite' | 'look' | 'deletedAtMs'>[],
  reflectors: readonly Pick<ReflectorRecord, 'id' | 'label' | 'deletedAtMs'>[],
  nowMs: number,
  range = { incidenceMinDeg: DEFAULT_INCIDENCE_MIN_DEG, incidenceMaxDeg: DEFAULT_INCIDENCE_MAX_DEG },
): SiteNextPasses {
  const usableSets = sets.filter((s) => site.demo === true || s.demo !== true);
  const failures: string[] = [];
  const pos = { latDeg: site.latDeg, lonDeg: site.lonDeg, heightM: site.heightEllM };
  const search = (set: SetLike, opts: { incidenceMinDeg: number; incidenceMaxDeg: number; look?: 'left' | 'right' }): Pass[] => {
    try {
      const r = findPasses(set, pos, { startMs: nowMs, days: NEXT_PASS_DAYS }, opts);
      // Propagation stops (unreadable elements, decay) and stale elements come back as warnings naming the set.
      for (const w of r.warnings) if (!failures.includes(w)) failures.push(w);
      return r.passes.filter((p) => p.timeMs >= nowMs);
    } catch (e) {
      const msg = `${tleLabel(set)}: ${e instanceof Error ? e.message : String(e)}`;
      if (!failures.includes(msg)) failures.push(msg);
      return [];
    }
  };
  const live = reflectors.filter((r) => r.deletedAtMs === null);
  const wanted = geometries.filter((g) => g.deletedAtMs === null && g.reflectorId !== null && live.some((r) => r.id === g.reflectorId));
  // One search per set and look side over the union of the wanted incidences (±5°), then each pass matched to its track.
  const found = new Map<string, Pass[]>();
  for (const look of ['right', 'left'] as const) {
    const gs = wanted.filter((g) => g.look === look);
    if (gs.length === 0) continue;
    const opts = { incidenceMinDeg: Math.max(0.5, Math.min(...gs.map((g) => g.incidenceDeg)) - 5), incidenceMaxDeg: Math.min(89.5, Math.max(...gs.map((g) => g.incidenceDeg)) + 5), look };
    usableSets.forEach((set, i) => found.set(`${i}/${look}`, search(set, opts)));
  }
  const served: ServedPass[] = [];
  for (const g of wanted) {
    const r = live.find((x) => x.id === g.reflectorId)!;
    let best: Pass | null = null;
    usableSets.forEach((set, i) => {
      if (g.satellite && set.name.trim() && set.name.trim() !== g.satellite) return;
      const p = (found.get(`${i}/${g.look}`) ?? []).find((x) => (g.direction === null || x.direction === g.direction) && Math.abs(x.incidenceDeg - g.incidenceDeg) <= SAME_TRACK_INCIDENCE_DEG);
      if (p && (!best || p.timeMs < best.timeMs)) best = p;
    });
    served.push({ reflectorLabel: r.label, geometry: g, pass: best });
  }
  served.sort((a, b) => (a.pass?.timeMs ?? Infinity) - (b.pass?.timeMs ?? Infinity));
  let any: Pass | null = null;
  if (served.length === 0) {
    for (const set of usableSets) {
      const p = search(set, range)[0];
      if (p && (!any || p.timeMs < any.timeMs)) any = p;
    }
  }
  return { served, any, ...range, usable: usableSets.length, demoSkipped: sets.length - usableSets.length, failures };
}
