/**
 * Roots in a bracket: findRoot by Brent's method (no derivative), and findRootWithSlope by
 * safeguarded Newton steps where f' is known (the profile ends and the joint region's rays).
 *
 * findRoot: a bracketed root of a continuous function by Brent's method: bisection, secant and inverse
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

/** A function value and its derivative at x. */
export interface SlopePoint {
  x: number;
  f: number;
  /** df/dx at x (NaN when unknown) */
  df: number;
}

interface SlopeRootResult {
  /**
   * 'root': x is the root to within the tolerance; 'limit': the evaluation limit ended the search
   * first (x is the latest point); 'no-sign-change': f(b), evaluated because the search needed it,
   * has the sign of f(a), so [a, b] holds no root to search (the last evaluation was at b);
   * 'not-finite': f was not finite at x
   */
  status: 'root' | 'limit' | 'no-sign-change' | 'not-finite';
  x: number;
  evaluations: number;
}

/**
 * A root of f in [a.x, b] by Newton's method safeguarded with bisection: a Newton step is taken from
 * the latest point when it stays inside the current bracket, is at most half the step before
 * last, and the Newton step before it was not slow (SLOW_NEWTON); otherwise the bracket is halved. This is rtsafe of Press, W. H. et al. (2007) Numerical
 * Recipes, 3rd ed., Cambridge University Press, sec. 9.4 (written from memory), with two changes:
 * the iteration starts from the end with the smaller |f| instead of the middle (so the first Newton
 * step may span the whole interval), and f(b) may be unknown (`fb` null). Then b is evaluated only
 * when a Newton step would leave [a, b] or stall before a sign change has been seen.
 *
 * The search stops when the last Newton step (or half the bracket) is at most `tolerance` (plus
 * 2 eps |x|), or when a Newton step d of at most NEWTON_MODEL_STEP has an estimated error
 * d^2 |f''| / (2 |f'|) + e |d| of at most tolerance / 8 (the quadratic convergence of Newton's
 * method near a simple root, and the linear one left by a relative slope error e). f'' comes from
 * the slopes at the last two points, when they lie within CURVATURE_SPAN, and e from the gap
 * between their secant and the mean of their slopes. The returned x is the point after that step,
 * which is not evaluated. Either stop on a Newton step also needs the slope confirmed by that
 * secant (e at most TRUSTED_SLOPE_ERROR), and a Newton step that leaves |f| above SLOW_NEWTON of
 * where it was is followed by bisection: a wrong df costs evaluations, not the root.
 */
