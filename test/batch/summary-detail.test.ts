/**
 * A batch without reports analyses at detail 'summary' (fewer profiles, no joint region, residual
 * checks for the winner only). Its summary rows must be those of a full analysis: the same
 * verdict, constants and intervals. Invented data: seeded simulations of every mechanism on a
 * generous and a sparse design, with proportional and constant noise.
 */
import { describe, expect, it } from 'vitest';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { summarizeAnalysis } from '../../src/batch/summarize.js';
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
          const full = summarizeAnalysis(analyzeTable(table, { detail: 'full' }));
          const summary = summarizeAnalysis(analyzeTable(table, { detail: 'summary' }));
          expect(summary).toEqual(full);
        });
      }
    }
  }
});
