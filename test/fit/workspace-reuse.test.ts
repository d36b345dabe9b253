/**
 * The engine reuses its work arrays from one call to the next of the same size
 * (src/fit/levenberg-marquardt.ts): every call must still give what a first call gives, whatever
 * ran before it, including a call made from inside a residual function (which gets its own arrays).
 */
import { describe, expect, it } from 'vitest';
import { levenbergMarquardt } from '../../src/fit/levenberg-marquardt.js';
import type { LeastSquaresProblem } from '../../src/fit/least-squares-problem.js';

// invented Michaelis-Menten points: y = a x / (b + x)
const xs = [0.5, 1, 2, 4, 8, 16];
const ys = [1.9, 3.2, 4.9, 6.4, 7.7, 8.3];
const mm: LeastSquaresProblem = {
  n: xs.length,
  m: 2,
  residuals(p, r) {
    xs.forEach((x, k) => (r[k] = ys[k] - (p[0] * x) / (p[1] + x)));
  },
  jacobian(p, J) {
    xs.forEach((x, k) => {
      J[2 * k] = -x / (p[1] + x);
      J[2 * k + 1] = (p[0] * x) / (p[1] + x) ** 2;
    });
  },
};
const plain = (r: ReturnType<typeof levenbergMarquardt>) => ({ ...r, x: Array.from(r.x), residuals: Array.from(r.residuals), jacobian: Array.from(r.jacobian) });

describe('reused work arrays', () => {
  it('a repeated call gives the same result, bit for bit, after calls of other problems of the same size', () => {
    const first = plain(levenbergMarquardt(mm, [5, 1]));
    const other: LeastSquaresProblem = { ...mm, residuals: (p, r) => xs.forEach((x, k) => (r[k] = 100 - p[0] * x - p[1])) };
    levenbergMarquardt(other, [1, 1]);
    levenbergMarquardt(mm, [50, 30], { maxEvaluations: 3 });
    expect(plain(levenbergMarquardt(mm, [5, 1]))).toEqual(first);
  });

  it('a start outside the domain returns a zero Jacobian even after a successful call', () => {
    levenbergMarquardt(mm, [5, 1]);
    const failed = levenbergMarquardt({ ...mm, residuals: () => false }, [5, 1]);
    expect(failed.status).toBe('failed');
    expect(Array.from(failed.jacobian)).toEqual(new Array(12).fill(0));
  });

  it('a nested call of the same size inside a residual function leaves the outer solve unchanged', () => {
    const expected = plain(levenbergMarquardt(mm, [5, 1]));
    let nested = 0;
    const outer: LeastSquaresProblem = {
      ...mm,
      residuals(p, r) {
        if (nested++ < 3) levenbergMarquardt(mm, [2, 2]);
        return mm.residuals(p, r);
      },
    };
    expect(plain(levenbergMarquardt(outer, [5, 1]))).toEqual(expected);
    expect(nested).toBeGreaterThan(3);
  });
});
