/**
 * Runs test on the signs of one sequence of residuals (Wald, A. and Wolfowitz, J. (1940)
 * Ann. Math. Stat. 11, 147-162), conditional on the numbers of positive and negative signs.
 *
 * Zeros are dropped (see sign-runs.ts). Method choice with `method: 'auto'` (the default): exact
 * probabilities from the combinatorial distribution of runs when n+ + n- <= `exactMaxTotal`
 * (default 50, which covers every case with n+ and n- both <= 20, the range of the
 * Swed-Eisenhart (1943) tables); otherwise the normal approximation with continuity correction.
 * When every nonzero residual has the same sign, the conditional test carries no information:
 * `method` is 'not-applicable' and the p-values are NaN (the caller should report the one-signed
 * series itself, which is a strong sign of misfit).
 */
import { countSignRuns } from './sign-runs.js';
import { runsDistribution, runsMoments } from './runs-distribution.js';
import { exactRunsTails, normalRunsTails } from './runs-p-values.js';

export type RunsMethodChoice = 'auto' | 'exact' | 'normal';

export interface RunsTestOptions {
  method?: RunsMethodChoice;
  /** largest n+ + n- for which 'auto' uses exact probabilities; default 50 */
  exactMaxTotal?: number;
}

export interface RunsTestResult {
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

export const DEFAULT_EXACT_MAX_TOTAL = 50;

export function runsTest(residuals: ArrayLike<number>, options: RunsTestOptions = {}): RunsTestResult {
  const count = countSignRuns(residuals);
  const { mean, variance } = runsMoments(count.nPositive, count.nNegative);
  const base = {
    ...count,
    expectedRuns: mean,
    varianceRuns: variance,
    z: variance > 0 ? (count.runs - mean) / Math.sqrt(variance) : NaN,
  };
  if (count.nPositive === 0 || count.nNegative === 0) {
    return { ...base, method: 'not-applicable', pTooFew: NaN, pTooMany: NaN, pTwoSided: NaN };
  }
  const total = count.nPositive + count.nNegative;
  const method = chooseRunsMethod(options, [total]);
  const tails = method === 'exact'
    ? exactRunsTails(runsDistribution(count.nPositive, count.nNegative), count.runs)
    : normalRunsTails(count.runs, mean, variance);
  return { ...base, method, ...tails };
}

/** Resolves 'auto' to 'exact' when every series total is within the exact limit. */
export function chooseRunsMethod(options: RunsTestOptions, seriesTotals: number[]): 'exact' | 'normal' {
  const choice = options.method ?? 'auto';
  if (choice !== 'auto') return choice;
  const limit = options.exactMaxTotal ?? DEFAULT_EXACT_MAX_TOTAL;
  return seriesTotals.every((t) => t <= limit) ? 'exact' : 'normal';
}
