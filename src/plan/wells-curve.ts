/** The expected chance of a firm call (the search's heuristic) at smaller budgets, for the wells figure. */
import { searchDesigns, type PlanSettings } from './design-search.js';
import type { WellsCurvePoint } from './plan-figures.js';

const CURVE_FRACTIONS: readonly number[] = [0.25, 0.5, 0.75, 1];

export function wellsCurve(settings: PlanSettings): WellsCurvePoint[] {
  const c = settings.constraints;
  const budgets = [...new Set(CURVE_FRACTIONS.map((f) => Math.round((f * c.wells) / c.replicates) * c.replicates))].filter((w) => w / c.replicates >= 6);
  const out: WellsCurvePoint[] = [];
  for (const wells of budgets) {
    try {
      const s = searchDesigns({ ...settings, constraints: { ...c, wells } });
      out.push({ wells, recommended: s.recommendable[0].firmCallChance, common: s.common.firmCallChance });
    } catch {
      // a budget too small for any grid is left out of the curve
    }
  }
  return out;
}
