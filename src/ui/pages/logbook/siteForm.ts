/**
 * The "New site" / "Edit site" form: typed text → SiteFields for siteRepo, checked field by field in place.
 * Also the hand-overs between a site record and the workflow (the site the other tabs work on). Pure.
 */
import { siteHeightForGeometryM, type PositionSource, type SiteFields, type SiteRecord } from '../../../data/index.ts';
import type { Fix } from '../../../sensors/index.ts';
import type { SiteInput } from '../../state/workflow.ts';
import { hasErrors, line, note, num, optNum, RANGES, wrapLonDeg, type FieldErrors } from './parse.ts';

/**
 * What the height field holds: metres above the WGS84 ellipsoid, metres above mean sea level (what some phones
 * report; kept as such, never converted), or nothing yet (unknown, to be surveyed).
 */
export type HeightRef = 'ellipsoidal' | 'sea-level' | 'unknown';

export interface SiteForm {
  code: string;
  name: string;
  latDeg: string;
  lonDeg: string;
  /** The height typed or taken from the fix, in the reference `heightRef` names (the field keeps its old name). */
  heightEllM: string;
  heightRef: HeightRef;
  /** Horizontal accuracy, m; empty = unknown. */
  accuracyM: string;
  positionSource: Exclude<PositionSource, 'imported'> | 'imported';
  referenceFrame: string;
  /** Decimal year; empty = none. */
  frameEpoch: string;
  notes: string;
}

export const DEFAULT_FRAME = 'WGS84';

export const EMPTY_SITE_FORM: SiteForm = {
  code: '',
  name: '',
  latDeg: '',
  lonDeg: '',
  heightEllM: '',
  heightRef: 'ellipsoidal',
  accuracyM: '',
  positionSource: 'typed',
  referenceFrame: DEFAULT_FRAME,
  frameEpoch: '',
  notes: '',
};

export interface ParsedSite {
  fields: SiteFields | null;
  errors: FieldErrors<keyof SiteForm>;
}

const HEIGHT_LABEL: Record<HeightRef, string> = { ellipsoidal: 'Ellipsoidal height', 'sea-level': 'Height above sea level', unknown: 'Height' };
export const heightLabel = (r: HeightRef): string => HEIGHT_LABEL[r];

/** The height for its reference; an unknown height needs nothing, an empty known one says what to do instead. */
function parseHeight(f: SiteForm): { value?: number | null; error?: string } {
  if (f.heightRef === 'unknown') return { value: null };
  if (f.heightEllM.trim() === '') return { error: `${HEIGHT_LABEL[f.heightRef]} is empty: type it, or choose “Unknown, to be surveyed”` };
  return num(HEIGHT_LABEL[f.heightRef], f.heightEllM, RANGES.heightEllM);
}

/** Check every field; `fields` only when all are fine. New sites are never demo records. */
export function parseSiteForm(f: SiteForm, demo = false): ParsedSite {
  const code = line('Site code', f.code, { min: 1, max: 32 });
  const name = line('Site name', f.name, { max: 200 });
  const lat = num('Latitude', f.latDeg, RANGES.latDeg);
  const lon = num('Longitude', f.lonDeg, RANGES.lonDeg);
  const h = parseHeight(f);
  const acc = optNum('Position accuracy', f.accuracyM, RANGES.accuracyM);
  const frame = line('Reference frame', f.referenceFrame, { min: 1, max: 40 });
  const epoch = optNum('Frame epoch', f.frameEpoch, RANGES.frameEpoch);
  const notes = note('Notes', f.notes);
  const errors: ParsedSite['errors'] = {
    code: code.error,
    name: name.error,
    latDeg: lat.error,
    lonDeg: lon.error,
    heightEllM: h.error,
    accuracyM: acc.error,
    referenceFrame: frame.error,
    frameEpoch: epoch.error,
    notes: notes.error,
  };
  if (hasErrors(errors)) return { fields: null, errors };
  return {
    errors: {},
    fields: {
      code: code.value!,
      name: name.value!,
      latDeg: lat.value!,
      lonDeg: wrapLonDeg(lon.value!),
      heightEllM: f.heightRef === 'ellipsoidal' ? h.value! : null,
      ...(f.heightRef === 'sea-level' ? { heightMslM: h.value! } : {}),
      positionSource: f.positionSource,
      positionAccuracyM: acc.value ?? null,
      referenceFrame: frame.value!,
      frameEpoch: epoch.value ?? null,
      notes: notes.value!,
      demo,
    },
  };
}

/** Apply a typed change; typing coordinates over a phone fix makes the position 'typed'. */
export function editSiteForm(f: SiteForm, patch: Partial<SiteForm>): SiteForm {
  const next = { ...f, ...patch };
  const coordsTyped = patch.latDeg !== undefined || patch.lonDeg !== undefined;
  if (coordsTyped && f.positionSource === 'gnss-phone' && patch.positionSource === undefined) next.positionSource = 'typed';
  return next;
}

