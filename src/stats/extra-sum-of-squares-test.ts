/**
 * Extra-sum-of-squares F test of a reduced model nested in a full one (Draper, N. R. and
 * Smith, H. (1998) Applied Regression Analysis, 3rd ed., Wiley, chapter on the extra sum of
 * squares principle; for nonlinear models the test is approximate: Bates, D. M. and Watts, D. G.
 * (1988) Nonlinear Regression Analysis and Its Applications, Wiley, ch. 3):
 *   F = ((SSE_r - SSE_f) / (df_r - df_f)) / (SSE_f / df_f),   p = P(F(df_r - df_f, df_f) > F)
 * where df are residual degrees of freedom (n minus the number of fitted parameters).
 * If SSE_r < SSE_f the reduced fit beat the full one, which cannot happen at the true optima of
 * nested models: F is reported as computed (negative), p = 1, and `reducedFitsBetter` is true so
 * the caller can flag a fit that did not reach its optimum.
 */
import { fSurvival } from './distributions.js';

interface ExtraSumOfSquaresInput {
  sseReduced: number;
  dfReduced: number;
  sseFull: number;
  dfFull: number;
}

interface ExtraSumOfSquaresResult {
  F: number;
  numeratorDf: number;
  denominatorDf: number;
  p: number;
  reducedFitsBetter: boolean;
}

export function extraSumOfSquaresTest(input: ExtraSumOfSquaresInput): ExtraSumOfSquaresResult {
  const { sseReduced, dfReduced, sseFull, dfFull } = input;
  if (!(Number.isFinite(sseReduced) && sseReduced >= 0 && Number.isFinite(sseFull) && sseFull > 0)) {
    throw new RangeError(
      `extraSumOfSquaresTest: sums of squares must be finite, reduced >= 0 and full > 0 (got ${sseReduced}, ${sseFull})`,
    );
  }
  if (!(Number.isInteger(dfReduced) && Number.isInteger(dfFull) && dfFull > 0 && dfReduced > dfFull)) {
    throw new RangeError(
      `extraSumOfSquaresTest: need integer residual df with dfReduced > dfFull > 0 (got ${dfReduced}, ${dfFull})`,
    );
  }
  const numeratorDf = dfReduced - dfFull;
  const F = ((sseReduced - sseFull) / numeratorDf) / (sseFull / dfFull);
  const reducedFitsBetter = sseReduced < sseFull;
  return {
    F,
    numeratorDf,
    denominatorDf: dfFull,
    p: reducedFitsBetter ? 1 : fSurvival(F, numeratorDf, dfFull),
    reducedFitsBetter,
  };
}
