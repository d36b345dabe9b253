/**
 * Lack-of-fit F test from replicated points (Draper, N. R. and Smith, H. (1998) Applied
 * Regression Analysis, 3rd ed., Wiley, sec. 2.1).
 *
 * Points that share the same conditions (same [S] and [I]) form a group and share one fitted
 * value, so the scatter within a group estimates pure error whatever the model is:
 *   SS_pe  = sum_groups sum_j w_j (e_j - ebar_w)^2,   e_j = y_j - f (unweighted residual),
 *            ebar_w = weighted mean of e within the group,      df_pe  = n - g
 *   SS_lof = SSE - SS_pe,   SSE = sum (weighted residual)^2,      df_lof = g - p
 *   F = (SS_lof / df_lof) / (SS_pe / df_pe),   p = P(F(df_lof, df_pe) > F)
 * with n points, g groups and p fitted parameters.
 *
 * Inputs are weighted residuals r_j = sqrt(w_j) e_j. If `weights` is omitted, weights are taken
 * as equal within each group (then the weighted residuals can be used directly); when weights
 * differ within a group (per-row SD) pass them so e_j = r_j / sqrt(w_j) can be recovered.
 * The test is not applicable (null result with a reason) when there are no replicates
 * (df_pe = 0), when df_lof <= 0, or when the pure-error sum of squares is zero.
 */
import { fSurvival } from './distributions.js';

export interface LackOfFitResult {
  pureErrorSS: number;
  pureErrorDf: number;
  lackOfFitSS: number;
  lackOfFitDf: number;
  F: number;
  p: number;
  groups: number;
}

export interface LackOfFitNotApplicable {
  applicable: false;
  reason: string;
  groups: number;
  pureErrorDf: number;
  lackOfFitDf: number;
}

export type LackOfFitOutcome = ({ applicable: true } & LackOfFitResult) | LackOfFitNotApplicable;

export function lackOfFitTest(
  weightedResiduals: ArrayLike<number>,
  groupIds: ArrayLike<string | number>,
  parameterCount: number,
  weights?: ArrayLike<number>,
): LackOfFitOutcome {
  const n = weightedResiduals.length;
  if (groupIds.length !== n) {
    throw new RangeError(`lackOfFitTest: ${n} residuals but ${groupIds.length} group ids`);
  }
  if (weights && weights.length !== n) {
    throw new RangeError(`lackOfFitTest: ${n} residuals but ${weights.length} weights`);
  }
  if (!Number.isInteger(parameterCount) || parameterCount < 0) {
    throw new RangeError(`lackOfFitTest: parameter count must be a non-negative integer (got ${parameterCount})`);
  }
  const members = new Map<string | number, number[]>();
  let sse = 0;
  for (let i = 0; i < n; i++) {
    const r = weightedResiduals[i];
    if (!Number.isFinite(r)) throw new RangeError(`lackOfFitTest: residual at index ${i} is not finite (${r})`);
    if (weights && !(weights[i] > 0 && Number.isFinite(weights[i]))) {
      throw new RangeError(`lackOfFitTest: weight at index ${i} must be positive and finite (got ${weights[i]})`);
    }
    sse += r * r;
    const list = members.get(groupIds[i]);
    if (list) list.push(i);
    else members.set(groupIds[i], [i]);
  }
  const groups = members.size;
  const pureErrorDf = n - groups;
  const lackOfFitDf = groups - parameterCount;
  const notApplicable = (reason: string): LackOfFitNotApplicable =>
    ({ applicable: false, reason, groups, pureErrorDf, lackOfFitDf });
  if (pureErrorDf === 0) return notApplicable('no replicated conditions, so there is no pure-error estimate');
  if (lackOfFitDf <= 0) {
    return notApplicable(`only ${groups} distinct conditions for ${parameterCount} parameters, so no lack-of-fit degrees of freedom`);
  }

  const weightOf = (i: number): number => (weights ? weights[i] : 1);
  /** e_i = r_i / sqrt(w_i), the unweighted residual */
  const residualOf = (i: number): number => (weights ? weightedResiduals[i] / Math.sqrt(weights[i]) : weightedResiduals[i]);
  let pureErrorSS = 0;
  for (const idx of members.values()) {
    if (idx.length < 2) continue;
    let sumW = 0;
    let sumWe = 0;
    for (const i of idx) {
      sumW += weightOf(i);
      sumWe += weightOf(i) * residualOf(i);
    }
    const meanE = sumWe / sumW;
    for (const i of idx) pureErrorSS += weightOf(i) * (residualOf(i) - meanE) ** 2;
  }
  if (!(pureErrorSS > 0)) return notApplicable('replicates agree exactly, so the pure-error sum of squares is zero');
  // SSE >= SS_pe in exact arithmetic; clamp rounding below zero
  const lackOfFitSS = Math.max(0, sse - pureErrorSS);
  const F = (lackOfFitSS / lackOfFitDf) / (pureErrorSS / pureErrorDf);
  return {
    applicable: true,
    pureErrorSS,
    pureErrorDf,
    lackOfFitSS,
    lackOfFitDf,
    F,
    p: fSurvival(F, lackOfFitDf, pureErrorDf),
    groups,
  };
}