/**
 * Fill the position from a phone fix. The height follows what the platform reports: ellipsoidal (W3C, Android), or
 * above sea level (iOS), kept as that; with no altitude at all a typed height stays, else the height is unknown.
 */
export function siteFormWithFix(f: SiteForm, fix: Fix): SiteForm {
  const msl = fix.heightMslM ?? null;
  const height: Pick<SiteForm, 'heightEllM' | 'heightRef'> =
    fix.heightEllM !== null
      ? { heightEllM: fix.heightEllM.toFixed(2), heightRef: 'ellipsoidal' }
      : msl !== null
        ? { heightEllM: msl.toFixed(2), heightRef: 'sea-level' }
        : f.heightEllM.trim() !== '' && f.heightRef !== 'unknown'
          ? { heightEllM: f.heightEllM, heightRef: f.heightRef }
          : { heightEllM: '', heightRef: 'unknown' };
  return {
    ...f,
    latDeg: fix.latDeg.toFixed(7),
    lonDeg: fix.lonDeg.toFixed(7),
    ...height,
    accuracyM: fix.horizontalAccuracyM.toFixed(1),
    positionSource: 'gnss-phone',
    referenceFrame: f.referenceFrame.trim() === '' ? DEFAULT_FRAME : f.referenceFrame,
  };
}

function heightOfRecord(r: SiteRecord): Pick<SiteForm, 'heightEllM' | 'heightRef'> {
  if (r.heightEllM !== null) return { heightEllM: String(r.heightEllM), heightRef: 'ellipsoidal' };
  if (r.heightMslM !== undefined && r.heightMslM !== null) return { heightEllM: String(r.heightMslM), heightRef: 'sea-level' };
  return { heightEllM: '', heightRef: 'unknown' };
}

export function siteFormFromRecord(r: SiteRecord): SiteForm {
  return {
    code: r.code,
    name: r.name,
    latDeg: String(r.latDeg),
    lonDeg: String(r.lonDeg),
    ...heightOfRecord(r),
    accuracyM: r.positionAccuracyM === null ? '' : String(r.positionAccuracyM),
    positionSource: r.positionSource,
    referenceFrame: r.referenceFrame,
    frameEpoch: r.frameEpoch === null ? '' : String(r.frameEpoch),
    notes: r.notes,
  };
}

/** A new-site form from the site the other tabs worked on (typed or phone GNSS on the Passes screen). */
export function siteFormFromWorkflow(s: SiteInput): SiteForm {
  return {
    ...EMPTY_SITE_FORM,
    code: s.code ?? '',
    name: s.name ?? '',
    latDeg: String(s.latDeg),
    lonDeg: String(s.lonDeg),
    heightEllM: String(s.heightEllM),
    accuracyM: s.accuracyM === undefined ? '' : String(s.accuracyM),
    positionSource: s.source === 'gnss-phone' ? 'gnss-phone' : 'typed',
  };
}

/** The workflow's site for a logbook record ("Use this site"). */
export function siteInputFromRecord(r: SiteRecord): SiteInput {
  return {
    id: r.id,
    code: r.code,
    name: r.name,
    latDeg: r.latDeg,
    lonDeg: r.lonDeg,
    heightEllM: siteHeightForGeometryM(r),
    ...(r.heightEllM === null ? { heightKnown: false } : {}),
    ...(r.positionAccuracyM !== null ? { accuracyM: r.positionAccuracyM } : {}),
    source: 'logbook',
  };
}

/** The patch for a site edit: changedFields, plus clearing a sea-level height the form no longer holds. */
export function sitePatch(before: SiteFields, after: SiteFields): Partial<SiteFields> {
  const patch = changedFields(before, after);
  if (before.heightMslM != null && after.heightMslM === undefined) patch.heightMslM = null;
  return patch;
}

/** Only the fields that differ (an unchanged form writes no revision). */
export function changedFields<T extends object>(before: T, after: T): Partial<T> {
  const patch: Partial<T> = {};
  for (const k of Object.keys(after) as (keyof T)[]) {
    if (JSON.stringify(before[k]) !== JSON.stringify(after[k])) patch[k] = after[k];
  }
  return patch;
}

/** The workflow site's logbook record: by id, else by code (case-insensitive); null when it is not in the logbook. */
export function findWorkflowSite<S extends { id: string; code: string }>(sites: readonly S[], s: SiteInput | null): S | null {
  if (!s) return null;
  if (s.id) {
    const byId = sites.find((x) => x.id === s.id);
    if (byId) return byId;
  }
  const code = s.code?.trim().toLowerCase();
  if (!code) return null;
  return sites.find((x) => x.code.toLowerCase() === code) ?? null;
}

const META = ['id', 'rev', 'createdAtMs', 'updatedAtMs', 'deletedAtMs'] as const;

/** A stored record's editable fields (RecordMeta left out), to diff against a parsed form. */
export function withoutMeta<T extends { id: string }>(r: T): Omit<T, (typeof META)[number]> {
  const copy: Record<string, unknown> = { ...r };
  for (const k of META) delete copy[k];
  return copy as Omit<T, (typeof META)[number]>;
}
