import { describe, expect, it } from 'vitest';
import { bisquareWeights, madScale, BISQUARE_C } from '../../src/evidence/diagnostics/robust-refit.js';
import { residualSeriesBySubstrate } from '../../src/evidence/diagnostics/residual-diagnostics.js';
import { median } from '../../src/stats/median.js';
import { maxInhibitor, subsetFitData, fitDataFromArrays } from '../../src/fit/fit-data.js';
import { pPhrase } from '../../src/text/format-number.js';
import { seededRandom } from '../../src/simulate/random.js';
import { normalQuantile } from '../../src/stats/distributions.js';
import type { MechanismFit } from '../../src/fit/fit-mechanism.js';

describe('Tukey bisquare weights (Beaton & Tukey 1974: w(u) = (1 - u^2)^2 for |u| < 1, else 0, u = r / (c s))', () => {
  it('follow the formula, including the cut-off at c x s', () => {
    const s = 2;
    const r = [0, 1, -3, BISQUARE_C * s * 0.999, BISQUARE_C * s, -20];
    const w = bisquareWeights(r, s);
    r.forEach((x, k) => {
      const u = x / (BISQUARE_C * s);
      expect(w[k]).toBeCloseTo(Math.abs(u) < 1 ? (1 - u * u) ** 2 : 0, 14);
    });
    expect(w[0]).toBe(1);
    expect(w[4]).toBe(0);
  });
  it('MAD / 0.6745 estimates sigma for normal residuals (0.6745 = the normal 0.75 quantile)', () => {
    expect(normalQuantile(0.75)).toBeCloseTo(0.6745, 4);
    const rng = seededRandom(3);
    const r = Array.from({ length: 20000 }, () => 2.5 * rng.normal());
    expect(madScale(r)).toBeGreaterThan(2.45);
    expect(madScale(r)).toBeLessThan(2.55);
  });
});

describe('residual series for the runs test', () => {
  it('averages replicates per (S, I) and orders by [S] within each [I] series, series by [I]', () => {
    const s = Float64Array.from([4, 1, 1, 2, 1, 2]);
    const i = Float64Array.from([0, 0, 0, 0, 3, 3]);
    const weightedResiduals = Float64Array.from([5, 1, -3, 2, 7, -1]);
    const fit = { n: 6, weightedResiduals } as unknown as MechanismFit;
    expect(residualSeriesBySubstrate(fit, { s, i, v: new Float64Array(6) })).toEqual([[-1, 2, 5], [7, -1]]);
  });
});

describe('small shared helpers', () => {
  it('median of odd and even counts, NaN for none', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([])).toBeNaN();
  });
  it('maxInhibitor and subsetFitData', () => {
    const d = fitDataFromArrays([1, 2, 3], [0, 5, 2], [9, 8, 7], [0.1, 0.2, 0.3]);
    expect(maxInhibitor(d)).toBe(5);
    const sub = subsetFitData(d, [2, 0]);
    expect(Array.from(sub.s)).toEqual([3, 1]);
    expect(Array.from(sub.sd!)).toEqual([0.3, 0.1]);
  });
  it('pPhrase words p values', () => {
    expect(pPhrase(0.0004)).toBe('p < 0.001');
    expect(pPhrase(0.2261)).toBe('p = 0.226');
    expect(pPhrase(NaN)).toBe('p not available');
  });
});

describe('CSV cells (RFC 4180 quoting) and folder names', () => {
  it('quote commas, quotes and both kinds of line break; blank for null and non-finite', async () => {
    const { csvCell } = await import('../../src/report/csv-cell.js');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "x"')).toBe('"say ""x"""');
    expect(csvCell('one\rtwo')).toBe('"one\rtwo"');
    expect(csvCell(NaN)).toBe('');
    expect(csvCell(null)).toBe('');
    expect(csvCell(true)).toBe('yes');
    expect(csvCell(1.5)).toBe('1.5');
  });
  it('safe folder names', async () => {
    const { safeName } = await import('../../src/report/safe-name.js');
    expect(safeName('CPD 7/b')).toBe('CPD_7_b');
    expect(safeName('..hidden')).toBe('_hidden');
    expect(safeName('')).toBe('_');
  });
});
