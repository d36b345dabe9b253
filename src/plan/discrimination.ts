/**
 * How well a design tells the true mechanism from its rivals: the T-criterion of Atkinson, A. C.
 * and Fedorov, V. V. (1975) Biometrika 62, 57-70. For a true model eta_t at known constants and
 * a rival eta_r, the noncentrality is
 *
 *   lambda = min over beta of  sum_j n_j (eta_t(x_j) - eta_r(x_j, beta))^2 / var_j
 *
 * (the rival's best weighted least-squares fit to the noise-free true rates). It is the expected
 * growth of the rival's scaled residual sum of squares, so it drives every test or criterion
 * that separates the two. Here it is turned into a rough chance that the rival is set aside,
 * used only to rank candidate designs; the predictions the plan reports come from the Monte Carlo
 * run through the analysis itself (monte-carlo.ts).
 */
import { MECHANISMS, modelFor } from '../models/index.js';
import type { Mechanism, MechanismModel } from '../models/types.js';
import { levenbergMarquardt } from '../fit/levenberg-marquardt.js';
import type { LeastSquaresProblem } from '../fit/least-squares-problem.js';
import { normalCdf, normalQuantile } from '../stats/distributions.js';
import type { DesignPoint, PlanNoise, PriorPoint } from './design-types.js';
import { paramsAt, rateVariance } from './fisher-information.js';

const THREE_PARAMETER: readonly Mechanism[] = ['competitive', 'uncompetitive', 'noncompetitive'];

/**
 * Thresholds of the ranking heuristic (this tool's approximations, not the verdict rule itself):
 * a rival with the same number of parameters is taken as set aside when its AICc exceeds the
 * truth's by RIVAL_GAP; a nested rival when a 1-df likelihood-ratio test rejects it at
 * NESTED_LEVEL (0.05 against no inhibition, 0.01 for mixed against a three-parameter model).
 */
const RIVAL_GAP = 4;
const DETECTION_LEVEL = 0.05;
const MIXED_LEVEL = 0.01;

/** The rivals the analysis must set aside to call `truth`, with how each is judged. */
export function rivalsOf(truth: Mechanism, inPlay: readonly Mechanism[]): Array<{ rival: Mechanism; kind: 'same-size' | 'nested'; level: number }> {
  const out: Array<{ rival: Mechanism; kind: 'same-size' | 'nested'; level: number }> = [];
  if (truth === 'none') return out;
  if (inPlay.includes('none')) out.push({ rival: 'none', kind: 'nested', level: DETECTION_LEVEL });
  if (truth === 'mixed') {
    for (const r of THREE_PARAMETER) if (inPlay.includes(r)) out.push({ rival: r, kind: 'nested', level: MIXED_LEVEL });
  } else {
    for (const r of THREE_PARAMETER) if (r !== truth && inPlay.includes(r)) out.push({ rival: r, kind: 'same-size', level: 0 });
  }
  return out;
}

/** The noncentrality lambda of the rival against the truth on the design. */
export function rivalNoncentrality(truth: PriorPoint, rival: MechanismModel, points: readonly DesignPoint[], noise: PlanNoise): number {
  const trueModel = modelFor(truth.mechanism);
  const pt = paramsAt(trueModel, truth);
  const used = points.filter((p) => p.replicates > 0);
  const n = used.length;
  const m = rival.params.length;
  const target = used.map((p) => trueModel.rate(pt, p.substrate, p.inhibitor));
  const scale = used.map((p, j) => Math.sqrt(p.replicates / rateVariance(noise, target[j])));
  const g = new Float64Array(m);
  const problem: LeastSquaresProblem = {
    n,
    m,
    residuals(x, r) {
      const p = Array.from(x, Math.exp);
      for (let j = 0; j < n; j++) {
        const v = rival.rate(p, used[j].substrate, used[j].inhibitor);
        if (!Number.isFinite(v)) return false;
        r[j] = scale[j] * (target[j] - v);
      }
      return true;
    },
    jacobian(x, J) {
      const p = Array.from(x, Math.exp);
      for (let j = 0; j < n; j++) {
        rival.gradLog(p, used[j].substrate, used[j].inhibitor, g, 0);
        for (let k = 0; k < m; k++) J[j * m + k] = -scale[j] * g[k];
      }
    },
  };
  const kGuesses = [truth.Ki, truth.Kiu].filter((x): x is number => x !== undefined);
  let best = Infinity;
  for (const k of kGuesses) {
    const start = rival.params.map((name) => (name === 'Vmax' ? truth.Vmax : name === 'Km' ? truth.Km : k));
    const result = levenbergMarquardt(problem, Float64Array.from(start, Math.log), { ftol: 1e-10, xtol: 1e-10, gtol: 1e-10, skipFinalJacobian: true });
    if (Number.isFinite(result.sse)) best = Math.min(best, result.sse);
  }
  return best;
}

/** Rough chance that the rival is set aside, from its noncentrality (see the header). */
export function chanceRivalSetAside(lambda: number, kind: 'same-size' | 'nested', level: number): number {
  if (!(lambda > 0)) return 0;
  const root = Math.sqrt(lambda);
  if (kind === 'nested') {
    // 1-df likelihood-ratio statistic ~ noncentral chi-square(1, lambda) = (Z + sqrt(lambda))^2
    const z = normalQuantile(level / 2);
    return normalCdf(root + z) + normalCdf(-root + z);
  }
  // difference of the two scaled SSEs: mean lambda, variance about 4 lambda (normal approximation)
  return normalCdf((lambda - RIVAL_GAP) / (2 * root));
}

/** Rough chance of a firm call of the truth at this prior point: product over the rivals. */
export function chanceOfFirmCall(truth: PriorPoint, inPlay: readonly Mechanism[], points: readonly DesignPoint[], noise: PlanNoise): number {
  let chance = 1;
  for (const r of rivalsOf(truth.mechanism, inPlay)) {
    const model = MECHANISMS.find((x) => x.mechanism === r.rival)!;
    chance *= chanceRivalSetAside(rivalNoncentrality(truth, model, points, noise), r.kind, r.level);
  }
  return chance;
}
