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
  /**
   * The logbook reflector whose shape and edge the Plan screen uses, for the site it was picked on (so it is picked
   * once per site, and a typed shape or edge is not overwritten). id null: shape and edge typed by the crew.
   */
  planReflector?: { siteId: string; id: string | null; label: string | null };
  /** Target orientation from the Plan screen (null until valid). */
  target: { azimuthDeg: number; tiltDeg: number; rollDeg: number } | null;
  capture: Capture | null;
}

export const DEFAULT_WORKFLOW: Workflow = {
  site: null,
  // An empty row: a new phone has no aim until the crew chooses a site's pass or types a geometry (no example values).
  geometries: [{ incidenceDeg: '', headingDeg: '', look: 'right', source: 'typed' }],
  shape: 'triangular',
  edgeM: '1.0',
  band: 'C',
  target: null,
  capture: null,
};

export const workflow = createStore<Workflow>(DEFAULT_WORKFLOW);

/**
 * Older versions started the Plan screen with an example geometry (incidence 37°, heading 190°, right-looking) that
 * looked like a real plan. A saved task still holding that untouched example has it replaced by an empty row.
 */
export function isLegacyExample(g: GeometryInput): boolean {
  return g.source === 'typed' && g.label === undefined && g.incidenceDeg === '37' && g.headingDeg === '190' && g.look === 'right';
}
