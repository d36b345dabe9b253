/** The diagnostics part of the JSON document: residual checks, per-series fits, error model, robust refit. */
import type { AnalysisResult } from '../analysis/types.js';
import type { ResidualDiagnostics } from '../evidence/diagnostics/residual-diagnostics.js';
import { jsonNumber, type Json } from './json-values.js';
import { wordVerdict } from '../wording/verdict-words.js';


function residualJson(d: ResidualDiagnostics, result: AnalysisResult): { [key: string]: Json } {
  const lof = d.lackOfFit;
  return {
    runs: { runs: d.runs.runs, expected: jsonNumber(d.runs.expectedRuns), method: d.runs.method, pTooFew: jsonNumber(d.runs.pTooFew), pTwoSided: jsonNumber(d.runs.pTwoSided) },
    trends: Object.fromEntries(Object.entries(d.trends).map(([k, t]) => [k, { rho: jsonNumber(t.rho), p: jsonNumber(t.p) }])),
    lackOfFit: lof.applicable
      ? { applicable: true, f: jsonNumber(lof.F), df: [lof.lackOfFitDf, lof.pureErrorDf], p: jsonNumber(lof.p) }
      : { applicable: false, reason: lof.reason },
    normality: d.normality ? { test: 'Shapiro-Wilk', w: jsonNumber(d.normality.W), p: jsonNumber(d.normality.p) } : null,
    suspects: d.suspects.map((s) => ({
      line: result.table.points[s.index]?.line ?? null,
      substrate: s.substrate,
      inhibitor: s.inhibitor,
      rate: s.rate,
      studentised: jsonNumber(s.studentised),
      leverage: jsonNumber(s.leverage),
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
    seriesFits: (result.seriesFits ?? []).map((s) => ({ inhibitor: s.inhibitor, n: s.n, converged: s.converged, Vmax: jsonNumber(s.Vmax), seVmax: jsonNumber(s.seVmax), Km: jsonNumber(s.Km), seKm: jsonNumber(s.seKm) })),
    seriesDisagreements: (result.seriesDisagreements ?? []).map((d) => ({ inhibitor: d.inhibitor, quantity: d.quantity, separate: jsonNumber(d.separate), global: jsonNumber(d.global), z: jsonNumber(d.z) })),
    errorModelCheck: em
      ? {
          mechanism: em.mechanism,
          chosen: em.chosen,
          best: em.best,
          clearlyWorse: em.clearlyWorse,
          scores: em.scores.map((s) => ({ errorModel: s.errorModel, logLik: jsonNumber(s.logLik), aicc: jsonNumber(s.aicc), delta: jsonNumber(s.delta) })),
          skipped: em.skipped.map((s) => ({ errorModel: s.errorModel, reason: s.reason })),
        }
      : null,
    errorModelChoice: result.errorModelChoice
      ? { automatic: result.errorModelChoice.automatic, scores: result.errorModelChoice.scores.map((s) => ({ errorModel: s.errorModel, bestAicc: jsonNumber(s.bestAicc) })) }
      : null,
  };
  if (result.robust) {
    out.robust = {
      method: 'Tukey bisquare, c = 4.685, weights found on mixed',
      downWeighted: result.robust.downWeighted.map((d) => ({ line: d.line, substrate: d.substrate, inhibitor: d.inhibitor, rate: d.rate, weight: jsonNumber(d.weight) })),
      ranking: result.robust.ranking.map((m) => ({ mechanism: m.mechanism, aicc: jsonNumber(m.aicc), weight: jsonNumber(m.weight) })),
      verdict: { mechanism: result.robust.verdict.mechanism, outcome: result.robust.verdict.outcome, headline: wordVerdict(result.robust.verdict).headline },
      changesVerdict: result.robust.changesVerdict,
    };
  }
  return out;
}
