/**
 * Fitting one mechanism to all inhibitor series at once (global fit): weighted nonlinear least
 * squares on the untransformed rates, parameters on the log scale, Levenberg-Marquardt steps
 * (src/fit/levenberg-marquardt.ts), several starts, and iteratively reweighted least squares when
 * the error model's weights depend on the fitted rates (src/fit/error-models.ts).
 */
import type { MechanismModel, Mechanism } from '../models/types.js';
import type { LeastSquaresOptions, LeastSquaresProblem, LeastSquaresResult } from './least-squares-problem.js';
import { levenbergMarquardt } from './levenberg-marquardt.js';
import { computeWeights, gaussianLogLikelihood, weightsDependOnFit, type ErrorModel } from './error-models.js';
import type { FitData } from './fit-data.js';
import { poolConditions, replicateGroups, type ReplicateGroups } from './replicate-groups.js';

export interface MechanismFit {
  mechanism: Mechanism;
  model: MechanismModel;
  errorModel: ErrorModel;
  /** natural-scale parameters, in model.params order */
  params: Float64Array;
  /** ln(params) */
  theta: Float64Array;
  /** fitted rate per point */
  fitted: Float64Array;
  /** observed minus fitted rate */
  residuals: Float64Array;
  /** the weights at the solution */
  weights: Float64Array;
  /** sqrt(w) * (observed - fitted) */
  weightedResiduals: Float64Array;
  /** sqrt(w) * d fitted / d theta, row-major n x p (the weighted model Jacobian) */
  jacobian: Float64Array;
  /** weighted sum of squared residuals */
  sse: number;
  n: number;
  /** number of fitted rate parameters (sigma not counted) */
  p: number;
  /** residual degrees of freedom n - p */
  df: number;
  /** Gaussian log-likelihood with sigma^2 at its MLE (see error-models.ts) */
  logLik: number;
  converged: boolean;
  /** plain-words reason the fit ended */
  message: string;
  /** how many starting points were tried, and how many of them reached the best SSE (rel. 1e-6) */
  startsTried: number;
  startsReachingBest: number;
  /** number of reweighting passes (0 for fixed weights) */
  reweightPasses: number;
}

export interface FitOptions {
  /** extra natural-scale starting vectors (e.g. warm starts from nested models) */
  extraStarts?: number[][];
  /** maximum reweighting passes for fit-dependent weights; default 200 */
  maxReweightPasses?: number;
  /**
   * fixed multipliers of the error-model weights, one per point (robust refits: bounded-influence
   * weights in (0, 1]); the log-likelihood then includes their logarithms like any other weight
   */
  weightMultipliers?: Float64Array;
}

/** Largest |ln p - ln scale| allowed; beyond it a step is treated as outside the domain. */
const LOG_SPAN = 35;

/** A weighted problem; `refreshWeights` must be called after sqrtW is changed in place. */
interface WeightedProblem extends LeastSquaresProblem {
  /** re-reads sqrtW (the pooled form caches sums over it; the per-point form reads it live) */
  refreshWeights(): void;
}

/**
 * A least-squares problem in theta = ln(p) with fixed weights. Residual k is
 * sqrt(w_k) * (v_k - f(S_k, I_k; exp(theta))). For large replicated tables the replicates of each
 * condition are pooled (src/fit/replicate-groups.ts): the same sum of squares and the same steps
 * from one residual per condition plus one constant residual.
 */
export function weightedProblem(model: MechanismModel, data: FitData, sqrtW: Float64Array, logScale: Float64Array): WeightedProblem {
  const m = model.params.length;
  const groups = replicateGroups(data);
  if (groups && groups.count >= m) return pooledProblem(model, data, groups, sqrtW, logScale);
  const n = data.v.length;
  const p = new Float64Array(m);
  const grad = new Float64Array(m);
  // the models' batch loops where they have them (MechanismModel.rates): the same numbers, faster
  const batch = model.rates && model.gradLogs ? { rates: model.rates, gradLogs: model.gradLogs, f: new Float64Array(n), g: new Float64Array(n * m) } : null;
  const toNatural = naturalParams(p, logScale);
  return {
    n,
    m,
    residuals(x, r) {
      if (!toNatural(x)) return false;
      if (batch) {
        const f = batch.f;
        batch.rates.call(model, p, data, f);
        for (let k = 0; k < n; k++) {
          r[k] = sqrtW[k] * (data.v[k] - f[k]);
          if (!Number.isFinite(r[k])) return false;
        }
        return true;
      }
      for (let k = 0; k < n; k++) {
        const f = model.rate(p, data.s[k], data.i[k], data.e?.[k]);
        r[k] = sqrtW[k] * (data.v[k] - f);
        if (!Number.isFinite(r[k])) return false;
      }
      return true;
    },
    jacobian(x, J) {
      toNatural(x);
      if (batch) {
        const g = batch.g;
        batch.gradLogs.call(model, p, data, g);
        for (let k = 0; k < n; k++) {
          const row = k * m;
          for (let j = 0; j < m; j++) J[row + j] = -sqrtW[k] * g[row + j];
        }
        return;
      }
      for (let k = 0; k < n; k++) {
        model.gradLog(p, data.s[k], data.i[k], grad, 0, data.e?.[k]);
        const row = k * m;
        for (let j = 0; j < m; j++) J[row + j] = -sqrtW[k] * grad[j];
      }
    },
    refreshWeights() {},
  };
}

