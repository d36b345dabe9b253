/**
 * The diagnostics stage: residual checks of every model, per-series fits, the error-model check,
 * design checks that need fitted constants, and (on request) the robust refit. Turns what it finds
 * into verdict caveats (src/evidence/verdict.ts), each with a plain message and, where one exists,
 * the experiment or action that would remove it.
 *
 * Thresholds (DEVELOPERS.md, "The verdict rule"): runs test "too few runs" p < 0.01 and lack-of-fit
 * p < 0.01 block a decisive call; trends (p < 0.01), non-normal residuals (p < 0.01), suspect points
 * and per-series disagreements are reported without blocking; an error model clearly worse than
 * another blocks only if the call changes under the better one.
 */
import type { Mechanism } from '../models/types.js';
import type { FitData } from '../fit/fit-data.js';
import type { ErrorModel } from '../fit/error-models.js';
import { residualDiagnostics, type ResidualDiagnostics } from '../evidence/residual-diagnostics.js';
import { seriesDisagreements, seriesFits, type SeriesDisagreement } from '../evidence/series-fits.js';
import type { ErrorModelCheck } from '../evidence/error-model-check.js';
import { designCaveats } from '../evidence/design-caveats.js';
import type { Caveat } from '../evidence/verdict.js';
import type { ModelResult, SeriesFit } from './types.js';
import { pPhrase } from '../text/format-number.js';

export const DIAGNOSTIC_LEVEL = 0.01;

interface DiagnosticsStage {
  residuals: Partial<Record<Mechanism, ResidualDiagnostics>>;
  seriesFits: SeriesFit[];
  seriesDisagreements: SeriesDisagreement[];
  errorModelCheck: ErrorModelCheck | null;
}

/**
 * Residual checks of every model (or, with `only`, of that model alone: what a batch summary
 * needs), and the per-series fits.
 */
export function runDiagnostics(models: readonly ModelResult[], data: FitData, errorModel: ErrorModel, only?: Mechanism): DiagnosticsStage {
  const residuals: DiagnosticsStage['residuals'] = {};
  for (const m of models) if (m.fit.df > 0 && (only === undefined || m.mechanism === only)) residuals[m.mechanism] = residualDiagnostics(m.fit, data);
  const series = seriesFits(data, errorModel);
  return { residuals, seriesFits: series, seriesDisagreements: [], errorModelCheck: null };
}

function detectedValue(m: ModelResult, name: string): number | undefined {
  const e = m.estimates.find((x) => x.name === name);
  return e && e.detected && e.value !== null ? e.value : undefined;
}

/** Caveats about the fit of the given (preliminary winning) model. */
/** Points whose studentised residual is beyond the suspect cut-off (not high leverage alone). */
export function largeResidualPoints(d: ResidualDiagnostics | undefined): ResidualDiagnostics['suspects'] {
  return (d?.suspects ?? []).filter((s) => s.why !== 'high leverage');
}

interface CaveatOptions {
  /** noise-free rates: residual checks describe rounding only, so only the design caveats are given */
  noiseFree?: boolean;
  /** the robust refit runs on these data (it is then the evidence on suspect points, not advice) */
  robustRefitRuns?: boolean;
}

export function caveatsFor(winner: ModelResult, stage: DiagnosticsStage, data: FitData, options: CaveatOptions = {}): Caveat[] {
  const out: Caveat[] = [];
  const d = options.noiseFree ? undefined : stage.residuals[winner.mechanism];
  const name = winner.mechanism;
  if (d) {
    if (d.runs.pTooFew < DIAGNOSTIC_LEVEL)
      out.push({
        code: 'residual-runs',
        message: `the ${name} residuals run in long same-sign stretches along [S] (runs test ${pPhrase(d.runs.pTooFew)}): the model misses systematically`,
        blocking: true,
        suggestion: 'look at the residual panels; consider a mechanism outside the five (partial or tight-binding inhibition) or a data problem',
      });
    if (d.lackOfFit.applicable && d.lackOfFit.p < DIAGNOSTIC_LEVEL)
      out.push({
        code: 'lack-of-fit',
        message: `the ${name} fit departs from the replicate means more than replicate scatter allows (lack-of-fit ${pPhrase(d.lackOfFit.p)})`,
        blocking: true,
        suggestion: 'check for outliers, drift across the plate, or a mechanism outside the five',
      });
    for (const [key, label] of [['substrate', '[S]'], ['inhibitor', '[I]'], ['fitted', 'the fitted rate']] as const) {
      const t = d.trends[key];
      if (t.p < DIAGNOSTIC_LEVEL)
        out.push({ code: `trend-${key}`, message: `the ${name} residuals drift with ${label} (Spearman rho ${t.rho.toFixed(2)}, ${pPhrase(t.p)})`, blocking: false });
    }
    if (d.normality && d.normality.p < DIAGNOSTIC_LEVEL)
      out.push({
        code: 'non-normal',
        message: `the ${name} residuals are not normal (Shapiro-Wilk ${pPhrase(d.normality.p)}): intervals may be off`,
        blocking: false,
        suggestion: 'check the error model and look for outliers (--robust)',
      });
    const large = largeResidualPoints(d);
    if (large.length)
      out.push({
        code: 'suspect-points',
        message: `${large.length} point${large.length > 1 ? 's have' : ' has'} a studentised residual beyond 3 (listed in the report)`,
        blocking: false,
        suggestion: options.robustRefitRuns
          ? 'inspect the flagged wells (listed in the report); the robust refit says whether the call depends on them'
          : 'inspect the flagged wells; rerun with --robust to see whether the call depends on them',
      });
  }
  const disagreements = seriesDisagreements(winner.fit, stage.seriesFits);
  stage.seriesDisagreements = disagreements;
  if (disagreements.length && !options.noiseFree)
    out.push({
      code: 'series-disagree',
      message: `fitted alone, ${disagreements.length} apparent constant${disagreements.length > 1 ? 's differ' : ' differs'} from the ${name} global fit by more than 3 SE`,
      blocking: false,
    });
  const km = detectedValue(winner, 'Km');
  const ks = ['Ki', 'Kiu'].map((n) => detectedValue(winner, n)).filter((x): x is number => x !== undefined);
  out.push(...designCaveats(data, { Km: km ?? NaN, ...(ks.length ? { K: Math.min(...ks) } : {}) }));
  return out;
}

/** Runs the error-model check on the winner and words its caveat (blocking decided by the caller). */
export function errorModelCaveat(check: ErrorModelCheck, callChangesUnderBest: Mechanism | null): Caveat | null {
  if (!check.clearlyWorse) return null;
  const best = check.scores.find((s) => s.errorModel === check.best)!;
  const chosen = check.scores.find((s) => s.errorModel === check.chosen)!;
  const gap = (chosen.aicc - best.aicc).toFixed(1);
  return callChangesUnderBest
    ? {
        code: 'error-model',
        message: `the ${check.chosen} error model fits the scatter clearly worse than ${check.best} (AICc ${gap} higher), and under ${check.best} the call would be ${callChangesUnderBest}`,
        blocking: true,
        suggestion: `rerun with --error ${check.best} (or --error auto)`,
      }
    : {
        code: 'error-model',
        message: `the ${check.chosen} error model fits the scatter clearly worse than ${check.best} (AICc ${gap} higher); the call is the same under ${check.best}`,
        blocking: false,
        suggestion: `rerun with --error ${check.best} (or --error auto) for better intervals`,
      };
}

