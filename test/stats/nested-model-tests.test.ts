import { describe, expect, it } from 'vitest';
import ref from '../fixtures/scipy-stats/reference.json';
import { extraSumOfSquaresTest } from '../../src/stats/extra-sum-of-squares-test.js';
import { likelihoodRatioTest } from '../../src/stats/likelihood-ratio-test.js';

// Reference: test/fixtures/scipy-stats/runner.py, textbook formulas with p from
// scipy.stats.f.sf and scipy.stats.chi2.sf.

describe('extraSumOfSquaresTest vs scipy', () => {
  for (const c of ref.nested.extraSumOfSquares) {
    it(`SSE ${c.sseReduced} on ${c.dfReduced} vs ${c.sseFull} on ${c.dfFull}`, () => {
      const res = extraSumOfSquaresTest(c);
      expect(res.F).toBeCloseTo(c.F, 12);
      expect(res.numeratorDf).toBe(c.dfReduced - c.dfFull);
      expect(Math.abs(res.p - c.p) / c.p).toBeLessThan(1e-9);
      expect(res.reducedFitsBetter).toBe(false);
    });
  }
  it('reduced fit better than full: flagged, p = 1', () => {
    const res = extraSumOfSquaresTest({ sseReduced: 9, dfReduced: 20, sseFull: 10, dfFull: 19 });
    expect(res.reducedFitsBetter).toBe(true);
    expect(res.p).toBe(1);
  });
  it('inconsistent degrees of freedom are an error', () => {
    expect(() => extraSumOfSquaresTest({ sseReduced: 9, dfReduced: 19, sseFull: 8, dfFull: 19 })).toThrow(/dfReduced > dfFull/);
  });
});

describe('likelihoodRatioTest vs scipy', () => {
  for (const c of ref.nested.likelihoodRatio) {
    it(`logL ${c.logLikReduced} vs ${c.logLikFull}, df ${c.df}`, () => {
      const res = likelihoodRatioTest({ logLikReduced: c.logLikReduced, logLikFull: c.logLikFull, dfDifference: c.df });
      expect(res.statistic).toBeCloseTo(c.statistic, 12);
      expect(Math.abs(res.p - c.p) / c.p).toBeLessThan(1e-6);
    });
  }
  it('negative statistic: flagged, p = 1', () => {
    const res = likelihoodRatioTest({ logLikReduced: -3, logLikFull: -4, dfDifference: 1 });
    expect(res.reducedFitsBetter).toBe(true);
    expect(res.p).toBe(1);
  });
});
