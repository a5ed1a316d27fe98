/**
 * The next radar pass over a logbook site, from the element sets stored on the phone (the Passes screen's store),
 * searched over the coming 14 days with the default swath. Null when no element set sees the site in that time.
 */
import { findPasses, type Pass } from '../../../core/orbit/passes.ts';
import type { TleSet } from '../../../core/orbit/tle.ts';

export const NEXT_PASS_DAYS = 14;

export function nextPassOver(sets: readonly TleSet[], site: { latDeg: number; lonDeg: number; heightEllM: number }, nowMs: number): Pass | null {
  let best: Pass | null = null;
  for (const set of sets) {
    try {
      const { passes } = findPasses(set, { latDeg: site.latDeg, lonDeg: site.lonDeg, heightM: site.heightEllM }, { startMs: nowMs, days: NEXT_PASS_DAYS });
      const p = passes.find((x) => x.timeMs >= nowMs);
      if (p && (!best || p.timeMs < best.timeMs)) best = p;
    } catch {
      /* a set that cannot be propagated (decayed, bad elements) is skipped; the Passes screen explains it */
    }
  }
  return best;
}
