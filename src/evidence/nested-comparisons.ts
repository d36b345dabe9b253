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
import type { Mechanism } from '../models/types.js';
import type { MechanismFit } from '../fit/fit-mechanism.js';
import { weightsDependOnFit } from '../fit/error-models.js';
import { chisqSurvival, fSurvival } from '../stats/distributions.js';

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

const PAIRS: Array<[Mechanism, Mechanism]> = [
  ['none', 'competitive'],
  ['none', 'uncompetitive'],
  ['none', 'noncompetitive'],
  ['none', 'mixed'],
  ['competitive', 'mixed'],
  ['uncompetitive', 'mixed'],
  ['noncompetitive', 'mixed'],
];

export function compareNested(simpler: MechanismFit, fuller: MechanismFit): NestedComparison {
  const extra = fuller.p - simpler.p;
  const dfDen = fuller.df;
  const gain = Math.max(0, simpler.sse - fuller.sse);
  const f = dfDen > 0 && fuller.sse > 0 ? gain / extra / (fuller.sse / dfDen) : NaN;
  const fP = Number.isFinite(f) ? fSurvival(f, extra, dfDen) : NaN;
  const lr = Math.max(0, 2 * (fuller.logLik - simpler.logLik));
  const lrP = chisqSurvival(lr, extra);
  const primary = weightsDependOnFit(fuller.errorModel) ? 'LR' : 'F';
  return {
    simpler: simpler.mechanism,
    fuller: fuller.mechanism,
    extraParams: extra,
    f,
    fDf: [extra, dfDen],
    fP,
    lr,
    lrP,
    primary,
    p: primary === 'F' ? fP : lrP,
  };
}

/** All standard nested pairs among the fits given (pairs with a missing model are skipped). */
export function nestedComparisons(fits: readonly MechanismFit[]): NestedComparison[] {
  const by = new Map(fits.map((f) => [f.mechanism, f]));
  const out: NestedComparison[] = [];
  for (const [a, b] of PAIRS) {
    const fa = by.get(a);
    const fb = by.get(b);
    if (fa && fb) out.push(compareNested(fa, fb));
  }
  return out;
}
