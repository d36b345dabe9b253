/**
 * Status reporting of the Levenberg-Marquardt engine on tiny problems whose outcome is known in
 * advance: each stopping rule of MINPACK lmder (Moré 1978; MINPACK-1 user guide, ANL-80-74, info
 * codes 1-8) is provoked on its own by switching the other tolerances off.
 */
import { describe, expect, test } from 'vitest';
import { levenbergMarquardt } from '../../src/fit/levenberg-marquardt.js';
import type { LeastSquaresProblem } from '../../src/fit/least-squares-problem.js';

/** Rosenbrock's function as residuals r = (10 (x2 - x1^2), 1 - x1); minimum 0 at (1, 1). */
const rosenbrock: LeastSquaresProblem = {
  n: 2,
  m: 2,
  residuals(x, r) {
    r[0] = 10 * (x[1] - x[0] * x[0]);
    r[1] = 1 - x[0];
  },
  jacobian(x, J) {
    J[0] = -20 * x[0];
    J[1] = 10;
    J[2] = -1;
    J[3] = 0;
  },
};

/**
 * y = a exp(b t) through five invented points that no exponential fits exactly
 * (so the minimum has a nonzero residual).
 */
const t = [0, 1, 2, 3, 4];
const y = [1.1, 1.9, 4.2, 7.8, 16.5];
const exponential: LeastSquaresProblem = {
  n: 5,
  m: 2,
  residuals(x, r) {
    for (let i = 0; i < 5; i++) r[i] = x[0] * Math.exp(x[1] * t[i]) - y[i];
  },
  jacobian(x, J) {
    for (let i = 0; i < 5; i++) {
      const e = Math.exp(x[1] * t[i]);
      J[2 * i] = e;
      J[2 * i + 1] = x[0] * t[i] * e;
    }
  },
};

/** Cosines between r and each column of J at x (the scale-free stationarity measure of lmder's gtol). */
function gradientCosines(problem: LeastSquaresProblem, x: Float64Array): number[] {
  const r = new Float64Array(problem.n);
  const J = new Float64Array(problem.n * problem.m);
  problem.residuals(x, r);
  problem.jacobian(x, J);
  const rnorm = Math.sqrt(r.reduce((s, v) => s + v * v, 0));
  const cosines: number[] = [];
  for (let j = 0; j < problem.m; j++) {
    let dot = 0;
    let colsq = 0;
    for (let i = 0; i < problem.n; i++) {
      dot += J[i * problem.m + j] * r[i];
      colsq += J[i * problem.m + j] ** 2;
    }
    cosines.push(Math.abs(dot) / (Math.sqrt(colsq) * rnorm));
  }
  return cosines;
}

