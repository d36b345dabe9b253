/**
 * Pooled runs test over several independent series (one per inhibitor concentration, each
 * ordered by [S] by the caller). The statistic is the total number of runs T = sum_j R_j, each
 * R_j counted within its own series (runs never continue across series).
 *
 * Under the null hypothesis (random order of signs within each series, conditional on each
 * series' counts) the R_j are independent, so:
 * - exact: the pmf of T is the convolution of the per-series exact pmfs (runs-distribution.ts);
 * - normal: E[T] = sum E[R_j], Var[T] = sum Var[R_j], with continuity correction of one half.
 * This is the single-series test of Wald, A. and Wolfowitz, J. (1940) Ann. Math. Stat. 11,
 * 147-162 applied to a sum of independent statistics; pooling this way is common practice.
 *
 * With `method: 'auto'` the exact convolution is used when every series has n+ + n- <=
 * `exactMaxTotal` (default 50, see runs-method.ts), otherwise the normal approximation.
 * A series whose nonzero residuals all share one sign contributes R = 1 with certainty (no
 * information but no distortion); the pooled test is 'not-applicable' (NaN p-values) only when
 * every series is like that. Zeros are dropped within each series.
 */
import { countSignRuns, type SignRunCount } from './sign-runs.js';
import { runsDistribution, runsMoments } from './runs-distribution.js';
import { exactRunsTails, normalRunsTails } from './runs-p-values.js';
import { chooseRunsMethod, type RunsTestOptions } from './runs-method.js';

export interface PooledRunsTestResult {
  /** total runs over all series */
  runs: number;
  expectedRuns: number;
  varianceRuns: number;
  z: number;
  method: 'exact' | 'normal' | 'not-applicable';
  pTooFew: number;
  pTooMany: number;
  pTwoSided: number;
  /** per-series counts, in input order */
  series: SignRunCount[];
  /** number of series with both signs present (the informative ones) */
  informativeSeries: number;
}

export function pooledRunsTest(
  seriesList: ReadonlyArray<ArrayLike<number>>,
  options: RunsTestOptions = {},
): PooledRunsTestResult {
  const series = seriesList.map((s) => countSignRuns(s));
  let runs = 0;
  let mean = 0;
  let variance = 0;
  let informativeSeries = 0;
  for (const c of series) {
    const m = runsMoments(c.nPositive, c.nNegative);
    runs += c.runs;
    mean += m.mean;
    variance += m.variance;
    if (c.nPositive > 0 && c.nNegative > 0) informativeSeries++;
  }
  const base = {
    runs,
    expectedRuns: mean,
    varianceRuns: variance,
    z: variance > 0 ? (runs - mean) / Math.sqrt(variance) : NaN,
    series,
    informativeSeries,
  };
  if (informativeSeries === 0) {
    return { ...base, method: 'not-applicable', pTooFew: NaN, pTooMany: NaN, pTwoSided: NaN };
  }
  const method = chooseRunsMethod(options, series.map((c) => c.nPositive + c.nNegative));
  const tails = method === 'exact'
    ? exactRunsTails(convolvedRunsDistribution(series), runs)
    : normalRunsTails(runs, mean, variance);
  return { ...base, method, ...tails };
}

/** Exact pmf of the total number of runs: convolution of the per-series pmfs. */
function convolvedRunsDistribution(series: ReadonlyArray<SignRunCount>): Float64Array {
  let pmf = new Float64Array([1]);
  for (const c of series) {
    const own = runsDistribution(c.nPositive, c.nNegative);
    const next = new Float64Array(pmf.length + own.length - 1);
    for (let a = 0; a < pmf.length; a++) {
      if (pmf[a] === 0) continue;
      for (let b = 0; b < own.length; b++) next[a + b] += pmf[a] * own[b];
    }
    pmf = next;
  }
  return pmf;
}
