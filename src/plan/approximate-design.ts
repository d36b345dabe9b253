/**
 * Optimum approximate designs on a finite set of candidate points, by the multiplicative
 * algorithm (Silvey, S. D., Titterington, D. M. and Torsney, B. (1978) Commun. Statist. A7,
 * 1379-1389; Titterington, D. M. (1976) for D-optimality): each iteration multiplies the weight
 * of every candidate point by its share of the directional derivative,
 *
 *   w_i <- w_i * d_i / sum_k w_k d_k,   d_i = mean over criterion terms of  d_term,i / s_term
 *
 * where for one term (a model at one prior point, parameters of interest s) d_term,i is the
 * Ds variance function g_i' M^-1 g_i - g2_i' M22^-1 g2_i (the nuisance part removed; for D all
 * parameters are of interest and d = g' M^-1 g). A criterion averaged over prior points, the mean
 * of ln Ds / s, gives the mean of the d's (the "Bayesian" or prior-averaged criterion of
 * Atkinson, Donev & Tobias 2007, ch. 18). At the optimum every support point has d = 1 and no
 * candidate exceeds 1 (the equivalence theorem), which is the stopping test.
 */
import type { MechanismModel } from '../models/types.js';
import type { DesignPoint, PlanNoise } from './design-types.js';
import { fisherInformation, inverseSymmetric, rateVariance, subMatrix } from './fisher-information.js';

/** One term of the averaged criterion: a model at natural-scale constants, parameters of interest. */
export interface CriterionTerm {
  model: MechanismModel;
  params: number[];
  /** indices into model.params; all of them for D-optimality */
  interest: number[];
}

export interface ApproximateDesign {
  /** weight per candidate point, summing to 1 */
  weights: number[];
  /** largest d_i over the candidates at the end (1 at the optimum) */
  maxDerivative: number;
  iterations: number;
}

/** Unit-replicate copies of the candidates with the given weights (for the information matrix). */
function weighted(candidates: readonly { substrate: number; inhibitor: number }[], w: readonly number[]): DesignPoint[] {
  return candidates.map((c, k) => ({ substrate: c.substrate, inhibitor: c.inhibitor, replicates: w[k] }));
}

/** Directional-derivative shares d_i (averaged over the terms) of the weights w. */
export function varianceFunction(candidates: readonly { substrate: number; inhibitor: number }[], w: readonly number[], terms: readonly CriterionTerm[], noise: PlanNoise): number[] {
  const d = new Array<number>(candidates.length).fill(0);
  const design = weighted(candidates, w);
  for (const term of terms) {
    const m = term.model.params.length;
    const info = fisherInformation(term.model, term.params, design, noise);
    const inv = inverseSymmetric(info, m);
    if (!inv) throw new Error('singular information matrix in the design search: start from weights on more points');
    const nuisance = [...Array(m).keys()].filter((k) => !term.interest.includes(k));
    const invNuisance = nuisance.length > 0 ? inverseSymmetric(subMatrix(info, m, nuisance), nuisance.length) : null;
    const g = new Float64Array(m);
    candidates.forEach((c, i) => {
      term.model.gradLog(term.params, c.substrate, c.inhibitor, g, 0);
      const scale = 1 / rateVariance(noise, term.model.rate(term.params, c.substrate, c.inhibitor));
      let q = 0;
      for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) q += g[a] * inv[a * m + b] * g[b];
      if (invNuisance) {
        const s = nuisance.length;
        for (let a = 0; a < s; a++) for (let b = 0; b < s; b++) q -= g[nuisance[a]] * invNuisance[a * s + b] * g[nuisance[b]];
      }
      d[i] += (scale * q) / term.interest.length / terms.length;
    });
  }
  return d;
}

/** The multiplicative algorithm from equal weights; stops when max d_i < 1 + tolerance. */
export function optimumApproximateDesign(
  candidates: readonly { substrate: number; inhibitor: number }[],
  terms: readonly CriterionTerm[],
  noise: PlanNoise,
  options: { maxIterations?: number; tolerance?: number } = {},
): ApproximateDesign {
  const maxIterations = options.maxIterations ?? 2000;
  const tolerance = options.tolerance ?? 1e-3;
  let w = candidates.map(() => 1 / candidates.length);
  let maxD = Infinity;
  let it = 0;
  for (; it < maxIterations; it++) {
    const d = varianceFunction(candidates, w, terms, noise);
    maxD = Math.max(...d);
    if (maxD < 1 + tolerance) break;
    const total = w.reduce((s, wk, k) => s + wk * d[k], 0);
    w = w.map((wk, k) => (wk * d[k]) / total);
  }
  return { weights: w, maxDerivative: maxD, iterations: it };
}

/**
 * Whole units (groups of replicate wells) from approximate weights: the efficient rounding of
 * Pukelsheim, F. and Rieder, S. (1992) Biometrika 79, 763-770 (from memory): start from
 * ceil((N - l/2) w_i) over the l points with weight above `minWeight`, then add one unit where
 * n_i / w_i is smallest or remove one where (n_i - 1) / w_i is largest until the total is N.
 */
export function efficientRounding(weights: readonly number[], units: number, minWeight = 1e-3): number[] {
  const support = weights.map((w) => w > minWeight);
  const l = support.filter(Boolean).length;
  const n = weights.map((w, k) => (support[k] ? Math.max(0, Math.ceil((units - l / 2) * w)) : 0));
  let total = n.reduce((s, x) => s + x, 0);
  while (total < units) {
    let best = -1;
    for (let k = 0; k < n.length; k++) if (support[k] && (best < 0 || n[k] / weights[k] < n[best] / weights[best])) best = k;
    n[best]++;
    total++;
  }
  while (total > units) {
    let best = -1;
    for (let k = 0; k < n.length; k++) if (n[k] > 0 && (best < 0 || (n[k] - 1) / weights[k] > (n[best] - 1) / weights[best])) best = k;
    n[best]--;
    total--;
  }
  return n;
}
