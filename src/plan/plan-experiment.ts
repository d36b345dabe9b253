/**
 * `planExperiment`: the whole plan. Search the candidate designs by expected Fisher information
 * (design-search.ts), then check the two best recommendable grids, the common grid and the
 * single-[I] design by Monte Carlo through the analysis (monte-carlo.ts). Of the two grids and
 * the common grid, those within MONTE_CARLO_TIE of the best check score (mean over the mechanisms
 * of decisive-correct minus decisive-wrong shares) count as equally decisive, and the one with the
 * narrowest median Ki/Kiu intervals among them is the recommendation. Without simulation the best grid by the
 * information criteria is.
 */
import type { ConcentrationUnit } from '../input/types.js';
import type { Mechanism } from '../models/types.js';
import type { DesignPoint } from './design-types.js';
import { wellCount } from './design-types.js';
import { searchDesigns, withMeasured, type MechanismExpectation, type PlanSettings, type ScoredDesign } from './design-search.js';
import { monteCarloAnalysisOptions, monteCarloPrediction, type MechanismPrediction } from './monte-carlo.js';
import { budgetUnits } from './candidate-designs.js';

export interface PlanRequest extends PlanSettings {
  units: { substrate: ConcentrationUnit; inhibitor: ConcentrationUnit };
  /** simulations per design and true mechanism; 0 for an information-only plan */
  simulations: number;
  seed: number;
  /** [E] when known: accepted and recorded, not yet used (tight binding is not modelled here) */
  enzyme?: number;
  /** notes carried into the result (e.g. where a follow-up's prior came from) */
  notes?: string[];
  /** progress of the Monte Carlo check: analyses done of total */
  onProgress?: (done: number, total: number) => void;
}

export type CandidateRole = 'recommended' | 'runner-up' | 'common-grid' | 'single-inhibitor' | 'ds-optimum';

export interface PlanCandidate {
  name: string;
  role: CandidateRole;
  description: string;
  wellCount: number;
  points: DesignPoint[];
  /** from the expected information (averaged over the prior points) */
  expected: Partial<Record<Mechanism, MechanismExpectation>>;
  firmCallChance: number;
  meanLogDs: number;
  smallestRateShare: number;
  /** from the Monte Carlo check; null when not simulated */
  predicted: Partial<Record<Mechanism, MechanismPrediction>> | null;
}

export interface PlanResult {
  request: Omit<PlanRequest, 'onProgress'>;
  recommended: PlanCandidate;
  candidates: PlanCandidate[];
  gridsScreened: number;
  /** the options of every simulated analysis, when simulated */
  analysisOptions: Record<string, unknown> | null;
  /** the assumptions the plan rests on, in plain words */
  assumptions: string[];
  notes: string[];
}

function candidate(s: ScoredDesign, role: CandidateRole, name?: string): PlanCandidate {
  return {
    name: name ?? (role === 'recommended' ? role : s.design.name),
    role,
    description: s.design.description,
    wellCount: wellCount(s.design),
    points: s.design.points,
    expected: s.expected,
    firmCallChance: s.firmCallChance,
    meanLogDs: s.meanLogDs,
    smallestRateShare: s.smallestRateShare,
    predicted: null,
  };
}

/**
 * Contenders whose Monte Carlo score is within this of the best count as equally decisive (about
 * one simulation in each of the five mechanisms at the default 50); among them the narrowest
 * intervals win (this tool's choice).
 */
const MONTE_CARLO_TIE = 0.02;

/** Mean over the mechanisms with an inhibition constant of ln(median fold width) of Ki (Kiu when there is no Ki); open counts as OPEN_FOLD */
function meanLogFold(predicted: Partial<Record<Mechanism, MechanismPrediction>>): number {
  const xs = Object.entries(predicted)
    .filter(([m]) => m !== 'none')
    .map(([, p]) => p!.kiFoldWidth ?? p!.kiuFoldWidth ?? OPEN_FOLD);
  return xs.reduce((s, x) => s + Math.log(x), 0) / Math.max(1, xs.length);
}

/** The fold width an open or undetected interval counts as when designs are compared (this tool's choice). */
const OPEN_FOLD = 100;

/** Index of the recommendation among simulated contenders (header rule); ties keep the earlier. */
export function chooseRecommendation(predicted: ReadonlyArray<Partial<Record<Mechanism, MechanismPrediction>>>): number {
  const scores = predicted.map(monteCarloScore);
  const top = Math.max(...scores);
  let best = -1;
  predicted.forEach((p, k) => {
    if (scores[k] < top - MONTE_CARLO_TIE) return;
    if (best < 0 || meanLogFold(p) < meanLogFold(predicted[best]) - 1e-12) best = k;
  });
  return best;
}

