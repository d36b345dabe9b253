/**
 * Evidence that an inhibition arm the data could hide is absent: one-sided profile-likelihood tests
 * on alpha = Kiu / Ki of the mixed model (the profile t statistic of Bates & Watts 1988, sec. 6.1,
 * referred to Student's t with n - p degrees of freedom).
 *
 * A three-constant call is a claim about alpha: competitive says alpha is very large (binding to the
 * enzyme-substrate complex is negligible), uncompetitive that it is very small, noncompetitive that
 * it is close to 1. Failing to reject the larger (mixed) model is absence of evidence, so a firm
 * call needs the data to reject the nearest mixed alternative:
 *  - competitive:    alpha <= ALPHA_FAR rejected (claim: alpha > ALPHA_FAR)
 *  - uncompetitive:  alpha >= 1 / ALPHA_FAR rejected
 *  - noncompetitive: alpha >= NONCOMPETITIVE_BAND and alpha <= 1 / NONCOMPETITIVE_BAND both rejected
 * each at one-sided p < EXCLUSION_LEVEL. The constants were chosen by simulation over sparse and
 * generous designs (bench/verdict-space-bench.mjs, docs/decisions/firm-calls-exclude-alternatives.md).
 */
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import type { FitData } from '../../fit/fit-data.js';
import { tCdf, tSurvival } from '../../stats/distributions.js';
import { profileTausAt } from '../intervals/profile-likelihood.js';

/** alpha beyond which (or below whose reciprocal) the other arm counts as negligible. */
export const ALPHA_FAR = 10;
/** alpha within this factor of 1 counts as noncompetitive (Ki and Kiu the same within the factor). */
export const NONCOMPETITIVE_BAND = 2;
/** one-sided level at which the nearest mixed alternative must be rejected for a firm call. */
export const EXCLUSION_LEVEL = 0.005;

export type AlphaClaim = 'above' | 'below';

export interface AlphaBoundTest {
  /** the claim tested: alpha above or below the bound */
  claim: AlphaClaim;
  bound: number;
  /** profile t statistic at the bound (NaN when it could not be computed) */
  tau: number;
  /** one-sided p-value of the alternative (alpha on the other side of the bound) */
  p: number;
  /** true when the alternative is rejected at EXCLUSION_LEVEL */
  excluded: boolean;
}

export interface AlphaExclusions {
  /** alpha > ALPHA_FAR: supports a competitive call */
  competitive: AlphaBoundTest;
  /** alpha < 1 / ALPHA_FAR: supports an uncompetitive call */
  uncompetitive: AlphaBoundTest;
  /** 1 / NONCOMPETITIVE_BAND < alpha < NONCOMPETITIVE_BAND: supports a noncompetitive call */
  noncompetitive: [AlphaBoundTest, AlphaBoundTest];
}

function boundTest(claim: AlphaClaim, bound: number, tau: number, df: number, level: number): AlphaBoundTest {
  // tau < 0 when the bound lies below the estimate: a claim "above" is supported by a large -tau.
  const p = !Number.isFinite(tau) ? 1 : claim === 'above' ? tCdf(tau, df) : tSurvival(tau, df);
  return { claim, bound, tau, p, excluded: p < level };
}

/** The four tests a firm three-constant call rests on, from the mixed fit (one profile walk each way). */
export function alphaExclusions(mixed: MechanismFit, data: FitData): AlphaExclusions {
  const bounds = [ALPHA_FAR, 1 / ALPHA_FAR, NONCOMPETITIVE_BAND, 1 / NONCOMPETITIVE_BAND];
  const { taus, df } = profileTausAt(mixed, data, 'alpha', bounds);
  return {
    competitive: boundTest('above', ALPHA_FAR, taus[0], df, EXCLUSION_LEVEL),
    uncompetitive: boundTest('below', 1 / ALPHA_FAR, taus[1], df, EXCLUSION_LEVEL),
    noncompetitive: [boundTest('below', NONCOMPETITIVE_BAND, taus[2], df, EXCLUSION_LEVEL), boundTest('above', 1 / NONCOMPETITIVE_BAND, taus[3], df, EXCLUSION_LEVEL)],
  };
}
