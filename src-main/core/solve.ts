// Bracketed root finding by Brent's method (inverse quadratic interpolation with a bisection
// fallback), after the classic formulation (R. P. Brent, "Algorithms for Minimization without
// Derivatives", 1973). The function takes a context argument instead of being a closure so
// hot callers need not allocate.

export type RootFunction<C> = (x: number, ctx: C) => number;

const EPS = Number.EPSILON;

/**
 * A root of f in [lo, hi], to within `tol` (absolute) plus a few ulps, in at most `maxIter`
 * steps. When f does not change sign on the interval, the end with the smaller |f| is
 * returned: callers check the bracket themselves where that matters.
 */
export function findRoot<C>(f: RootFunction<C>, ctx: C, lo: number, hi: number, tol = 1e-9, maxIter = 100): number {
  let a = lo;
  let b = hi;
  let fa = f(a, ctx);
  let fb = f(b, ctx);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if ((fa > 0 && fb > 0) || (fa < 0 && fb < 0) || !(Number.isFinite(fa) && Number.isFinite(fb))) {
    return Math.abs(fa) <= Math.abs(fb) ? a : b;
  }
  let c = b;
  let fc = fb;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIter; iter++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * EPS * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm >= 0 ? tol1 : -tol1;
    fb = f(b, ctx);
  }
  return b;
}