/** Mean over mechanisms of decisive-correct minus decisive-wrong (the Monte Carlo ranking). */
export function monteCarloScore(predicted: Partial<Record<Mechanism, MechanismPrediction>>): number {
  const xs = Object.values(predicted).map((p) => p!.decisiveCorrect - p!.decisiveWrong);
  return xs.reduce((s, x) => s + x, 0) / Math.max(1, xs.length);
}

export function planExperiment(request: PlanRequest): PlanResult {
  const c = request.constraints;
  if (c.wells > c.plate) throw new Error(`${c.wells} wells do not fit a ${c.plate}-well plate`);
  if (budgetUnits(c) < 6) throw new Error(`${c.wells} wells at ${c.replicates} replicates leave fewer than 6 design points; the mixed model needs more`);
  const search = searchDesigns(request);
  const best2 = search.recommendable.slice(0, 2);
  const checked: Array<{ s: ScoredDesign; predicted: PlanCandidate['predicted'] }> = [...best2, search.common, search.singleInhibitor].map((s) => ({ s, predicted: null }));
  const notes: string[] = [...(request.notes ?? [])];
  if (request.simulations > 0) {
    const total = checked.length * request.mechanisms.length * request.simulations;
    let done = 0;
    for (const entry of checked) {
      const predicted: Partial<Record<Mechanism, MechanismPrediction>> = {};
      for (const mech of request.mechanisms)
        predicted[mech] = monteCarloPrediction({ ...entry.s.design, points: withMeasured(entry.s.design.points, request) }, mech, request.prior, request.noise, {
          simulations: request.simulations,
          seed: request.seed,
          units: request.units,
          onAnalysis: () => request.onProgress?.(++done, total),
        });
      entry.predicted = predicted;
    }
  }
  // the recommendation among the two grids and the common grid (see the header); without
  // simulation the best grid by the information criteria
  const contenders = request.simulations > 0 ? [...checked.slice(0, best2.length), checked[best2.length]] : checked.slice(0, 1);
  const bestIndex = request.simulations > 0 ? chooseRecommendation(contenders.map((c) => c.predicted!)) : 0;
  const out: PlanCandidate[] = [];
  const best = contenders[bestIndex];
  out.push({ ...candidate(best.s, 'recommended'), predicted: best.predicted });
  if (best.s === search.common) notes.push('the common grid did as well as the searched grids in the Monte Carlo check, with intervals as narrow, so it is the recommendation');
  checked
    .slice(0, best2.length)
    .filter((g) => g !== best)
    .forEach((g, k) => out.push({ ...candidate(g.s, 'runner-up', k === 0 ? 'runner-up' : `runner-up-${k + 1}`), predicted: g.predicted }));
  out.push({ ...candidate(search.common, 'common-grid'), predicted: checked[best2.length].predicted });
  out.push({ ...candidate(search.singleInhibitor, 'single-inhibitor'), predicted: checked[best2.length + 1].predicted });
  if (search.dsOptimum) out.push(candidate(search.dsOptimum, 'ds-optimum'));
  notes.push(
    `the smallest expected rate in the recommended design is ${(100 * out[0].smallestRateShare).toPrecision(2)}% of Vmax (over the prior range): the ${request.noise.model} noise model is assumed to hold down to it; if the assay has a noise floor there, plan with constant noise or a lower --max-inhibitor`,
  );
  if (request.enzyme !== undefined)
    notes.push('[E] was given but is not yet used: the plan assumes [E] well below Ki (no tight-binding model in the plan)');
  const { onProgress: _ignored, notes: _notes, ...plain } = request;
  return {
    request: plain,
    recommended: out[0],
    candidates: out,
    gridsScreened: search.gridsScreened,
    analysisOptions: request.simulations > 0 ? { ...monteCarloAnalysisOptions(request.noise) } : null,
    assumptions: planAssumptions(request),
    notes,
  };
}

export function planAssumptions(r: PlanRequest): string[] {
  const noise = r.noise.model === 'constant' ? `constant noise, SD ${r.noise.level} (rate units, Vmax ${r.prior.vmax})` : `proportional noise, CV ${r.noise.level}`;
  return [
    `the models and cautions of the analysis hold (initial rates, reversible binding at equilibrium, [E] well below Ki, no time-dependent inhibition, aggregation or optical interference)`,
    `the noise is ${noise}, independent between wells, with no plate or edge effects`,
    `the constants lie in the stated ranges; the predictions are averages over those ranges (mixed inhibitors at alpha 0.25 and 4)`,
    `the mechanisms in play are ${r.mechanisms.join(', ')}`,
    `predicted shares are from ${r.simulations > 0 ? `${r.simulations} simulations per design and mechanism` : 'no simulation (information only)'}; they are estimates with their own sampling error`,
  ];
}

