/**
 * Layout of the Passes screen's two drawings, as plain numbers (testable without a DOM):
 *  - the sky plot: a polar plot seen from above (east to the right of north, as GNSS sky plots), north at the top, azimuth clockwise, elevation
 *    90° at the centre and 0° on the rim (radius ∝ zenith angle, an azimuthal equidistant view of the sky);
 *  - the reflector's −3 dB beam outline on that plot, approximated as an ellipse of angles around boresight;
 *  - the timeline: days across, ascending and descending passes on separate rows.
 */
import { reflectorAxesEnu, type ReflectorOrientation } from '../../../core/geometry/orientation.ts';
import { azElFromEnu } from '../../../core/geometry/pointing.ts';
import type { PassDirection } from '../../../core/orbit/passes.ts';
import type { Beamwidth3dB } from '../../../core/reflector/beamwidth.ts';
import { toRad } from '../../../core/units.ts';
import type { Vec3 } from '../../../core/vec3.ts';
import { parseSiteLocalMs, siteDay } from '../../siteTime.ts';
import { MS_PER_DAY } from './computePasses.ts';

export interface AzEl {
  azimuthDeg: number;
  elevationDeg: number;
}

export interface SkyFrame {
  cx: number;
  cy: number;
  /** Radius of the horizon circle, px. */
  radiusPx: number;
}

/** Point of the sky plot for a direction: r = R (90° − el)/90°, x = cx + r sin az, y = cy − r cos az. */
export function skyPoint(d: AzEl, f: SkyFrame): { x: number; y: number } {
  const r = (f.radiusPx * (90 - d.elevationDeg)) / 90;
  const a = toRad(d.azimuthDeg);
  return { x: f.cx + r * Math.sin(a), y: f.cy - r * Math.cos(a) };
}

/** Line of sight of a track: toward the satellite at elevation 90° − incidence. */
export const trackDirection = (t: { reflectorAzimuthDeg: number; incidenceDeg: number }): AzEl => ({
  azimuthDeg: t.reflectorAzimuthDeg,
  elevationDeg: 90 - t.incidenceDeg,
});

/** Boresight direction of the reflector (for roll 0: azimuth = the bisector's, elevation = tilt + 35.26°). */
export function boresightDirection(o: ReflectorOrientation): AzEl {
  return azElFromEnu(reflectorAxesEnu(o).boresight);
}

const S13 = Math.sqrt(1 / 3), S23 = Math.sqrt(2 / 3);
/** Body frame (right, forward, up): boresight, and the unit tangents toward the vertical edge and to the right. */
const B: Vec3 = [0, S23, S13];
const T_UP: Vec3 = [0, -S13, S23];
const T_RIGHT: Vec3 = [1, 0, 0];

/**
 * Approximate −3 dB outline: directions at angle θ(φ) from boresight, φ measured around it from the vertical-edge
 * side toward the right, with θ on an ellipse whose semi-axes are the derived cut half-widths
 *   θ(φ) = 1 / √((cos φ / a)² + (sin φ / c)²),  a = above or below half-width by the sign of cos φ, c = azimuth half-width.
 * Exact on the two cuts (φ = 0°, 90°, 180°, 270°); between them it is an interpolation, so label it approximate.
 */
export function beamOutline(o: ReflectorOrientation, bw: Beamwidth3dB, points = 72): AzEl[] {
  const ax = reflectorAxesEnu(o);
  const c = bw.azimuthFullDeg / 2;
  const out: AzEl[] = [];
  for (let i = 0; i < points; i++) {
    const phi = (2 * Math.PI * i) / points;
    const a = Math.cos(phi) >= 0 ? bw.elevationAboveDeg : bw.elevationBelowDeg;
    const theta = 1 / Math.hypot(Math.cos(phi) / toRad(a), Math.sin(phi) / toRad(c));
    const k = Math.sin(theta);
    const body = (j: number) => Math.cos(theta) * B[j] + k * (Math.cos(phi) * T_UP[j] + Math.sin(phi) * T_RIGHT[j]);
    const [bx, by, bz] = [body(0), body(1), body(2)];
    const enu = (j: number) => bx * ax.right[j] + by * ax.forward[j] + bz * ax.up[j];
    out.push(azElFromEnu([enu(0), enu(1), enu(2)]));
  }
  return out;
}

export interface TimelineInput {
  timeMs: number;
  direction: PassDirection;
  satellite: string;
  incidenceDeg: number;
}

export interface TimelineMark extends TimelineInput {
  x: number;
  y: number;
  /** Triangle pointing up (ascending, moving north) or down (descending), plus a letter: never colour alone. */
  shape: 'up' | 'down';
  letter: 'A' | 'D';
}

export interface TimelineTick {
  x: number;
  /** "3 Dec" at labelled ticks, "" otherwise. */
  label: string;
}

