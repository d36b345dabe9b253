import { describe, expect, it } from 'vitest';
import { levenbergMarquardt } from '../../src/fit/levenberg-marquardt.js';
import type { LeastSquaresProblem } from '../../src/fit/least-squares-problem.js';

/** Michaelis-Menten on invented points: y = a x / (b + x). */
const xs = [0.5, 1, 2, 4, 8, 16];
const ys = [1.9, 3.2, 4.9, 6.4, 7.7, 8.3];
function problem(counter: { jacobians: number }): LeastSquaresProblem {
  return {
    n: xs.length,
    m: 2,
    residuals(p, r) {
      xs.forEach((x, k) => (r[k] = ys[k] - (p[0] * x) / (p[1] + x)));
    },
    jacobian(p, J) {
      counter.jacobians++;
      xs.forEach((x, k) => {
        J[2 * k] = -x / (p[1] + x);
        J[2 * k + 1] = (p[0] * x) / (p[1] + x) ** 2;
      });
    },
  };
}

describe('engine option skipFinalJacobian', () => {
  it('gives the same solution with at most one Jacobian evaluation fewer, and no Jacobian in the result', () => {
    const a = { jacobians: 0 };
    const b = { jacobians: 0 };
    const full = levenbergMarquardt(problem(a), [5, 1]);
    const lean = levenbergMarquardt(problem(b), [5, 1], { skipFinalJacobian: true });
    expect(Array.from(lean.x)).toEqual(Array.from(full.x));
    expect(lean.sse).toBe(full.sse);
    expect(lean.status).toBe(full.status);
    expect(lean.jacobian).toHaveLength(0);
    // without the option: the Jacobian at the solution, n x m
    expect(full.jacobian).toHaveLength(xs.length * 2);
    expect(full.jacobian[0]).toBeCloseTo(-xs[0] / (full.x[1] + xs[0]), 14);
    expect(a.jacobians - b.jacobians).toBeGreaterThanOrEqual(0);
    expect(a.jacobians - b.jacobians).toBeLessThanOrEqual(1);
  });
});
