/**
 * The installation form: filled from the Align capture and the Plan target so the crew never retypes, checked in
 * place, and turned into InstallationFields (every figure in a unit-named field; the declination with its model).
 * The form keeps the planned geometries as a snapshot, so a draft restored after a reload still has them. Pure.
 */
import { AZIMUTH_METHODS, type AzimuthMethod, type InstallationFields, type InstallationRecord } from '../../../data/index.ts';
import { fmtNum } from '../../format.ts';
import type { Capture, GeometryInput, Workflow } from '../../state/workflow.ts';
import { bandFrequencyGhz } from './geometryPlan.ts';
import { allBlank, crewNames, groupNum, hasErrors, isStr, line, note, num, optNum, RANGES, utcTime, wrapLonDeg, wrapRollDeg, type Checked, type FieldErrors } from './parse.ts';
import { isoExactUtc, isoSecondsUtc } from './words.ts';

export interface InstallationForm {
  siteId: string;
  reflectorId: string;
  plannedAzimuthDeg: string;
  plannedTiltDeg: string;
  measuredAzimuthDeg: string;
  measuredTiltDeg: string;
  measuredRollDeg: string;
  azimuthMethod: AzimuthMethod;
  /** East-positive, degrees; empty = none used. */
  declinationDeg: string;
  declinationModel: string;
  predictedLossDb: string;
  fixLatDeg: string;
  fixLonDeg: string;
  fixAccuracyM: string;
  /** ISO 8601 UTC time of the fix. */
  fixAt: string;
  /** ISO 8601 UTC. */
  installedAt: string;
  /** Names separated by commas. */
  crew: string;
  notes: string;
  /** Planned geometries from the Plan screen, recorded for the site with the installation. */
  geometries: GeometryInput[];
  band: string;
  frequencyGhz: string;
  /** Time of the Align capture the figures came from, or null when typed. */
  captureAtMs: number | null;
}

export type InstallationErrors = FieldErrors<keyof InstallationForm>;

/** How the capture was measured, for the notes: "Align capture: mean of 45 readings, σ azimuth 0.30°, σ tilt 0.05°." */
export function captureSummary(c: Capture): string {
  const parts = [c.samples > 1 ? `mean of ${c.samples} readings` : 'a single typed reading'];
  if (c.azimuthStdDeg !== undefined) parts.push(`σ azimuth ${fmtNum(c.azimuthStdDeg, 2)}°`);
  if (c.tiltStdDeg !== undefined) parts.push(`σ tilt ${fmtNum(c.tiltStdDeg, 2)}°`);
  return `Align capture: ${parts.join(', ')}.`;
}

const lossText = (db: number | null) => (db === null || !Number.isFinite(db) ? '' : fmtNum(Math.max(0, db), 2));

/** Put a capture's figures into the form (measured orientation, method, declination, loss, time, how measured). */
export function applyCapture(f: InstallationForm, c: Capture): InstallationForm {
  const summary = captureSummary(c);
  const notes = f.notes.includes('Align capture:') ? f.notes.replace(/Align capture:[^\n]*/, summary) : [summary, f.notes].filter((x) => x).join('\n');
  return {
    ...f,
    measuredAzimuthDeg: fmtNum(c.azimuthDeg, 2),
    measuredTiltDeg: fmtNum(c.tiltDeg, 2),
    measuredRollDeg: fmtNum(wrapRollDeg(c.rollDeg), 2),
    azimuthMethod: c.method,
    declinationDeg: c.declinationDeg === null ? '' : fmtNum(c.declinationDeg, 2),
    declinationModel: c.declinationModel ?? '',
    predictedLossDb: lossText(c.predictedLossDb),
    installedAt: isoSecondsUtc(c.atMs),
    notes,
    captureAtMs: c.atMs,
  };
}

/** True when the capture's loss could not be stored (outside the corner for a planned pass: no return). */
export const captureLossUnstorable = (c: Capture | null): boolean => c !== null && c.predictedLossDb !== null && !Number.isFinite(c.predictedLossDb);

