/**
 * Replicates pooled into conditions for the least-squares engine (docs/decisions/grouped-replicates.md).
 *
 * With weights held fixed, the weighted sum of squares over the points k of one condition g (the
 * same S, I and enzyme, so the same fitted rate f_g) splits exactly:
 *
 *   sum_k w_k (v_k - f_g)^2 = W_g (vbar_g - f_g)^2 + sum_k w_k (v_k - vbar_g)^2,
 *   W_g = sum_k w_k,  vbar_g = sum_k w_k v_k / W_g.
 *
 * The last term does not depend on the parameters. So one residual sqrt(W_g) (vbar_g - f_g) per
 * condition, plus one constant residual sqrt(C) with C the sum of those within-condition terms (its
 * Jacobian row is zero), has the same sum of squares, the same J'J, the same J'r and the same
 * Jacobian column norms as the per-point residuals: Levenberg-Marquardt takes the same steps and
 * stops at the same point, at a cost per evaluation that grows with the number of conditions
 * instead of the number of points. The weights may differ within a condition (robust multipliers,
 * an SD column); fit-dependent weights (proportional, sqrt) are equal within one because they
 * depend on f_g only.
 *
 * Pooling is used only where it pays: at least GROUPED_FIT_MIN_POINTS points with at least
 * GROUPED_FIT_MIN_REPLICATES points per condition on average. Smaller tables keep the per-point
 * residuals, so their results stay the same to the last digit.
 */
import type { FitData } from './fit-data.js';

/** Fewest points for which replicates are pooled in the fit. */
export const GROUPED_FIT_MIN_POINTS = 1000;
/** Fewest points per condition, on average, for which replicates are pooled in the fit. */
export const GROUPED_FIT_MIN_REPLICATES = 4;

/** The conditions of a FitData: the points that share S, I (and enzyme, when present). */
export interface ReplicateGroups {
  /** number of conditions */
  count: number;
  /** condition index of each point */
  groupOf: Int32Array;
  /** index of one point of each condition (its S, I and enzyme stand for the condition) */
  first: Int32Array;
}

const cache = new WeakMap<FitData, ReplicateGroups | null>();

/**
 * The conditions of `data` when pooling them pays (see above) and `data.perPointFit` does not ask
 * for per-point residuals, otherwise null. Computed once per FitData object (FitData arrays are not
 * changed after they are built).
 */
export function replicateGroups(data: FitData): ReplicateGroups | null {
  if (data.perPointFit) return null;
  if (cache.has(data)) return cache.get(data) ?? null;
  const groups = findGroups(data);
  cache.set(data, groups);
  return groups;
}

function findGroups(data: FitData): ReplicateGroups | null {
  const n = data.v.length;
  if (n < GROUPED_FIT_MIN_POINTS) return null;
  const index = new Map<string, number>();
  const groupOf = new Int32Array(n);
  const first: number[] = [];
  for (let k = 0; k < n; k++) {
    const key = data.e ? `${data.s[k]}|${data.i[k]}|${data.e[k]}` : `${data.s[k]}|${data.i[k]}`;
    let g = index.get(key);
    if (g === undefined) {
      g = first.length;
      index.set(key, g);
      first.push(k);
    }
    groupOf[k] = g;
  }
  if (first.length * GROUPED_FIT_MIN_REPLICATES > n) return null;
  return { count: first.length, groupOf, first: Int32Array.from(first) };
}

/** Pooled weights, weighted means and the within-condition sum of squares, for given sqrt(weights). */
interface PooledConditions {
  /** sqrt(W_g) per condition */
  sqrtW: Float64Array;
  /** weighted mean rate per condition */
  mean: Float64Array;
  /** sqrt of the within-condition weighted sum of squares (the constant residual) */
  sqrtWithin: number;
}

export function poolConditions(groups: ReplicateGroups, v: Float64Array, sqrtW: Float64Array): PooledConditions {
  const { count, groupOf } = groups;
  const n = v.length;
  const total = new Float64Array(count);
  const mean = new Float64Array(count);
  for (let k = 0; k < n; k++) {
    const w = sqrtW[k] * sqrtW[k];
    total[groupOf[k]] += w;
    mean[groupOf[k]] += w * v[k];
  }
  for (let g = 0; g < count; g++) mean[g] = total[g] > 0 ? mean[g] / total[g] : 0;
  // second pass about the means (not the one-pass sum of squares, which cancels badly)
  let within = 0;
  for (let k = 0; k < n; k++) {
    const d = v[k] - mean[groupOf[k]];
    within += sqrtW[k] * sqrtW[k] * d * d;
  }
  return { sqrtW: total.map(Math.sqrt), mean, sqrtWithin: Math.sqrt(within) };
}
