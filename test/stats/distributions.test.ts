import { describe, expect, it } from 'vitest';
import ref from '../fixtures/scipy-stats/reference.json';
import * as dist from '../../src/stats/distributions.js';

// Reference values: scipy.stats t/f/chi2/norm (test/fixtures/scipy-stats/runner.py).
type Fn = (...args: number[]) => number;

describe('distribution wrappers vs scipy', () => {
  for (const c of ref.distributions.cases) {
    it(`${c.fn}(${c.args.join(', ')}) = ${c.value}`, () => {
      const fn = (dist as unknown as Record<string, Fn>)[c.fn];
      const got = fn(...c.args);
      const relative = Math.abs(got - c.value) / Math.max(Math.abs(c.value), 1e-300);
      expect(relative).toBeLessThan(1e-9);
    });
  }
  it('fSurvival keeps small upper tails (F = 80 on 2, 30 df) where 1 - fCdf would lose digits', () => {
    const p = dist.fSurvival(80, 2, 30);
    expect(p).toBeGreaterThan(0);
    expect(p).toBeLessThan(1e-11);
  });
  it('invalid parameters give NaN (stdlib convention)', () => {
    expect(dist.fSurvival(1, 0, 3)).toBeNaN();
    expect(dist.tQuantile(1.5, 3)).toBeNaN();
  });
});
