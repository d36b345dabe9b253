/**
 * A bounded-influence refit beside the least-squares one (`--robust`): Tukey's bisquare weights
 * by iteratively reweighted least squares (Beaton, A. E. and Tukey, J. W. (1974) Technometrics 16,
 * 147-185; tuning constant c = 4.685 for 95% efficiency at the normal, Holland, P. W. and
 * Welsch, R. E. (1977) Commun. Stat. A6, 813-827), with the scale re-estimated each pass as
 * MAD / 0.6745 of the weighted residuals (Hampel 1974).
 *
 * The robustness weights are found on the most general model (mixed), so that a point is judged
 * against a curve that could have bent to it; they are then held fixed while all mechanisms are
 * refitted and ranked, which keeps the likelihoods comparable. Points given weight 0 are left
 * out of the robust refit (and listed); points between 0 and 1 stay in with their weight.
 */
import { MECHANISMS, modelFor } from '../../models/index.js';
import type { Mechanism } from '../../models/types.js';
import { fitMechanism, type MechanismFit } from '../../fit/fit-mechanism.js';
import { fitAllMechanisms } from '../../fit/fit-all-mechanisms.js';
import type { ErrorModel } from '../../fit/error-models.js';
import { subsetFitData, type FitData } from '../../fit/fit-data.js';
import { median } from '../../stats/median.js';

export const BISQUARE_C = 4.685;
/** A point counts as down-weighted when its final bisquare weight is below this (half weight; common practice, no source). */
export const DOWN_WEIGHTED_BELOW = 0.5;

interface DownWeightedPoint {
  /** index into the fitted points */
  index: number;
  weight: number;
}

interface RobustRefit {
  /** robustness weight of every point (1 = full weight, 0 = rejected) */
  weights: Float64Array;
  downWeighted: DownWeightedPoint[];
  /** fits of all mechanisms with the robustness weights (on the points with weight > 0) */
  fits: MechanismFit[];
  /** data the robust fits used (points with weight > 0) */
  data: FitData;
  /** map from robust-fit point index to original index */
  kept: number[];
}


/** Tukey bisquare weights for residuals r at scale s. */
export function bisquareWeights(r: ArrayLike<number>, scale: number, c = BISQUARE_C): Float64Array {
  const out = new Float64Array(r.length);
  for (let k = 0; k < r.length; k++) {
    const u = r[k] / (c * scale);
    out[k] = Math.abs(u) < 1 ? (1 - u * u) ** 2 : 0;
  }
  return out;
}

/** Scale estimate MAD / 0.6745 about zero (residuals of a fit centre on zero). */
export function madScale(r: ArrayLike<number>): number {
  return median(Array.from(r, Math.abs)) / 0.6745;
}


export function robustRefit(data: FitData, errorModel: ErrorModel, start: MechanismFit, maxPasses = 50): RobustRefit {
  const n = data.v.length;
  const general: Mechanism = MECHANISMS.some((m) => m.mechanism === 'mixed') ? 'mixed' : start.mechanism;
  const model = modelFor(general);
  let weights: Float64Array = new Float64Array(n).fill(1);
  let multipliers: Float64Array = new Float64Array(n).fill(1);
  let fit = start.mechanism === general ? start : fitMechanism(model, data, errorModel);
  for (let pass = 0; pass < maxPasses; pass++) {
    // residual scaled by the error-model weight alone (fit.weights includes the multipliers)
    const base = Float64Array.from(fit.residuals, (r, k) => r * Math.sqrt(fit.weights[k] / multipliers[k]));
    const scale = madScale(base);
    if (!(scale > 0)) break;
    const next = bisquareWeights(base, scale);
    let change = 0;
    for (let k = 0; k < n; k++) change = Math.max(change, Math.abs(next[k] - weights[k]));
    weights = next;
    // settled: the weights are final, and a refit with them would not be used (the mechanisms are
    // refitted below on the kept points)
    if (change < 1e-6) break;
    // a tiny floor keeps rejected points from making the weights singular while iterating
    multipliers = Float64Array.from(weights, (w) => Math.max(w, 1e-12));
    fit = fitMechanism(model, data, errorModel, { weightMultipliers: multipliers, extraStarts: [Array.from(fit.params)] });
  }
  const kept: number[] = [];
  for (let k = 0; k < n; k++) if (weights[k] > 0) kept.push(k);
  const robustData = subsetFitData(data, kept);
  const keptWeights = Float64Array.from(kept, (k) => weights[k]);
  const fits = fitAllMechanisms(robustData, errorModel, MECHANISMS, { weightMultipliers: keptWeights });
  const downWeighted: DownWeightedPoint[] = [];
  for (let k = 0; k < n; k++) if (weights[k] < DOWN_WEIGHTED_BELOW) downWeighted.push({ index: k, weight: weights[k] });
  return { weights, downWeighted, fits, data: robustData, kept };
}
