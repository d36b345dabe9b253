/**
 * A batch without reports analyses at detail 'summary' (fewer profiles, no joint region, residual
 * checks for the winner only). Its summary rows must be those of a full analysis: the same
 * verdict, constants and intervals; and the profiles it computes (SUMMARY_PROFILES, which a
 * follow-up plan reads too) those of a full analysis. Invented data: seeded simulations of every mechanism on a
 * generous and a sparse design, with proportional and constant noise.
 */
import { describe, expect, it } from 'vitest';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { summarizeAnalysis } from '../../src/batch/summarize.js';
import { SUMMARY_PROFILES } from '../../src/analysis/stage-intervals.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import type { Mechanism, ParamName } from '../../src/models/types.js';

const truths: Array<[Mechanism, Partial<Record<ParamName, number>>]> = [
  ['none', { Vmax: 80, Km: 12 }],
  ['competitive', { Vmax: 80, Km: 12, Ki: 1.5 }],
  ['uncompetitive', { Vmax: 80, Km: 12, Kiu: 2 }],
  ['noncompetitive', { Vmax: 80, Km: 12, Ki: 1 }],
  ['mixed', { Vmax: 80, Km: 12, Ki: 0.8, Kiu: 5 }],
];
const designs = {
  generous: { substrate: [2, 4, 8, 16, 32, 64, 128], inhibitor: [0, 0.5, 1, 2, 4], replicates: 2 },
  sparse: { substrate: [3, 12, 48], inhibitor: [0, 1, 4], replicates: 1 },
};

describe("detail 'summary' gives a full analysis' summary row", () => {
  let seed = 40;
  for (const [designName, design] of Object.entries(designs)) {
    for (const [mechanism, params] of truths) {
      for (const noise of ['proportional', 'constant'] as const) {
        const s = seed++;
        it(`${designName} design, ${mechanism} truth, ${noise} noise`, () => {
          const points = simulateRates({ mechanism, params, ...design, noise, noiseLevel: noise === 'constant' ? 1.5 : 0.05, seed: s });
          const table = tableFromPoints(points, { source: '<simulated>' });
          const fullResult = analyzeTable(table, { detail: 'full' });
          const summaryResult = analyzeTable(table, { detail: 'summary' });
          expect(summarizeAnalysis(summaryResult)).toEqual(summarizeAnalysis(fullResult));
          // the profiles a summary computes are those of the full analysis, bit for bit, and the
          // best-ranked model has those of Km (a follow-up plan's prior) and of its constants
          for (const m of summaryResult.models) {
            const inFull = fullResult.models.find((f) => f.mechanism === m.mechanism)!;
            for (const e of m.estimates) if (e.profile) expect(e.profile).toEqual(inFull.estimates.find((f) => f.name === e.name)!.profile);
          }
          const best = summaryResult.models[0];
          for (const e of best.estimates) expect(e.profile !== undefined).toBe(SUMMARY_PROFILES.includes(e.name as never) && best.fit.df > 0);
        });
      }
    }
  }
});
