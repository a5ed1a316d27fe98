/**
 * The inspection form: checklist, optional re-measured orientation (from an Align capture or typed), crew, notes →
 * InspectionFields. Pure.
 */
import {
  CHECK_STATES,
  CHECKLIST_ITEMS,
  type Checklist,
  type CheckState,
  type InspectionFields,
  type InspectionRecord,
} from '../../../data/index.ts';
import { fmtNum } from '../../format.ts';
import type { Capture } from '../../state/workflow.ts';
import { allBlank, crewNames, groupNum, hasErrors, isStr, note, RANGES, utcTime, wrapRollDeg, type FieldErrors } from './parse.ts';
import { isoExactUtc, isoSecondsUtc } from './words.ts';

export interface InspectionForm {
  siteId: string;
  reflectorId: string;
  /** ISO 8601 UTC. */
  inspectedAt: string;
  checklist: Checklist;
  /** Re-measured orientation; all three empty = not re-measured. */
  azimuthDeg: string;
  tiltDeg: string;
  rollDeg: string;
  crew: string;
  notes: string;
  /** Time of the Align capture the orientation came from, or null. */
  captureAtMs: number | null;
}

export type InspectionErrors = FieldErrors<keyof InspectionForm>;

export const UNCHECKED: Checklist = {
  debris: 'not-checked',
  standingWater: 'not-checked',
  snowIce: 'not-checked',
  vegetation: 'not-checked',
  damage: 'not-checked',
  movement: 'not-checked',
};

export function newInspectionForm(o: { siteId: string; reflectorId: string; crewName: string; nowMs: number }): InspectionForm {
  return {
    siteId: o.siteId,
    reflectorId: o.reflectorId,
    inspectedAt: isoSecondsUtc(o.nowMs),
    checklist: { ...UNCHECKED },
    azimuthDeg: '',
    tiltDeg: '',
    rollDeg: '',
    crew: o.crewName.trim(),
    notes: '',
    captureAtMs: null,
  };
}

/** Take the re-measured orientation from an Align capture. */
export function applyCaptureToInspection(f: InspectionForm, c: Capture): InspectionForm {
  return {
    ...f,
    azimuthDeg: fmtNum(c.azimuthDeg, 2),
    tiltDeg: fmtNum(c.tiltDeg, 2),
    rollDeg: fmtNum(wrapRollDeg(c.rollDeg), 2),
    captureAtMs: c.atMs,
  };
}

export function inspectionFormFromRecord(r: InspectionRecord): InspectionForm {
  const n = (x: number | undefined) => (x === undefined ? '' : String(x));
  return {
    siteId: r.siteId,
    reflectorId: r.reflectorId,
    inspectedAt: isoExactUtc(r.inspectedAtMs),
    checklist: { ...r.checklist },
    azimuthDeg: n(r.remeasured?.azimuthDeg),
    tiltDeg: n(r.remeasured?.tiltDeg),
    rollDeg: n(r.remeasured?.rollDeg),
    crew: r.crew.join(', '),
    notes: r.notes,
    captureAtMs: null,
  };
}

export function parseInspectionForm(f: InspectionForm): { fields: Omit<InspectionFields, 'photoIds'> | null; errors: InspectionErrors } {
  const at = utcTime('Inspected at (UTC)', f.inspectedAt);
  const none = allBlank(f.azimuthDeg, f.tiltDeg, f.rollDeg);
  const az = groupNum(!none, 'Re-measured azimuth', f.azimuthDeg, RANGES.azimuthDeg);
  const tilt = groupNum(!none, 'Re-measured tilt', f.tiltDeg, RANGES.tiltDeg);
  const roll = groupNum(!none, 'Re-measured roll', f.rollDeg, RANGES.rollDeg);
  const crew = crewNames(f.crew);
  const notes = note('Notes', f.notes);
  const errors: InspectionErrors = {
    siteId: f.siteId ? undefined : 'The reflector’s site is missing',
    reflectorId: f.reflectorId ? undefined : 'Choose the reflector',
    inspectedAt: at.error,
    azimuthDeg: az.error,
    tiltDeg: tilt.error,
    rollDeg: roll.error,
    crew: crew.error,
    notes: notes.error,
  };
  if (hasErrors(errors)) return { fields: null, errors };
  return {
    errors: {},
    fields: {
      reflectorId: f.reflectorId,
      siteId: f.siteId,
      inspectedAtMs: at.value!,
      checklist: { ...f.checklist },
      remeasured: none ? null : { azimuthDeg: az.value!, tiltDeg: tilt.value!, rollDeg: wrapRollDeg(roll.value!) },
      crew: crew.value,
      notes: notes.value!,
      demo: false,
    },
  };
}

/** "2 issues: debris, movement" / "all 6 OK" / "4 OK, 2 not checked". */
export function checklistSummary(c: Checklist, labels: Record<string, string>): string {
  const issues = CHECKLIST_ITEMS.filter((k) => c[k] === 'issue');
  if (issues.length) return `${issues.length} issue${issues.length > 1 ? 's' : ''}: ${issues.map((k) => labels[k].toLowerCase()).join(', ')}`;
  const okCount = CHECKLIST_ITEMS.filter((k) => c[k] === 'ok').length;
  if (okCount === CHECKLIST_ITEMS.length) return `all ${okCount} OK`;
  return `${okCount} OK, ${CHECKLIST_ITEMS.length - okCount} not checked`;
}

/** Accept a stored draft only with the current shape (it may come from an older app). */
export function isInspectionForm(v: unknown): v is InspectionForm {
  if (typeof v !== 'object' || v === null) return false;
  const o = v as Record<string, unknown>;
  const c = o.checklist as Record<string, unknown> | null;
  return (
    (['siteId', 'reflectorId', 'inspectedAt', 'azimuthDeg', 'tiltDeg', 'rollDeg', 'crew', 'notes'] as const).every((k) => isStr(o[k])) &&
    typeof c === 'object' &&
    c !== null &&
    CHECKLIST_ITEMS.every((k) => CHECK_STATES.includes(c[k] as CheckState)) &&
    (o.captureAtMs === null || typeof o.captureAtMs === 'number')
  );
}
