/**
 * Information criteria for ranking mechanisms fitted to the same rates.
 *
 * The parameter count k includes the error variance sigma^2, which every model estimates.
 *  AICc = -2 log L + 2k + 2k(k+1)/(n-k-1)   (Hurvich, C. M. and Tsai, C.-L. (1989) Biometrika 76, 297-307)
 *  BIC  = -2 log L + k ln n                  (Schwarz, G. (1978) Ann. Stat. 6, 461-464)
 *  Akaike weight w_i = exp(-Delta_i/2) / sum_j exp(-Delta_j/2), Delta_i = AICc_i - min AICc
 *  (Burnham, K. P. and Anderson, D. R. (2002) Model Selection and Multimodel Inference, 2nd ed., sec. 2.9).
 */

/** AICc; +Infinity when n - k - 1 <= 0 (too few points for the correction to exist). */
export function aicc(logLik: number, k: number, n: number): number {
  if (n - k - 1 <= 0) return Infinity;
  return -2 * logLik + 2 * k + (2 * k * (k + 1)) / (n - k - 1);
}

export function bic(logLik: number, k: number, n: number): number {
  return -2 * logLik + k * Math.log(n);
}

/** Differences from the smallest value (0 for the best). */
export function deltas(values: readonly number[]): number[] {
  const best = Math.min(...values);
  return values.map((v) => v - best);
}

/** Akaike weights from criterion values (AICc or BIC); models with an infinite value get 0. */
export function akaikeWeights(values: readonly number[]): number[] {
  const d = deltas(values);
  const raw = d.map((x) => (Number.isFinite(x) ? Math.exp(-x / 2) : 0));
  const total = raw.reduce((a, b) => a + b, 0);
  return raw.map((x) => x / total);
}
