/** The "checks" block of the text summary: the main diagnostic flags of the winning model. */
import type { AnalysisResult } from '../analysis/types.js';
import { pPhrase, sig, valueWithUnit } from '../text/format-number.js';
import { pointsThatStandOut } from '../evidence/diagnostics/standing-out.js';

export function diagnosticLines(result: AnalysisResult): string[] {
  const mech = result.verdict.mechanism;
  const d = mech ? result.residualChecks?.[mech] : undefined;
  const lines: string[] = [];
  if (d) {
    lines.push(`  runs of residual signs along [S]: ${d.runs.runs} (expected ${sig(d.runs.expectedRuns, 3)}), too-few-runs ${pPhrase(d.runs.pTooFew)}`);
    lines.push(
      d.lackOfFit.applicable
        ? `  lack of fit against replicate scatter: F = ${sig(d.lackOfFit.F, 3)}, ${pPhrase(d.lackOfFit.p)}`
        : `  lack of fit: not tested (${d.lackOfFit.reason})`,
    );
    lines.push(`  residual trend vs [S] ${pPhrase(d.trends.substrate.p)}, vs [I] ${pPhrase(d.trends.inhibitor.p)}, vs fitted ${pPhrase(d.trends.fitted.p)}`);
    if (d.normality) lines.push(`  normality of studentised residuals (Shapiro-Wilk): W = ${d.normality.W.toFixed(3)}, ${pPhrase(d.normality.p)}`);
    const u = result.input.units;
    const withUnit = (x: number, unit: string | null) => valueWithUnit(sig(x), unit);
    const { suspects, leverageOnly } = pointsThatStandOut(d);
    if (leverageOnly) lines.push(`  ${leverageOnly} high-leverage point${leverageOnly > 1 ? 's sit' : ' sits'} on the curve (a property of the design); not flagged`);
    for (const s of suspects) {
      const line = result.table.points[s.index]?.line;
      lines.push(`  ! suspect point, line ${line ?? '?'} ([S] ${withUnit(s.substrate, u.substrate)}, [I] ${withUnit(s.inhibitor, u.inhibitor)}, rate ${withUnit(s.rate, u.rate)}): ${s.why}, studentised ${sig(s.studentised, 3)}, leverage ${sig(s.leverage, 2)}`);
    }
  }
  const em = result.errorModelCheck;
  if (em) {
    const scores = em.scores.map((s) => `${s.errorModel} ${s.delta === 0 ? 'best' : '+' + s.delta.toFixed(1)}`).join(', ');
    lines.push(`  error models (ΔAICc on ${em.mechanism}): ${scores}${em.clearlyWorse ? `  ! ${em.chosen} is clearly worse than ${em.best}` : ''}`);
  }
  const robust = result.robust;
  if (robust) {
    lines.push(
      robust.downWeighted.length === 0
        ? '  robust refit: no point down-weighted'
        : `  robust refit: ${robust.downWeighted.length} point(s) down-weighted (lines ${robust.downWeighted.map((x) => x.line).join(', ')}); robust call: ${robust.verdict.mechanism}${robust.changesVerdict ? ' (DIFFERENT)' : ' (same)'}`,
    );
  }
  return lines;
}
