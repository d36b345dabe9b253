/**
 * Dose-response (IC50) curves at a single [S]: rate against [I], fitted by least squares (constant
 * error, unweighted) with the Levenberg-Marquardt engine (src/fit/levenberg-marquardt.ts).
 *
 *   four-parameter logistic   v = bottom + (top - bottom) / (1 + (I / IC50)^h)
 *     (the Hill equation with a baseline: Hill, A. V. (1910) J. Physiol. 40, iv-vii; the
 *     four-parameter form as in the NIH/NCATS Assay Guidance Manual, "Assay Operations for SAR
 *     Support", section from memory)
 *   single-site hyperbola     v = v0 / (1 + I / IC50)
 *     (one inhibitor site, full inhibition: the 4PL with bottom 0 and h = 1)
 *
 * Parameters are fitted as [top, bottom, ln IC50, h] and [v0, ln IC50]: the log keeps IC50
 * positive without bounds, as for the mechanism fits. Checked against scipy.optimize.least_squares
 * in test/fit/dose-response.test.ts (fixture test/fixtures/dose-response/runner.py).
 */
import type { LeastSquaresProblem } from './least-squares-problem.js';
import { levenbergMarquardt } from './levenberg-marquardt.js';
import { unscaledCovariance } from './qr.js';

export type DoseResponseModel = 'four-parameter-logistic' | 'single-site-hyperbola';

export const DOSE_RESPONSE_LABELS: Record<DoseResponseModel, string> = {
  'four-parameter-logistic': 'four-parameter logistic (Hill slope)',
  'single-site-hyperbola': 'single-site hyperbola (Hill slope 1, full inhibition)',
};

/** Names of the fitted parameters, in order, on the fitted scale. */
export const DOSE_RESPONSE_PARAMS: Record<DoseResponseModel, readonly string[]> = {
  'four-parameter-logistic': ['top', 'bottom', 'lnIC50', 'hill'],
  'single-site-hyperbola': ['top', 'lnIC50'],
};

export interface DoseResponseFit {
  model: DoseResponseModel;
  /** fitted parameters, in DOSE_RESPONSE_PARAMS order (IC50 as ln IC50) */
  x: Float64Array;
  sse: number;
  n: number;
  p: number;
  df: number;
  /** standard errors on the fitted scale (NaN where the information matrix is singular) */
  se: Float64Array;
  /** covariance on the fitted scale, p x p row-major */
  covariance: Float64Array;
  converged: boolean;
  message: string;
  fitted: Float64Array;
}

/** Largest move of ln IC50 away from ln(max [I]) that a fit may take (a factor of e^35 ~ 1.6e15). */
const LN_RANGE = 35;

/** The rate model and its derivatives, as a least-squares problem in the fitted parameters. */
export function doseResponseProblem(model: DoseResponseModel, inhibitor: Float64Array, rate: Float64Array): LeastSquaresProblem {
  const n = rate.length;
  const lnI = Float64Array.from(inhibitor, (i) => (i > 0 ? Math.log(i) : -Infinity));
  const centre = Math.log(Math.max(...inhibitor.filter((i) => i > 0), 1e-300));
  const inDomain = (lnC: number) => Math.abs(lnC - centre) <= LN_RANGE;
  if (model === 'four-parameter-logistic') {
    return {
      n,
      m: 4,
      residuals(x, r) {
        const [top, bottom, lnC, h] = x;
        if (!inDomain(lnC) || !Number.isFinite(h)) return false;
        for (let k = 0; k < n; k++) {
          const u = inhibitor[k] > 0 ? Math.exp(h * (lnI[k] - lnC)) : 0;
          r[k] = rate[k] - (bottom + (top - bottom) / (1 + u));
          if (!Number.isFinite(r[k])) return false;
        }
        return true;
      },
      jacobian(x, J) {
        const [top, bottom, lnC, h] = x;
        for (let k = 0; k < n; k++) {
          const u = inhibitor[k] > 0 ? Math.exp(h * (lnI[k] - lnC)) : 0;
          const q = 1 / (1 + u);
          const span = top - bottom;
          // d r / d x = - d f / d x
          J[k * 4] = -q;
          J[k * 4 + 1] = -(1 - q);
          J[k * 4 + 2] = -(span * h * u * q * q);
          J[k * 4 + 3] = u > 0 ? span * u * q * q * (lnI[k] - lnC) : 0;
        }
      },
    };
  }
  return {
    n,
    m: 2,
    residuals(x, r) {
      const [v0, lnC] = x;
      if (!inDomain(lnC)) return false;
      const c = Math.exp(lnC);
      for (let k = 0; k < n; k++) r[k] = rate[k] - v0 / (1 + inhibitor[k] / c);
      return true;
    },
    jacobian(x, J) {
      const [v0, lnC] = x;
      const c = Math.exp(lnC);
      for (let k = 0; k < n; k++) {
        const w = inhibitor[k] / c;
        const q = 1 / (1 + w);
        J[k * 2] = -q;
        J[k * 2 + 1] = -(v0 * w * q * q);
      }
    },
  };
}

