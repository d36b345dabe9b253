/**
 * Error models: how the standard deviation of a measured rate depends on the rate.
 *
 *   constant      SD_i = sigma                 weight w_i = 1
 *   proportional  SD_i = sigma * f_i           weight w_i = 1 / f_i^2
 *   sqrt          SD_i = sigma * sqrt(f_i)     weight w_i = 1 / f_i
 *   column        SD_i = sigma * sd_i          weight w_i = 1 / sd_i^2  (sd from the file; sigma
 *                                                estimated, so only relative SDs matter)
 *
 * f_i is the fitted rate. Where the weights depend on f, the fit iterates them (iteratively
 * reweighted least squares; Carroll, R. J. and Ruppert, D. (1988) Transformation and Weighting in
 * Regression, Chapman & Hall, ch. 2). The Gaussian log-likelihood at the solution, with sigma^2
 * at its maximum-likelihood value SSE_w / n, is
 *
 *   log L = -n/2 * (ln(2*pi*SSE_w/n) + 1) + 1/2 * sum_i ln w_i
 *
 * The last term makes log L comparable between mechanisms whose fitted values (hence weights)
 * differ, and between error models fitted to the same rates.
 */
export type ErrorModel = 'constant' | 'proportional' | 'sqrt' | 'column';

export const ERROR_MODELS: readonly ErrorModel[] = ['constant', 'proportional', 'sqrt', 'column'];

/** True when the weights depend on the fitted values (and so must be iterated). */
export function weightsDependOnFit(model: ErrorModel): boolean {
  return model === 'proportional' || model === 'sqrt';
}

/**
 * Writes the weights for the given error model into `out`. `basis` is the fitted rate (or, before
 * a fit exists, the observed rate floored at a small positive value).
 */
export function computeWeights(model: ErrorModel, basis: ArrayLike<number>, sd: ArrayLike<number> | undefined, out: Float64Array): void {
  const n = out.length;
  switch (model) {
    case 'constant':
      out.fill(1);
      return;
    case 'proportional':
      for (let k = 0; k < n; k++) out[k] = 1 / (basis[k] * basis[k]);
      return;
    case 'sqrt':
      for (let k = 0; k < n; k++) out[k] = 1 / basis[k];
      return;
    case 'column':
      if (!sd) throw new Error('the column error model needs an sd column');
      for (let k = 0; k < n; k++) out[k] = 1 / (sd[k] * sd[k]);
      return;
  }
}

/** The Gaussian log-likelihood at sigma^2 = SSE_w / n, including the weights (see above). */
export function gaussianLogLikelihood(weightedSse: number, weights: ArrayLike<number>): number {
  const n = weights.length;
  let sumLogW = 0;
  for (let k = 0; k < n; k++) sumLogW += Math.log(weights[k]);
  return -0.5 * n * (Math.log((2 * Math.PI * weightedSse) / n) + 1) + 0.5 * sumLogW;
}
