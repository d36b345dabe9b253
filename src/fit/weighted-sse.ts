/** The weighted residual sum of squares of a model at given parameters, for the nesting checks. */
import type { MechanismModel } from '../models/types.js';
import type { FitData } from './fit-data.js';

/** Weighted SSE of a model at given parameters, with the weights held fixed: sum of w_k (v_k - rate_k)^2. */
export function weightedSseAt(model: MechanismModel, data: FitData, params: ArrayLike<number>, weights: Float64Array): number {
  let sse = 0;
  for (let k = 0; k < data.v.length; k++) {
    const r = data.v[k] - model.rate(params, data.s[k], data.i[k], data.e?.[k]);
    sse += weights[k] * r * r;
  }
  return sse;
}
