/**
 * Profile-likelihood (profile-t) intervals for nonlinear least squares, after Bates, D. M. and
 * Watts, D. G. (1988) Nonlinear Regression Analysis and Its Applications, Wiley, ch. 6.
 *
 * For a quantity c (a parameter on the log scale, or ln alpha), S(c) is the smallest weighted SSE
 * with c held fixed and the other parameters re-optimised, and the profile t statistic is
 *   tau(c) = sign(c - c_hat) * sqrt((S(c) - S_hat) / s^2),   s^2 = S_hat / (n - p).
 * The interval at level 1 - a is {c : |tau(c)| <= t(1 - a/2, n - p)}. It does not depend on the
 * parametrisation (ln Ki or Ki give the same ends), unlike a Wald interval.
 *
 * Search, for each end: step outward from the estimate (first step 90% of the Wald half-width on the
 * log scale, at most 1; doubled whenever |tau| grows by less than an eighth of the cutoff per step,
 * so a flat profile is crossed quickly), re-optimising the free parameters by Levenberg-Marquardt from the previous
 * point (warm start). Within each step the end is searched as the root of |tau| - cutoff by Newton
 * steps safeguarded with bisection (findRootWithSlope, find-root.ts), dtau/dc coming from the
 * envelope theorem (heldSlope, profiled-problem.ts); the step's far point is computed only when
 * the search needs it, and when tau there is still below the cutoff the walk goes on from it. An
 * end not reached inside the data's support (profile-support.ts) is open (null): the search never
 * reports the edge of its box as an end.
 *
 * Weights: fixed at their values at the solution. For IRLS fits (proportional and sqrt error
 * models) this profiles the weighted SSE of the final reweighting pass, the usual treatment of a
 * weighted fit; the variance function is not re-estimated along the profile.
 */
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { parameterLogScales, weightedProblem } from '../../fit/fit-mechanism.js';
import type { FitData } from '../../fit/fit-data.js';
import { levenbergMarquardt } from '../../fit/levenberg-marquardt.js';
import type { LeastSquaresOptions, LeastSquaresProblem, LeastSquaresResult } from '../../fit/least-squares-problem.js';
import { unscaledCovariance } from '../../fit/qr.js';
import { tQuantile } from '../../stats/distributions.js';
import { findRootWithSlope, type SlopePoint } from './find-root.js';
import { freePart, fullTheta, heldSlope, profiledProblem, profiledQuantity, quantityAt, type ProfiledName, type ProfiledQuantity } from './profiled-problem.js';
import { profileSupport, type ProfileSupport } from './profile-support.js';
import { DETECTION_FACTOR } from './detection-bound.js';

/** A profile-likelihood curve of one parameter (Bates & Watts 1988, sec. 6.1). */
export interface ProfileCurve {
  parameter: 'Vmax' | 'Km' | 'Ki' | 'Kiu' | 'alpha' | 'beta' | 'Et';
  /** natural-scale values of the parameter along the profile */
  values: number[];
  /** signed square root of the scaled SSE increase (profile t statistic tau) at each value */
  tau: number[];
  /** |tau| at the interval ends (the t quantile used) */
  cutoff: number;
}

/**
 * Tolerances of each constrained refit of the tests at given values (profileTausAt): the SSE to
 * 1e-12 relative. Their tau is reported and compared with a level, so it is kept as it was.
 */
const PROFILE_FIT: LeastSquaresOptions = { ftol: 1e-12, xtol: 1e-12, gtol: 1e-14, skipFinalJacobian: true };
/**
 * Tolerances of the refits of the interval search: the SSE to 1e-10 relative. What an end needs:
 * near the cutoff t, S - S_hat = t^2 s^2 with s^2 = S_hat / df, so a relative SSE error e moves tau
 * by e df / (2 t) and the end by that over dtau/dc, about 1/SE: for df = 100, t = 2 and a log-scale
 * SE of 0.1, e = 1e-10 moves the end by 2.5e-10, under the 1e-8 root tolerance. Measured
 * (docs/decisions/analysis-cost.md): over 2160 simulated compounds the ends moved by less than the
 * root tolerance, with 1e-10 as with 1e-12.
 */
const INTERVAL_FIT: LeastSquaresOptions = { ftol: 1e-10, xtol: 1e-10, gtol: 1e-14, skipFinalJacobian: true };

