/**
 * Which of the chosen site's reflectors the Plan screen sizes: the one whose recorded geometry serves the planned
 * track (same satellite and direction), else the first by label. Pure, so it is tested without a database.
 */
import type { GeometryRecord, ReflectorRecord } from '../../../data/index.ts';
import type { GeometryInput } from '../../state/workflow.ts';

export function pickPlanReflector(
  reflectors: readonly Pick<ReflectorRecord, 'id' | 'label' | 'deletedAtMs'>[],
  geometries: readonly Pick<GeometryRecord, 'reflectorId' | 'satellite' | 'direction' | 'deletedAtMs'>[],
  planned: readonly Pick<GeometryInput, 'satellite' | 'direction'>[],
): string | null {
  const live = reflectors.filter((r) => r.deletedAtMs === null).sort((a, b) => a.label.localeCompare(b.label));
  if (live.length === 0) return null;
  for (const p of planned) {
    if (!p.direction) continue;
    const g = geometries.find(
      (x) => x.deletedAtMs === null && x.reflectorId !== null && x.direction === p.direction && (p.satellite === undefined || x.satellite === p.satellite) && live.some((r) => r.id === x.reflectorId),
    );
    if (g) return g.reflectorId;
  }
  return live[0].id;
}

/** The signal-to-clutter verdict in words (never colour alone): null until both numbers are known. */
export function scrVerdict(scrDb: number | null, targetScrDb: number | null, edgeForTargetM: number | null): { ok: boolean; text: string } | null {
  if (scrDb === null || targetScrDb === null) return null;
  if (scrDb >= targetScrDb) return { ok: true, text: `Meets the ${targetScrDb} dB target (${(scrDb - targetScrDb).toFixed(1)} dB to spare).` };
  const edge = edgeForTargetM !== null && Number.isFinite(edgeForTargetM) ? ` A ${edgeForTargetM.toFixed(2)} m edge would reach it.` : '';
  return { ok: false, text: `Below the ${targetScrDb} dB target by ${(targetScrDb - scrDb).toFixed(1)} dB: the reflector may not stand out of the clutter.${edge}` };
}