export function findRootWithSlope(
  f: (x: number) => SlopePoint,
  a: SlopePoint,
  b: number,
  fb: SlopePoint | null,
  tolerance: number,
  maxEvaluations = 60,
): SlopeRootResult {
  let evaluations = 0;
  const done = (status: SlopeRootResult['status'], x: number): SlopeRootResult => ({ status, x, evaluations });
  if (a.f === 0) return done('root', a.x);
  if (fb && fb.f === 0) return done('root', b);
  const signA = Math.sign(a.f);
  if (!(signA !== 0) || (fb && !(Math.sign(fb.f) === -signA))) throw new RangeError('findRootWithSlope: f(a) must be finite and f(b), when given, of the other sign');
  // xa: the nearest point known to have the sign of f(a); xb: the nearest known to have the other
  // sign, or b while its sign is not known
  let xa = a.x;
  let xb = b;
  let bKnown = fb !== null;
  let current = fb && usable(fb) && (!usable(a) || Math.abs(fb.f) < Math.abs(a.f)) ? fb : a;
  let before: SlopePoint | null = fb === null ? null : current === fb ? a : fb;
  let stepBefore = 2 * Math.abs(b - a.x);
  let step = stepBefore;
  // the last Newton step left |f| above SLOW_NEWTON of where it was (a wrong slope, or a root
  // that is not simple): the next step is not Newton's
  let slow = false;
  for (;;) {
    const lo = Math.min(xa, xb);
    const hi = Math.max(xa, xb);
    const newton = usable(current) ? current.x - current.f / current.df : NaN;
    const newtonFits: boolean = !slow && newton > lo && newton < hi && Math.abs(2 * current.f) <= Math.abs(stepBefore * current.df);
    slow = false;
    let next: number;
    if (newtonFits) {
      stepBefore = step;
      step = current.f / current.df;
      next = newton;
    } else if (!bKnown) {
      if (evaluations >= maxEvaluations) return done('limit', current.x);
      const far = f(b);
      evaluations++;
      if (far.f === 0) return done('root', b);
      if (!Number.isFinite(far.f)) return done('not-finite', b);
      if (Math.sign(far.f) === signA) return done('no-sign-change', b);
      bKnown = true;
      if (usable(far) && (!usable(current) || Math.abs(far.f) < Math.abs(current.f))) current = far;
      continue;
    } else {
      stepBefore = step;
      step = 0.5 * (xb - xa);
      next = xa + step;
    }
    if (Math.abs(step) <= tolerance + 2 * Number.EPSILON * Math.abs(next) && (!newtonFits || slopeError(current, before) <= TRUSTED_SLOPE_ERROR)) return done('root', next);
    if (newtonFits && before && usable(before) && Math.abs(step) <= NEWTON_MODEL_STEP && Math.abs(current.x - before.x) <= CURVATURE_SPAN) {
      // Newton's error after this step is about K step^2, K = |f''| / (2 |f'|), with f'' from the
      // slopes at the last two points (close enough to measure the curvature where the root is),
      // plus e |step| for a relative error e of the slope, seen as the gap between the secant and
      // the mean of the two slopes: stop when that is well inside the tolerance.
      const k = Math.abs((current.df - before.df) / (current.x - before.x)) / (2 * Math.abs(current.df));
      const e = slopeError(current, before);
      if (e <= TRUSTED_SLOPE_ERROR && k * step * step + e * Math.abs(step) <= tolerance / 8) return done('root', next);
    }
    if (evaluations >= maxEvaluations) return done('limit', current.x);
    const point = f(next);
    evaluations++;
    if (point.f === 0) return done('root', next);
    if (!Number.isFinite(point.f)) return done('not-finite', next);
    slow = newtonFits && Math.abs(point.f) > SLOW_NEWTON * Math.abs(current.f);
    before = current;
    if (Math.sign(point.f) === signA) xa = next;
    else {
      xb = next;
      bKnown = true;
    }
    current = point;
  }
}

/**
 * A Newton step that leaves |f| above this share of where it was is slow (a slope far too steep
 * crawls towards the root by 1 - 1/k a step): the next step bisects, or looks at the far end.
 */
const SLOW_NEWTON = 0.9;

/** Largest Newton step whose error is judged from the quadratic model (|f''| / (2 |f'|) step^2). */
const NEWTON_MODEL_STEP = 1e-3;
/** Largest distance between the two points whose slopes give f'' for that judgement. */
const CURVATURE_SPAN = 1e-2;

/**
 * Relative error of the slope at `current`, as the gap between the secant through the last two
 * points (which does not rest on the reported slopes) and the mean of their slopes; Infinity
 * without a point before.
 */
function slopeError(current: SlopePoint, before: SlopePoint | null): number {
  if (before === null || !usable(before)) return Infinity;
  const secant = (current.f - before.f) / (current.x - before.x);
  const e = Math.abs(secant - 0.5 * (current.df + before.df)) / Math.abs(current.df);
  return Number.isFinite(e) ? e : Infinity;
}

/**
 * Largest slope error (slopeError) with which a short Newton step may end the search: a slope k
 * times too steep would otherwise stop it up to k tolerances from the root.
 */
const TRUSTED_SLOPE_ERROR = 0.5;

function usable(p: SlopePoint): boolean {
  return Number.isFinite(p.f) && Number.isFinite(p.df) && p.df !== 0;
}