export interface ParameterProfile {
  name: ProfiledName;
  /** natural-scale interval at the level; an end is null when it is open */
  interval: [number | null, number | null];
  /** the same ends on the log scale */
  logInterval: [number | null, number | null];
  /** every profile point computed (both sides), sorted by value */
  curve: ProfileCurve;
  /** plain-words notes on open ends or oddities of the search */
  notes: string[];
  /** constrained fits run */
  evaluations: number;
}

interface ProfileOptions {
  /** confidence level; default 0.95 */
  level?: number;
  /** absolute tolerance of the ends on the log scale; default 1e-8 (a relative 1e-8 in the parameter) */
  tolerance?: number;
  /**
   * quantities whose curves are drawn: where the search found a closed end without computing the
   * far point of the walk's last step (beyond the end), that point is computed too, so the drawn
   * curve crosses the cutoff as far out as the walk went; default none
   */
  beyondEnds?: readonly ProfiledName[];
  /** profile only these quantities (of those the fit has); default every parameter, and alpha */
  only?: readonly ProfiledName[];
}

interface ProfilePoint {
  c: number;
  sse: number;
  tau: number;
  z: Float64Array;
  theta: Float64Array;
  /** weighted residuals at the constrained optimum (for the slope) */
  residuals: Float64Array;
  /** dtau/dc once computed (slopeOf) */
  slope?: number;
}

const MAX_STEPS = 80;

/** Shared, per fit: the full problem at the fixed weights and the Wald covariance of theta. */
interface FitContext {
  fit: MechanismFit;
  data: FitData;
  full: LeastSquaresProblem;
  s2: number;
  cutoff: number;
  covariance: Float64Array;
  tolerance: number;
  beyondEnds: readonly ProfiledName[];
}

function fitContext(fit: MechanismFit, data: FitData, options: ProfileOptions): FitContext {
  const level = options.level ?? 0.95;
  const sqrtW = fit.weights.map(Math.sqrt);
  const full = weightedProblem(fit.model, data, sqrtW, parameterLogScales(fit.model, data));
  const s2 = fit.sse / fit.df;
  const cutoff = tQuantile(1 - (1 - level) / 2, fit.df);
  const covariance = unscaledCovariance(fit.jacobian, fit.n, fit.p).matrix.map((x) => x * s2);
  return { fit, data, full, s2, cutoff, covariance, tolerance: options.tolerance ?? 1e-8, beyondEnds: options.beyondEnds ?? [] };
}

/** Wald SE of the profiled quantity on the log scale (NaN when not identified). */
function logScaleSe(ctx: FitContext, q: ProfiledQuantity): number {
  const m = q.m;
  const c = ctx.covariance;
  if (q.name === 'alpha') {
    const ki = ctx.fit.model.params.indexOf('Ki');
    const kiu = ctx.fit.model.params.indexOf('Kiu');
    return Math.sqrt(c[kiu * m + kiu] + c[ki * m + ki] - 2 * c[ki * m + kiu]);
  }
  const j = ctx.fit.model.params.indexOf(q.name);
  return Math.sqrt(c[j * m + j]);
}

/** Profiles every parameter of a fit, and alpha when the model has both Ki and Kiu (or those of `options.only`). */
export function profileAllOfFit(fit: MechanismFit, data: FitData, options: ProfileOptions = {}): ParameterProfile[] {
  if (!(fit.df > 0) || !Number.isFinite(fit.sse)) return [];
  const ctx = fitContext(fit, data, options);
  const names: ProfiledName[] = [...fit.model.params];
  if (fit.model.params.includes('Ki') && fit.model.params.includes('Kiu')) names.push('alpha');
  const wanted = options.only;
  return names.filter((name) => !wanted || wanted.includes(name)).map((name) => profileWithContext(ctx, name));
}

/**
 * The constrained refit of a profile at one fixed value c of the quantity (log scale), with the
 * re-entry starts an undetected arm needs. Shared by the interval search and the point tests.
 */
interface ProfileEvaluator {
  q: ProfiledQuantity;
  support: ProfileSupport;
  cHat: number;
  zHat: Float64Array;
  evaluate(c: number, zStart: Float64Array): ProfilePoint;
  /** dtau/dc at a point (NaN at tau = 0, where tau's slope is not defined by S alone) */
  slopeOf(point: ProfilePoint): number;
  /** constrained fits run so far */
  evaluations(): number;
  /** true once a constrained fit found a lower SSE than the fit itself */
  lowerSseSeen(): boolean;
}

