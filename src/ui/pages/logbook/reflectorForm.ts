/**
 * The reflector form (add/edit on the site screen and inside the installation form): typed text → ReflectorFields.
 * The apex position and the GNSS antenna offset are optional as a whole: all three boxes empty = not surveyed. Pure.
 */
import type { ReflectorFields, ReflectorRecord, ReflectorShape } from '../../../data/index.ts';
import { allBlank, groupNum, hasErrors, line, note, num, RANGES, wrapLonDeg, type FieldErrors } from './parse.ts';

export interface ReflectorForm {
  label: string;
  shape: ReflectorShape;
  edgeM: string;
  panels: 'solid' | 'mesh';
  meshOpeningMm: string;
  drainage: string;
  foundation: string;
  apexLatDeg: string;
  apexLonDeg: string;
  apexHeightEllM: string;
  apexHeightAboveMarkM: string;
  arpEastM: string;
  arpNorthM: string;
  arpUpM: string;
  notes: string;
}

export const EMPTY_REFLECTOR_FORM: ReflectorForm = {
  label: '',
  shape: 'triangular',
  edgeM: '',
  panels: 'solid',
  meshOpeningMm: '',
  drainage: '',
  foundation: '',
  apexLatDeg: '',
  apexLonDeg: '',
  apexHeightEllM: '',
  apexHeightAboveMarkM: '',
  arpEastM: '',
  arpNorthM: '',
  arpUpM: '',
  notes: '',
};

export interface ParsedReflector {
  fields: ReflectorFields | null;
  errors: FieldErrors<keyof ReflectorForm>;
}


export function parseReflectorForm(f: ReflectorForm, siteId: string): ParsedReflector {
  const label = line('Reflector label', f.label, { min: 1, max: 80 });
  const edge = num('Inner edge', f.edgeM, RANGES.edgeM);
  const mesh = groupNum(f.panels === 'mesh' && f.meshOpeningMm.trim() !== '', 'Mesh opening', f.meshOpeningMm, RANGES.meshOpeningMm);
  const drainage = note('Drainage', f.drainage, 2000);
  const foundation = note('Foundation', f.foundation, 2000);
  const aboveMark = num('Apex height above the mark', f.apexHeightAboveMarkM, RANGES.apexAboveMarkM);
  const noApex = allBlank(f.apexLatDeg, f.apexLonDeg, f.apexHeightEllM);
  const aLat = groupNum(!noApex, 'Apex latitude', f.apexLatDeg, RANGES.latDeg);
  const aLon = groupNum(!noApex, 'Apex longitude', f.apexLonDeg, RANGES.lonDeg);
  const aH = groupNum(!noApex, 'Apex ellipsoidal height', f.apexHeightEllM, RANGES.heightEllM);
  const noArp = allBlank(f.arpEastM, f.arpNorthM, f.arpUpM);
  const e = groupNum(!noArp, 'Antenna offset east', f.arpEastM, RANGES.arpOffsetM);
  const n = groupNum(!noArp, 'Antenna offset north', f.arpNorthM, RANGES.arpOffsetM);
  const u = groupNum(!noArp, 'Antenna offset up', f.arpUpM, RANGES.arpOffsetM);
  const notes = note('Notes', f.notes);
  const errors: ParsedReflector['errors'] = {
    label: label.error,
    edgeM: edge.error,
    meshOpeningMm: mesh.error,
    drainage: drainage.error,
    foundation: foundation.error,
    apexHeightAboveMarkM: aboveMark.error,
    apexLatDeg: aLat.error,
    apexLonDeg: aLon.error,
    apexHeightEllM: aH.error,
    arpEastM: e.error,
    arpNorthM: n.error,
    arpUpM: u.error,
    notes: notes.error,
  };
  if (hasErrors(errors)) return { fields: null, errors };
  return {
    errors: {},
    fields: {
      siteId,
      label: label.value!,
      shape: f.shape,
      edgeM: edge.value!,
      construction: {
        panels: f.panels,
        ...(mesh.value !== undefined ? { meshOpeningMm: mesh.value } : {}),
        drainage: drainage.value!,
        foundation: foundation.value!,
      },
      apex: noApex ? null : { latDeg: aLat.value!, lonDeg: wrapLonDeg(aLon.value!), heightEllM: aH.value! },
      apexHeightAboveMarkM: aboveMark.value!,
      gnssArpOffsetM: noArp ? null : { eastM: e.value!, northM: n.value!, upM: u.value! },
      notes: notes.value!,
      demo: false,
    },
  };
}

const s = (x: number | undefined) => (x === undefined ? '' : String(x));

export function reflectorFormFromRecord(r: ReflectorRecord): ReflectorForm {
  return {
    label: r.label,
    shape: r.shape,
    edgeM: String(r.edgeM),
    panels: r.construction.panels,
    meshOpeningMm: s(r.construction.meshOpeningMm),
    drainage: r.construction.drainage,
    foundation: r.construction.foundation,
    apexLatDeg: s(r.apex?.latDeg),
    apexLonDeg: s(r.apex?.lonDeg),
    apexHeightEllM: s(r.apex?.heightEllM),
    apexHeightAboveMarkM: String(r.apexHeightAboveMarkM),
    arpEastM: s(r.gnssArpOffsetM?.eastM),
    arpNorthM: s(r.gnssArpOffsetM?.northM),
    arpUpM: s(r.gnssArpOffsetM?.upM),
    notes: r.notes,
  };
}

/** The next free label: "A", "B", … after the site's existing ones ("R1" style labels get "R2"). */
export function nextReflectorLabel(existing: readonly string[]): string {
  const taken = new Set(existing.map((x) => x.trim().toUpperCase()));
  for (let i = 0; i < 26; i++) {
    const c = String.fromCharCode(65 + i);
    if (!taken.has(c)) return c;
  }
  let k = existing.length + 1;
  while (taken.has(`R${k}`)) k++;
  return `R${k}`;
}

/** A new reflector's form from the plan the crew worked on (shape and edge from the Plan screen). */
export function reflectorFormFromPlan(plan: { shape: string; edgeM: string }, existingLabels: readonly string[]): ReflectorForm {
  return {
    ...EMPTY_REFLECTOR_FORM,
    label: nextReflectorLabel(existingLabels),
    shape: plan.shape === 'square' ? 'square' : 'triangular',
    edgeM: plan.edgeM,
  };
}
