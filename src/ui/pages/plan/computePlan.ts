/**
 * Everything the Plan screen shows, computed from the raw form text in one pure function (testable without a DOM).
 * Invalid fields come back as per-field messages; results are null until the inputs that feed them are valid.
 */
import { reflectorAxesEnu, enuToBody, type ReflectorOrientation } from '../../../core/geometry/orientation.ts';
import { aimForPass, type PassGeometry } from '../../../core/geometry/pointing.ts';
import { bandWavelengthM, wavelengthFromFrequencyM } from '../../../core/radar/bands.ts';
import { edgeForScrM, losPrecisionMm, phaseStdRad, resolutionCellAreaM2, scrDb } from '../../../core/radar/clutter.ts';
import type { TrihedralShapeName } from '../../../core/radar/shapes.ts';
import { beamwidth3dB } from '../../../core/reflector/beamwidth.ts';
import { compromiseOrientation } from '../../../core/reflector/compromise.ts';
import { misalignment } from '../../../core/reflector/misalignment.ts';
import { peakRcsM2 } from '../../../core/reflector/trihedral.ts';
import { toDb, toDeg } from '../../../core/units.ts';
import { requireIncidenceDeg, requireInRange, requirePositive } from '../../../core/validate.ts';
import { parseField } from '../../components/fields.tsx';
import type { GeometryInput } from '../../state/workflow.ts';

export interface PlanForm {
  geometries: GeometryInput[];
  shape: TrihedralShapeName;
  edgeM: string;
  band: string;
  frequencyGhz: string;
  clutterDb: string;
  rangeResolutionM: string;
  azimuthResolutionM: string;
  targetScrDb: string;
}

export interface GeometryResult {
  errors: { incidenceDeg?: string; headingDeg?: string };
  geometry: PassGeometry | null;
  lossDb: number | null;
  offBoresightDeg: number | null;
  /** Direction of this pass in the reflector frame at the target orientation (for the pattern plot). */
  elevationDeg: number | null;
  azimuthOffsetDeg: number | null;
}

export interface PlanResult {
  geometries: GeometryResult[];
  errors: { edgeM?: string; frequencyGhz?: string; clutterDb?: string; rangeResolutionM?: string; azimuthResolutionM?: string; targetScrDb?: string };
  wavelengthM: number | null;
  target: ReflectorOrientation | null;
  boresightElevationDeg: number | null;
  worstLossDb: number | null;
  compromiseMessage: string | null;
  separateRecommended: boolean;
  peakRcsM2: number | null;
  peakRcsDbsm: number | null;
  beamwidth: { elevationFullDeg: number; azimuthFullDeg: number };
  cellAreaM2: number | null;
  scrDb: number | null;
  phaseStdRad: number | null;
  /** LOS precision of one image, mm. */
  losStdMm: number | null;
  /** LOS precision of the difference of two images (a displacement between two dates): √2 × losStdMm, mm. */
  losStdDiffMm: number | null;
  edgeForTargetM: number | null;
}

const nonNeg = (label: string, v: number) => requireInRange(label, v, { min: 0, max: 1e6 });