function profileEvaluator(ctx: FitContext, name: ProfiledName, fitOptions: LeastSquaresOptions): ProfileEvaluator {
  const { fit } = ctx;
  const q = profiledQuantity(fit.model.params, name);
  const support = profileSupport(ctx.data, name);
  const fixed = { value: 0 };
  const problem = profiledProblem(ctx.full, q, fixed);
  const cHat = quantityAt(q, fit.theta);
  let evaluations = 0;
  let lowerSseSeen = false;

  const zHat = freePart(q, fit.theta);
  const armIndices = fit.model.params.flatMap((p, j) => (p === 'Ki' || p === 'Kiu' ? [j] : []));
  const theta = new Float64Array(q.m);
  const armOff = (z: Float64Array, c: number) => armIndices.some((j) => fullTheta(q, z, c, theta)[j] > support.lnDetectionBound);
  const lnMaxInhibitor = support.lnDetectionBound - Math.log(DETECTION_FACTOR);
  const reentryStarts = (z: Float64Array, c: number, zStart: Float64Array): Float64Array[] => {
    const starts: Float64Array[] = zStart !== zHat ? [zHat] : [];
    fullTheta(q, z, c, theta);
    for (const j of armIndices) {
      const f = q.freeIndex[j];
      if (f < 0 || q.fixedCoefficient[j] !== 0 || !(theta[j] > support.lnDetectionBound)) continue;
      for (const value of [support.lnDetectionBound, lnMaxInhibitor]) {
        const start = Float64Array.from(z);
        start[f] = value;
        starts.push(start);
      }
    }
    return starts;
  };
  // The refits run at the latest c, by start: a refit asked for again at the same c from the same
  // start (the exclusion tests' direct refit from the estimate repeats one the walk ran) is the
  // same computation, so its result is reused.
  let runsAt = NaN;
  const runs: { start: Float64Array; result: LeastSquaresResult }[] = [];
  const solve = (z: Float64Array): LeastSquaresResult => {
    if (fixed.value !== runsAt) {
      runsAt = fixed.value;
      runs.length = 0;
    }
    const seen = runs.find((run) => run.start.every((v, k) => Object.is(v, z[k])));
    if (seen) return seen.result;
    const result = levenbergMarquardt(problem, z, fitOptions);
    evaluations++;
    runs.push({ start: Float64Array.from(z), result });
    return result;
  };
  const evaluate = (c: number, zStart: Float64Array): ProfilePoint => {
    fixed.value = c;
    let r = solve(zStart);
    // An arm past the detection bound sits on a flat ridge where LM cannot feel whether bringing it
    // back would help: also start from the estimate's free parameters, and from the warm start with
    // each such arm pulled back to the detection bound and to the highest [I] tested; keep the
    // lowest SSE.
    if (armOff(r.x, c)) {
      for (const z of reentryStarts(r.x, c, zStart)) {
        const other = solve(z);
        if (other.sse < r.sse) r = other;
      }
    }
    const increase = r.sse - fit.sse;
    if (increase < -1e-9 * fit.sse) lowerSseSeen = true;
    const tau = Math.sign(c - cHat) * Math.sqrt(Math.max(0, increase) / ctx.s2);
    return { c, sse: r.sse, tau, z: Float64Array.from(r.x), theta: fullTheta(q, r.x, c, new Float64Array(q.m)), residuals: r.residuals };
  };
  // tau^2 = (S - S_hat) / s^2, so dtau/dc = (dS/dc) / (2 s^2 tau), with dS/dc from heldSlope
  const jacobian = new Float64Array(ctx.full.n * q.m);
  // a walk step's start is the far point of the step before, whose slope that step's search used
  const slopeOf = (point: ProfilePoint): number =>
    (point.slope ??= point.tau === 0 || !Number.isFinite(point.sse) ? NaN : heldSlope(ctx.full, q.fixedCoefficient, point.theta, point.residuals, jacobian) / (2 * ctx.s2 * point.tau));
  return { q, support, cHat, zHat, evaluate, slopeOf, evaluations: () => evaluations, lowerSseSeen: () => lowerSseSeen };
}

/** Largest step (log scale) of the walk from the estimate to a tested value: each refit starts near its answer. */
const TEST_WALK_STEP = Math.log(2);

/**
 * The profile t statistic tau at natural-scale values of a quantity (Bates & Watts 1988, sec. 6.1):
 * negative below the estimate, positive above it. With df = n - p it is referred to Student's t
 * for a one-sided test of "the quantity is at most (or at least) this value". Each value is
 * reached by walking out from the estimate (or from the edge of the data's support, profile-support.ts,
 * when the estimate lies beyond it) in steps of at most TEST_WALK_STEP, warm-starting every
 * constrained refit from the last one (values on one side share the walk); the direct refit from
 * the estimate is tried too and the lower SSE kept. A refit that stalls would overstate |tau| and
 * so claim an exclusion the data do not make; the walk guards against that.
 */
