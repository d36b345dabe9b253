/**
 * Whatever the rates, the analysis ends in a result or a plain AnalysisError, never in another
 * exception, and its sentences never show NaN or undefined (issue 15: odd data stated plainly).
 * Random tables (fast-check, seeded) on a fixed 4 x 3 grid with random rates: zeros, negatives,
 * constants, huge and tiny values, and repeats. (Magnitudes outside 1e-150..1e150 are refused by
 * design: test/input/numeric-range.test.ts.)
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeTable, AnalysisError } from '../../src/analysis/analyze-table.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { wordVerdict } from '../../src/wording/verdict-words.js';

const S = [1, 3, 10, 30];
const I = [0, 1, 4];
const rate = fc.oneof(
  // rates as a plate export writes them (two decimals), positive or around zero
  { arbitrary: fc.integer({ min: 50, max: 15000 }).map((x) => x / 100), weight: 6 },
  { arbitrary: fc.integer({ min: -500, max: 20000 }).map((x) => x / 100), weight: 2 },
  { arbitrary: fc.constantFrom(0, 1, 12.5, -1, 1e-9, 1e9), weight: 2 },
);

describe('no internal errors on random rate tables', () => {
  it('result or AnalysisError; no NaN or undefined in the verdict text', () => {
    let analysed = 0;
    fc.assert(
      fc.property(fc.array(rate, { minLength: 12, maxLength: 12 }), (rates) => {
        const points = rates.map((v, k) => ({ line: k + 2, substrate: S[k % 4], inhibitor: I[Math.floor(k / 4)], rate: v }));
        let result;
        try {
          result = analyzeTable(tableFromPoints(points), { detail: 'summary' });
        } catch (e) {
          expect(e).toBeInstanceOf(AnalysisError);
          expect((e as Error).message).not.toMatch(/NaN|undefined/);
          return;
        }
        analysed++;
        const words = wordVerdict(result.verdict);
        const text = [words.headline, ...words.reasons, ...words.suggestions].join(' ');
        expect(words.headline.length).toBeGreaterThan(0);
        expect(text).not.toMatch(/NaN|undefined/);
      }),
      { numRuns: 100, seed: 20261202 },
    );
    // most random tables are analysable: the property is not passing on refusals alone
    expect(analysed).toBeGreaterThan(20);
  });

  it('random designs of every mechanism (simulated): result or AnalysisError, plain sentences', () => {
    const mechanism = fc.constantFrom('none', 'competitive', 'uncompetitive', 'noncompetitive', 'mixed') as fc.Arbitrary<'none' | 'competitive' | 'uncompetitive' | 'noncompetitive' | 'mixed'>;
    const levels = (n: [number, number], lo: number, hi: number) =>
      fc.uniqueArray(fc.integer({ min: lo, max: hi }), { minLength: n[0], maxLength: n[1] }).map((xs) => xs.sort((a, b) => a - b).map((x) => x / 10));
    fc.assert(
      fc.property(
        mechanism, levels([2, 8], 1, 2000), levels([1, 4], 1, 500), fc.integer({ min: 1, max: 3 }), fc.integer({ min: 1, max: 1e6 }),
        fc.constantFrom(0.01, 0.05, 0.2),
        (m, substrate, inhibitor, replicates, seed, noise) => {
          const points = simulateRates({
            mechanism: m, params: { Vmax: 100, Km: 10, Ki: 2, Kiu: 8 }, substrate, inhibitor: [0, ...inhibitor], replicates, noise: 'proportional', noiseLevel: noise, seed,
          });
          let text: string;
          try {
            const r = analyzeTable(tableFromPoints(points), { detail: 'summary' });
            const words = wordVerdict(r.verdict);
            text = [words.headline, ...words.reasons, ...words.suggestions].join(' ');
          } catch (e) {
            expect(e).toBeInstanceOf(AnalysisError);
            text = (e as Error).message;
          }
          expect(text).not.toMatch(/NaN|undefined/);
        },
      ),
      { numRuns: 40, seed: 20261203 },
    );
  });
});
