/**
 * Expected Fisher information of a design for one mechanism at given constants, from the models'
 * own analytic log-parameter gradients (src/models, gradLog):
 *
 *   M(theta) = sum over points of  n_j * g_j g_j' / var_j,   g_j = d v / d ln p  at ([S]_j, [I]_j)
 *
 * with var_j = sigma^2 (constant noise) or (cv * v_j)^2 (proportional noise), n_j the wells at the
 * point. This is the information of the weighted least-squares estimate with the weights the
 * analysis iterates to (1/v^2 for proportional error), i.e. the inverse of its asymptotic
 * covariance (Seber, G. A. F. and Wild, C. J. (1989) Nonlinear Regression, Wiley, sec. 2.1 and 2.8;
 * Atkinson, A. C., Donev, A. N. and Tobias, R. D. (2007) Optimum Experimental Designs, with SAS,
 * Oxford, ch. 17). sigma is taken as known; the parameters are on the log scale, so the square
 * root of a diagonal element of M^-1 is the relative standard error of that constant.
 */
import type { MechanismModel, ParamName } from '../models/types.js';
import type { DesignPoint, PlanNoise, PriorPoint } from './design-types.js';

/** The model's parameter vector (natural scale) at a prior point. */
export function paramsAt(model: MechanismModel, point: PriorPoint): number[] {
  return model.params.map((name: ParamName) => {
    // the plan covers the classic models: their constants are the fields of a prior point
    const value = (point as unknown as Partial<Record<ParamName, number>>)[name];
    if (value === undefined || !(value > 0)) throw new Error(`prior point has no positive ${name} for ${model.label}`);
    return value;
  });
}

/** Variance of one rate under the plan's noise. */
export function rateVariance(noise: PlanNoise, rate: number): number {
  return noise.model === 'constant' ? noise.level * noise.level : (noise.level * rate) ** 2;
}

/** M (m x m, row-major) of the design for the model at natural-scale parameters p. */
export function fisherInformation(model: MechanismModel, p: ArrayLike<number>, points: readonly DesignPoint[], noise: PlanNoise): Float64Array {
  const m = model.params.length;
  const info = new Float64Array(m * m);
  const g = new Float64Array(m);
  for (const pt of points) {
    if (pt.replicates <= 0) continue;
    model.gradLog(p, pt.substrate, pt.inhibitor, g, 0);
    const w = pt.replicates / rateVariance(noise, model.rate(p, pt.substrate, pt.inhibitor));
    for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) info[a * m + b] += w * g[a] * g[b];
  }
  return info;
}

/**
 * Cholesky factor L (lower, row-major) of a symmetric matrix, or null when it is not positive
 * definite to working precision (pivot below 1e-12 of the largest diagonal element).
 */
function cholesky(a: ArrayLike<number>, m: number): Float64Array | null {
  const l = new Float64Array(m * m);
  let maxDiag = 0;
  for (let k = 0; k < m; k++) maxDiag = Math.max(maxDiag, Math.abs(a[k * m + k]));
  for (let j = 0; j < m; j++) {
    let d = a[j * m + j];
    for (let k = 0; k < j; k++) d -= l[j * m + k] ** 2;
    if (!(d > 1e-12 * maxDiag)) return null;
    const ljj = Math.sqrt(d);
    l[j * m + j] = ljj;
    for (let i = j + 1; i < m; i++) {
      let s = a[i * m + j];
      for (let k = 0; k < j; k++) s -= l[i * m + k] * l[j * m + k];
      l[i * m + j] = s / ljj;
    }
  }
  return l;
}

/** ln det of a symmetric positive definite matrix; -Infinity when singular. */
export function logDeterminant(a: ArrayLike<number>, m: number): number {
  const l = cholesky(a, m);
  if (!l) return -Infinity;
  let s = 0;
  for (let k = 0; k < m; k++) s += 2 * Math.log(l[k * m + k]);
  return s;
}

/** Inverse of a symmetric positive definite matrix (via Cholesky); null when singular. */
export function inverseSymmetric(a: ArrayLike<number>, m: number): Float64Array | null {
  const l = cholesky(a, m);
  if (!l) return null;
  const inv = new Float64Array(m * m);
  const col = new Float64Array(m);
  for (let c = 0; c < m; c++) {
    // solve L y = e_c, then L' x = y
    for (let i = 0; i < m; i++) {
      let s = i === c ? 1 : 0;
      for (let k = 0; k < i; k++) s -= l[i * m + k] * col[k];
      col[i] = s / l[i * m + i];
    }
    for (let i = m - 1; i >= 0; i--) {
      let s = col[i];
      for (let k = i + 1; k < m; k++) s -= l[k * m + i] * col[k];
      col[i] = s / l[i * m + i];
    }
    for (let i = 0; i < m; i++) inv[i * m + c] = col[i];
  }
  return inv;
}

/** The sub-matrix of the rows and columns `idx`. */
export function subMatrix(a: ArrayLike<number>, m: number, idx: readonly number[]): Float64Array {
  const s = idx.length;
  const out = new Float64Array(s * s);
  for (let r = 0; r < s; r++) for (let c = 0; c < s; c++) out[r * s + c] = a[idx[r] * m + idx[c]];
  return out;
}

/**
 * ln of the Ds criterion for the parameters `interest`: ln det M - ln det M_22, where M_22 is the
 * block of the other (nuisance) parameters; equals -ln det of the interest block of M^-1
 * (Atkinson, Donev & Tobias 2007, sec. 10.3). -Infinity when M is singular.
 */
export function logDsCriterion(info: ArrayLike<number>, m: number, interest: readonly number[]): number {
  const full = logDeterminant(info, m);
  if (full === -Infinity) return -Infinity;
  const nuisance = [...Array(m).keys()].filter((k) => !interest.includes(k));
  return nuisance.length === 0 ? full : full - logDeterminant(subMatrix(info, m, nuisance), nuisance.length);
}

/** Expected standard errors of ln p (relative SEs), one per parameter; NaN where M is singular. */
export function expectedLogStandardErrors(info: ArrayLike<number>, m: number): number[] {
  const inv = inverseSymmetric(info, m);
  return [...Array(m).keys()].map((k) => (inv ? Math.sqrt(inv[k * m + k]) : NaN));
}

/** Fold width high/low of a Wald interval on the log scale: exp(2 z se). */
export function foldWidth(logSe: number, z = 1.959963984540054): number {
  return Number.isFinite(logSe) ? Math.exp(2 * z * logSe) : Infinity;
}

/** The indices of the inhibition constants (Ki, Kiu) in the model's parameter list. */
export function inhibitionIndices(model: MechanismModel): number[] {
  return model.params.flatMap((name, k) => (name === 'Ki' || name === 'Kiu' ? [k] : []));
}
