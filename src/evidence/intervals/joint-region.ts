/**
 * Joint confidence region for (Ki, Kiu) of the mixed model: the profile-based two-parameter
 * likelihood region
 *   { (Ki, Kiu) : S_prof(Ki, Kiu) <= S_hat * (1 + 2/(n - p) * F(2, n - p; level)) },
 * where S_prof is the weighted SSE with Ki and Kiu held fixed and Vmax, Km re-optimised. This is
 * the likelihood-ratio region for a subset of the parameters in the F form used by Bates, D. M. and
 * Watts, D. G. (1988) Nonlinear Regression Analysis and Its Applications, Wiley, ch. 6 (profile
 * pair plots; section from memory): it follows the curvature of the model, unlike the ellipse of
 * the Wald covariance. Weights are fixed at the solution, as for the profiles.
 *
 * The outline is traced on rays from the estimate in (ln Ki, ln Kiu), each ray scaled by the Wald
 * SEs so that the angles spread evenly over the region. Along the first ray (and after a ray that
 * left the box), step outward until the profiled SSE passes the threshold; every other ray starts
 * at its neighbour's crossing. The
 * crossing is then found by safeguarded Newton steps on the distance statistic, whose slope along
 * the ray comes from one Jacobian at each constrained optimum (envelope theorem; find-root.ts,
 * findRootWithSlope). A ray that reaches the edge of the searched box (profile-support.ts: up to
 * the detection bound of each constant) first contributes its box-edge point and marks the region
 * open.
 */
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { parameterLogScales, weightedProblem } from '../../fit/fit-mechanism.js';
import type { FitData } from '../../fit/fit-data.js';
import type { LeastSquaresOptions, LeastSquaresProblem } from '../../fit/least-squares-problem.js';
import { levenbergMarquardt } from '../../fit/levenberg-marquardt.js';
import { unscaledCovariance } from '../../fit/qr.js';
import { fQuantile } from '../../stats/distributions.js';
import { findRootWithSlope, type SlopePoint } from './find-root.js';
import { heldSlope } from './profiled-problem.js';
import { profileSupport } from './profile-support.js';

/** A joint confidence region for (Ki, Kiu) of the mixed model: the likelihood contour. */
export interface JointRegion {
  level: number;
  /** closed outline, natural scale */
  ki: number[];
  kiu: number[];
  /** true when the contour leaves the searched box (the region is open on some side) */
  open: boolean;
  /**
   * the searched box, natural scale, the same for Ki and Kiu (src/evidence/intervals/profile-support.ts):
   * outline points on its edge mark where the region leaves the searched range
   */
  box?: { low: number; high: number };
}

interface JointRegionOptions {
  level?: number;
  /** number of rays; default 72 */
  rays?: number;
}

/**
 * Tolerances of each constrained refit on a ray: the SSE to 1e-12 relative. At the contour the SSE
 * exceeds its minimum by a few percent, so the distance statistic is good to about 1e-10, far
 * below the 1e-8 to which the crossing is found.
 */
const RAY_FIT: LeastSquaresOptions = { ftol: 1e-12, xtol: 1e-12, gtol: 1e-14, skipFinalJacobian: true };

/** Width (along the scaled ray) to which a crossing is found. */
const CROSSING_TOLERANCE = 1e-8;

/** The problem in the free parameters with the two given log-parameters held at `fixed`. */
function pairProblem(full: LeastSquaresProblem, held: [number, number], fixed: [number, number]): { problem: LeastSquaresProblem; fill: (z: ArrayLike<number>) => Float64Array; free: number[] } {
  const { n, m } = full;
  const free = Array.from({ length: m }, (_, j) => j).filter((j) => j !== held[0] && j !== held[1]);
  const theta = new Float64Array(m);
  const jFull = new Float64Array(n * m);
  const freeIndex = Int32Array.from(free);
  const mFree = free.length;
  const fill = (z: ArrayLike<number>) => {
    for (let f = 0; f < mFree; f++) theta[freeIndex[f]] = z[f];
    theta[held[0]] = fixed[0];
    theta[held[1]] = fixed[1];
    return theta;
  };
  const problem: LeastSquaresProblem = {
    n,
    m: free.length,
    residuals: (z, r) => full.residuals(fill(z), r),
    jacobian: (z, J) => {
      full.jacobian(fill(z), jFull);
      // plain loops over typed arrays, column by column: this copy runs for every ray step
      for (let f = 0; f < mFree; f++) {
        const j = freeIndex[f];
        for (let k = 0; k < n; k++) J[k * mFree + f] = jFull[k * m + j];
      }
    },
  };
  return { problem, fill, free };
}

