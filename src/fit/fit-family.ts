/**
 * Fits the models of a non-classic family (tight-binding, partial) after the classic five, with
 * warm starts and the nesting check derived from the registry's containment rules
 * (src/models/registry.ts) rather than from hand-written tables:
 *  - every model starts (besides its own data-driven starts) from each already fitted model it
 *    contains, embedded by the rules with a switched-off constant at 100 x the highest [I] and a
 *    vanishing beta at 0.01, and from the classic model of the same mechanism (same parameter
 *    names; tight-binding constants also at 1/5, since the classic fit of tight-binding
 *    data overestimates them; partial models also with beta 0.2 and 0.5);
 *  - the nesting check of src/fit/nesting-limit.ts, as for the classic five.
 */
import type { MechanismModel, ParamName } from '../models/types.js';
import { embedByRules } from '../models/registry.js';
import type { ErrorModel } from './error-models.js';
import { maxInhibitor, type FitData } from './fit-data.js';
import { fitMechanism, type MechanismFit } from './fit-mechanism.js';
import { respectNesting } from './nesting-limit.js';

function classicCounterpartStarts(model: MechanismModel, classic: readonly MechanismFit[]): number[][] {
  const same = classic.find((f) => f.mechanism === model.mechanism);
  if (!same) return [];
  const base = (factor: number, beta: number) =>
    model.params.map((name) => {
      const j = same.model.params.indexOf(name);
      if (j >= 0) return name === 'Ki' || name === 'Kiu' ? same.params[j] * factor : same.params[j];
      if (name === 'beta') return beta;
      if (name === 'Kiu') return same.params[same.model.params.indexOf('Ki')] * 3;
      return NaN;
    });
  const out =
    model.family === 'tight-binding' ? [base(1, NaN), base(0.2, NaN)] : [base(1, 0.2), base(0.5, 0.2), base(0.5, 0.5)];
  return out.filter((s) => s.every(Number.isFinite));
}

/** Fits `models` (one family, simplest first); `classic` are the classic fits of the same data and error model. */
export function fitFamily(models: readonly MechanismModel[], data: FitData, errorModel: ErrorModel, classic: readonly MechanismFit[]): MechanismFit[] {
  const far = 100 * (maxInhibitor(data) || 1);
  const done: MechanismFit[] = [...classic];
  const out: MechanismFit[] = [];
  for (const model of models) {
    const warm: number[][] = [];
    for (const f of done) {
      const e = embedByRules(f.model, model, f.params, (_name: ParamName, to) => (to === 'zero' ? 0.01 : far));
      if (e) warm.push(e);
    }
    warm.push(...classicCounterpartStarts(model, classic));
    let fit = fitMechanism(model, data, errorModel, { extraStarts: warm });
    fit = respectNesting(fit, done, data, errorModel);
    done.push(fit);
    out.push(fit);
  }
  return out;
}