/** Writes exp(x) into p; false when x leaves the allowed domain around logScale. */
function naturalParams(p: Float64Array, logScale: Float64Array): (x: Float64Array) => boolean {
  return (x) => {
    for (let j = 0; j < p.length; j++) {
      if (!(Math.abs(x[j] - logScale[j]) <= LOG_SPAN)) return false;
      p[j] = Math.exp(x[j]);
    }
    return true;
  };
}

/** The pooled form: residual g is sqrt(W_g) (vbar_g - f_g); the last residual is the constant sqrt(C). */
function pooledProblem(model: MechanismModel, data: FitData, groups: ReplicateGroups, sqrtW: Float64Array, logScale: Float64Array): WeightedProblem {
  const G = groups.count;
  const m = model.params.length;
  const p = new Float64Array(m);
  const grad = new Float64Array(m);
  const toNatural = naturalParams(p, logScale);
  const first = groups.first;
  let pooled = poolConditions(groups, data.v, sqrtW);
  return {
    n: G + 1,
    m,
    residuals(x, r) {
      if (!toNatural(x)) return false;
      const { sqrtW: w, mean } = pooled;
      for (let g = 0; g < G; g++) {
        const k = first[g];
        const f = model.rate(p, data.s[k], data.i[k], data.e?.[k]);
        r[g] = w[g] * (mean[g] - f);
        if (!Number.isFinite(r[g])) return false;
      }
      r[G] = pooled.sqrtWithin;
      return Number.isFinite(r[G]);
    },
    jacobian(x, J) {
      toNatural(x);
      const w = pooled.sqrtW;
      for (let g = 0; g < G; g++) {
        const k = first[g];
        model.gradLog(p, data.s[k], data.i[k], grad, 0, data.e?.[k]);
        const row = g * m;
        for (let j = 0; j < m; j++) J[row + j] = -w[g] * grad[j];
      }
      J.fill(0, G * m, (G + 1) * m);
    },
    refreshWeights() {
      pooled = poolConditions(groups, data.v, sqrtW);
    },
  };
}

/** ln of a typical magnitude for each parameter, from the data (centre of the allowed domain). */
export function parameterLogScales(model: MechanismModel, data: FitData): Float64Array {
  let vmax = 0;
  let smax = 0;
  let imax = 0;
  for (let k = 0; k < data.v.length; k++) {
    vmax = Math.max(vmax, Math.abs(data.v[k]));
    smax = Math.max(smax, data.s[k]);
    imax = Math.max(imax, data.i[k]);
  }
  const scale: Record<string, number> = { Vmax: vmax || 1, Km: smax || 1, Ki: imax || 1, Kiu: imax || 1 };
  if (model.specs) {
    const byDimension: Record<string, number> = { rate: vmax || 1, substrate: smax || 1, inhibitor: imax || 1, enzyme: imax || 1, dimensionless: 1 };
    return Float64Array.from(model.specs.map((spec) => Math.log(byDimension[spec.dimension])));
  }
  return Float64Array.from(model.params.map((name) => Math.log(scale[name])));
}

/**
 * Tolerances of the screening pass over the starts. Every start runs to a relative change of 1e-8
 * (far past where basins separate); only the best is then polished to the engine's default
 * tolerances. This costs a fraction of running every start to rounding level and finds the same
 * minimum (checked against scipy in test/fit/scipy-agreement.test.ts).
 */
const SCREENING: LeastSquaresOptions = { ftol: 1e-8, xtol: 1e-8, gtol: 1e-10, skipFinalJacobian: true };

/**
 * The final solves, at the engine's default tolerances. The fit's Jacobian at the solution is built
 * by assembleFit, so the engine need not evaluate and copy one.
 */
const POLISH: LeastSquaresOptions = { skipFinalJacobian: true };

