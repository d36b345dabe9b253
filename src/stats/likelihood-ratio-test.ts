/**
 * Likelihood-ratio test of a reduced model nested in a full one (Wilks, S. S. (1938) Ann. Math.
 * Stat. 9, 60-62): statistic 2 (logL_full - logL_reduced), referred to a chi-square distribution
 * with df = difference in the number of free parameters; p is the upper tail.
 * A negative statistic (reduced model with the higher likelihood, which cannot happen at the true
 * optima) gives p = 1 and `reducedFitsBetter` true. Caveat: when the reduced model sits on the
 * boundary of the full model's parameter space (e.g. Ki -> infinity) the chi-square reference is
 * only approximate (Self, S. G. and Liang, K.-Y. (1987) J. Am. Stat. Assoc. 82, 605-610).
 * Upper tails are 1 - chi-square cdf, so p-values below about 1e-16 come out as 0.
 */
import { chisqSurvival } from './distributions.js';

interface LikelihoodRatioInput {
  logLikReduced: number;
  logLikFull: number;
  /** number of free parameters in the full model minus in the reduced model */
  dfDifference: number;
}

interface LikelihoodRatioResult {
  statistic: number;
  df: number;
  p: number;
  reducedFitsBetter: boolean;
}

export function likelihoodRatioTest(input: LikelihoodRatioInput): LikelihoodRatioResult {
  const { logLikReduced, logLikFull, dfDifference } = input;
  if (!(Number.isFinite(logLikReduced) && Number.isFinite(logLikFull))) {
    throw new RangeError(`likelihoodRatioTest: log-likelihoods must be finite (got ${logLikReduced}, ${logLikFull})`);
  }
  if (!(Number.isInteger(dfDifference) && dfDifference > 0)) {
    throw new RangeError(`likelihoodRatioTest: df difference must be a positive integer (got ${dfDifference})`);
  }
  const statistic = 2 * (logLikFull - logLikReduced);
  const reducedFitsBetter = statistic < 0;
  return {
    statistic,
    df: dfDifference,
    p: reducedFitsBetter ? 1 : chisqSurvival(statistic, dfDifference),
    reducedFitsBetter,
  };
}