export interface TimelineLayout {
  width: number;
  height: number;
  plotLeft: number;
  plotRight: number;
  rows: { direction: PassDirection; y: number; label: string }[];
  ticks: TimelineTick[];
  marks: TimelineMark[];
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** Room one "30 Dec" label needs at 11 px type, px: labels are at least this far apart so they never collide. */
export const TIMELINE_LABEL_PX = 46;
/** Rows (ascending, descending) and the day axis, px from the top of a 120 px high drawing. */
export const TIMELINE_ROWS_Y = [28, 62] as const;
export const TIMELINE_AXIS_Y = 90;

/**
 * Timeline of passes in [startMs, startMs + days): x proportional to time, one row per direction, a tick at each
 * UTC midnight and a label ("3 Dec", UTC) on every n-th tick, n chosen so labels are TIMELINE_LABEL_PX apart or more.
 * Passes outside the window are left out.
 */
export function timelineLayout(passes: readonly TimelineInput[], startMs: number, days: number, size = { width: 360, height: 120 }, zone: string | null = null): TimelineLayout {
  const plotLeft = 96, plotRight = size.width - 10;
  const endMs = startMs + days * MS_PER_DAY;
  const x = (t: number) => plotLeft + ((t - startMs) / (endMs - startMs)) * (plotRight - plotLeft);
  const rows = [
    { direction: 'ascending' as const, y: TIMELINE_ROWS_Y[0], label: 'Ascending ▲' },
    { direction: 'descending' as const, y: TIMELINE_ROWS_Y[1], label: 'Descending ▼' },
  ];
  const pxPerDay = (plotRight - plotLeft) / days;
  const every = Math.max(1, Math.ceil(TIMELINE_LABEL_PX / pxPerDay));
  const ticks: TimelineTick[] = [];
  if (zone) {
    // Midnights of the site's own days (a day may be 23 or 25 hours long across a clock change).
    const [y, m, d] = siteDay(startMs, zone).split('-').map(Number);
    for (let i = 0, n = 0; i <= days + 1; i++) {
      const day = new Date(Date.UTC(y, m - 1, d + i));
      const t = parseSiteLocalMs(day.toISOString().slice(0, 10) + 'T00:00', zone);
      if (t < startMs || t > endMs) continue;
      ticks.push({ x: x(t), label: n++ % every === 0 ? `${day.getUTCDate()} ${MONTHS[day.getUTCMonth()]}` : '' });
    }
  } else {
    const firstMidnight = Math.ceil(startMs / MS_PER_DAY) * MS_PER_DAY;
    for (let t = firstMidnight, i = 0; t <= endMs; t += MS_PER_DAY, i++) {
      const dd = new Date(t);
      ticks.push({ x: x(t), label: i % every === 0 ? `${dd.getUTCDate()} ${MONTHS[dd.getUTCMonth()]}` : '' });
    }
  }
  const marks: TimelineMark[] = passes
    .filter((p) => p.timeMs >= startMs && p.timeMs < endMs)
    .map((p) => ({
      ...p,
      x: x(p.timeMs),
      y: rows[p.direction === 'ascending' ? 0 : 1].y,
      shape: p.direction === 'ascending' ? 'up' : 'down',
      letter: p.direction === 'ascending' ? 'A' : 'D',
    }));
  return { width: size.width, height: size.height, plotLeft, plotRight, rows, ticks, marks };
}

/** The "now" mark's text anchor, so that its label stays inside the plot near either end. */
export function nowAnchor(x: number, plotLeft: number, plotRight: number, halfWidthPx = 12): 'start' | 'middle' | 'end' {
  if (x - halfWidthPx < plotLeft) return 'start';
  if (x + halfWidthPx > plotRight) return 'end';
  return 'middle';
}

export interface LabelBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

const overlaps = (a: LabelBox, b: LabelBox) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/**
 * Places a label of size w × h by each point so that no two labels overlap and no label covers a mark (a square of
 * half-size markPx): the first free spot among 8 directions at growing distances. Returns each label's box
 * (top-left corner); a label that finds no free spot within the tries goes furthest out, below the rest.
 */
export function placeLabels(points: readonly { x: number; y: number }[], w: number, h: number, markPx: number): LabelBox[] {
  const marks = points.map((p) => ({ x: p.x - markPx, y: p.y - markPx, w: 2 * markPx, h: 2 * markPx }));
  const placed: LabelBox[] = [];
  const dirs = [0, 1, 2, 3, 4, 5, 6, 7].map((k) => [Math.cos((k * Math.PI) / 4), Math.sin((k * Math.PI) / 4)]);
  points.forEach((p) => {
    let box: LabelBox | null = null;
    for (let ring = 1; ring <= 6 && !box; ring++) {
      const r = markPx + 2 + (ring - 1) * h;
      for (const [dx, dy] of dirs) {
        const cx = p.x + dx * (r + w / 2), cy = p.y + dy * (r + h / 2);
        const b = { x: cx - w / 2, y: cy - h / 2, w, h };
        if (!placed.some((o) => overlaps(o, b)) && !marks.some((m) => overlaps(m, b))) {
          box = b;
          break;
        }
      }
    }
    if (!box) {
      const lowest = placed.reduce((m, o) => Math.max(m, o.y + o.h), p.y);
      box = { x: p.x - w / 2, y: lowest + 1, w, h };
    }
    placed.push(box);
  });
  return placed;
}

/** SVG points of a triangle of half-size `s` centred on (x, y), pointing up or down. */
export function trianglePoints(x: number, y: number, s: number, shape: 'up' | 'down'): string {
  const k = shape === 'up' ? 1 : -1;
  return `${x},${y - k * s} ${x - s},${y + k * s} ${x + s},${y + k * s}`;
}
