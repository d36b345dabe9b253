import { describe, expect, it } from 'vitest';
import ref from '../fixtures/scipy-stats/reference.json';
import { lackOfFitTest } from '../../src/stats/lack-of-fit-test.js';

// Reference: test/fixtures/scipy-stats/runner.py fits weighted polynomials with numpy and computes
// pure error and lack of fit by the textbook formulas of Draper and Smith (1998) sec. 2.1
// (weighted pure error about the weighted group mean); p from scipy.stats.f.sf.

function close(got: number, want: number, rel = 1e-10): void {
  expect(Math.abs(got - want)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(want)));
}

describe('lackOfFitTest vs numpy textbook computation', () => {
  ref.lackOfFit.cases.forEach((c, k) => {
    it(`case ${k}: ${c.parameters} parameters, weights ${new Set(c.weights).size > 1 ? 'unequal' : 'equal'}`, () => {
      const unequal = new Set(c.weights).size > 1;
      const res = lackOfFitTest(c.residuals, c.groups, c.parameters, unequal ? c.weights : undefined);
      if (!res.applicable) throw new Error(res.reason);
      expect(res.pureErrorDf).toBe(c.pureErrorDf);
      expect(res.lackOfFitDf).toBe(c.lackOfFitDf);
      close(res.pureErrorSS, c.pureErrorSS);
      close(res.lackOfFitSS, c.lackOfFitSS);
      close(res.F, c.F, 1e-9);
      close(res.p, c.p, 1e-9);
    });
  });
  it('equal weights: passing the weights or not gives the same answer', () => {
    const c = ref.lackOfFit.cases[0];
    const a = lackOfFitTest(c.residuals, c.groups, c.parameters);
    const b = lackOfFitTest(c.residuals, c.groups, c.parameters, c.weights);
    expect(a).toEqual(b);
  });
});

describe('lackOfFitTest not applicable', () => {
  it('no replicates', () => {
    const res = lackOfFitTest([0.1, -0.2, 0.3, 0.05], ['a', 'b', 'c', 'd'], 2);
    expect(res.applicable).toBe(false);
    if (!res.applicable) expect(res.reason).toMatch(/no replicated/);
  });
  it('no lack-of-fit degrees of freedom', () => {
    const res = lackOfFitTest([0.1, -0.2, 0.3, 0.05], [1, 1, 2, 2], 2);
    expect(res.applicable).toBe(false);
    if (!res.applicable) expect(res.lackOfFitDf).toBe(0);
  });
  it('zero pure error', () => {
    const res = lackOfFitTest([0.1, 0.1, 0.3, 0.3, -0.2], [1, 1, 2, 2, 3], 1);
    expect(res.applicable).toBe(false);
    if (!res.applicable) expect(res.reason).toMatch(/pure-error sum of squares is zero/);
  });
  it('bad input is an error', () => {
    expect(() => lackOfFitTest([0.1, NaN], [1, 1], 1)).toThrow(/index 1/);
    expect(() => lackOfFitTest([0.1, 0.2], [1], 1)).toThrow(/group ids/);
  });
});