function runStarts(problem: LeastSquaresProblem, starts: Float64Array[]): { best: LeastSquaresResult; reaching: number } {
  const results = starts.map((x0) => levenbergMarquardt(problem, x0, SCREENING));
  let best = results[0];
  for (const r of results) if (isBetter(r, best)) best = r;
  const reaching = results.filter((r) => Math.abs(r.sse - best.sse) <= 1e-6 * Math.max(best.sse, 1e-300)).length;
  const polished = levenbergMarquardt(problem, best.x, POLISH);
  return { best: isBetter(best, polished) ? best : polished, reaching };
}

function isBetter(a: LeastSquaresResult, b: LeastSquaresResult): boolean {
  if (!Number.isFinite(b.sse)) return Number.isFinite(a.sse);
  return a.sse < b.sse;
}

/** Observed rates floored at 1% of the largest, as a weight basis before any fit exists. */
function observedBasis(v: Float64Array): Float64Array {
  let vmax = 0;
  for (const x of v) vmax = Math.max(vmax, Math.abs(x));
  const floor = 0.01 * (vmax || 1);
  return v.map((x) => Math.max(x, floor));
}

/** Fits one mechanism globally to all points. */
export function fitMechanism(model: MechanismModel, data: FitData, errorModel: ErrorModel, options: FitOptions = {}): MechanismFit {
  const n = data.v.length;
  const m = model.params.length;
  const logScale = parameterLogScales(model, data);
  const weights = new Float64Array(n);
  const sqrtW = new Float64Array(n);
  const setWeights = (basis: ArrayLike<number>) => {
    computeWeights(errorModel, basis, data.sd, weights);
    const extra = options.weightMultipliers;
    if (extra) for (let k = 0; k < n; k++) weights[k] *= extra[k];
    for (let k = 0; k < n; k++) sqrtW[k] = Math.sqrt(weights[k]);
  };
  setWeights(observedBasis(data.v));

  const naturalStarts = [...model.starts(data), ...(options.extraStarts ?? [])];
  const starts = naturalStarts
    .filter((s) => s.length === m && s.every((x) => x > 0 && Number.isFinite(x)))
    .map((s) => Float64Array.from(s, (x, j) => clampLog(Math.log(x), logScale[j])));

  const problem = weightedProblem(model, data, sqrtW, logScale);
  const { best: first, reaching } = runStarts(problem, starts);
  let result = first;
  let passes = 0;

  if (weightsDependOnFit(errorModel)) {
    const maxPasses = options.maxReweightPasses ?? 200;
    const fitted = new Float64Array(n);
    const previous = new Float64Array(n);
    // Reweighting: new weights from the fitted rates, then a few Levenberg-Marquardt steps (not a
    // full fit) from the current point. The fixed point is the same as with full refits, and each
    // pass costs one or two Jacobians. Once the weights settle, full refits at the engine's
    // tolerances finish the job, and the weights are checked once more at the polished point.
    let settled = false;
    let tightPasses = 0;
    while (passes < maxPasses) {
      predict(model, result.x, data, fitted);
      previous.set(weights);
      setWeights(fitted);
      problem.refreshWeights();
      passes++;
      let change = 0;
      for (let k = 0; k < n; k++) change = Math.max(change, Math.abs(weights[k] - previous[k]) / previous[k]);
      if (settled && change < 1e-10) break;
      if (change < 1e-7 || passes > maxPasses / 2) settled = true;
      if (settled) {
        result = refitFrom(problem, result.x, logScale);
        if (++tightPasses >= 20) break;
      } else {
        result = levenbergMarquardt(problem, result.x, REWEIGHT_STEP);
      }
    }
    // final weights are those of the final fitted values
    predict(model, result.x, data, fitted);
    setWeights(fitted);
    problem.refreshWeights();
    result = refitFrom(problem, result.x, logScale);
  }
  return assembleFit(model, data, errorModel, result, weights, sqrtW, starts.length, reaching, passes);
}

/** A reweighting pass: at most a few residual evaluations from the current point. */
const REWEIGHT_STEP: LeastSquaresOptions = { maxEvaluations: 4, ftol: 1e-12, xtol: 1e-12, gtol: 1e-14, skipFinalJacobian: true };

/** The largest value a parameter can take in the fit: the upper edge of its domain. */
export function domainEdge(model: MechanismModel, data: FitData, name: string): number {
  const j = model.params.indexOf(name as never);
  return Math.exp(parameterLogScales(model, data)[j] + LOG_SPAN - 1);
}

/** The lower edge of a parameter's domain (a parameter whose effect vanishes at zero, e.g. beta). */
export function domainLowEdge(model: MechanismModel, data: FitData, name: string): number {
  const j = model.params.indexOf(name as never);
  return Math.exp(parameterLogScales(model, data)[j] - LOG_SPAN + 1);
}

