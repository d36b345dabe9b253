import { describe, expect, it } from 'vitest';
import ref from '../fixtures/scipy-stats/reference.json';
import { shapiroWilk, shapiroWilkCoefficients } from '../../src/stats/shapiro-wilk.js';

// Reference: scipy.stats.shapiro (scipy 1.17), samples and results in
// test/fixtures/scipy-stats/reference.json written by runner.py. Measured agreement: |dW| < 1e-9
// for every case; relative p difference < 1e-7 up to n = 1000 and 1.4e-6 at n = 5000 (where 1 - W
// is about 5e-4, so tiny differences in W move p the most).

describe('shapiroWilk vs scipy.stats.shapiro', () => {
  for (const c of ref.shapiro.cases) {
    it(`${c.label} (n = ${c.n}): W = ${c.W.toFixed(6)}, p = ${c.p.toPrecision(4)}`, () => {
      const res = shapiroWilk(c.x);
      expect(res.n).toBe(c.n);
      expect(Math.abs(res.W - c.W)).toBeLessThan(1e-9);
      expect(Math.abs(res.p - c.p) / c.p).toBeLessThan(c.n > 1000 ? 1e-5 : 1e-6);
    });
  }
});

describe('shapiroWilk properties', () => {
  it('coefficients are antisymmetric with unit sum of squares (AS R94 normalisation)', () => {
    for (const n of [3, 4, 5, 6, 7, 20, 101]) {
      const a = shapiroWilkCoefficients(n);
      let s = 0; let s2 = 0;
      for (let i = 0; i < n; i++) { s += a[i]; s2 += a[i] * a[i]; expect(a[i]).toBeCloseTo(-a[n - 1 - i], 15); }
      expect(s).toBeCloseTo(0, 14);
      expect(s2).toBeCloseTo(1, 12);
    }
  });
  it('W is invariant to location and scale and to input order', () => {
    const x = [3.1, -0.4, 2.2, 5.0, 1.1, 0.3, 2.7, 1.9];
    const base = shapiroWilk(x);
    const moved = shapiroWilk(x.map((v) => 7 - 3 * v).reverse());
    expect(moved.W).toBeCloseTo(base.W, 13);
    expect(moved.p).toBeCloseTo(base.p, 12);
  });
  it('rejects n < 3, n > 5000, zero range and non-finite values', () => {
    expect(() => shapiroWilk([1, 2])).toThrow(/3 to 5000/);
    expect(() => shapiroWilk(new Float64Array(5001).map((_, i) => i))).toThrow(/3 to 5000/);
    expect(() => shapiroWilk([2, 2, 2, 2])).toThrow(/zero range/);
    expect(() => shapiroWilk([1, Infinity, 2])).toThrow(/index 1/);
  });
});