export function profileTausAt(fit: MechanismFit, data: FitData, name: ProfiledName, values: readonly number[]): { taus: number[]; df: number } {
  if (!(fit.df > 0) || !Number.isFinite(fit.sse)) return { taus: values.map(() => NaN), df: fit.df };
  const ev = profileEvaluator(fitContext(fit, data, {}), name, PROFILE_FIT);
  const taus = values.map(() => NaN);
  // The walks start where the interval search does: at the estimate, or at the edge of the support
  // when the estimate lies beyond it (an arm far past its detection bound, where the profile is
  // flat and steps of TEST_WALK_STEP would repeat the same refit dozens of times).
  const c0 = Math.min(ev.support.high, Math.max(ev.support.low, ev.cHat));
  let origin: { c: number; z: Float64Array } | null = null;
  for (const direction of [-1, 1] as const) {
    const order = values
      .map((v, k) => ({ k, c: v > 0 ? Math.log(v) : NaN }))
      .filter((x) => Number.isFinite(x.c) && direction * (x.c - ev.cHat) > 0)
      .sort((a, b) => direction * (a.c - b.c));
    // the edge is a start only for the walk towards the support; the other walk leaves from the estimate
    let at = { c: ev.cHat, z: ev.zHat };
    if (direction * (c0 - ev.cHat) > 0 && order.length > 0) at = origin ??= { c: c0, z: ev.evaluate(c0, ev.zHat).z };
    for (const { k, c } of order) {
      let point: ProfilePoint | null = null;
      while (direction * (c - at.c) > 0) {
        const next = direction * (c - at.c) > TEST_WALK_STEP ? at.c + direction * TEST_WALK_STEP : c;
        point = ev.evaluate(next, at.z);
        if (!Number.isFinite(point.sse)) break;
        at = { c: next, z: point.z };
      }
      const direct = ev.evaluate(c, ev.zHat);
      const best = point && Number.isFinite(point.sse) && point.c === c && !(direct.sse < point.sse) ? point : direct;
      taus[k] = Number.isFinite(best.sse) ? best.tau : NaN;
    }
  }
  // a value at the estimate itself
  values.forEach((v, k) => {
    if (v > 0 && Math.log(v) === ev.cHat) taus[k] = 0;
  });
  return { taus, df: fit.df };
}

