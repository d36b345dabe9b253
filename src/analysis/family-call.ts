/**
 * Glue between the analysis and the family comparison: builds the comparison's input from the
 * classic results and the family stage, and returns the family call with the verdict to report
 * (the classic verdict object itself when the family is classic).
 */
import type { RateTable } from '../input/types.js';
import type { FitData } from '../fit/fit-data.js';
import { compareFamilies, verdictWithFamily, type FamilyCall } from '../evidence/selection/family-comparison.js';
import type { Verdict } from '../evidence/verdict/verdict.js';
import type { FamilyStage } from './stage-families.js';
import type { ModelResult } from './types.js';

export function familyCallFor(
  classic: Verdict,
  models: readonly ModelResult[],
  families: FamilyStage | null,
  data: FitData,
  table: RateTable,
): { family: FamilyCall; verdict: Verdict } {
  let lowest = Infinity;
  for (const x of data.i) if (x > 0 && x < lowest) lowest = x;
  const family = compareFamilies({
    classic,
    classicModels: models.map((m) => ({ id: m.mechanism, family: 'classic', mechanism: m.mechanism, aicc: m.aicc, logLik: m.logLik, converged: m.converged, estimates: m.estimates })),
    ...(families?.tight ? { tight: families.tight } : {}),
    ...(families?.partial ? { partial: families.partial } : {}),
    lowestInhibitor: lowest,
    inhibitorUnit: table.units.inhibitor ?? '',
  });
  const verdict = verdictWithFamily(classic, family, family.family === 'tight-binding' ? families?.tightVerdict : undefined);
  return { family, verdict };
}
