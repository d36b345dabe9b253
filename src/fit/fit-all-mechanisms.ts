/**
 * Fits every mechanism of the registry to the same data, feeding each model warm starts from the
 * models nested in it: the inhibited models start (among others) from the no-inhibition solution,
 * and mixed starts from the competitive, uncompetitive and noncompetitive solutions. Since the
 * engine only accepts steps that lower the SSE, a model warm-started from a nested solution ends
 * no worse than that solution (with fixed weights), which is the multi-start check of the nesting.
 */
import { MECHANISMS } from '../models/index.js';
import type { Mechanism, MechanismModel } from '../models/types.js';
import type { ErrorModel } from './error-models.js';
import { maxInhibitor, type FitData } from './fit-data.js';
import { domainEdge, fitAtParams, fitMechanism, type FitOptions, type MechanismFit } from './fit-mechanism.js';

/** A constant far above the tested inhibitor range, used to start an arm "switched off". */
function farConstant(data: FitData): number {
  return 100 * (maxInhibitor(data) || 1);
}

/**
 * The parameters of `fuller` that reproduce a `simpler` solution: shared names carry over, a
 * missing inhibition constant is set to `off` (its arm switched off), and noncompetitive inside
 * mixed sets Kiu = Ki. Null when `simpler` is not nested in `fuller` this way.
 */
export function embedNested(simpler: MechanismModel, fuller: MechanismModel, params: ArrayLike<number>, off: (name: string) => number): number[] | null {
  if (simpler.params.length >= fuller.params.length) return null;
  const value = (name: string): number | undefined => {
    const j = simpler.params.indexOf(name as never);
    return j >= 0 ? params[j] : undefined;
  };
  if (simpler.mechanism === 'noncompetitive' && fuller.mechanism !== 'mixed') return null;
  return fuller.params.map((name) => {
    if (simpler.mechanism === 'noncompetitive' && name === 'Kiu') return value('Ki')!;
    return value(name) ?? off(name);
  });
}

function warmStarts(model: MechanismModel, done: Map<Mechanism, MechanismFit>, data: FitData): number[][] {
  const far = farConstant(data);
  const sources: Mechanism[] = model.mechanism === 'mixed' ? ['competitive', 'uncompetitive', 'noncompetitive'] : model.params.length === 3 ? ['none'] : [];
  const starts: number[][] = [];
  for (const m of sources) {
    const fit = done.get(m);
    const embedded = fit && embedNested(fit.model, model, fit.params, () => (model.mechanism === 'mixed' ? far : far / 10));
    if (embedded) starts.push(embedded);
  }
  return starts;
}

/** Weighted SSE of a model at given parameters, with the weights held fixed. */
function weightedSseAt(model: MechanismModel, data: FitData, params: ArrayLike<number>, weights: Float64Array): number {
  let sse = 0;
  for (let k = 0; k < data.v.length; k++) {
    const r = data.v[k] - model.rate(params, data.s[k], data.i[k], data.e?.[k]);
    sse += weights[k] * r * r;
  }
  return sse;
}

/**
 * The nesting check: at the fuller model's final weights, no nested solution may have a lower SSE,
 * since the nested solution is a limit of the fuller model. Where one does, the search stalled
 * (typically with a constant run off to where its gradient vanishes), and the fuller model's fit
 * is replaced by that solution embedded, the extra constant at the edge of its domain (reported as
 * "not detected" downstream). With fixed weights this is simply SSE_fuller <= SSE_nested.
 */
function respectNesting(fit: MechanismFit, done: Map<Mechanism, MechanismFit>, data: FitData, errorModel: ErrorModel, options: Pick<FitOptions, 'weightMultipliers'>): MechanismFit {
  let best = fit;
  let bestSse = fit.sse;
  for (const nested of done.values()) {
    const embedded = embedNested(nested.model, fit.model, nested.params, (name) => domainEdge(fit.model, data, name));
    if (!embedded) continue;
    const sse = weightedSseAt(fit.model, data, embedded, fit.weights);
    if (!(sse < bestSse)) continue;
    bestSse = sse;
    const candidate = fitAtParams(
      fit.model,
      data,
      errorModel,
      embedded,
      `Best fit is a limit of this model: the ${nested.mechanism} solution with the extra constant switched off.`,
      options.weightMultipliers,
    );
    best = { ...candidate, startsTried: fit.startsTried, startsReachingBest: fit.startsReachingBest, reweightPasses: fit.reweightPasses };
  }
  return best;
}

/** Fits all registered mechanisms; results in registry order (simplest first). */
export function fitAllMechanisms(
  data: FitData,
  errorModel: ErrorModel,
  models: readonly MechanismModel[] = MECHANISMS,
  options: Pick<FitOptions, 'weightMultipliers'> = {},
): MechanismFit[] {
  const done = new Map<Mechanism, MechanismFit>();
  for (const model of models) {
    const fit = fitMechanism(model, data, errorModel, { ...options, extraStarts: warmStarts(model, done, data) });
    done.set(model.mechanism, respectNesting(fit, done, data, errorModel, options));
  }
  return models.map((m) => done.get(m.mechanism)!);
}
