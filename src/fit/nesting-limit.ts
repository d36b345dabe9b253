/**
 * The nesting check shared by the classic five (src/fit/fit-all-mechanisms.ts) and the other families
 * (src/fit/fit-family.ts). A nested model's solution is a limit of the fuller model (its extra constant
 * switched off: an inhibition constant at infinity, beta at zero), so at the fuller model's final
 * weights no nested solution may have a lower weighted SSE. Where one does, the search stalled
 * (typically with a constant run off to where its gradient vanishes) and the fit is replaced by that
 * solution embedded at the edge of the domain, reported as "not detected" downstream. With fixed
 * weights this is simply SSE_fuller <= SSE_nested. Containment comes from the registry's rules
 * (src/models/registry.ts).
 */
import { embedByRules, modelId } from '../models/registry.js';
import type { ErrorModel } from './error-models.js';
import type { FitData } from './fit-data.js';
import { domainEdge, domainLowEdge, fitAtParams, type MechanismFit } from './fit-mechanism.js';
import { weightedSseAt } from './weighted-sse.js';

/** `fit`, or the lowest-SSE embedding of a contained solution where one beats it at `fit`'s weights. */
export function respectNesting(
  fit: MechanismFit,
  contained: Iterable<MechanismFit>,
  data: FitData,
  errorModel: ErrorModel,
  weightMultipliers?: Float64Array,
): MechanismFit {
  let best = fit;
  let bestSse = fit.sse;
  for (const nested of contained) {
    const embedded = embedByRules(nested.model, fit.model, nested.params, (name, to) =>
      to === 'zero' ? domainLowEdge(fit.model, data, name) : domainEdge(fit.model, data, name),
    );
    if (!embedded) continue;
    const sse = weightedSseAt(fit.model, data, embedded, fit.weights);
    if (!(sse < bestSse)) continue;
    bestSse = sse;
    const note = `Best fit is a limit of this model: the ${modelId(nested.model)} solution with the extra constant switched off.`;
    const candidate = fitAtParams(fit.model, data, errorModel, embedded, note, weightMultipliers);
    best = { ...candidate, startsTried: fit.startsTried, startsReachingBest: fit.startsReachingBest, reweightPasses: fit.reweightPasses };
  }
  return best;
}
