/**
 * Brent's bracketing root finder: inverse quadratic interpolation and secant steps, falling back to bisection,
 * so it never leaves the bracket and converges at least as fast as bisection.
 * Source: R. P. Brent, "Algorithms for Minimization without Derivatives", Prentice-Hall 1973, ch. 4
 *   (procedure zero); the layout follows Press et al., "Numerical Recipes", 3rd ed., 2007, §9.3.
 * Validity: f continuous on [a, b] with f(a)·f(b) ≤ 0. Stops when the bracket is narrower than 2·tol.
 */

export interface RootResult {
  x: number;
  fx: number;
  evaluations: number;
}

/**
 * A root of `f` in [a, b], to within `tol` (same units as x). `fa`, `fb` are f(a), f(b) when the caller already
 * has them (they are not re-evaluated). Throws RangeError when the signs do not bracket a root.
 */
export function brentRoot(f: (x: number) => number, a: number, b: number, tol: number, fa = f(a), fb = f(b), maxIter = 100): RootResult {
  if (!(tol > 0)) throw new RangeError(`tol must be greater than 0, got ${tol}`);
  if (fa * fb > 0) throw new RangeError(`f(${a}) = ${fa} and f(${b}) = ${fb} do not bracket a root`);
  let evaluations = 0;
  if (fa === 0) return { x: a, fx: fa, evaluations };
  if (fb === 0) return { x: b, fx: fb, evaluations };
  let c = b, fc = fb, d = b - a, e = d;
  for (let iter = 0; iter < maxIter; iter++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a; fc = fa; d = b - a; e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return { x: b, fx: fb, evaluations };
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number, q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qa = fa / fc, r = fb / fc;
        p = s * (2 * xm * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      if (2 * p < Math.min(3 * xm * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d; d = p / q;
      } else {
        d = xm; e = d;
      }
    } else {
      d = xm; e = d;
    }
    a = b; fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
    evaluations += 1;
  }
  return { x: b, fx: fb, evaluations };
}