function profileWithContext(ctx: FitContext, name: ProfiledName): ParameterProfile {
  const { fit } = ctx;
  const ev = profileEvaluator(ctx, name, INTERVAL_FIT);
  const { q, support, cHat, zHat, evaluate } = ev;
  const notes: string[] = [];

  const c0 = Math.min(support.high, Math.max(support.low, cHat));
  const start = c0 === cHat
    ? { c: cHat, sse: fit.sse, tau: 0, z: zHat, theta: Float64Array.from(fit.theta), residuals: new Float64Array(0) }
    : evaluate(c0, zHat);
  const se = logScaleSe(ctx, q);
  // First step to 90% of the Wald end (cutoff x SE on the log scale): where the profile is close to
  // quadratic the next step brackets the end, and the root search finishes it.
  const firstStep = Number.isFinite(se) && se > 0 ? Math.min(1, Math.max(1e-6, 0.9 * ctx.cutoff * se)) : 0.1;

  const points: ProfilePoint[] = [start];
  const lower = walkToEnd(-1);
  const upper = walkToEnd(+1);
  if (ev.lowerSseSeen()) notes.push(`the ${name} profile reached a lower SSE than the fit: the reported optimum may not be the best one`);

  points.sort((a, b) => a.c - b.c);
  const curve: ProfileCurve = {
    parameter: name,
    values: points.map((p) => Math.exp(p.c)),
    tau: points.map((p) => p.tau),
    cutoff: ctx.cutoff,
  };
  return {
    name,
    interval: [lower === null ? null : Math.exp(lower), upper === null ? null : Math.exp(upper)],
    logInterval: [lower, upper],
    curve,
    notes,
    evaluations: ev.evaluations(),
  };

  /** The end on one side (log scale), or null when it is open. */
  function walkToEnd(direction: -1 | 1): number | null {
    const limit = direction > 0 ? support.high : support.low;
    let previous = start;
    let step = firstStep;
    for (let k = 0; k < MAX_STEPS; k++) {
      if (leavesSupport(previous, direction, support)) return openEnd(direction, 'detection');
      if (direction * (limit - previous.c) <= 0) return openEnd(direction, 'box');
      let c = previous.c + direction * step;
      if (direction * (c - limit) > 0) c = limit;
      let point: ProfilePoint;
      if (direction * previous.tau - ctx.cutoff < 0 && previous.tau !== 0) {
        // Where tau's slope predicts the crossing inside this step, the end is searched from the
        // last point and the step's far point c is computed only when the search needs it.
        const search = searchEnd(previous, c, null, direction);
        if (search.end !== undefined) return search.end;
        point = search.far!;
      } else {
        point = evaluate(c, previous.z);
        points.push(point);
        if (!Number.isFinite(point.sse)) return openEnd(direction, 'failed');
        if (direction * point.tau >= ctx.cutoff) return refineEnd(previous, point, direction);
      }
      if (direction * point.tau - direction * previous.tau < ctx.cutoff / 8) step *= 2;
      previous = point;
    }
    return openEnd(direction, 'steps');
  }

  function refineEnd(inside: ProfilePoint, outside: ProfilePoint, direction: -1 | 1): number | null {
    const gInside = direction * inside.tau - ctx.cutoff;
    const gOutside = direction * outside.tau - ctx.cutoff;
    if (!(gInside < 0 && gOutside >= 0)) {
      // The constrained fit found a different valley between the two points (tau is not monotone
      // there); the outer point is the first one known to lie beyond the cutoff.
      notes.push(`the ${name} profile is not monotone near its ${direction > 0 ? 'upper' : 'lower'} end; the end is the first point found beyond the cutoff`);
      return gInside >= 0 ? inside.c : outside.c;
    }
    return searchEnd(inside, outside.c, outside, direction).end!;
  }

  /**
   * The root of direction * tau - cutoff in [inside.c, c] by safeguarded Newton steps on tau
   * (findRootWithSlope), each refit warm-started from the last. With `outside` null the far point
   * c is not yet computed: the result is then either the end (`end`, null when a refit failed) or,
   * when tau at c is still below the cutoff, the point at c (`far`), from which the walk goes on.
   */
  function searchEnd(inside: ProfilePoint, c: number, outside: ProfilePoint | null, direction: -1 | 1): { end?: number | null; far?: ProfilePoint } {
    let last = inside;
    let farDone = outside !== null;
    const slopePoint = (p: ProfilePoint): SlopePoint => ({ x: p.c, f: direction * p.tau - ctx.cutoff, df: direction * ev.slopeOf(p) });
    const g = (x: number): SlopePoint => {
      last = evaluate(x, (outside && last === inside ? outside : last).z);
      points.push(last);
      if (x === c) farDone = true;
      return Number.isFinite(last.sse) ? slopePoint(last) : { x, f: NaN, df: NaN };
    };
    const root = findRootWithSlope(g, slopePoint(inside), c, outside && slopePoint(outside), ctx.tolerance);
    if (root.status === 'no-sign-change') return { far: last };
    if (root.status === 'not-finite') return { end: openEnd(direction, 'failed') };
    if (root.status === 'limit') notes.push(`the ${name} interval end was not refined to full precision`);
    if (!farDone && ctx.beyondEnds.includes(name)) points.push(evaluate(c, last.z));
    return { end: root.x };
  }

  function openEnd(direction: -1 | 1, why: 'detection' | 'box' | 'failed' | 'steps'): null {
    const side = direction > 0 ? 'upper' : 'lower';
    const reason = {
      detection: `an inhibition arm stops being detected before |tau| reaches ${ctx.cutoff.toFixed(3)}`,
      box: `the profile stays below the cutoff up to the edge of what the data cover`,
      failed: `the constrained fit failed`,
      steps: `the profile did not reach the cutoff within ${MAX_STEPS} steps`,
    }[why];
    notes.push(`${name}: ${side} end open (${reason})`);
    return null;
  }

  /** alpha only: the walk ends when the arm it moves towards is no longer detected. */
  function leavesSupport(point: ProfilePoint, direction: -1 | 1, s: ProfileSupport): boolean {
    if (name !== 'alpha') return false;
    const params = fit.model.params;
    const arm = direction > 0 ? params.indexOf('Kiu') : params.indexOf('Ki');
    return point.theta[arm] > s.lnDetectionBound;
  }
}