/**
 * The fit object of a model at given parameter values, without iterating (used to embed a nested
 * model's solution in a fuller model, where the extra constant sits at the edge of its domain).
 * Fit-dependent weights are those of the fitted rates at these values, as at an IRLS fixed point.
 */
export function fitAtParams(
  model: MechanismModel,
  data: FitData,
  errorModel: ErrorModel,
  params: ArrayLike<number>,
  message: string,
  weightMultipliers?: Float64Array,
): MechanismFit {
  const n = data.v.length;
  const theta = Float64Array.from(params, Math.log);
  const fitted = new Float64Array(n);
  predict(model, theta, data, fitted);
  const weights = new Float64Array(n);
  computeWeights(errorModel, weightsDependOnFit(errorModel) ? fitted : observedBasis(data.v), data.sd, weights);
  if (weightMultipliers) for (let k = 0; k < n; k++) weights[k] *= weightMultipliers[k];
  const sqrtW = weights.map(Math.sqrt);
  const result = { x: theta, converged: true, message } as LeastSquaresResult;
  return assembleFit(model, data, errorModel, result, weights, sqrtW, 0, 0, 0);
}

/** How close (in ln units) to the edge of the domain a parameter counts as run off. */
const EDGE_MARGIN = 5;
/** Where a run-off parameter is put back for a second try: this far (ln units) from the log scale. */
const PULLED_IN_SPAN = 10;

/**
 * Refits from x after the weights changed. When an inhibition arm has run off to the edge of the
 * domain, its Jacobian column is zero to machine precision, the scaled trust region puts no limit
 * on that coordinate and every trial step leaves the domain, so Levenberg-Marquardt stalls where it
 * starts. A second start with such parameters pulled back to exp(+-PULLED_IN_SPAN) times their scale
 * (where the column is small but not zero) lets the other parameters move; the lower SSE is kept.
 */
function refitFrom(problem: LeastSquaresProblem, x: Float64Array, logScale: Float64Array): LeastSquaresResult {
  const result = levenbergMarquardt(problem, x, POLISH);
  let pulled: Float64Array | null = null;
  for (let j = 0; j < x.length; j++) {
    const offset = x[j] - logScale[j];
    if (Math.abs(offset) > LOG_SPAN - EDGE_MARGIN) {
      pulled ??= Float64Array.from(x);
      pulled[j] = logScale[j] + Math.sign(offset) * PULLED_IN_SPAN;
    }
  }
  if (!pulled) return result;
  const second = levenbergMarquardt(problem, pulled, POLISH);
  return isBetter(second, result) ? second : result;
}

function clampLog(x: number, centre: number): number {
  return Math.min(centre + LOG_SPAN - 1, Math.max(centre - LOG_SPAN + 1, x));
}

function predict(model: MechanismModel, theta: Float64Array, data: FitData, out: Float64Array): void {
  const p = theta.map(Math.exp);
  for (let k = 0; k < out.length; k++) out[k] = model.rate(p, data.s[k], data.i[k], data.e?.[k]);
}

function assembleFit(
  model: MechanismModel,
  data: FitData,
  errorModel: ErrorModel,
  result: LeastSquaresResult,
  weights: Float64Array,
  sqrtW: Float64Array,
  startsTried: number,
  startsReachingBest: number,
  reweightPasses: number,
): MechanismFit {
  const n = data.v.length;
  const m = model.params.length;
  const theta = Float64Array.from(result.x);
  const params = theta.map(Math.exp);
  const fitted = new Float64Array(n);
  predict(model, theta, data, fitted);
  const residuals = new Float64Array(n);
  const weightedResiduals = new Float64Array(n);
  let sse = 0;
  for (let k = 0; k < n; k++) {
    residuals[k] = data.v[k] - fitted[k];
    weightedResiduals[k] = sqrtW[k] * residuals[k];
    sse += weightedResiduals[k] * weightedResiduals[k];
  }
  const jacobian = new Float64Array(n * m);
  const grad = new Float64Array(m);
  for (let k = 0; k < n; k++) {
    model.gradLog(params, data.s[k], data.i[k], grad, 0, data.e?.[k]);
    for (let j = 0; j < m; j++) jacobian[k * m + j] = sqrtW[k] * grad[j];
  }
  const converged = result.converged && Number.isFinite(sse);
  return {
    mechanism: model.mechanism,
    model,
    errorModel,
    params,
    theta,
    fitted,
    residuals,
    weights: Float64Array.from(weights),
    weightedResiduals,
    jacobian,
    sse,
    n,
    p: m,
    df: n - m,
    logLik: gaussianLogLikelihood(sse, weights),
    converged,
    message: result.message,
    startsTried,
    startsReachingBest,
    reweightPasses,
  };
}
