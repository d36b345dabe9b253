/**
 * Which error model fits the scatter? The best mechanism is refitted under each candidate error
 * model and the fits are compared by AICc computed from the weighted Gaussian likelihood, which
 * includes the log weights and so is comparable across error models fitted to the same rates
 * (src/fit/error-models.ts; Carroll and Ruppert 1988, ch. 2). All candidates have one variance
 * parameter, so this is in effect a likelihood comparison. A chosen model whose AICc exceeds the
 * best by more than 10 is "clearly worse" (Burnham and Anderson 2002, sec. 2.6: essentially no
 * support).
 */
import type { MechanismModel } from '../../models/types.js';
import { fitMechanism, type MechanismFit } from '../../fit/fit-mechanism.js';
import type { ErrorModel } from '../../fit/error-models.js';
import type { FitData } from '../../fit/fit-data.js';
import { aicc } from '../selection/information-criteria.js';

export const CLEARLY_WORSE_DELTA = 10;

export interface ErrorModelScore {
  errorModel: ErrorModel;
  logLik: number;
  aicc: number;
  delta: number;
}

export interface ErrorModelCheck {
  mechanism: MechanismModel['mechanism'];
  chosen: ErrorModel;
  best: ErrorModel;
  scores: ErrorModelScore[];
  /** the chosen error model's AICc exceeds the best one's by more than CLEARLY_WORSE_DELTA */
  clearlyWorse: boolean;
  /** candidates not scored, with the reason */
  skipped: Array<{ errorModel: ErrorModel; reason: string }>;
}

/** The error models that can be scored on these data. */
export function candidateErrorModels(data: FitData): { usable: ErrorModel[]; skipped: ErrorModelCheck['skipped'] } {
  const usable: ErrorModel[] = ['constant'];
  const skipped: ErrorModelCheck['skipped'] = [];
  const positive = data.v.every((x) => x > 0);
  for (const m of ['proportional', 'sqrt'] as const) {
    if (positive) usable.push(m);
    else skipped.push({ errorModel: m, reason: 'needs positive rates' });
  }
  if (data.sd) usable.push('column');
  return { usable, skipped };
}

function scoreFit(fit: MechanismFit): number {
  return aicc(fit.logLik, fit.p + 1, fit.n);
}

/** Compares error models on one mechanism, reusing the fit already made under the chosen one. */
export function checkErrorModel(chosenFit: MechanismFit, data: FitData): ErrorModelCheck {
  const { usable, skipped } = candidateErrorModels(data);
  const fits = usable.map((em) =>
    em === chosenFit.errorModel ? chosenFit : fitMechanism(chosenFit.model, data, em, { extraStarts: [Array.from(chosenFit.params)] }),
  );
  if (!usable.includes(chosenFit.errorModel)) fits.push(chosenFit);
  const raw = fits.map((f) => ({ errorModel: f.errorModel, logLik: f.logLik, aicc: scoreFit(f) }));
  const best = raw.reduce((a, b) => (b.aicc < a.aicc ? b : a));
  const scores = raw.map((r) => ({ ...r, delta: r.aicc - best.aicc }));
  const chosen = scores.find((s) => s.errorModel === chosenFit.errorModel)!;
  return {
    mechanism: chosenFit.mechanism,
    chosen: chosenFit.errorModel,
    best: best.errorModel,
    scores,
    clearlyWorse: chosen.delta > CLEARLY_WORSE_DELTA,
    skipped,
  };
}
