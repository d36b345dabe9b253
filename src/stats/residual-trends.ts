/**
 * Monotone trend of residuals against each covariate the caller supplies (for the mechanism
 * fits: [S], [I] and the fitted rate), measured by Spearman's rank correlation
 * (spearman-correlation.ts). A small p-value says the residuals drift with that covariate, a sign
 * of a wrong model or a wrong error model; a rank test is used because it needs no assumption
 * about the shape of the drift. Checking residuals against [S], [I] and fitted value in this way
 * is common practice (no single source).
 */
import { spearmanCorrelation, type SpearmanResult } from './spearman-correlation.js';

export function residualTrends<K extends string>(
  residuals: ArrayLike<number>,
  covariates: Readonly<Record<K, ArrayLike<number>>>,
): Record<K, SpearmanResult> {
  const result = {} as Record<K, SpearmanResult>;
  for (const key of Object.keys(covariates) as K[]) {
    const values = covariates[key];
    if (values.length !== residuals.length) {
      throw new RangeError(
        `residualTrends: covariate "${key}" has ${values.length} values but there are ${residuals.length} residuals`,
      );
    }
    result[key] = spearmanCorrelation(values, residuals);
  }
  return result;
}
