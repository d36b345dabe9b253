/**
 * The two rules that sort the flagged points of a fit (src/evidence/diagnostics/residual-diagnostics.ts
 * flags a point whose externally studentised residual is beyond STUDENTISED_LIMIT, or whose leverage is
 * above LEVERAGE_FACTOR p/n), kept side by side so that the analysis and the report cannot drift apart:
 *
 * - a point has a large residual when it is off the curve beyond STUDENTISED_LIMIT, whatever its
 *   leverage. These points start the automatic robust refit and make the suspect-points caveat.
 * - a point stands out when it has a large residual, or high leverage together with a residual beyond
 *   LEVERAGED_RESIDUAL_LIMIT, where its pull on the fit matters. High leverage alone does not (it is a
 *   property of the design: the replicates at the highest [S] all have it). The report and the text
 *   summary list these points; results.json keeps every flagged point (`suspects`).
 *
 * Every point with a large residual stands out. The limit 2 is common practice (no source).
 */
import { type ResidualDiagnostics, type SuspectPoint } from './residual-diagnostics.js';

export const LEVERAGED_RESIDUAL_LIMIT = 2;

/** Off the curve beyond STUDENTISED_LIMIT (the flag is not high leverage alone). */
function hasLargeResidual(s: SuspectPoint): boolean {
  return s.why !== 'high leverage';
}

/** The flagged points with a large residual: the ones the robust refit and the caveat are about. */
export function largeResidualPoints(d: ResidualDiagnostics | undefined): SuspectPoint[] {
  return (d?.suspects ?? []).filter(hasLargeResidual);
}

/** Whether the report lists this flagged point (a large residual, or leverage with a residual beyond 2). */
export function standsOut(s: SuspectPoint): boolean {
  return hasLargeResidual(s) || Math.abs(s.studentised) > LEVERAGED_RESIDUAL_LIMIT;
}

/** The flagged points that stand out, and how many high-leverage points sit on the curve. */
export function pointsThatStandOut(d: ResidualDiagnostics): { suspects: SuspectPoint[]; leverageOnly: number } {
  const suspects = d.suspects.filter(standsOut);
  return { suspects, leverageOnly: d.suspects.length - suspects.length };
}
