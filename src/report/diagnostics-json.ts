/** The diagnostics part of the JSON document: residual checks, per-series fits, error model, robust refit. */
import type { AnalysisResult } from '../analysis/types.js';
import type { ResidualDiagnostics } from '../evidence/residual-diagnostics.js';
import type { Json } from './results-json.js';

function num(x: number | null | undefined): number | null {
  return x === null || x === undefined || !Number.isFinite(x) ? null : x;
}

function residualJson(d: ResidualDiagnostics, result: AnalysisResult): { [key: string]: Json } {
  const lof = d.lackOfFit;
  return {
    runs: { runs: d.runs.runs, expected: num(d.runs.expectedRuns), method: d.runs.method, pTooFew: num(d.runs.pTooFew), pTwoSided: num(d.runs.pTwoSided) },
    trends: Object.fromEntries(Object.entries(d.trends).map(([k, t]) => [k, { rho: num(t.rho), p: num(t.p) }])),
    lackOfFit: lof.applicable
      ? { applicable: true, f: num(lof.F), df: [lof.lackOfFitDf, lof.pureErrorDf], p: num(lof.p) }
      : { applicable: false, reason: lof.reason },
    normality: d.normality ? { test: 'Shapiro-Wilk', w: num(d.normality.W), p: num(d.normality.p) } : null,
    suspects: d.suspects.map((s) => ({
      line: result.table.points[s.index]?.line ?? null,
      substrate: s.substrate,
      inhibitor: s.inhibitor,
      rate: s.rate,
      studentised: num(s.studentised),
      leverage: num(s.leverage),
      why: s.why,
    })),
  };
}

export function diagnosticsJson(result: AnalysisResult): { [key: string]: Json } {
  const residuals: { [key: string]: Json } = {};
  for (const [mech, d] of Object.entries(result.residualChecks ?? {})) if (d) residuals[mech] = residualJson(d, result);
  const em = result.errorModelCheck;
  const out: { [key: string]: Json } = {
    residuals,
    seriesFits: (result.seriesFits ?? []).map((s) => ({ inhibitor: s.inhibitor, n: s.n, converged: s.converged, Vmax: num(s.Vmax), seVmax: num(s.seVmax), Km: num(s.Km), seKm: num(s.seKm) })),
    seriesDisagreements: (result.seriesDisagreements ?? []).map((d) => ({ inhibitor: d.inhibitor, quantity: d.quantity, separate: num(d.separate), global: num(d.global), z: num(d.z) })),
    errorModelCheck: em
      ? {
          mechanism: em.mechanism,
          chosen: em.chosen,
          best: em.best,
          clearlyWorse: em.clearlyWorse,
          scores: em.scores.map((s) => ({ errorModel: s.errorModel, logLik: num(s.logLik), aicc: num(s.aicc), delta: num(s.delta) })),
          skipped: em.skipped.map((s) => ({ errorModel: s.errorModel, reason: s.reason })),
        }
      : null,
    errorModelChoice: result.errorModelChoice
      ? { automatic: result.errorModelChoice.automatic, scores: result.errorModelChoice.scores.map((s) => ({ errorModel: s.errorModel, bestAicc: num(s.bestAicc) })) }
      : null,
  };
  if (result.robust) {
    out.robust = {
      method: 'Tukey bisquare, c = 4.685, weights found on mixed',
      downWeighted: result.robust.downWeighted.map((d) => ({ line: d.line, substrate: d.substrate, inhibitor: d.inhibitor, rate: d.rate, weight: num(d.weight) })),
      ranking: result.robust.ranking.map((m) => ({ mechanism: m.mechanism, aicc: num(m.aicc), weight: num(m.weight) })),
      verdict: { mechanism: result.robust.verdict.mechanism, outcome: result.robust.verdict.outcome, headline: result.robust.verdict.headline },
      changesVerdict: result.robust.changesVerdict,
    };
  }
  return out;
}
