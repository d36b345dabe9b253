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
import type { FitData } from './fit-data.js';
import { fitMechanism, type FitOptions, type MechanismFit } from './fit-mechanism.js';

/** A constant far above the tested inhibitor range, used to start an arm "switched off". */
function farConstant(data: FitData): number {
  let imax = 0;
  for (const x of data.i) imax = Math.max(imax, x);
  return 100 * (imax || 1);
}

function warmStarts(model: MechanismModel, done: Map<Mechanism, MechanismFit>, data: FitData): number[][] {
  const far = farConstant(data);
  const none = done.get('none');
  const starts: number[][] = [];
  if (model.mechanism === 'mixed') {
    const c = done.get('competitive');
    const u = done.get('uncompetitive');
    const nc = done.get('noncompetitive');
    if (c) starts.push([c.params[0], c.params[1], c.params[2], far]);
    if (u) starts.push([u.params[0], u.params[1], far, u.params[2]]);
    if (nc) starts.push([nc.params[0], nc.params[1], nc.params[2], nc.params[2]]);
  } else if (model.params.length === 3 && none) {
    starts.push([none.params[0], none.params[1], far / 10]);
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
  const done = new Map<Mechanism, MechanismFit>();
  for (const model of models) {
    const fit = fitMechanism(model, data, errorModel, { ...options, extraStarts: warmStarts(model, done, data) });
    done.set(model.mechanism, fit);
  }
  return models.map((m) => done.get(m.mechanism)!);
}
