/**
 * A bracketed root of a continuous function by Brent's method: bisection, secant and inverse
 * quadratic interpolation combined so that each step at least halves the bracket every few steps
 * (Brent, R. P. (1973) Algorithms for Minimization without Derivatives, Prentice-Hall, ch. 4,
 * procedure zero).
 */

interface RootResult {
  /** the point where the function changes sign, to within the tolerance */
  x: number;
  /** function value at x */
  fx: number;
  evaluations: number;
  /** false when the evaluation limit ended the search before the tolerance was met */
  converged: boolean;
}

/**
 * Finds x in [a, b] with f(x) = 0, given f(a) and f(b) of opposite signs (or one of them zero).
 * `tolerance` is the absolute width in x at which to stop (plus 2 eps |x|, as in Brent's zero).
 */
export function findRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  fa: number,
  fb: number,
  tolerance: number,
  maxEvaluations = 60,
): RootResult {
  if (fa === 0) return { x: a, fx: 0, evaluations: 0, converged: true };
  if (fb === 0) return { x: b, fx: 0, evaluations: 0, converged: true };
  if (Math.sign(fa) === Math.sign(fb)) throw new RangeError('findRoot: f(a) and f(b) must have opposite signs');
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  let evaluations = 0;
  for (;;) {
    if (Math.sign(fb) === Math.sign(fc)) {
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
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return { x: b, fx: fb, evaluations, converged: true };
    if (evaluations >= maxEvaluations) return { x: b, fx: fb, evaluations, converged: false };
    if (Math.abs(e) < tol || Math.abs(fa) <= Math.abs(fb)) {
      d = m;
      e = m;
    } else {
      // secant (a === c) or inverse quadratic interpolation
      let s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      s = e;
      e = d;
      if (2 * p < 3 * m * q - Math.abs(tol * q) && p < Math.abs(0.5 * s * q)) {
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    evaluations++;
  }
}