/** A new form from the workflow: plan target, planned geometries, capture (when there is one), crew from Settings. */
export function installationFormFromWorkflow(wf: Workflow, o: { crewName: string; nowMs: number; siteId?: string; reflectorId?: string }): InstallationForm {
  const base: InstallationForm = {
    siteId: o.siteId ?? '',
    reflectorId: o.reflectorId ?? '',
    plannedAzimuthDeg: wf.target ? fmtNum(wf.target.azimuthDeg, 2) : '',
    plannedTiltDeg: wf.target ? fmtNum(wf.target.tiltDeg, 2) : '',
    measuredAzimuthDeg: '',
    measuredTiltDeg: '',
    measuredRollDeg: '0',
    azimuthMethod: 'other-instrument',
    declinationDeg: '',
    declinationModel: '',
    predictedLossDb: '',
    fixLatDeg: '',
    fixLonDeg: '',
    fixAccuracyM: '',
    fixAt: '',
    installedAt: isoSecondsUtc(o.nowMs),
    crew: o.crewName.trim(),
    notes: '',
    geometries: wf.geometries.filter((g) => g.incidenceDeg.trim() !== '' && g.headingDeg.trim() !== ''),
    band: wf.band === 'custom' ? 'other' : wf.band,
    frequencyGhz: bandFrequencyGhz(wf.band) ?? '',
    captureAtMs: null,
  };
  return wf.capture ? applyCapture(base, wf.capture) : base;
}

/** The form of a stored installation (editing writes a revision). */
export function installationFormFromRecord(r: InstallationRecord): InstallationForm {
  const n = (x: number | null) => (x === null ? '' : String(x));
  return {
    siteId: r.siteId,
    reflectorId: r.reflectorId,
    plannedAzimuthDeg: n(r.plannedAzimuthDeg),
    plannedTiltDeg: n(r.plannedTiltDeg),
    measuredAzimuthDeg: n(r.measuredAzimuthDeg),
    measuredTiltDeg: n(r.measuredTiltDeg),
    measuredRollDeg: n(r.measuredRollDeg),
    azimuthMethod: r.azimuthMethod,
    declinationDeg: n(r.declinationDeg),
    declinationModel: r.declinationModel ?? '',
    predictedLossDb: n(r.predictedLossDb),
    fixLatDeg: r.fix ? String(r.fix.latDeg) : '',
    fixLonDeg: r.fix ? String(r.fix.lonDeg) : '',
    fixAccuracyM: r.fix ? String(r.fix.accuracyM) : '',
    fixAt: r.fix ? isoExactUtc(r.fix.atMs) : '',
    installedAt: isoExactUtc(r.installedAtMs),
    crew: r.crew.join(', '),
    notes: r.notes,
    geometries: [],
    band: '',
    frequencyGhz: '',
    captureAtMs: null,
  };
}

/** Everything but the ids the save step adds (planned geometries, photos). */
export type InstallationCoreFields = Omit<InstallationFields, 'geometryIds' | 'photoIds'>;

