/**
 * Tables measured at one substrate concentration (IC50 curves). Such a table cannot tell a
 * mechanism, so it is not sent through the five global fits: it is recognised here and fitted as a
 * dose-response curve instead (src/evidence/constants/dose-response.ts: four-parameter logistic and
 * single-site hyperbola, IC50 with intervals, Cheng-Prusoff Ki per mechanism given Km).
 *
 * The entry points for a caller that dispatches (the CLI's `analyze`, or analyzeTable):
 *   isSingleSubstrateTable(table)  -> true when every used point has the same [S]
 *   analyzeSingleSubstrate(table, options) -> SingleSubstrateResult
 * Two or more [S] levels go through the global mechanism fit as before.
 */
import type { RateTable } from '../input/types.js';
import { doseResponseEvidence, type DoseResponseEvidence } from '../evidence/constants/dose-response.js';
import { distinctLevels } from '../input/distinct-levels.js';

/** The distinct [S] of the used points, ascending. */
export function substrateLevels(table: Pick<RateTable, 'points'>): number[] {
  return distinctLevels(table.points.map((p) => p.substrate));
}

/** True when the table holds one [S] level only: a dose-response (IC50) experiment. */
export function isSingleSubstrateTable(table: Pick<RateTable, 'points'>): boolean {
  return table.points.length > 0 && substrateLevels(table).length === 1;
}

export interface SingleSubstrateOptions {
  /** confidence level of the intervals; default 0.95 */
  level?: number;
  /** Km of the substrate, in the table's [S] unit, for the Cheng-Prusoff Ki of each mechanism */
  km?: number;
}

export interface SingleSubstrateResult {
  kind: 'dose-response';
  table: RateTable;
  /** the one [S] of the table, in its [S] unit */
  substrate: number;
  units: RateTable['units'];
  level: number;
  evidence: DoseResponseEvidence;
}

/** Fits the dose-response curve of a one-[S] table; throws RangeError for any other table. */
export function analyzeSingleSubstrate(table: RateTable, options: SingleSubstrateOptions = {}): SingleSubstrateResult {
  const levels = substrateLevels(table);
  if (levels.length !== 1) throw new RangeError(`analyzeSingleSubstrate: the table has ${levels.length} [S] levels, not one`);
  const level = options.level ?? 0.95;
  const inhibitor = Float64Array.from(table.points, (p) => p.inhibitor);
  const rate = Float64Array.from(table.points, (p) => p.rate);
  const evidence = doseResponseEvidence(inhibitor, rate, { level, substrate: levels[0], ...(options.km !== undefined ? { km: options.km } : {}) });
  return { kind: 'dose-response', table, substrate: levels[0], units: table.units, level, evidence };
}
