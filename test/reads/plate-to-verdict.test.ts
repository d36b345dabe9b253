/**
 * End to end: a simulated plate of a known mechanism goes reads -> rates -> analyze, and the call
 * and Ki match those from the exact initial rates within their intervals. Invented enzyme and
 * compound (simulation only); curves from the integrated Michaelis-Menten equation at each [I]
 * (src/simulate/simulate-plate.ts).
 */
import { describe, expect, it } from 'vitest';
import { parseKineticReads, parsePlateMap, ratesFromReads, rateTableText, parseConversionFactor } from '../../src/reads/index.js';
import { parseRateText } from '../../src/input/index.js';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { simulatePlate } from '../../src/simulate/simulate-plate.js';
import { tableOf } from '../helpers/sim-table.js';
import { seededRandom } from '../../src/simulate/random.js';
import type { Mechanism } from '../../src/models/types.js';
import type { AnalysisResult } from '../../src/analysis/types.js';

const TIMES = Array.from({ length: 40 }, (_, k) => 15 * k); // 15 s reads for 10 min

function kiOf(result: AnalysisResult, name: 'Ki' | 'Kiu') {
  const model = result.models.find((m) => m.mechanism === result.verdict.mechanism)!;
  return model.estimates.find((e) => e.name === name)!;
}

/** The two intervals overlap, and the truth lies inside the interval from the reads. */
function expectMatchingConstants(reads: ReturnType<typeof kiOf>, exact: ReturnType<typeof kiOf>, truth: number): void {
  const [rl, rh] = (reads.profile ?? reads.wald!) as [number, number];
  const [el, eh] = (exact.profile ?? exact.wald!) as [number, number];
  expect(rl).toBeLessThan(eh);
  expect(el).toBeLessThan(rh);
  expect(rl).toBeLessThan(truth);
  expect(rh).toBeGreaterThan(truth);
}

function runPlate(mechanism: Mechanism, params: Record<string, number>, seed: number) {
  const plate = simulatePlate({
    mechanism,
    params,
    substrate: [4, 8, 12, 20, 30, 50, 100, 160],
    inhibitor: [0, 0.5, 1, 2, 4],
    replicates: 2,
    times: TIMES,
    signalPerUnit: 0.00622, // absorbance per uM of product (NADH-like, 1 cm)
    baseline: 0.3,
    drift: 2e-6,
    noiseSd: 0.0003,
    seed,
    compound: 'QX-101',
  });
  const reads = parseKineticReads(plate.readsCsv, { source: 'plate.csv' });
  const map = parsePlateMap(plate.mapCsv, 'map.csv');
  const rates = ratesFromReads([reads], map, { conversion: parseConversionFactor('6.22/mM') });
  const [table] = parseRateText(rateTableText(rates), { source: 'rates.csv' });
  // each rate carries the standard error of its window fit in `sd`: weights by --error column
  const fromReads = analyzeTable(table, { errorModel: 'column' });
  // The exact initial rates of the same wells, measured with the same precision: true v0 plus a
  // seeded normal error of the SE the reads gave that well, with that SE as sd. (Noise-free rates
  // cannot be used: every model then fits to rounding error and no call can be made.)
  const rng = seededRandom(1000 + seed);
  const exactPoints = rates.wells
    .filter((w) => w.excludeReason === null)
    .map((w, k) => {
      const truth = plate.wells.find((x) => x.well === w.well)!.v0;
      return { line: k + 2, substrate: w.substrate!, inhibitor: w.inhibitor!, rate: truth + w.se! * rng.normal(), sd: w.se! };
    });
  const exact = analyzeTable({ ...tableOf(exactPoints), hasSd: true }, { errorModel: 'column' });
  return { rates, table, fromReads, exact };
}

describe('simulated plate -> rates -> analyze', () => {
  // 80 sample wells (8 [S] x 5 [I] x 2) and 16 blanks; Vmax 0.01 uM/s, so 10% of the lowest [S]
  // is used in about 4 min of the 10 min read
  it('competitive (Km 20 uM, Ki 1 uM): same call; Ki from the exact rates inside the interval from the reads', () => {
    const { rates, table, fromReads, exact } = runPlate('competitive', { Vmax: 0.01, Km: 20, Ki: 1 }, 11);
    expect(rates.wells.length).toBe(80);
    expect(table.points.length + table.excluded.length).toBe(80);
    expect(table.points.length).toBeGreaterThanOrEqual(76);
    expect(exact.verdict.mechanism).toBe('competitive');
    expect(fromReads.verdict.mechanism).toBe(exact.verdict.mechanism);
    expectMatchingConstants(kiOf(fromReads, 'Ki'), kiOf(exact, 'Ki'), 1);
  });
  it('uncompetitive (Kiu 1 uM): same call; Kiu inside the interval', () => {
    const { fromReads, exact } = runPlate('uncompetitive', { Vmax: 0.01, Km: 20, Kiu: 1 }, 12);
    expect(exact.verdict.mechanism).toBe('uncompetitive');
    expect(fromReads.verdict.mechanism).toBe('uncompetitive');
    expectMatchingConstants(kiOf(fromReads, 'Kiu'), kiOf(exact, 'Kiu'), 1);
  });
});
