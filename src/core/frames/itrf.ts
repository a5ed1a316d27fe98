/**
 * ITRF realisations 2000, 2005, 2008, 2014 and 2020 and the published transformations between them.
 *
 * Parameters, position-vector convention (see helmert.ts), in the tables' units (mm, ppb, mas; per year):
 * - ITRF2020 → ITRF2014/2008/2005/2000 at epoch 2015.0: IERS ITRF Centre (IGN), "Transformation parameters from
 *   ITRF2020 to past ITRFs" (Transfo-ITRF2020_TRFs.txt, 2022), published with Altamimi, Rebischung, Collilieux,
 *   Métivier & Chanard, "ITRF2020: an augmented reference frame refining the modeling of nonlinear station
 *   motions", J. Geodesy 97:47, 2023. Cross-checked value for value against PROJ's data file `ITRF2020`
 *   (PROJ 9.x, generated from the EPSG database).
 * - ITRF2014 → ITRF2008/2005/2000 at epoch 2010.0: IERS ITRF Centre (IGN), Transfo-ITRF2014_ITRFs.txt, published
 *   with Altamimi et al., J. Geophys. Res. Solid Earth 121:6109–6131, 2016, Table 4. Cross-checked value for value
 *   against PROJ's data file `ITRF2014` (Debian proj-data 9.1.1, /usr/share/proj/ITRF2014).
 * All rotations and rotation rates of these rows are zero in both tables.
 *
 * Path: a pair that one table gives directly (either side ITRF2020, else either side ITRF2014) uses that row,
 * forward or inverted; any other pair (2008↔2005, 2008↔2000, 2005↔2000) goes through ITRF2020:
 * source → ITRF2020 → target, both legs from the ITRF2020 table. The transformation is evaluated at the
 * coordinates' own epoch (the frames move relative to each other); it does not change the epoch.
 */
import { requireFinite, requireOneOf } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';
import { applyHelmert7, helmertAtEpoch, invertHelmert7, type Helmert14 } from './helmert.ts';

export const ITRF_FRAMES = ['ITRF2000', 'ITRF2005', 'ITRF2008', 'ITRF2014', 'ITRF2020'] as const;
export type ItrfFrame = (typeof ITRF_FRAMES)[number];

const row = (t: Vec3, d: number, tRate: Vec3, dRate: number, epochYear: number): Helmert14 => ({
  tMm: t,
  dPpb: d,
  rMas: [0, 0, 0],
  tRateMmPerYr: tRate,
  dRatePpbPerYr: dRate,
  rRateMasPerYr: [0, 0, 0],
  epochYear,
});

/** ITRF2020 → past ITRFs, epoch 2015.0 (IGN Transfo-ITRF2020_TRFs.txt; Altamimi et al. 2023). */
export const FROM_ITRF2020: Readonly<Record<Exclude<ItrfFrame, 'ITRF2020'>, Helmert14>> = {
  ITRF2014: row([-1.4, -0.9, 1.4], -0.42, [0.0, -0.1, 0.2], 0.0, 2015.0),
  ITRF2008: row([0.2, 1.0, 3.3], -0.29, [0.0, -0.1, 0.1], 0.03, 2015.0),
  ITRF2005: row([2.7, 0.1, -1.4], 0.65, [0.3, -0.1, 0.1], 0.03, 2015.0),
  ITRF2000: row([-0.2, 0.8, -34.2], 2.25, [0.1, 0.0, -1.7], 0.11, 2015.0),
};

/** ITRF2014 → ITRF2008/2005/2000, epoch 2010.0 (IGN Transfo-ITRF2014_ITRFs.txt; Altamimi et al. 2016, Table 4). */
export const FROM_ITRF2014: Readonly<Record<'ITRF2008' | 'ITRF2005' | 'ITRF2000', Helmert14>> = {
  ITRF2008: row([1.6, 1.9, 2.4], -0.02, [0.0, 0.0, -0.1], 0.03, 2010.0),
  ITRF2005: row([2.6, 1.0, -2.3], 0.92, [0.3, 0.0, -0.1], 0.03, 2010.0),
  ITRF2000: row([0.7, 1.2, -26.1], 2.12, [0.1, 0.1, -1.9], 0.11, 2010.0),
};

/** One applied leg: which published row, in which direction. */
export interface TransformLeg {
  from: ItrfFrame;
  to: ItrfFrame;
  /** "ITRF2020 table" or "ITRF2014 table". */
  table: 'ITRF2020 table' | 'ITRF2014 table';
  inverted: boolean;
}

function directLeg(from: ItrfFrame, to: ItrfFrame): { leg: TransformLeg; params: Helmert14 } | null {
  if (from === 'ITRF2020' && to !== 'ITRF2020') return { leg: { from, to, table: 'ITRF2020 table', inverted: false }, params: FROM_ITRF2020[to] };
  if (to === 'ITRF2020' && from !== 'ITRF2020') return { leg: { from, to, table: 'ITRF2020 table', inverted: true }, params: FROM_ITRF2020[from] };
  if (from === 'ITRF2014' && (to === 'ITRF2008' || to === 'ITRF2005' || to === 'ITRF2000'))
    return { leg: { from, to, table: 'ITRF2014 table', inverted: false }, params: FROM_ITRF2014[to] };
  if (to === 'ITRF2014' && (from === 'ITRF2008' || from === 'ITRF2005' || from === 'ITRF2000'))
    return { leg: { from, to, table: 'ITRF2014 table', inverted: true }, params: FROM_ITRF2014[from] };
  return null;
}

export interface ItrfTransformResult {
  xyzM: Vec3;
  legs: TransformLeg[];
}

/** Validate a frame name (case-insensitive, "ITRF14"-style short names accepted). */
export function parseItrfFrame(name: string, value: string): ItrfFrame {
  const v = value.trim().toUpperCase();
  const short = /^ITRF(\d\d)$/.exec(v);
  const full = short ? `ITRF20${short[1]}` : v;
  return requireOneOf(name, full, ITRF_FRAMES);
}

/** Transform Earth-centred coordinates (m) from one ITRF realisation to another at the coordinates' epoch. */
export function transformItrf(xyzM: Vec3, from: ItrfFrame, to: ItrfFrame, epochYear: number): ItrfTransformResult {
  xyzM.forEach((v, i) => requireFinite(`xyz[${i}]`, v));
  requireOneOf('from frame', from, ITRF_FRAMES);
  requireOneOf('to frame', to, ITRF_FRAMES);
  requireFinite('epoch', epochYear);
  if (from === to) return { xyzM: [...xyzM] as unknown as Vec3, legs: [] };
  const path: [ItrfFrame, ItrfFrame][] = directLeg(from, to) ? [[from, to]] : [[from, 'ITRF2020'], ['ITRF2020', to]];
  let x = xyzM;
  const legs: TransformLeg[] = [];
  for (const [a, b] of path) {
    const d = directLeg(a, b);
    if (!d) throw new Error(`no published transformation ${a} → ${b}`);
    const h = helmertAtEpoch(d.params, epochYear);
    x = d.leg.inverted ? invertHelmert7(h, x) : applyHelmert7(h, x);
    legs.push(d.leg);
  }
  return { xyzM: x, legs };
}
