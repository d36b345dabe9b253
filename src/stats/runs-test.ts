/**
 * Runs test on the signs of one sequence of residuals (Wald, A. and Wolfowitz, J. (1940)
 * Ann. Math. Stat. 11, 147-162), conditional on the numbers of positive and negative signs.
 *
 * Zeros are dropped (see sign-runs.ts). Method choice with `method: 'auto'` (the default): exact
 * probabilities from the combinatorial distribution of runs when n+ + n- <= `exactMaxTotal`
 * (default 50, see runs-method.ts); otherwise the normal approximation with continuity correction.
 * When every nonzero residual has the same sign, the conditional test carries no information:
 * `method` is 'not-applicable' and the p-values are NaN (the caller should report the one-signed
 * series itself, which is a strong sign of misfit).
 *
 * One series is the pooled test (pooled-runs-test.ts) over a list of one: the convolution of a
 * single pmf is that pmf, and the summed moments are its own.
 */
import { pooledRunsTest } from './pooled-runs-test.js';
import type { RunsTestOptions } from './runs-method.js';

interface RunsTestResult {
  runs: number;
  nPositive: number;
  nNegative: number;
  zerosDropped: number;
  expectedRuns: number;
  varianceRuns: number;
  /** (runs - expectedRuns) / sqrt(varianceRuns), without continuity correction; NaN if variance is 0 */
  z: number;
  method: 'exact' | 'normal' | 'not-applicable';
  /** P(R <= runs): the one-sided "too few runs" p-value */
  pTooFew: number;
  /** P(R >= runs) */
  pTooMany: number;
  pTwoSided: number;
}

export function runsTest(residuals: ArrayLike<number>, options: RunsTestOptions = {}): RunsTestResult {
  const pooled = pooledRunsTest([residuals], options);
  const { nPositive, nNegative, zerosDropped } = pooled.series[0];
  return {
    runs: pooled.runs,
    nPositive,
    nNegative,
    zerosDropped,
    expectedRuns: pooled.expectedRuns,
    varianceRuns: pooled.varianceRuns,
    z: pooled.z,
    method: pooled.method,
    pTooFew: pooled.pTooFew,
    pTooMany: pooled.pTooMany,
    pTwoSided: pooled.pTwoSided,
  };
}