/** One point on a ray: the distance statistic, its slope along the ray, and the free optimum. */
interface RayPoint {
  t: number;
  d: number;
  /** d d / d t (NaN where d = 0) */
  slope: number;
  z: Float64Array;
}

export function jointRegionKiKiu(fit: MechanismFit, data: FitData, options: JointRegionOptions = {}): JointRegion | null {
  const level = options.level ?? 0.95;
  const rays = options.rays ?? 72;
  const ki = fit.model.params.indexOf('Ki');
  const kiu = fit.model.params.indexOf('Kiu');
  if (ki < 0 || kiu < 0 || !(fit.df > 0) || !Number.isFinite(fit.sse)) return null;
  const s2 = fit.sse / fit.df;
  const radius = Math.sqrt(2 * fQuantile(level, 2, fit.df));
  const sqrtW = fit.weights.map(Math.sqrt);
  const full = weightedProblem(fit.model, data, sqrtW, parameterLogScales(fit.model, data));
  const fixed: [number, number] = [0, 0];
  const { problem, fill, free } = pairProblem(full, [ki, kiu], fixed);
  const box = profileSupport(data, 'Ki');
  const clamp = (x: number) => Math.min(box.high, Math.max(box.low, x));
  const centre: [number, number] = [clamp(fit.theta[ki]), clamp(fit.theta[kiu])];
  const cov = unscaledCovariance(fit.jacobian, fit.n, fit.p).matrix;
  const scale = (j: number) => {
    const se = Math.sqrt(s2 * cov[j * fit.p + j]);
    return Number.isFinite(se) && se > 0 ? Math.min(se, 2) : 1;
  };
  const scales: [number, number] = [scale(ki), scale(kiu)];
  const zHat = Float64Array.from(free, (j) => fit.theta[j]);
  const jFull = new Float64Array(full.n * full.m);
  // how the held pair moves along a ray: theta_Ki, theta_Kiu = centre + t * dir
  const rayCoefficients = new Float64Array(full.m);

  /**
   * The distance statistic d = sqrt((S - S_hat) / s^2) at the point t along the ray, its free
   * optimum, and the slope dd/dt = (dS/dt) / (2 s^2 d), dS/dt by the envelope theorem
   * (profiled-problem.ts, heldSlope: one Jacobian at the solution).
   */
  const pointAt = (dir: [number, number], t: number, warm: Float64Array): RayPoint => {
    fixed[0] = centre[0] + t * dir[0];
    fixed[1] = centre[1] + t * dir[1];
    const r = levenbergMarquardt(problem, warm, RAY_FIT);
    const z = Float64Array.from(r.x);
    const d = Math.sqrt(Math.max(0, r.sse - fit.sse) / s2);
    if (!Number.isFinite(d)) return { t, d, slope: NaN, z };
    rayCoefficients[ki] = dir[0];
    rayCoefficients[kiu] = dir[1];
    const dSdt = heldSlope(full, rayCoefficients, fill(z), r.residuals, jFull);
    return { t, d, slope: d > 0 ? dSdt / (2 * s2 * d) : NaN, z };
  };

  const lnKi: number[] = [];
  const lnKiu: number[] = [];
  let open = fit.theta[ki] > box.high || fit.theta[kiu] > box.high;
  // the crossing of the ray before: where the next ray's search starts (null after an open ray)
  let neighbour: RayPoint | null = null;
  for (let r = 0; r < rays; r++) {
    const angle = (2 * Math.PI * r) / rays;
    const dir: [number, number] = [scales[0] * Math.cos(angle), scales[1] * Math.sin(angle)];
    const tEdge = edgeDistance(centre, dir, box.low, box.high);
    const crossing = rayCrossing(dir, tEdge, neighbour);
    neighbour = crossing;
    const t = crossing?.t ?? tEdge;
    if (crossing === null) open = true;
    lnKi.push(centre[0] + t * dir[0]);
    lnKiu.push(centre[1] + t * dir[1]);
  }
  lnKi.push(lnKi[0]);
  lnKiu.push(lnKiu[0]);
  return { level, ki: lnKi.map(Math.exp), kiu: lnKiu.map(Math.exp), open, box: { low: Math.exp(box.low), high: Math.exp(box.high) } };

  /**
   * Where d(t) first reaches the radius along the ray, or null when it does not before the edge of
   * the box. With the neighbouring ray's crossing, the search starts there (the contour is
   * continuous, so the crossing is close) from that ray's free optimum; otherwise it steps outward
   * from the estimate (first step 0.5, doubled while d grows by less than radius / 8 per step).
   * Once bracketed, the crossing is found by safeguarded Newton steps (findRootWithSlope).
   */
  function rayCrossing(dir: [number, number], tEdge: number, near: RayPoint | null): RayPoint | null {
    const centrePoint: RayPoint = { t: 0, d: 0, slope: NaN, z: zHat };
    let step = 0.5;
    let previous = centrePoint;
    if (near !== null && near.t < tEdge) {
      const guess = pointAt(dir, near.t, near.z);
      if (!Number.isFinite(guess.d)) return null;
      if (guess.d >= radius) return crossingIn(dir, centrePoint, guess);
      previous = guess;
      // aim the first step at the crossing the slope predicts, a little beyond it
      if (guess.slope > 0) step = Math.max(1.1 * (radius - guess.d) / guess.slope, 1e-3 * Math.max(1, guess.t));
    }
    for (let k = 0; k < 60; k++) {
      const t = Math.min(previous.t + step, tEdge);
      const point = pointAt(dir, t, previous.z);
      if (!Number.isFinite(point.d)) return null;
      if (point.d >= radius) return crossingIn(dir, previous, point);
      if (point.d - previous.d < radius / 8) step *= 2;
      previous = point;
      if (t >= tEdge) return null;
    }
    return null;
  }

  /**
   * The root of d(t) - radius between `inside` (d below the radius) and `outside` (at or above it),
   * to CROSSING_TOLERANCE, each refit warm-started from the last. The crossing carries the free
   * optimum of the last point computed, the next ray's warm start.
   */
  function crossingIn(dir: [number, number], inside: RayPoint, outside: RayPoint): RayPoint {
    let last = outside;
    const g = (t: number): SlopePoint => {
      last = pointAt(dir, t, last.z);
      return { x: t, f: last.d - radius, df: last.slope };
    };
    const slopePoint = (p: RayPoint): SlopePoint => ({ x: p.t, f: p.d - radius, df: p.slope });
    const root = findRootWithSlope(g, slopePoint(inside), outside.t, slopePoint(outside), CROSSING_TOLERANCE);
    // a refit that failed inside the bracket: the outer point is the one known to lie beyond
    if (root.status === 'not-finite') return outside;
    return { ...last, t: root.x };
  }
}

/** Distance along `dir` from `from` to the edge of the square [low, high]^2. */
function edgeDistance(from: [number, number], dir: [number, number], low: number, high: number): number {
  let t = Infinity;
  for (let a = 0; a < 2; a++) {
    if (dir[a] > 0) t = Math.min(t, (high - from[a]) / dir[a]);
    else if (dir[a] < 0) t = Math.min(t, (low - from[a]) / dir[a]);
  }
  return Math.max(0, t);
}
