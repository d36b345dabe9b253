/**
 * Fits every mechanism of the registry to the same data, feeding each model warm starts from the
 * models nested in it: the inhibited models start (among others) from the no-inhibition solution,
 * and mixed starts from the competitive, uncompetitive and noncompetitive solutions (derived from
 * the models' containment rules, src/models/registry.ts). Since the
 * engine only accepts steps that lower the SSE, a model warm-started from a nested solution ends
 * no worse than that solution (with fixed weights), which is the multi-start check of the nesting.
 */
import { MECHANISMS } from '../models/index.js';
import type { MechanismModel } from '../models/types.js';
import { containmentOf, embedByRules, modelId } from '../models/registry.js';
import type { ErrorModel } from './error-models.js';
import { maxInhibitor, type FitData } from './fit-data.js';
import { fitMechanism, type FitOptions, type MechanismFit } from './fit-mechanism.js';
import { respectNesting } from './nesting-limit.js';

/** A constant far above the tested inhibitor range, used to start an arm "switched off". */
function farConstant(data: FitData): number {
  return 100 * (maxInhibitor(data) || 1);
}

/**
 * Warm starts from the largest models contained in this one (by the registry's containment rules,
 * src/models/registry.ts): mixed from competitive, uncompetitive and noncompetitive, each
 * three-parameter model from no inhibition. A constant the smaller model lacks starts switched off:
 * at `far` inside mixed, at far/10 inside a three-parameter model.
 */
function warmStarts(model: MechanismModel, done: Map<string, MechanismFit>, data: FitData): number[][] {
  const far = farConstant(data);
  const contained = (model.contains ?? []).map((c) => done.get(c.model)).filter((f): f is MechanismFit => f !== undefined);
  const largest = contained.filter((f) => !contained.some((g) => g !== f && containmentOf(f.model, g.model)));
  const starts: number[][] = [];
  for (const fit of largest) {
    const embedded = embedByRules(fit.model, model, fit.params, () => (model.params.length >= 4 ? far : far / 10));
    if (embedded) starts.push(embedded);
  }
  return starts;
}

/** Fits all registered mechanisms; results in registry order (simplest first). */
export function fitAllMechanisms(
  data: FitData,
  errorModel: ErrorModel,
  models: readonly MechanismModel[] = MECHANISMS,
  options: Pick<FitOptions, 'weightMultipliers'> = {},
): MechanismFit[] {
  const done = new Map<string, MechanismFit>();
  for (const model of models) {
    const fit = fitMechanism(model, data, errorModel, { ...options, extraStarts: warmStarts(model, done, data) });
    done.set(modelId(model), respectNesting(fit, done.values(), data, errorModel, options.weightMultipliers));
  }
  return models.map((m) => done.get(modelId(m))!);
}
