/**
 * Convex polygons in a plane: the area of the intersection of two convex polygons.
 * Clipping: Sutherland & Hodgman, "Reentrant Polygon Clipping", Communications of the ACM 17(1):32–42, 1974
 * (the subject is clipped by each edge of the convex clip polygon in turn); area by the shoelace formula
 * A = ½ Σ (xᵢ yᵢ₊₁ − xᵢ₊₁ yᵢ). Validity: the clip polygon convex; the subject any simple polygon (here convex).
 * Polygons travel as flat coordinate arrays [x₀, y₀, x₁, y₁, …] so the pattern's hot loop allocates nothing.
 */
export type Point2 = readonly [number, number];

/** Signed area of the first n vertices of a flat coordinate array, positive for anticlockwise order. */
export function signedAreaFlat(p: ArrayLike<number>, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    s += p[2 * i] * p[2 * j + 1] - p[2 * j] * p[2 * i + 1];
  }
  return s / 2;
}

let bufA = new Float64Array(64);
let bufB = new Float64Array(64);

/**
 * Area of subject ∩ clip for two anticlockwise polygons given as flat arrays with ns and nc vertices.
 * Uses module scratch buffers (single-threaded, not re-entered), so it does not allocate after warm-up.
 */
export function convexOverlapAreaFlat(subject: ArrayLike<number>, ns: number, clip: ArrayLike<number>, nc: number): number {
  const cap = 2 * (ns + nc + 1);
  if (bufA.length < cap) {
    bufA = new Float64Array(cap);
    bufB = new Float64Array(cap);
  }
  let src = bufA, dst = bufB;
  for (let i = 0; i < 2 * ns; i++) src[i] = subject[i];
  let n = ns;
  for (let e = 0; e < nc && n > 0; e++) {
    const ax = clip[2 * e], ay = clip[2 * e + 1];
    const f = e + 1 === nc ? 0 : e + 1;
    const ex = clip[2 * f] - ax, ey = clip[2 * f + 1] - ay;
    let m = 0;
    for (let j = 0; j < n; j++) {
      const k = j + 1 === n ? 0 : j + 1;
      const px = src[2 * j], py = src[2 * j + 1], qx = src[2 * k], qy = src[2 * k + 1];
      // side ≥ 0: on or left of the directed clip edge, i.e. inside an anticlockwise polygon.
      const sp = ex * (py - ay) - ey * (px - ax);
      const sq = ex * (qy - ay) - ey * (qx - ax);
      if (sp >= 0) {
        dst[2 * m] = px;
        dst[2 * m + 1] = py;
        m++;
      }
      if (sp >= 0 !== sq >= 0) {
        const t = sp / (sp - sq);
        dst[2 * m] = px + t * (qx - px);
        dst[2 * m + 1] = py + t * (qy - py);
        m++;
      }
    }
    const tmp = src;
    src = dst;
    dst = tmp;
    n = m;
  }
  return n < 3 ? 0 : Math.abs(signedAreaFlat(src, n));
}

/** Area of the intersection of two convex polygons given as point lists in either vertex order. */
export function convexOverlapArea(a: readonly Point2[], b: readonly Point2[]): number {
  const flat = (p: readonly Point2[]) => {
    const out = p.flat();
    if (signedAreaFlat(out, p.length) >= 0) return out;
    return p.slice().reverse().flat();
  };
  return convexOverlapAreaFlat(flat(a), a.length, flat(b), b.length);
}
