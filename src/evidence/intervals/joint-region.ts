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
 * SEs so that the angles spread evenly over the region: along a ray, step outward until the
 * profiled SSE passes the threshold, then find the crossing by Brent's method. A ray that reaches
 * the edge of the searched box (profile-support.ts: up to the detection bound of each constant)
 * first contributes its box-edge point and marks the region open.
 */
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { parameterLogScales, weightedProblem } from '../../fit/fit-mechanism.js';
import type { FitData } from '../../fit/fit-data.js';
import type { LeastSquaresProblem } from '../../fit/least-squares-problem.js';
import { levenbergMarquardt } from '../../fit/levenberg-marquardt.js';
import { unscaledCovariance } from '../../fit/qr.js';
import { fQuantile } from '../../stats/distributions.js';
import { findRoot } from './find-root.js';
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

/** The problem in the free parameters with the two given log-parameters held at `fixed`. */
function pairProblem(full: LeastSquaresProblem, held: [number, number], fixed: [number, number]): { problem: LeastSquaresProblem; theta: Float64Array; free: number[] } {
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
  return { problem, theta, free };
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
  const { problem, free } = pairProblem(full, [ki, kiu], fixed);
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

  /** distance statistic sqrt((S - S_hat) / s^2) at the point t along the ray, and its free optimum */
  const distanceAt = (dir: [number, number], t: number, warm: Float64Array): { d: number; z: Float64Array } => {
    fixed[0] = centre[0] + t * dir[0];
    fixed[1] = centre[1] + t * dir[1];
    // only x and the SSE are used: no final Jacobian (x and the SSE are the same either way)
    const r = levenbergMarquardt(problem, warm, { skipFinalJacobian: true });
    return { d: Math.sqrt(Math.max(0, r.sse - fit.sse) / s2), z: Float64Array.from(r.x) };
  };

  const lnKi: number[] = [];
  const lnKiu: number[] = [];
  let open = fit.theta[ki] > box.high || fit.theta[kiu] > box.high;
  for (let r = 0; r < rays; r++) {
    const angle = (2 * Math.PI * r) / rays;
    const dir: [number, number] = [scales[0] * Math.cos(angle), scales[1] * Math.sin(angle)];
    const tEdge = edgeDistance(centre, dir, box.low, box.high);
    let previous: { t: number; d: number; z: Float64Array } = { t: 0, d: 0, z: zHat };
    let step = 0.5;
    let found: number | null = null;
    for (let k = 0; k < 60 && found === null; k++) {
      const t = Math.min(previous.t + step, tEdge);
      const point = distanceAt(dir, t, previous.z);
      if (!Number.isFinite(point.d)) break;
      if (point.d >= radius) {
        let warm = point.z;
        const g = (x: number) => {
          const p = distanceAt(dir, x, warm);
          warm = p.z;
          return p.d - radius;
        };
        found = findRoot(g, previous.t, t, previous.d - radius, point.d - radius, 1e-8).x;
        break;
      }
      if (point.d - previous.d < radius / 8) step *= 2;
      previous = { t, d: point.d, z: point.z };
      if (t >= tEdge) break;
    }
    const t = found ?? tEdge;
    if (found === null) open = true;
    lnKi.push(centre[0] + t * dir[0]);
    lnKiu.push(centre[1] + t * dir[1]);
  }
  lnKi.push(lnKi[0]);
  lnKiu.push(lnKiu[0]);
  return { level, ki: lnKi.map(Math.exp), kiu: lnKiu.map(Math.exp), open, box: { low: Math.exp(box.low), high: Math.exp(box.high) } };
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
