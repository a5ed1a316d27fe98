/**
 * Independent oracle for the physical-optics effective aperture, written for the tests and sharing no code with src/:
 * the projected aperture is the convex hull (monotone chain) of the projected panel corners, and the area of
 * its overlap with its point reflection through the projected apex is integrated numerically row by row
 * (midpoint rule over 800 horizontal rows; each row's chord of a convex polygon is exact). The code under test
 * uses a closed form (triangular) and Sutherland–Hodgman clipping (square) instead.
 * The overlap rule itself: Robertson 1947 (BSTJ 26:852–869); ../shared/REFERENCES.md §1 [derived] cross-check.
 */
import type { TrihedralShape } from '../../../src/core/reflector/trihedral.ts';

export type V3 = [number, number, number];
type P2 = [number, number];
const ROWS = 800;

// Edges in body coordinates (right, forward, up), from CONVENTIONS.md: e₁ = (f − r)/√2, e₂ = (f + r)/√2, e₃ = u.
const K = Math.SQRT1_2;
const EDGES: V3[] = [[-K, K, 0], [K, K, 0], [0, 0, 1]];
const add = (a: V3, b: V3): V3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
const dot3 = (a: V3, b: V3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

/** Corners of the panels (a = 1): triangles (0, eᵢ, eⱼ) or squares (0, eᵢ, eᵢ + eⱼ, eⱼ). */
function panelCorners(shape: TrihedralShape): V3[] {
  const pts: V3[] = [[0, 0, 0], ...EDGES];
  if (shape === 'square') pts.push(add(EDGES[0], EDGES[1]), add(EDGES[1], EDGES[2]), add(EDGES[2], EDGES[0]));
  return pts;
}

/** Monotone-chain convex hull (Andrew, Information Processing Letters 9(5):216–219, 1979), anticlockwise. */
function hull(points: P2[]): P2[] {
  const p = points.slice().sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const turn = (o: P2, a: P2, b: P2) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const half = (list: P2[]) => {
    const h: P2[] = [];
    for (const q of list) {
      while (h.length >= 2 && turn(h[h.length - 2], h[h.length - 1], q) <= 0) h.pop();
      h.push(q);
    }
    h.pop();
    return h;
  };
  return [...half(p), ...half(p.slice().reverse())];
}

/** Chord [xmin, xmax] of a convex polygon at height y, or null. */
function chord(poly: P2[], y: number): [number, number] | null {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < poly.length; i++) {
    const [x0, y0] = poly[i];
    const [x1, y1] = poly[(i + 1) % poly.length];
    if ((y0 <= y && y <= y1) || (y1 <= y && y <= y0)) {
      const x = y1 === y0 ? Math.min(x0, x1) : x0 + ((y - y0) / (y1 - y0)) * (x1 - x0);
      const xe = y1 === y0 ? Math.max(x0, x1) : x;
      lo = Math.min(lo, x);
      hi = Math.max(hi, xe);
    }
  }
  return lo <= hi ? [lo, hi] : null;
}

/** Overlap area of the projected aperture and its point reflection, per a², for body-frame unit vector k. */
export function oracleAreaRatio(shape: TrihedralShape, k: V3): number {
  // Basis of the plane normal to k by Gram–Schmidt from the body `up` or `right` axis.
  const seed: V3 = Math.abs(k[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
  const d = dot3(seed, k);
  const u0: V3 = [seed[0] - d * k[0], seed[1] - d * k[1], seed[2] - d * k[2]];
  const nu = Math.hypot(...u0);
  const u: V3 = [u0[0] / nu, u0[1] / nu, u0[2] / nu];
  const v: V3 = [k[1] * u[2] - k[2] * u[1], k[2] * u[0] - k[0] * u[2], k[0] * u[1] - k[1] * u[0]];
  const P = hull(panelCorners(shape).map((p) => [dot3(p, u), dot3(p, v)] as P2));
  const Q = P.map(([x, y]) => [-x, -y] as P2);
  const yLo = Math.max(Math.min(...P.map((p) => p[1])), Math.min(...Q.map((p) => p[1])));
  const yHi = Math.min(Math.max(...P.map((p) => p[1])), Math.max(...Q.map((p) => p[1])));
  if (!(yHi > yLo)) return 0;
  const h = (yHi - yLo) / ROWS;
  let area = 0;
  for (let j = 0; j < ROWS; j++) {
    const y = yLo + (j + 0.5) * h;
    const a = chord(P, y), b = chord(Q, y);
    if (a && b) area += Math.max(0, Math.min(a[1], b[1]) - Math.max(a[0], b[0])) * h;
  }
  return area;
}

export function bodyVector(elDeg: number, azDeg: number): V3 {
  const e = (elDeg * Math.PI) / 180, a = (azDeg * Math.PI) / 180;
  return [Math.cos(e) * Math.sin(a), Math.cos(e) * Math.cos(a), Math.sin(e)];
}

