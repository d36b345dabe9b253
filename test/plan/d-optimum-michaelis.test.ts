/**
 * The design search finds the closed-form D-optimum design of the Michaelis-Menten model on
 * (0, Smax] under constant noise: two equally weighted points, Km Smax/(2 Km + Smax) and Smax
 * (Duggleby, R. G. (1979) J. Theor. Biol. 81, 671-684; citation from memory, and checked
 * numerically by test/fixtures/plan-fisher/runner.py with scipy).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { noInhibition } from '../../src/models/index.js';
import { efficientRounding, optimumApproximateDesign, varianceFunction } from '../../src/plan/approximate-design.js';

const ref = JSON.parse(readFileSync(join(__dirname, '..', 'fixtures', 'plan-fisher', 'reference.json'), 'utf8')).michaelisDOptimum;

describe('D-optimum Michaelis-Menten design by the multiplicative algorithm', () => {
  const { Vmax, Km, Smax } = ref;
  // 400 candidate [S] on a log grid over (0, Smax]: spacing 1.5% per step
  const candidates = Array.from({ length: 400 }, (_, k) => ({ substrate: Smax * 1e-3 ** (1 - k / 399), inhibitor: 0 }));
  const terms = [{ model: noInhibition, params: [Vmax, Km], interest: [0, 1] }];
  const result = optimumApproximateDesign(candidates, terms, { model: 'constant', level: 1 }, { maxIterations: 20000, tolerance: 1e-4 });

  it('the scipy runner agrees with the closed form', () => {
    expect(ref.numericPoints[0]).toBeCloseTo(ref.closedFormLowPoint, 5);
    expect(ref.numericPoints[1]).toBeCloseTo(Smax, 6);
    expect(ref.numericWeight).toBeCloseTo(0.5, 6);
  });
  it('the weight gathers at Smax and near Km Smax/(2 Km + Smax), half each', () => {
    expect(result.maxDerivative).toBeLessThan(1 + 1e-4);
    const low = ref.closedFormLowPoint;
    const nearLow = candidates.reduce((s, c, k) => s + (Math.abs(Math.log(c.substrate / low)) < 0.05 ? result.weights[k] : 0), 0);
    const atTop = result.weights[candidates.length - 1];
    expect(atTop).toBeGreaterThan(0.49);
    expect(atTop).toBeLessThan(0.51);
    expect(nearLow).toBeGreaterThan(0.49);
    expect(nearLow + atTop).toBeGreaterThan(0.995);
    // weighted mean of the low cluster within 1% of the closed form
    let sw = 0;
    let sl = 0;
    candidates.forEach((c, k) => {
      if (c.substrate < Smax / 2) {
        sw += result.weights[k];
        sl += result.weights[k] * Math.log(c.substrate);
      }
    });
    expect(Math.abs(Math.exp(sl / sw) / low - 1)).toBeLessThan(0.01);
  });
  it('equivalence theorem: the variance function is 1 at the support and at most 1 elsewhere', () => {
    const d = varianceFunction(candidates, result.weights, terms, { model: 'constant', level: 1 });
    expect(Math.max(...d)).toBeLessThan(1 + 1e-4);
    expect(d[candidates.length - 1]).toBeCloseTo(1, 3);
  });
  it('rounding to 12 wells gives 6 and 6', () => {
    const n = efficientRounding(result.weights, 12, 0.05);
    expect(n.reduce((s, x) => s + x, 0)).toBe(12);
    expect(n[candidates.length - 1]).toBe(6);
  });
});

describe('efficient rounding', () => {
  it('keeps the total and follows the weights', () => {
    expect(efficientRounding([0.5, 0.3, 0.2], 10)).toEqual([5, 3, 2]);
    expect(efficientRounding([0.7, 0.3], 3).reduce((s, x) => s + x, 0)).toBe(3);
    expect(efficientRounding([1 / 3, 1 / 3, 1 / 3], 7).reduce((s, x) => s + x, 0)).toBe(7);
  });
});
