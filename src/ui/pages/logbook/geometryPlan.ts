/**
 * Planned pass geometries from the Plan screen → geometry records of the site, so an installation lists the
 * geometries it serves. A geometry already recorded for the site (same incidence, heading, look, band and
 * reflector) is reused, never duplicated. Pure.
 */
import { BAND_PRESETS, wavelengthFromFrequencyM } from '../../../core/radar/bands.ts';
import type { GeometryFields, GeometryRecord } from '../../../data/index.ts';
import { fmtNum } from '../../format.ts';
import type { GeometryInput } from '../../state/workflow.ts';
import { num, RANGES } from './parse.ts';

/** Two geometries are the same plan when their angles agree to this, degrees (typed values have ≤ 4 decimals). */
export const SAME_GEOMETRY_TOL_DEG = 1e-6;
/** Wavelengths agree to this, metres. */
export const SAME_WAVELENGTH_TOL_M = 1e-9;

/** The centre frequency of a band preset as form text ("5.405"), or null for a band without a preset. */
export function bandFrequencyGhz(band: string): string | null {
  const p = BAND_PRESETS.find((b) => b.name === band);
  return p ? String(p.centreGhz) : null;
}

export interface PlannedGeometries {
  fields: GeometryFields[];
  /** One plain sentence per geometry that cannot be recorded (the installation is still saved without it). */
  errors: string[];
  /** Set when the frequency is needed and wrong. */
  frequencyError?: string;
}

/** The form's planned geometries as geometry fields for `siteId`, served by `reflectorId`. */
export function plannedGeometryFields(
  form: { geometries: readonly GeometryInput[]; band: string; frequencyGhz: string },
  siteId: string,
  reflectorId: string | null,
): PlannedGeometries {
  if (form.geometries.length === 0) return { fields: [], errors: [] };
  const f = num('Radar frequency', form.frequencyGhz, RANGES.frequencyGhz);
  if (f.value === undefined) return { fields: [], errors: [], frequencyError: f.error };
  const wavelengthM = wavelengthFromFrequencyM(f.value * 1e9);
  const band = form.band.trim() === '' ? 'other' : form.band.trim().slice(0, 16);
  const fields: GeometryFields[] = [];
  const errors: string[] = [];
  form.geometries.forEach((g, i) => {
    const inc = num('Incidence', g.incidenceDeg, { min: 0, max: 90, minInclusive: false, maxInclusive: false, unit: '°' });
    const hdg = num('Heading', g.headingDeg, RANGES.azimuthDeg);
    if (inc.value === undefined || hdg.value === undefined) {
      errors.push(`Planned geometry ${i + 1} is not recorded: ${inc.error ?? hdg.error}`);
      return;
    }
    const sat = g.satellite?.trim();
    fields.push({
      siteId,
      reflectorId,
      incidenceDeg: inc.value,
      headingDeg: hdg.value,
      look: g.look,
      direction: g.direction ?? null,
      band,
      wavelengthM,
      source: g.source,
      satellite: sat ? sat.slice(0, 40) : null,
      elementsEpochMs: g.elementsEpochMs !== undefined && Number.isInteger(g.elementsEpochMs) ? g.elementsEpochMs : null,
      demo: false,
    });
  });
  return { fields, errors };
}

/** True when a stored geometry records the same plan (a reflector-less one serves any reflector of the site). */
export function sameGeometry(want: GeometryFields, have: GeometryRecord): boolean {
  return (
    have.deletedAtMs === null &&
    have.siteId === want.siteId &&
    (have.reflectorId === want.reflectorId || have.reflectorId === null) &&
    Math.abs(have.incidenceDeg - want.incidenceDeg) <= SAME_GEOMETRY_TOL_DEG &&
    Math.abs(have.headingDeg - want.headingDeg) <= SAME_GEOMETRY_TOL_DEG &&
    have.look === want.look &&
    have.band === want.band &&
    Math.abs(have.wavelengthM - want.wavelengthM) <= SAME_WAVELENGTH_TOL_M
  );
}

/** For each wanted geometry, the id of a matching stored one, or null (to be created). */
export function matchGeometries(wanted: readonly GeometryFields[], stored: readonly GeometryRecord[]): (string | null)[] {
  return wanted.map((w) => stored.find((s) => sameGeometry(w, s))?.id ?? null);
}

/** "incidence 37.0°, heading 190.0° true, right-looking, C band (5.55 cm), ascending, GLINT-A". */
export function describeGeometry(g: Pick<GeometryFields, 'incidenceDeg' | 'headingDeg' | 'look' | 'band' | 'wavelengthM' | 'direction' | 'satellite'>): string {
  const parts = [
    `incidence ${fmtNum(g.incidenceDeg, 1)}°`,
    `heading ${fmtNum(g.headingDeg, 1)}° true`,
    `${g.look}-looking`,
    `${g.band} band (${fmtNum(g.wavelengthM * 100, 2)} cm)`,
  ];
  if (g.direction) parts.push(g.direction);
  if (g.satellite) parts.push(g.satellite);
  return parts.join(', ');
}
