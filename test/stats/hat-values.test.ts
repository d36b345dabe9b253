import { describe, expect, it } from 'vitest';
import ref from '../fixtures/scipy-stats/reference.json';
import { hatValues } from '../../src/fit/hat-values.js';
import { studentisedResiduals } from '../../src/stats/studentised-residuals.js';

// Reference: test/fixtures/scipy-stats/runner.py with numpy: leverage = diag(J pinv(J'J) J'),
// externally studentised residuals from explicit leave-one-out refits (independent of the
// deletion formula used in src/stats/studentised-residuals.ts).

describe('hatValues and studentisedResiduals vs numpy', () => {
  ref.hat.cases.forEach((c, k) => {
    it(`case ${k}: ${c.n} x ${c.p}, rank ${c.rank}`, () => {
      const { leverage, rank } = hatValues(c.jacobian, c.n, c.p);
      expect(rank).toBe(c.rank);
      for (let i = 0; i < c.n; i++) expect(Math.abs(leverage[i] - c.leverage[i])).toBeLessThan(1e-12);
      const sum = leverage.reduce((a, b) => a + b, 0);
      expect(sum).toBeCloseTo(rank, 12);
      const st = studentisedResiduals(c.residuals, leverage, c.s, c.dfResidual);
      for (let i = 0; i < c.n; i++) {
        expect(Math.abs(st.internal[i] - c.internal[i])).toBeLessThan(1e-10);
        expect(Math.abs(st.external[i] - c.external[i])).toBeLessThan(1e-9);
      }
    });
  });
});

describe('hatValues edge cases', () => {
  it('a row alone in its own column has leverage 1; studentised values are NaN there', () => {
    // J columns: intercept for rows 0-3, and an indicator of row 4 only
    const J = [1, 0, 1, 0, 1, 0, 1, 0, 0, 1];
    const { leverage, rank } = hatValues(J, 5, 2);
    expect(rank).toBe(2);
    expect(Array.from(leverage).map((h) => Number(h.toFixed(12)))).toEqual([0.25, 0.25, 0.25, 0.25, 1]);
    const st = studentisedResiduals([0.1, -0.2, 0.3, -0.2, 0], leverage, 0.3, 3);
    expect(st.internal[4]).toBeNaN();
    expect(Number.isFinite(st.internal[0])).toBe(true);
  });
  it('a zero Jacobian has rank 0 and zero leverage', () => {
    const { leverage, rank } = hatValues(new Float64Array(6), 3, 2);
    expect(rank).toBe(0);
    expect(Array.from(leverage)).toEqual([0, 0, 0]);
  });
  it('bad shape or non-finite entries are errors', () => {
    expect(() => hatValues([1, 2, 3], 2, 2)).toThrow(/expected 2 x 2/);
    expect(() => hatValues([1, NaN, 3, 4], 2, 2)).toThrow(/row 0, column 1/);
  });
});
