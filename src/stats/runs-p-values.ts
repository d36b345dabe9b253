/**
 * Tail probabilities for an observed number of runs, from an exact pmf or from the normal
 * approximation (Wald, A. and Wolfowitz, J. (1940) Ann. Math. Stat. 11, 147-162).
 *
 * - `pTooFew`  = P(R <= r): small when there are fewer runs than chance allows, the pattern a
 *   systematic misfit leaves in residuals ordered along a covariate.
 * - `pTooMany` = P(R >= r): small when signs alternate more than chance allows.
 * - `pTwoSided` = min(1, 2 min(pTooFew, pTooMany)) (doubling the smaller tail; common practice).
 * Normal approximation with continuity correction of one half:
 *   P(R <= r) ~ Phi((r + 0.5 - E[R]) / sd),   P(R >= r) ~ 1 - Phi((r - 0.5 - E[R]) / sd).
 */
import { normalCdf, normalSurvival } from './distributions.js';

interface RunsTailProbabilities {
  pTooFew: number;
  pTooMany: number;
  pTwoSided: number;
}

/** Tails from an exact pmf (index = number of runs). Each tail is summed directly, not as 1 - other. */
export function exactRunsTails(pmf: ArrayLike<number>, observedRuns: number): RunsTailProbabilities {
  let lower = 0;
  let upper = 0;
  for (let r = 0; r < pmf.length; r++) {
    if (r <= observedRuns) lower += pmf[r];
    if (r >= observedRuns) upper += pmf[r];
  }
  return withTwoSided(Math.min(1, lower), Math.min(1, upper));
}

/** Tails from the normal approximation with continuity correction. */
export function normalRunsTails(observedRuns: number, mean: number, variance: number): RunsTailProbabilities {
  const sd = Math.sqrt(variance);
  const lower = normalCdf((observedRuns + 0.5 - mean) / sd);
  const upper = normalSurvival((observedRuns - 0.5 - mean) / sd);
  return withTwoSided(lower, upper);
}

function withTwoSided(pTooFew: number, pTooMany: number): RunsTailProbabilities {
  return { pTooFew, pTooMany, pTwoSided: Math.min(1, 2 * Math.min(pTooFew, pTooMany)) };
}
