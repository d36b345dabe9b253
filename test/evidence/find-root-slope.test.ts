/**
 * findRootWithSlope (safeguarded Newton, after rtsafe in Press et al. 2007, Numerical Recipes sec.
 * 9.4) against roots known in closed form, and heldSlope (the envelope-theorem derivative of a
 * profiled sum of squares) against the closed-form profile of a straight-line fit.
 */
import { describe, expect, it } from 'vitest';
import { findRootWithSlope, type SlopePoint } from '../../src/evidence/intervals/find-root.js';
import { heldSlope, profiledQuantity } from '../../src/evidence/intervals/profiled-problem.js';
import type { LeastSquaresProblem } from '../../src/fit/least-squares-problem.js';

function counted(f: (x: number) => number, df: (x: number) => number) {
  const calls: number[] = [];
  const g = (x: number): SlopePoint => {
    calls.push(x);
    return { x, f: f(x), df: df(x) };
  };
  return { g, calls, at: (x: number): SlopePoint => ({ x, f: f(x), df: df(x) }) };
}

describe('findRootWithSlope', () => {
  it('finds the cube root of 2 (x^3 - 2, bracket [1, 2]) to the tolerance', () => {
    const { g, at } = counted((x) => x ** 3 - 2, (x) => 3 * x * x);
    const r = findRootWithSlope(g, at(1), 2, at(2), 1e-12);
    expect(r.status).toBe('root');
    expect(Math.abs(r.x - Math.cbrt(2))).toBeLessThan(1e-12);
    expect(r.evaluations).toBeLessThanOrEqual(8);
  });

  it('finds the fixed point of cos, 0.7390851332151607 (the Dottie number, OEIS A003957)', () => {
    const { g, at } = counted((x) => Math.cos(x) - x, (x) => -Math.sin(x) - 1);
    const r = findRootWithSlope(g, at(0), 1, at(1), 1e-13);
    expect(r.status).toBe('root');
    expect(r.x).toBeCloseTo(0.7390851332151607, 13);
  });

  it('with the far end unknown, reaches e (ln x - 1 from x = 1) without evaluating the far end', () => {
    const { g, calls, at } = counted((x) => Math.log(x) - 1, (x) => 1 / x);
    const r = findRootWithSlope(g, at(1), 5, null, 1e-10);
    expect(r.status).toBe('root');
    expect(Math.abs(r.x - Math.E)).toBeLessThan(1e-10);
    expect(calls).not.toContain(5);
  });

  it('with the far end unknown and no root before it, evaluates the far end and says so', () => {
    const { g, calls, at } = counted((x) => x - 10, () => 1);
    const r = findRootWithSlope(g, at(1), 5, null, 1e-10);
    expect(r.status).toBe('no-sign-change');
    expect(calls[calls.length - 1]).toBe(5);
  });

  it('falls back to bisection where Newton steps leave the bracket (atan x on [-10, 20])', () => {
    const { g, at } = counted((x) => Math.atan(x), (x) => 1 / (1 + x * x));
    const r = findRootWithSlope(g, at(-10), 20, at(20), 1e-12);
    expect(r.status).toBe('root');
    expect(Math.abs(r.x)).toBeLessThan(1e-12);
  });

  it('a wrong derivative costs steps, not the root (x^3 - 2 with df half as large again)', () => {
    const { g, at } = counted((x) => x ** 3 - 2, (x) => 4.5 * x * x);
    const r = findRootWithSlope(g, at(1), 2, at(2), 1e-12);
    expect(r.status).toBe('root');
    expect(Math.abs(r.x - Math.cbrt(2))).toBeLessThan(1e-11);
  });

  for (const factor of [10, 1000, 1e6]) {
    it(`a slope ${factor} times too steep still gives the root to the tolerance (x - 0.3 on [0, 1], far end known and unknown)`, () => {
      const { g, at } = counted((x) => x - 0.3, () => factor);
      for (const far of [at(1), null]) {
        const r = findRootWithSlope(g, at(0), 1, far, 1e-8);
        expect(r.status).toBe('root');
        expect(Math.abs(r.x - 0.3)).toBeLessThan(2e-8);
      }
    });
  }
  it('stops once the quadratic model puts the next Newton point within the tolerance (x^2 - 2 from 1.4)', () => {
    // Newton from 1.4: 1.4142857 (step 1.4e-2), then a step of 7.2e-5 whose error is about
    // (f''/2f') d^2 = 1.8e-9 < 1e-7 / 8: that point is returned without being evaluated.
    const { g, calls, at } = counted((x) => x * x - 2, (x) => 2 * x);
    const r = findRootWithSlope(g, at(1.4), 1.5, null, 1e-7);
    expect(r.status).toBe('root');
    expect(calls.length).toBe(2);
    expect(Math.abs(r.x - Math.SQRT2)).toBeLessThan(1e-7 / 8);
  });

  it('stops at the evaluation limit with status limit', () => {
    const { g, at } = counted((x) => x ** 3 - 2, () => NaN);
    const r = findRootWithSlope(g, at(1), 2, at(2), 1e-15, 5);
    expect(r.status).toBe('limit');
    expect(r.evaluations).toBe(5);
  });

  it('reports a non-finite function value', () => {
    const { g, at } = counted((x) => (x > 1.5 ? NaN : x - 1.7), () => 1);
    const r = findRootWithSlope(g, at(1), 2, null, 1e-10);
    expect(r.status).toBe('not-finite');
  });
});

describe('heldSlope', () => {
  // y = a + b x by least squares, residuals r = a + b x - y, theta = (a, b). Holding b, the best a
  // is mean(y) - b mean(x) and S(b) = sum ((y - my) - b (x - mx))^2, so
  // dS/db = -2 sum (x - mx) ((y - my) - b (x - mx)) (closed form, ordinary least squares).
  const x = [0.5, 1, 2, 3.5, 4, 6];
  const y = [1.1, 1.9, 3.2, 4.1, 5.3, 7.2];
  const n = x.length;
  const full: LeastSquaresProblem = {
    n,
    m: 2,
    residuals(t, r) {
      for (let k = 0; k < n; k++) r[k] = t[0] + t[1] * x[k] - y[k];
    },
    jacobian(_t, J) {
      for (let k = 0; k < n; k++) {
        J[k * 2] = 1;
        J[k * 2 + 1] = x[k];
      }
    },
  };
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  for (const b of [0.3, 1, 1.7]) {
    it(`equals the closed-form dS/db of the straight-line profile at b = ${b}`, () => {
      const theta = Float64Array.from([my - b * mx, b]);
      const r = new Float64Array(n);
      full.residuals(theta, r);
      const q = profiledQuantity(['Vmax', 'Km'], 'Km');
      const slope = heldSlope(full, q.fixedCoefficient, theta, r, new Float64Array(n * 2));
      const exact = -2 * x.reduce((s, xk, k) => s + (xk - mx) * (y[k] - my - b * (xk - mx)), 0);
      expect(slope).toBeCloseTo(exact, 12);
    });
  }
});
