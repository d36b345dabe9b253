/**
 * Noise-free rates: a model that reproduces every rate to about eight significant digits. Real
 * measurements never do; simulated or transcribed-from-a-formula data do, and then the residual
 * checks, tests and intervals describe rounding noise (zero residuals are not a systematic miss).
 * The verdict then names the simplest model that fits exactly (src/evidence/verdict/verdict.ts).
 */
import type { MechanismFit } from '../../fit/fit-mechanism.js';

/** Weighted SSE below this fraction of the weighted sum of squared rates counts as exact. */
const EXACT_FIT_RELATIVE_SSE = 1e-16;

function relativeSse(fit: MechanismFit, observed: ArrayLike<number>): number {
  let total = 0;
  for (let k = 0; k < observed.length; k++) total += fit.weights[k] * observed[k] * observed[k];
  return total > 0 ? fit.sse / total : NaN;
}

/** The mechanisms whose fits are exact, fewest parameters first. */
export function exactFits(fits: readonly MechanismFit[], observed: ArrayLike<number>): Array<{ mechanism: MechanismFit['mechanism']; p: number; relativeSse: number }> {
  return fits
    .filter((f) => f.converged && Number.isFinite(f.sse))
    .map((f) => ({ mechanism: f.mechanism, p: f.p, relativeSse: relativeSse(f, observed) }))
    .filter((f) => f.relativeSse <= EXACT_FIT_RELATIVE_SSE)
    .sort((a, b) => a.p - b.p);
}