/** Check every field; `fields` only when all are fine. */
export function parseInstallationForm(f: InstallationForm): { fields: InstallationCoreFields | null; errors: InstallationErrors } {
  const pAz = num('Planned azimuth', f.plannedAzimuthDeg, RANGES.azimuthDeg);
  const pTilt = num('Planned tilt', f.plannedTiltDeg, RANGES.tiltDeg);
  const mAz = num('Measured azimuth', f.measuredAzimuthDeg, RANGES.azimuthDeg);
  const mTilt = num('Measured tilt', f.measuredTiltDeg, RANGES.tiltDeg);
  const mRoll = num('Measured roll', f.measuredRollDeg, RANGES.rollDeg);
  const decl = optNum('Declination', f.declinationDeg, RANGES.declinationDeg);
  const model = line('Declination model', f.declinationModel, { max: 40 });
  const loss = optNum('Predicted loss', f.predictedLossDb, RANGES.lossDb);
  const noFix = allBlank(f.fixLatDeg, f.fixLonDeg, f.fixAccuracyM, f.fixAt);
  const fLat = groupNum(!noFix, 'Fix latitude', f.fixLatDeg, RANGES.latDeg);
  const fLon = groupNum(!noFix, 'Fix longitude', f.fixLonDeg, RANGES.lonDeg);
  const fAcc = groupNum(!noFix, 'Fix accuracy', f.fixAccuracyM, RANGES.accuracyM);
  const fAt: Checked<number> = noFix ? {} : utcTime('Fix time (UTC)', f.fixAt);
  const at = utcTime('Installed at (UTC)', f.installedAt);
  const crew = crewNames(f.crew);
  const notes = note('Notes', f.notes);
  const errors: InstallationErrors = {
    siteId: f.siteId ? undefined : 'Choose the site',
    reflectorId: f.reflectorId ? undefined : 'Choose or add the reflector',
    plannedAzimuthDeg: pAz.error,
    plannedTiltDeg: pTilt.error,
    measuredAzimuthDeg: mAz.error,
    measuredTiltDeg: mTilt.error,
    measuredRollDeg: mRoll.error,
    azimuthMethod: AZIMUTH_METHODS.includes(f.azimuthMethod) ? undefined : 'Choose how the azimuth was set',
    declinationDeg:
      decl.error ?? (f.azimuthMethod === 'compass' && decl.value === null ? 'A compass azimuth needs the declination that made it true (east +)' : undefined),
    declinationModel: model.error ?? (model.value && decl.value === null ? 'A declination model is named but no declination is given' : undefined),
    predictedLossDb: loss.error,
    fixLatDeg: fLat.error,
    fixLonDeg: fLon.error,
    fixAccuracyM: fAcc.error,
    fixAt: fAt.error,
    installedAt: at.error,
    crew: crew.error,
    notes: notes.error,
  };
  if (hasErrors(errors)) return { fields: null, errors };
  return {
    errors: {},
    fields: {
      reflectorId: f.reflectorId,
      siteId: f.siteId,
      plannedAzimuthDeg: pAz.value!,
      plannedTiltDeg: pTilt.value!,
      measuredAzimuthDeg: mAz.value!,
      measuredTiltDeg: mTilt.value!,
      measuredRollDeg: wrapRollDeg(mRoll.value!),
      azimuthMethod: f.azimuthMethod,
      declinationDeg: decl.value ?? null,
      declinationModel: model.value ? model.value : null,
      fix: noFix ? null : { latDeg: fLat.value!, lonDeg: wrapLonDeg(fLon.value!), accuracyM: fAcc.value!, atMs: fAt.value! },
      predictedLossDb: loss.value ?? null,
      crew: crew.value,
      installedAtMs: at.value!,
      notes: notes.value!,
      demo: false,
    },
  };
}

/** A draft read back from the database may come from an older app: accept it only with the current shape. */
export function isInstallationForm(v: unknown): v is InstallationForm {
  if (typeof v !== 'object' || v === null) return false;
  const o = v as Record<string, unknown>;
  const strings: (keyof InstallationForm)[] = [
    'siteId', 'reflectorId', 'plannedAzimuthDeg', 'plannedTiltDeg', 'measuredAzimuthDeg', 'measuredTiltDeg', 'measuredRollDeg',
    'declinationDeg', 'declinationModel', 'predictedLossDb', 'fixLatDeg', 'fixLonDeg', 'fixAccuracyM', 'fixAt', 'installedAt',
    'crew', 'notes', 'band', 'frequencyGhz',
  ];
  return (
    strings.every((k) => isStr(o[k])) &&
    AZIMUTH_METHODS.includes(o.azimuthMethod as AzimuthMethod) &&
    Array.isArray(o.geometries) &&
    o.geometries.every((g) => typeof g === 'object' && g !== null && isStr((g as GeometryInput).incidenceDeg) && isStr((g as GeometryInput).headingDeg)) &&
    (o.captureAtMs === null || typeof o.captureAtMs === 'number')
  );
}
