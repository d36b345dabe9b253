/**
 * IC50-shift experiments: two or three [S] levels, each with a full [I] series. The table still
 * goes through the global mechanism fit; in addition each [S] series is fitted alone as a
 * dose-response curve (src/evidence/constants/dose-response.ts), giving one IC50 per [S]. How the IC50
 * moves with [S] is what practitioners read from this design: it rises with [S] for a
 * competitive inhibitor, falls for an uncompetitive one and stays flat for a noncompetitive one
 * (Cheng, Y. and Prusoff, W. H. (1973) Biochem. Pharmacol. 22, 3099-3108).
 *
 * The design thresholds are common practice (no source): at most IC50_SHIFT_MAX_SUBSTRATE_LEVELS
 * [S] levels, each with at least IC50_SHIFT_MIN_INHIBITOR_LEVELS non-zero [I] levels.
 */
import type { RateTable } from '../input/types.js';
import { doseResponseEvidence, type Interval } from '../evidence/constants/dose-response.js';
import type { DoseResponseModel } from '../fit/dose-response-fit.js';
import { distinctLevels } from '../input/distinct-levels.js';

const IC50_SHIFT_MAX_SUBSTRATE_LEVELS = 3;
const IC50_SHIFT_MIN_INHIBITOR_LEVELS = 5;

interface SeriesIc50 {
  substrate: number;
  ic50: number;
  /** profile interval when it has an end, else Wald */
  interval: Interval;
  model: DoseResponseModel;
}

function inhibitorLevelsAt(table: Pick<RateTable, 'points'>, s: number): number {
  return new Set(table.points.filter((p) => p.substrate === s && p.inhibitor > 0).map((p) => p.inhibitor)).size;
}

/** True for 2 to 3 [S] levels, each with enough non-zero [I] levels for its own IC50 curve. */
export function isIc50ShiftDesign(table: Pick<RateTable, 'points'>): boolean {
  const levels = [...new Set(table.points.map((p) => p.substrate))];
  return levels.length >= 2 && levels.length <= IC50_SHIFT_MAX_SUBSTRATE_LEVELS && levels.every((s) => inhibitorLevelsAt(table, s) >= IC50_SHIFT_MIN_INHIBITOR_LEVELS);
}

/** One dose-response IC50 per [S] series, ascending in [S]; empty when the design is not an IC50 shift. */
export function ic50ShiftSeries(table: Pick<RateTable, 'points'>, level = 0.95): SeriesIc50[] {
  if (!isIc50ShiftDesign(table)) return [];
  const levels = distinctLevels(table.points.map((p) => p.substrate));
  const out: SeriesIc50[] = [];
  for (const s of levels) {
    const points = table.points.filter((p) => p.substrate === s);
    try {
      const e = doseResponseEvidence(Float64Array.from(points, (p) => p.inhibitor), Float64Array.from(points, (p) => p.rate), { substrate: s, level });
      const chosen = e.models.find((m) => m.model === e.chosen)!;
      const profiled = chosen.ic50.profile[0] !== null || chosen.ic50.profile[1] !== null;
      out.push({ substrate: s, ic50: chosen.ic50.value, interval: profiled ? chosen.ic50.profile : chosen.ic50.wald, model: chosen.model });
    } catch {
      // a series that cannot be fitted alone is left out of the plot
    }
  }
  return out;
}
