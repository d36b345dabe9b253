/**
 * The diagnostics stage: residual checks of every model, per-series fits, the error-model check,
 * design checks that need fitted constants, and (on request) the robust refit. Turns what it finds
 * into coded verdict caveats (src/evidence/verdict/caveat.ts) with their numbers; src/wording/caveat-words.ts
 * words them.
 *
 * Thresholds (DEVELOPERS.md, "The verdict rule"): runs test "too few runs" p < 0.01 and lack-of-fit
 * p < 0.01 block a decisive call; trends (p < 0.01), non-normal residuals (p < 0.01), suspect points
 * and per-series disagreements are reported without blocking; an error model clearly worse than
 * another blocks only if the call changes under the better one.
 */
import type { Mechanism } from '../models/types.js';
import type { FitData } from '../fit/fit-data.js';
import type { ErrorModel } from '../fit/error-models.js';
import { residualDiagnostics, STUDENTISED_LIMIT, type ResidualDiagnostics } from '../evidence/diagnostics/residual-diagnostics.js';
import { largeResidualPoints } from '../evidence/diagnostics/standing-out.js';
import { SERIES_SE_LIMIT, seriesDisagreements, seriesFits, type SeriesDisagreement } from '../evidence/diagnostics/series-fits.js';
import type { ErrorModelCheck } from '../evidence/diagnostics/error-model-check.js';
import { designCaveats } from '../evidence/checks/design-caveats.js';
import type { Caveat } from '../evidence/verdict/verdict.js';
import type { ModelResult, SeriesFit } from './types.js';

export const DIAGNOSTIC_LEVEL = 0.01;

interface DiagnosticsStage {
  residuals: Partial<Record<Mechanism, ResidualDiagnostics>>;
  seriesFits: SeriesFit[];
  seriesDisagreements: SeriesDisagreement[];
  errorModelCheck: ErrorModelCheck | null;
}

/**
 * Residual checks of every model (or, with `winnerOnly`, of the winner alone: what a batch summary
 * needs), the per-series fits, and where they disagree with the winner's global fit.
 */
export function runDiagnostics(models: readonly ModelResult[], data: FitData, errorModel: ErrorModel, winner: ModelResult, winnerOnly = false): DiagnosticsStage {
  const residuals: DiagnosticsStage['residuals'] = {};
  for (const m of models) if (m.fit.df > 0 && (!winnerOnly || m.mechanism === winner.mechanism)) residuals[m.mechanism] = residualDiagnostics(m.fit, data);
  const series = seriesFits(data, errorModel);
  return { residuals, seriesFits: series, seriesDisagreements: seriesDisagreements(winner.fit, series), errorModelCheck: null };
}

function detectedValue(m: ModelResult, name: string): number | undefined {
  const e = m.estimates.find((x) => x.name === name);
  return e && e.detected && e.value !== null ? e.value : undefined;
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
  const mechanism = winner.mechanism;
  if (d) {
    if (d.runs.pTooFew < DIAGNOSTIC_LEVEL) out.push({ code: 'residual-runs', mechanism, p: d.runs.pTooFew, blocking: true });
    if (d.lackOfFit.applicable && d.lackOfFit.p < DIAGNOSTIC_LEVEL) out.push({ code: 'lack-of-fit', mechanism, p: d.lackOfFit.p, blocking: true });
    for (const key of ['substrate', 'inhibitor', 'fitted'] as const) {
      const t = d.trends[key];
      if (t.p < DIAGNOSTIC_LEVEL) out.push({ code: `trend-${key}` as const, mechanism, rho: t.rho, p: t.p, blocking: false });
    }
    if (d.normality && d.normality.p < DIAGNOSTIC_LEVEL) out.push({ code: 'non-normal', mechanism, p: d.normality.p, blocking: false });
    const large = largeResidualPoints(d);
    if (large.length)
      out.push({ code: 'suspect-points', count: large.length, limit: STUDENTISED_LIMIT, robustRefitRuns: Boolean(options.robustRefitRuns), blocking: false });
  }
  const disagreements = stage.seriesDisagreements;
  if (disagreements.length && !options.noiseFree)
    out.push({ code: 'series-disagree', mechanism, count: disagreements.length, seLimit: SERIES_SE_LIMIT, blocking: false });
  const km = detectedValue(winner, 'Km');
  const ks = ['Ki', 'Kiu'].map((n) => detectedValue(winner, n)).filter((x): x is number => x !== undefined);
  out.push(...designCaveats(data, { Km: km ?? NaN, ...(ks.length ? { K: Math.min(...ks) } : {}) }));
  return out;
}

/** The error-model check's caveat (blocking decided by the caller: the call changes under the better model). */
export function errorModelCaveat(check: ErrorModelCheck, callChangesUnderBest: Mechanism | null): Caveat | null {
  if (!check.clearlyWorse) return null;
  const best = check.scores.find((s) => s.errorModel === check.best)!;
  const chosen = check.scores.find((s) => s.errorModel === check.chosen)!;
  return { code: 'error-model', chosen: check.chosen, best: check.best, aiccGap: chosen.aicc - best.aicc, callUnderBest: callChangesUnderBest, blocking: callChangesUnderBest !== null };
}
