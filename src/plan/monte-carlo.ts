/**
 * The Monte Carlo check of a design through the real pipeline: for each true mechanism, seeded
 * datasets are simulated on the design (truth drawn from the prior range) and each is analysed by
 * `analyzeTable`, exactly the call `mechanist analyze` makes, so the shares of firm calls come
 * from the same code (and the same verdict rule) the user will run. Analysis options: the error
 * model matching the noise (`constant` or `proportional`), level 0.95, detail 'summary' (profiles
 * only for the models the verdict can name; the verdict and the named mechanism's constants are
 * the same as with the default 'full'), no bootstrap, no robust refit.
 *
 * Common random numbers: simulation k of a mechanism uses the same truth and the same noise
 * deviates on every design (seed from the plan seed, the mechanism and k), so designs are compared
 * on the same draws.
 */
import { analyzeTable, type AnalysisOptions } from '../analysis/analyze-table.js';
import type { AnalysisResult } from '../analysis/types.js';
import type { ConcentrationUnit, RatePoint } from '../input/types.js';
import { MECHANISMS, modelFor } from '../models/index.js';
import type { Mechanism } from '../models/types.js';
import { seededRandom, type RandomSource } from '../simulate/random.js';
import { tableFromPoints } from '../simulate/table-from-points.js';
import type { Design, PlanNoise, PriorPoint } from './design-types.js';
import { paramsAt } from './fisher-information.js';
import { MIXED_ALPHAS, inhibitionRange, truthAt, type PlanPrior } from './plan-prior.js';

export interface MechanismPrediction {
  simulations: number;
  /** share of simulations with a firm call of the true mechanism (for 'none': the no-inhibition outcome) */
  decisiveCorrect: number;
  /** share with a firm call of another mechanism */
  decisiveWrong: number;
  /** median fold width (high/low) of the 95% interval of Ki in the true mechanism's fit (profile, else Wald; null when over half are open or not detected) */
  kiFoldWidth: number | null;
  kiuFoldWidth: number | null;
  /** how often each outcome/mechanism was called, e.g. "decisive:competitive", "undecided:competitive" */
  calls: Record<string, number>;
}

interface MonteCarloOptions {
  simulations: number;
  seed: number;
  units: { substrate: ConcentrationUnit; inhibitor: ConcentrationUnit };
  /** called after each analysis */
  onAnalysis?: () => void;
}

/** The options of every simulated analysis (see the header). */
export function monteCarloAnalysisOptions(noise: PlanNoise): AnalysisOptions {
  return { errorModel: noise.model, level: 0.95, detail: 'summary' };
}

function logUniform(rng: RandomSource, low: number, high: number): number {
  return low === high ? low : low * (high / low) ** rng.uniform();
}

/** The seed of simulation k of a mechanism (independent of the design). */
export function simulationSeed(seed: number, mechanism: Mechanism, k: number): number {
  const index = MECHANISMS.findIndex((m) => m.mechanism === mechanism);
  return (Math.imul(seed | 0, 1000003) + Math.imul(index + 1, 0x2545f491) + Math.imul(k + 1, 0x9e3779b1)) | 0;
}

/** The truth of simulation k: Km and K log-uniform in their ranges; mixed alternates MIXED_ALPHAS. */
export function drawTruth(mechanism: Mechanism, prior: PlanPrior, k: number, rng: RandomSource): PriorPoint {
  const Km = logUniform(rng, prior.km[0], prior.km[1]);
  if (mechanism === 'none') return { mechanism, Vmax: prior.vmax, Km };
  const range = inhibitionRange(prior);
  const K = logUniform(rng, range[0], range[1]);
  return truthAt(mechanism, Km, K, MIXED_ALPHAS[k % MIXED_ALPHAS.length], prior);
}

/** Simulated rates of the design at the truth, noise from rng. */
export function simulateDesign(design: Design, truth: PriorPoint, noise: PlanNoise, rng: RandomSource): RatePoint[] {
  const model = modelFor(truth.mechanism);
  const p = paramsAt(model, truth);
  const out: RatePoint[] = [];
  let line = 2;
  for (const pt of design.points) {
    const v = model.rate(p, pt.substrate, pt.inhibitor);
    const sd = noise.model === 'constant' ? noise.level : noise.level * v;
    for (let r = 1; r <= pt.replicates; r++) out.push({ line: line++, substrate: pt.substrate, inhibitor: pt.inhibitor, rate: v + sd * rng.normal(), replicate: String(r) });
  }
  return out;
}

/** Fold width high/low of the 95% interval of a constant in the true mechanism's fit. */
function intervalFoldWidth(result: AnalysisResult, mechanism: Mechanism, name: 'Ki' | 'Kiu'): number {
  const model = result.models.find((m) => m.mechanism === mechanism);
  const est = model?.estimates.find((e) => e.name === name);
  if (!est || !est.detected) return Infinity;
  const pr = est.profile;
  if (pr && pr[0] !== null && pr[1] !== null && pr[0] > 0) return pr[1] / pr[0];
  if (est.wald && est.wald[0] > 0) return est.wald[1] / est.wald[0];
  return Infinity;
}

function median(xs: number[]): number | null {
  if (xs.length === 0) return null;
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length / 2;
  const m = s.length % 2 ? s[Math.floor(mid)] : (s[mid - 1] + s[mid]) / 2;
  return Number.isFinite(m) ? m : null;
}

/** Runs the check for one design and one true mechanism. */
export function monteCarloPrediction(design: Design, mechanism: Mechanism, prior: PlanPrior, noise: PlanNoise, options: MonteCarloOptions): MechanismPrediction {
  const analysis = monteCarloAnalysisOptions(noise);
  const names = modelFor(mechanism).params;
  let correct = 0;
  let wrong = 0;
  const ki: number[] = [];
  const kiu: number[] = [];
  const calls: Record<string, number> = {};
  for (let k = 0; k < options.simulations; k++) {
    const rng = seededRandom(simulationSeed(options.seed, mechanism, k));
    const truth = drawTruth(mechanism, prior, k, rng);
    const table = tableFromPoints(simulateDesign(design, truth, noise, rng), { source: `<plan ${design.name}>`, units: options.units });
    let result: AnalysisResult | null = null;
    try {
      result = analyzeTable(table, analysis);
    } catch {
      // an analysis that cannot be completed counts as no firm call
    }
    options.onAnalysis?.();
    const v = result?.verdict;
    const key = v ? `${v.outcome}:${v.mechanism ?? 'none'}` : 'failed';
    calls[key] = (calls[key] ?? 0) + 1;
    if (v) {
      if (mechanism === 'none') {
        if (v.outcome === 'no-inhibition') correct++;
        else if (v.decisive) wrong++;
      } else if (v.decisive) {
        if (v.mechanism === mechanism) correct++;
        else wrong++;
      }
    }
    if (result && names.includes('Ki')) ki.push(intervalFoldWidth(result, mechanism, 'Ki'));
    if (result && names.includes('Kiu')) kiu.push(intervalFoldWidth(result, mechanism, 'Kiu'));
  }
  const n = options.simulations;
  return {
    simulations: n,
    decisiveCorrect: correct / n,
    decisiveWrong: wrong / n,
    kiFoldWidth: median(ki),
    kiuFoldWidth: median(kiu),
    calls,
  };
}