describe('levenbergMarquardt status', () => {
  test('default settings converge on the exponential fit to a stationary point', () => {
    const res = levenbergMarquardt(exponential, [1, 0.5]);
    expect(res.converged).toBe(true);
    expect(res.status.startsWith('converged')).toBe(true);
    // ftol = 1e-15 bounds the predicted reduction, about the squared cosine, so cosines near
    // sqrt(1e-15) ~ 3e-8 may remain; 1e-7 is that bound with a margin.
    for (const c of gradientCosines(exponential, res.x)) expect(c).toBeLessThan(1e-7);
    expect(res.sse).toBeGreaterThan(0);
    expect(res.message).toMatch(/^Converged/);
  });

  test('ftol alone ends with converged-ftol', () => {
    const res = levenbergMarquardt(exponential, [1, 0.5], { ftol: 1e-8, xtol: 0, gtol: 0 });
    expect(res.status).toBe('converged-ftol');
    expect(res.converged).toBe(true);
  });

  test('xtol alone ends with converged-xtol', () => {
    const res = levenbergMarquardt(exponential, [1, 0.5], { ftol: 0, xtol: 1e-8, gtol: 0 });
    expect(res.status).toBe('converged-xtol');
    expect(res.converged).toBe(true);
  });

  test('gtol alone ends with converged-gtol', () => {
    const res = levenbergMarquardt(exponential, [1, 0.5], { ftol: 0, xtol: 0, gtol: 1e-6 });
    expect(res.status).toBe('converged-gtol');
    expect(res.converged).toBe(true);
  });

  test('an exactly solvable problem ends with converged-zero-residual at the root', () => {
    const res = levenbergMarquardt(rosenbrock, [-1.2, 1]);
    expect(res.status).toBe('converged-zero-residual');
    expect(res.sse).toBe(0);
    expect(res.x[0]).toBe(1);
    expect(res.x[1]).toBe(1);
  });

  test('a tiny evaluation limit ends with max-evaluations, not converged', () => {
    const res = levenbergMarquardt(rosenbrock, [-1.2, 1], { maxEvaluations: 3 });
    expect(res.status).toBe('max-evaluations');
    expect(res.converged).toBe(false);
    expect(res.evaluations).toBe(3);
    expect(res.message).toContain('3 residual evaluations');
  });

  test('all tolerances zero ends with tolerance-too-small at the minimum', () => {
    const res = levenbergMarquardt(exponential, [1, 0.5], { ftol: 0, xtol: 0, gtol: 0 });
    expect(res.status).toBe('tolerance-too-small');
    const reference = levenbergMarquardt(exponential, [1, 0.5]);
    expect(Math.abs(res.sse - reference.sse)).toBeLessThanOrEqual(1e-12 * reference.sse);
  });

  test('residuals outside the domain at the start end with failed', () => {
    const outside: LeastSquaresProblem = { ...exponential, residuals: () => false };
    const res = levenbergMarquardt(outside, [1, 0.5]);
    expect(res.status).toBe('failed');
    expect(res.converged).toBe(false);
  });

  test('a non-finite Jacobian ends with failed and says where', () => {
    const broken: LeastSquaresProblem = { ...exponential, jacobian: (_x, J) => J.fill(NaN) };
    const res = levenbergMarquardt(broken, [1, 0.5]);
    expect(res.status).toBe('failed');
    expect(res.message).toContain('Jacobian');
  });

  test('trial points outside the domain shrink the step instead of ending the fit', () => {
    // log(x) = -20 from x = 1: the Gauss-Newton step x - x log(x / e^-20) = -19 leaves the domain x > 0.
    let outsideTrials = 0;
    const logFit: LeastSquaresProblem = {
      n: 1,
      m: 1,
      residuals(x, r) {
        if (!(x[0] > 0)) {
          outsideTrials++;
          return false;
        }
        r[0] = Math.log(x[0]) + 20;
      },
      jacobian(x, J) {
        J[0] = 1 / x[0];
      },
    };
    const res = levenbergMarquardt(logFit, [1]);
    expect(outsideTrials).toBeGreaterThan(0);
    expect(res.converged).toBe(true);
    expect(Math.abs(res.x[0] - Math.exp(-20))).toBeLessThan(1e-12 * Math.exp(-20));
  });

  test('the returned Jacobian and residuals belong to the returned x', () => {
    const res = levenbergMarquardt(exponential, [1, 0.5], { ftol: 1e-6, xtol: 0, gtol: 0 });
    const r = new Float64Array(5);
    const J = new Float64Array(10);
    exponential.residuals(res.x, r);
    exponential.jacobian(res.x, J);
    expect(Array.from(res.residuals)).toEqual(Array.from(r));
    expect(Array.from(res.jacobian)).toEqual(Array.from(J));
    expect(res.sse).toBeCloseTo(r.reduce((s, v) => s + v * v, 0), 12);
  });

  test('bad dimensions are refused with a plain error', () => {
    expect(() => levenbergMarquardt(exponential, [1])).toThrow(/starting point has 1 entries/);
    expect(() => levenbergMarquardt({ ...exponential, n: 1 }, [1, 0.5])).toThrow(/cannot determine/);
  });
});
