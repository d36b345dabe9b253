/**
 * Patterns in the rates that the five rapid-equilibrium models cannot describe, each turned into a
 * verdict caveat with the check that would settle it:
 *  - substrate inhibition: the control series falls at its highest [S] (the models assume rates
 *    that only rise with [S]; a fall biases Km and can shift the call). Flagged when the mean at
 *    the highest [S] lies below the series peak by more than SUBSTRATE_DROP_Z standard errors and
 *    by more than SUBSTRATE_DROP_FRACTION of the peak (both chosen here).
 *  - activation: rates rise with [I] (Spearman correlation of the no-inhibition residuals with [I],
 *    p < PATTERN_LEVEL, and the highest [I] above the control at most shared [S] levels).
 *  - saturating inhibitor: at the lowest non-zero [I] the activity relative to the control stays
 *    below SATURATED_ACTIVITY at every [S] tested: every tested [I] is far above the inhibition
 *    constants, so no series shows how inhibition changes with [S].
 * Standard errors use the replicate (pure-error) scatter where there are replicates, else the fit's
 * residual variance, with the fit's weights (sd_k^2 = scale / w_k).
 */
import type { FitData } from '../../fit/fit-data.js';
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { spearmanCorrelation } from '../../stats/spearman-correlation.js';
import { median } from '../../stats/median.js';
import { activityRatios, conditionMeans, inhibitorLevelsOf, type ConditionMean } from '../diagnostics/condition-means.js';
import { ACTIVATION_CODE, type Caveat } from '../verdict/caveat.js';

const SUBSTRATE_DROP_Z = 3;
const SUBSTRATE_DROP_FRACTION = 0.05;
const PATTERN_LEVEL = 0.01;
/** Activity (fraction of the control) below which the lowest [I] counts as complete inhibition. */
export const SATURATED_ACTIVITY = 0.1;
const SATURATING_CODE = 'inhibitor-saturating' as const;

/**
 * Scale of the weighted scatter: the pure-error variance of replicates within conditions where
 * there are replicates (free of any model misfit), else the fit's residual variance s^2.
 */
function scatterVariance(means: readonly ConditionMean[], data: FitData, fit: MechanismFit): number {
  let ss = 0;
  let df = 0;
  for (const g of means) {
    if (g.count < 2) continue;
    for (const k of g.indices) ss += fit.weights[k] * (data.v[k] - g.mean) ** 2;
    df += g.count - 1;
  }
  if (df > 0) return ss / df;
  return fit.df > 0 ? fit.sse / fit.df : NaN;
}

/** Variance of the mean of the points behind a condition, sd_k^2 = scale / w_k. */
function varianceOfMean(g: ConditionMean, fit: MechanismFit, scale: number): number {
  let sum = 0;
  for (const k of g.indices) sum += scale / fit.weights[k];
  return sum / (g.count * g.count);
}

export function substrateInhibitionCaveat(data: FitData, fit: MechanismFit): Caveat | null {
  const means = conditionMeans(data);
  const control = means.filter((m) => m.i === 0);
  if (control.length < 3) return null;
  const top = control[control.length - 1];
  const peak = control.slice(0, -1).reduce((a, b) => (b.mean > a.mean ? b : a));
  const drop = peak.mean - top.mean;
  if (!(drop > 0)) return null;
  const scale = scatterVariance(means, data, fit);
  const se = Math.sqrt(varianceOfMean(peak, fit, scale) + varianceOfMean(top, fit, scale));
  if (!(drop > SUBSTRATE_DROP_Z * se && drop > SUBSTRATE_DROP_FRACTION * peak.mean)) return null;
  return {
    code: 'substrate-inhibition',
    peak: { s: peak.s, mean: peak.mean },
    top: { s: top.s, mean: top.mean },
    standardErrors: drop / se,
    blocking: true,
    leading: true,
  };
}

export function activationCaveat(data: FitData, noneFit: MechanismFit | undefined): Caveat | null {
  if (!noneFit || !(noneFit.df > 0)) return null;
  const levels = inhibitorLevelsOf(conditionMeans(data));
  const highest = levels[levels.length - 1];
  if (!(highest > 0)) return null;
  const trend = spearmanCorrelation(data.i, noneFit.weightedResiduals);
  if (!(trend.rho > 0 && trend.p < PATTERN_LEVEL)) return null;
  const ratios = activityRatios(conditionMeans(data), highest);
  const above = ratios.filter((r) => r.ratio > 1).length;
  if (ratios.length === 0 || above < 0.75 * ratios.length) return null;
  return {
    code: ACTIVATION_CODE,
    levelsAbove: above,
    levels: ratios.length,
    medianRatio: median(ratios.map((r) => r.ratio)),
    rho: trend.rho,
    blocking: true,
    leading: true,
  };
}

export function saturatingInhibitorCaveat(data: FitData): Caveat | null {
  const means = conditionMeans(data);
  const lowest = inhibitorLevelsOf(means).find((x) => x > 0);
  if (lowest === undefined) return null;
  const ratios = activityRatios(means, lowest);
  if (ratios.length === 0) return null;
  const activity = Math.max(...ratios.map((r) => r.ratio));
  if (!(activity < SATURATED_ACTIVITY)) return null;
  return {
    code: SATURATING_CODE,
    lowestInhibitor: lowest,
    activityPercent: 100 * Math.max(activity, 0),
    blocking: true,
    leading: true,
  };
}
