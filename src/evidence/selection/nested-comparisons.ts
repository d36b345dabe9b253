/**
 * Tests between nested mechanisms: each inhibited model against "no inhibition", and each
 * three-parameter model against mixed.
 *
 * Extra-sum-of-squares F test (Draper, N. R. and Smith, H. (1998) Applied Regression Analysis,
 * 3rd ed., sec. 24.5 for the nonlinear case):
 *   F = ((SSE_r - SSE_f) / (p_f - p_r)) / (SSE_f / (n - p_f)),  upper tail of F(p_f - p_r, n - p_f).
 * Likelihood-ratio test: 2 (log L_f - log L_r) against chi-square(p_f - p_r) (Wilks, S. S. (1938)
 * Ann. Math. Stat. 9, 60-62). With fixed weights (constant or column error model) the F test is
 * the primary one; where weights are iterated they differ between the two fits, and the
 * likelihood-ratio test, which accounts for the weights through log L, is primary.
 *
 * Caution: the restricted models lie on the boundary of mixed (1/Kiu = 0, 1/Ki = 0), where the
 * nominal null distributions are conservative (Self, S. G. and Liang, K.-Y. (1987) J. Am. Stat.
 * Assoc. 82, 605-610): a small p is still strong evidence, a large one is not proof of absence.
 */
import type { Mechanism } from '../../models/types.js';
import { nestedPairsAmong } from '../../models/registry.js';
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { weightsDependOnFit } from '../../fit/error-models.js';
import { extraSumOfSquaresTest } from '../../stats/extra-sum-of-squares-test.js';
import { likelihoodRatioTest } from '../../stats/likelihood-ratio-test.js';

export interface NestedComparison {
  simpler: Mechanism;
  fuller: Mechanism;
  /** numerator degrees of freedom p_f - p_r */
  extraParams: number;
  f: number;
  fDf: [number, number];
  fP: number;
  lr: number;
  lrP: number;
  /** which test the verdict reads for this pair */
  primary: 'F' | 'LR';
  /** p value of the primary test */
  p: number;
}

/**
 * The pairs come from the models' own containment rules (src/models/registry.ts): for the classic
 * five, none in each inhibited model, then competitive, uncompetitive and noncompetitive in mixed.
 */

export function compareNested(simpler: MechanismFit, fuller: MechanismFit): NestedComparison {
  const extra = fuller.p - simpler.p;
  const usable = fuller.df > 0 && fuller.sse > 0 && Number.isFinite(simpler.sse);
  const f = usable
    ? extraSumOfSquaresTest({ sseReduced: simpler.sse, dfReduced: simpler.df, sseFull: fuller.sse, dfFull: fuller.df })
    : null;
  const lr = likelihoodRatioTest({ logLikReduced: simpler.logLik, logLikFull: fuller.logLik, dfDifference: extra });
  const primary = weightsDependOnFit(fuller.errorModel) ? 'LR' : 'F';
  const fP = f ? f.p : NaN;
  return {
    simpler: simpler.mechanism,
    fuller: fuller.mechanism,
    extraParams: extra,
    f: f ? Math.max(0, f.F) : NaN,
    fDf: [extra, fuller.df],
    fP,
    lr: Math.max(0, lr.statistic),
    lrP: lr.p,
    primary,
    p: primary === 'F' ? fP : lr.p,
  };
}

/** All nested pairs among the fits given, as their models declare them (pairs with a missing model are skipped). */
export function nestedComparisons(fits: readonly MechanismFit[]): NestedComparison[] {
  const byModel = new Map(fits.map((f) => [f.model, f]));
  return nestedPairsAmong(fits.map((f) => f.model)).map((pair) => compareNested(byModel.get(pair.simpler)!, byModel.get(pair.fuller)!));
}