export function computePlan(f: PlanForm): PlanResult {
  const geometries: GeometryResult[] = f.geometries.map((g) => {
    const inc = parseField('Incidence', g.incidenceDeg, requireIncidenceDeg);
    const hdg = parseField('Heading', g.headingDeg, (n, v) => requireInRange(n, v, { min: -360, max: 360, unit: '°' }));
    const ok = inc.value !== undefined && hdg.value !== undefined;
    return {
      errors: { incidenceDeg: inc.error, headingDeg: hdg.error },
      geometry: ok ? { incidenceDeg: inc.value!, headingDeg: hdg.value!, look: g.look, ...(g.losAzimuthDeg !== undefined ? { losAzimuthDeg: g.losAzimuthDeg } : {}) } : null,
      lossDb: null,
      offBoresightDeg: null,
      elevationDeg: null,
      azimuthOffsetDeg: null,
    };
  });
  const edge = parseField('Edge', f.edgeM, (n, v) => requireInRange(n, v, { min: 0.05, max: 10, minInclusive: true, unit: 'm' }));
  let wavelengthM: number | null = null;
  const errors: PlanResult['errors'] = { edgeM: edge.error };
  if (f.band === 'custom') {
    const fr = parseField('Frequency', f.frequencyGhz, (n, v) => requireInRange(n, v, { min: 0.1, max: 100, unit: 'GHz' }));
    errors.frequencyGhz = fr.error;
    if (fr.value !== undefined) wavelengthM = wavelengthFromFrequencyM(fr.value * 1e9);
  } else wavelengthM = bandWavelengthM(f.band);

  const valid = geometries.map((g) => g.geometry).filter((g): g is PassGeometry => g !== null);
  const allValid = valid.length === geometries.length && valid.length > 0;
  const reflector = edge.value !== undefined && wavelengthM !== null ? { shape: f.shape, edgeM: edge.value, wavelengthM } : null;

  let target: ReflectorOrientation | null = null;
  let worstLossDb: number | null = null;
  let compromiseMessage: string | null = null;
  let separateRecommended = false;
  if (allValid) {
    if (valid.length === 1) {
      const a = aimForPass(valid[0]);
      target = { azimuthDeg: a.reflectorAzimuthDeg, tiltDeg: a.baseTiltDeg, rollDeg: 0 };
    } else {
      const c = compromiseOrientation(reflector ?? { shape: f.shape, edgeM: 1, wavelengthM: 0.05 }, valid);
      target = c.orientation;
      compromiseMessage = c.message;
      separateRecommended = c.separateRecommended;
    }
    const r = reflector ?? { shape: f.shape, edgeM: 1, wavelengthM: 0.05 };
    const axes = reflectorAxesEnu(target);
    geometries.forEach((g) => {
      const m = misalignment(r, target!, g.geometry!);
      g.lossDb = m.lossDb;
      g.offBoresightDeg = m.offBoresightDeg;
      const b = enuToBody(axes, aimForPass(g.geometry!).losEnu);
      g.elevationDeg = toDeg(Math.asin(Math.max(-1, Math.min(1, b[2]))));
      g.azimuthOffsetDeg = toDeg(Math.atan2(b[0], b[1]));
    });
    worstLossDb = Math.max(...geometries.map((g) => g.lossDb ?? Infinity));
  }

  const peak = reflector ? peakRcsM2(reflector) : null;
  const peakRcsDbsm = peak !== null ? toDb(peak) : null;
  const s0 = parseField('Background σ⁰', f.clutterDb, (n, v) => requireInRange(n, v, { min: -40, max: 10, unit: 'dB' }));
  const rr = parseField('Range resolution', f.rangeResolutionM, (n, v) => requirePositive(n, v, 'm'));
  const ar = parseField('Azimuth resolution', f.azimuthResolutionM, (n, v) => requirePositive(n, v, 'm'));
  const ts = parseField('Target SCR', f.targetScrDb, (n, v) => nonNeg(n, v));
  Object.assign(errors, { clutterDb: s0.error, rangeResolutionM: rr.error, azimuthResolutionM: ar.error, targetScrDb: ts.error });
  const incForCell = valid.length ? Math.max(...valid.map((g) => g.incidenceDeg)) : null;
  const cellAreaM2 = rr.value !== undefined && ar.value !== undefined && incForCell !== null ? resolutionCellAreaM2(rr.value, ar.value, incForCell) : null;
  const worstRcsDbsm = peakRcsDbsm !== null && worstLossDb !== null && Number.isFinite(worstLossDb) ? peakRcsDbsm - worstLossDb : null;
  const scr = worstRcsDbsm !== null && s0.value !== undefined && cellAreaM2 !== null ? scrDb(worstRcsDbsm, s0.value, cellAreaM2) : null;
  const phase = scr !== null ? phaseStdRad(scr) : null;
  return {
    geometries,
    errors,
    wavelengthM,
    target,
    boresightElevationDeg: valid.length === 1 ? 90 - valid[0].incidenceDeg : null,
    worstLossDb,
    compromiseMessage,
    separateRecommended,
    peakRcsM2: peak,
    peakRcsDbsm,
    beamwidth: beamwidth3dB(f.shape),
    cellAreaM2,
    scrDb: scr,
    phaseStdRad: phase,
    losStdMm: phase !== null && wavelengthM !== null ? losPrecisionMm(phase, wavelengthM) : null,
    losStdDiffMm: phase !== null && wavelengthM !== null ? Math.SQRT2 * losPrecisionMm(phase, wavelengthM) : null,
    edgeForTargetM:
      wavelengthM !== null && ts.value !== undefined && s0.value !== undefined && cellAreaM2 !== null
        ? edgeForScrM(f.shape, wavelengthM, ts.value + (worstLossDb !== null && Number.isFinite(worstLossDb) ? worstLossDb : 0), s0.value, cellAreaM2)
        : null,
  };
}
