import { describe, expect, it } from 'vitest';
import ref from '../fixtures/scipy-stats/reference.json';
import { averageRanks } from '../../src/stats/average-ranks.js';
import { spearmanCorrelation } from '../../src/stats/spearman-correlation.js';
import { residualTrends } from '../../src/stats/residual-trends.js';

// Reference: scipy.stats.spearmanr (scipy 1.17) via test/fixtures/scipy-stats/runner.py.

describe('averageRanks', () => {
  it('ties share the mean rank (mid-ranks)', () => {
    expect(Array.from(averageRanks([10, 20, 10, 30, 20, 20]))).toEqual([1.5, 4, 1.5, 6, 4, 4]);
  });
});

describe('spearmanCorrelation vs scipy.stats.spearmanr', () => {
  for (const c of ref.spearman.cases) {
    it(`${c.label} (n = ${c.x.length}): rho = ${c.rho.toFixed(6)}`, () => {
      const res = spearmanCorrelation(c.x, c.y);
      expect(Math.abs(res.rho - c.rho)).toBeLessThan(1e-13);
      expect(Math.abs(res.p - c.p) / c.p).toBeLessThan(1e-9);
    });
  }
  it('perfect monotone relation: rho = 1, p = 0; constant input: NaN', () => {
    expect(spearmanCorrelation([1, 2, 3, 4], [1, 8, 27, 64])).toEqual({ n: 4, rho: 1, p: 0 });
    expect(spearmanCorrelation([1, 2, 3], [5, 5, 5]).rho).toBeNaN();
  });
  it('length mismatch is an error', () => {
    expect(() => spearmanCorrelation([1, 2, 3], [1, 2])).toThrow(/3 values but y has 2/);
  });
});

describe('residualTrends', () => {
  it('applies the rank correlation to each covariate (same as direct calls)', () => {
    const c = ref.spearman.cases[1];
    const res = residualTrends(c.y, { substrate: c.x, reversed: c.x.map((v) => -v) });
    expect(res.substrate.rho).toBeCloseTo(c.rho, 13);
    expect(res.reversed.rho).toBeCloseTo(-c.rho, 13);
    expect(res.reversed.p).toBeCloseTo(c.p, 12);
  });
  it('a covariate of the wrong length is an error naming it', () => {
    expect(() => residualTrends([1, 2, 3], { fitted: [1, 2] })).toThrow(/"fitted"/);
  });
});
