/**
 * The workflow the crew is in: the site, the pass geometries being served, the reflector, the target aim,
 * and the last alignment capture. Plain data only (numbers carry their unit in the name).
 */
import type { LookSide } from '../../core/geometry/pointing.ts';
import type { TrihedralShapeName } from '../../core/radar/shapes.ts';
import { createStore } from './store.ts';

export interface GeometryInput {
  /** Raw text as typed, so an invalid field keeps what the crew typed. */
  incidenceDeg: string;
  headingDeg: string;
  look: LookSide;
  /** Exact azimuth site → satellite from a pass search (degrees true); dropped as soon as the crew edits the row. */
  losAzimuthDeg?: number;
  /** Where it came from: typed, or a track of a satellite's passes. */
  label?: string;
  direction?: 'ascending' | 'descending';
  source: 'typed' | 'orbital-elements' | 'circular-approximation';
  satellite?: string;
  elementsEpochMs?: number;
}

export interface SiteInput {
  id?: string;
  code?: string;
  name?: string;
  latDeg: number;
  lonDeg: number;
  /** For geometry; when the logbook site's ellipsoidal height is unknown this is its best stand-in (see siteHeightForGeometryM). */
  heightEllM: number;
  /** false when heightEllM stands in for an unknown or sea-level height. */
  heightKnown?: false;
  accuracyM?: number;
  source: 'gnss-phone' | 'typed' | 'logbook';
}

export interface Capture {
  azimuthDeg: number;
  tiltDeg: number;
  rollDeg: number;
  azimuthStdDeg?: number;
  tiltStdDeg?: number;
  samples: number;
  method: 'sun-shadow' | 'reference-bearing' | 'compass' | 'other-instrument';
  declinationDeg: number | null;
  declinationModel: string | null;
  atMs: number;
  predictedLossDb: number | null;
}

export interface Workflow {
  site: SiteInput | null;
  geometries: GeometryInput[];
  shape: TrihedralShapeName;
  edgeM: string;
  band: string;
  /** Target orientation from the Plan screen (null until valid). */
  target: { azimuthDeg: number; tiltDeg: number; rollDeg: number } | null;
  capture: Capture | null;
}

export const DEFAULT_WORKFLOW: Workflow = {
  site: null,
  geometries: [{ incidenceDeg: '37', headingDeg: '190', look: 'right', source: 'typed' }],
  shape: 'triangular',
  edgeM: '1.0',
  band: 'C',
  target: null,
  capture: null,
};

export const workflow = createStore<Workflow>(DEFAULT_WORKFLOW);
