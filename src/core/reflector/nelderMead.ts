/**
 * Derivative-free minimisation by the Nelder–Mead simplex method, deterministic (no random restarts).
 * Source: Nelder & Mead, "A Simplex Method for Function Minimization", The Computer Journal 7(4):308–313, 1965,
 * with the standard coefficients reflection 1, expansion 2, contraction ½, shrink ½ (Lagarias, Reeds, Wright &
 * Wright, "Convergence Properties of the Nelder–Mead Simplex Method in Low Dimensions", SIAM J. Optim. 9(1):112–147,
 * 1998, §2). Validity: finds a local minimum; callers restart it from several points for non-smooth objectives.
 */

export interface NelderMeadOptions {
  /** Stop when every vertex is within this distance of the best in every coordinate. */
  xTol: number;
  /** Stop when the objective spread over the simplex is below this. */
  fTol: number;
  maxEvaluations: number;
}

export interface Minimum {
  x: number[];
  fx: number;
  evaluations: number;
}

/** Minimise `f` from `x0`, with an initial simplex of one step per coordinate (`steps[i]` along axis i). */
export function nelderMead(
  f: (x: readonly number[]) => number,
  x0: readonly number[],
  steps: readonly number[],
  opts: NelderMeadOptions,
): Minimum {
  const n = x0.length;
  const pts: number[][] = [x0.slice()];
  for (let i = 0; i < n; i++) {
    const p = x0.slice();
    p[i] += steps[i];
    pts.push(p);
  }
  const vals = pts.map((p) => f(p));
  let evaluations = vals.length;
  const order = Array.from({ length: n + 1 }, (_, i) => i);
  const combine = (a: readonly number[], b: readonly number[], t: number) => a.map((ai, i) => ai + t * (b[i] - ai));

  while (evaluations < opts.maxEvaluations) {
    // Stable sort keeps ties in index order, so the run is reproducible.
    order.sort((i, j) => vals[i] - vals[j] || i - j);
    const best = order[0], worst = order[n], second = order[n - 1];
    const spreadF = vals[worst] - vals[best];
    let spreadX = 0;
    for (const k of order) for (let i = 0; i < n; i++) spreadX = Math.max(spreadX, Math.abs(pts[k][i] - pts[best][i]));
    if (spreadX <= opts.xTol || spreadF <= opts.fTol) break;

    const centroid = new Array<number>(n).fill(0);
    for (const k of order.slice(0, n)) for (let i = 0; i < n; i++) centroid[i] += pts[k][i] / n;
    const reflected = combine(centroid, pts[worst], -1);
    const fr = f(reflected);
    evaluations++;
    if (fr < vals[best]) {
      const expanded = combine(centroid, pts[worst], -2);
      const fe = f(expanded);
      evaluations++;
      if (fe < fr) [pts[worst], vals[worst]] = [expanded, fe];
      else [pts[worst], vals[worst]] = [reflected, fr];
      continue;
    }
    if (fr < vals[second]) {
      [pts[worst], vals[worst]] = [reflected, fr];
      continue;
    }
    // Contract toward the better of the worst point and its reflection.
    const outside = fr < vals[worst];
    const contracted = combine(centroid, outside ? reflected : pts[worst], 0.5);
    const fc = f(contracted);
    evaluations++;
    if (fc < (outside ? fr : vals[worst])) {
      [pts[worst], vals[worst]] = [contracted, fc];
      continue;
    }
    for (const k of order.slice(1)) {
      pts[k] = combine(pts[best], pts[k], 0.5);
      vals[k] = f(pts[k]);
      evaluations++;
    }
  }
  let bi = 0;
  for (let k = 1; k <= n; k++) if (vals[k] < vals[bi]) bi = k;
  return { x: pts[bi], fx: vals[bi], evaluations };
}
