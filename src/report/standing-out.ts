/**
 * Which flagged points the report calls suspect: those that stand out from the fit. A point with
 * a large studentised residual stands out; a point with high leverage alone does not (leverage is
 * a property of the design: the replicates at the highest [S] all have it), unless it is also off
 * the curve by more than LEVERAGED_RESIDUAL_LIMIT studentised units, where its pull on the fit
 * matters. The analysis keeps every flagged point (results.json `suspects`); only the wording of
 * the report and the text summary is filtered. The limit 2 is common practice (no source).
 */
import type { ResidualDiagnostics, SuspectPoint } from '../evidence/diagnostics/residual-diagnostics.js';

export const LEVERAGED_RESIDUAL_LIMIT = 2;

export function standsOut(s: SuspectPoint): boolean {
  return s.why !== 'high leverage' || Math.abs(s.studentised) > LEVERAGED_RESIDUAL_LIMIT;
}

/** The flagged points that stand out, and how many high-leverage points sit on the curve. */
export function pointsThatStandOut(d: ResidualDiagnostics): { suspects: SuspectPoint[]; leverageOnly: number } {
  const suspects = d.suspects.filter(standsOut);
  return { suspects, leverageOnly: d.suspects.length - suspects.length };
}
