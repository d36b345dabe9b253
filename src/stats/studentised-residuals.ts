/**
 * Internally and externally studentised residuals from weighted residuals r_i, leverages h_ii
 * (src/fit/hat-values.ts), the residual standard deviation s and its degrees of freedom df = n - p
 * (Cook, R. D. and Weisberg, S. (1982) Residuals and Influence in Regression, Chapman and Hall,
 * ch. 2; Belsley, D. A., Kuh, E. and Welsch, R. E. (1980) Regression Diagnostics, Wiley, ch. 2):
 *   internal_i = r_i / (s sqrt(1 - h_ii))
 *   external_i = r_i / (s_(i) sqrt(1 - h_ii)),
 *   s_(i)^2 = (df s^2 - r_i^2 / (1 - h_ii)) / (df - 1)   (s without point i, no refit needed).
 * For nonlinear fits these use the linear approximation at the optimum.
 * A point with h_ii = 1 (within 1e-12) is fitted exactly whatever its value: both values are NaN.
 * The external value is NaN when df <= 1.
 */

interface StudentisedResiduals {
  internal: Float64Array;
  external: Float64Array;
}

export function studentisedResiduals(
  weightedResiduals: ArrayLike<number>,
  leverage: ArrayLike<number>,
  s: number,
  dfResidual: number,
): StudentisedResiduals {
  const n = weightedResiduals.length;
  if (leverage.length !== n) {
    throw new RangeError(`studentisedResiduals: ${n} residuals but ${leverage.length} leverages`);
  }
  if (!(Number.isFinite(s) && s > 0)) throw new RangeError(`studentisedResiduals: s must be positive (got ${s})`);
  if (!(dfResidual > 0)) throw new RangeError(`studentisedResiduals: df must be positive (got ${dfResidual})`);
  const internal = new Float64Array(n);
  const external = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = weightedResiduals[i];
    const oneMinusH = 1 - leverage[i];
    if (!(oneMinusH > 1e-12)) {
      internal[i] = NaN;
      external[i] = NaN;
      continue;
    }
    internal[i] = r / (s * Math.sqrt(oneMinusH));
    if (dfResidual <= 1) {
      external[i] = NaN;
      continue;
    }
    const deletedVariance = Math.max(0, (dfResidual * s * s - (r * r) / oneMinusH) / (dfResidual - 1));
    external[i] = r / (Math.sqrt(deletedVariance) * Math.sqrt(oneMinusH));
  }
  return { internal, external };
}
