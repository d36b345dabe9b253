import { describe, expect, it } from 'vitest';
import {
  tCdf, tSurvival, tQuantile, fCdf, fSurvival, fQuantile,
  chisqCdf, chisqSurvival, chisqQuantile, normalCdf, normalSurvival, normalQuantile,
} from '../../src/stats/distributions.js';

// Reference values: scipy 1.17 (test/fixtures/scipy-stats/runner.py -> distributions section).
describe('distributions wrappers (smoke: import works under NodeNext ESM)', () => {
  it('normal quantile 0.975 = 1.959963984540054 (scipy.stats.norm.ppf)', () => {
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963984540054, 12);
    expect(normalCdf(1.959963984540054)).toBeCloseTo(0.975, 12);
  });
  it('all functions return finite numbers', () => {
    for (const v of [tCdf(1, 5), tSurvival(1, 5), tQuantile(0.9, 5), fCdf(2, 3, 10), fSurvival(2, 3, 10),
      fQuantile(0.95, 3, 10), chisqCdf(3, 2), chisqSurvival(3, 2), chisqQuantile(0.95, 2), normalSurvival(2)]) {
      expect(Number.isFinite(v)).toBe(true);
    }
  });
});