/**
 * Data-driven starts: top from the highest rate, bottom from the lowest, ln IC50 at the [I] where
 * the rate first falls below half way (else the middle of the tested range) and a decade either
 * side, Hill slopes 0.5, 1 and 2.
 */
function doseResponseStarts(model: DoseResponseModel, inhibitor: Float64Array, rate: Float64Array): Float64Array[] {
  const top = Math.max(...rate);
  const bottom = Math.min(...rate);
  const half = (top + bottom) / 2;
  const order = Array.from(inhibitor.keys()).sort((a, b) => inhibitor[a] - inhibitor[b]);
  const positive = order.filter((k) => inhibitor[k] > 0);
  const crossing = positive.find((k) => rate[k] < half);
  const lnMid =
    crossing !== undefined
      ? Math.log(inhibitor[crossing])
      : positive.length > 0
        ? (Math.log(inhibitor[positive[0]]) + Math.log(inhibitor[positive[positive.length - 1]])) / 2
        : 0;
  const lnCs = [lnMid, lnMid - Math.LN10, lnMid + Math.LN10];
  if (model === 'single-site-hyperbola') return lnCs.map((c) => Float64Array.of(top, c));
  return lnCs.flatMap((c) => [0.5, 1, 2].map((h) => Float64Array.of(top, bottom, c, h)));
}

/** Fits one dose-response model from every start and keeps the lowest SSE. */
export function fitDoseResponse(model: DoseResponseModel, inhibitor: Float64Array, rate: Float64Array): DoseResponseFit {
  const problem = doseResponseProblem(model, inhibitor, rate);
  let best: ReturnType<typeof levenbergMarquardt> | null = null;
  for (const start of doseResponseStarts(model, inhibitor, rate)) {
    const r = levenbergMarquardt(problem, start);
    if (r.status === 'failed') continue;
    if (best === null || r.sse < best.sse) best = r;
  }
  const n = rate.length;
  const p = problem.m;
  if (best === null) {
    const nan = new Float64Array(p).fill(NaN);
    return { model, x: nan, sse: NaN, n, p, df: n - p, se: nan, covariance: new Float64Array(p * p).fill(NaN), converged: false, message: 'no start could be fitted', fitted: new Float64Array(n).fill(NaN) };
  }
  const df = n - p;
  const s2 = df > 0 ? best.sse / df : NaN;
  const unscaled = unscaledCovariance(best.jacobian, n, p).matrix;
  const covariance = Float64Array.from(unscaled, (c) => c * s2);
  const se = Float64Array.from({ length: p }, (_, j) => Math.sqrt(covariance[j * p + j]));
  const fitted = Float64Array.from(best.residuals, (r, k) => rate[k] - r);
  return { model, x: best.x, sse: best.sse, n, p, df, se, covariance, converged: best.converged, message: best.message, fitted };
}

/** The fitted rate at [I] = i (for figures and checks). */
export function doseResponseRate(fit: Pick<DoseResponseFit, 'model' | 'x'>, i: number): number {
  if (fit.model === 'single-site-hyperbola') return fit.x[0] / (1 + i / Math.exp(fit.x[1]));
  const [top, bottom, lnC, h] = fit.x;
  return bottom + (top - bottom) / (1 + (i > 0 ? Math.exp(h * (Math.log(i) - lnC)) : 0));
}
