import { describe, expect, it } from 'vitest';
import ref from '../fixtures/scipy-stats/reference.json';
import { countSignRuns } from '../../src/stats/sign-runs.js';
import { runsDistribution, runsMoments } from '../../src/stats/runs-distribution.js';
import { runsTest } from '../../src/stats/runs-test.js';
import { pooledRunsTest } from '../../src/stats/pooled-runs-test.js';

// Reference: test/fixtures/scipy-stats/runner.py, which enumerates every arrangement of the signs
// (itertools.combinations) and counts runs by brute force: an implementation independent of the
// closed-form pmf of Wald and Wolfowitz (1940) used in src/stats/runs-distribution.ts.

describe('countSignRuns', () => {
  it('counts runs and drops exact zeros (documented convention)', () => {
    expect(countSignRuns([0.5, 0, 0.2, -1, -2, 0, 3])).toEqual({
      runs: 3, nPositive: 3, nNegative: 2, zerosDropped: 2,
    });
  });
  it('throws on a non-finite value, naming its index', () => {
    expect(() => countSignRuns([1, NaN, -1])).toThrow(/index 1/);
  });
});

describe('runsDistribution vs brute-force enumeration', () => {
  for (const c of ref.runs.pmfs) {
    it(`n1=${c.n1}, n2=${c.n2} (${c.arrangements} arrangements)`, () => {
      const pmf = runsDistribution(c.n1, c.n2);
      expect(pmf.length).toBe(c.pmf.length);
      for (let r = 0; r < pmf.length; r++) expect(pmf[r]).toBeCloseTo(c.pmf[r], 13);
      // moments of the enumerated distribution equal the closed-form moments
      let m = 0; let v = 0;
      c.pmf.forEach((p, r) => { m += p * r; });
      c.pmf.forEach((p, r) => { v += p * (r - m) ** 2; });
      const mom = runsMoments(c.n1, c.n2);
      expect(mom.mean).toBeCloseTo(m, 12);
      expect(mom.variance).toBeCloseTo(v, 12);
    });
  }
  it('critical values for n1 = n2 = 10 match the Swed-Eisenhart (1943) table: 6 and 16 (from memory)', () => {
    const pmf = runsDistribution(10, 10);
    const cdf = (r: number) => pmf.slice(0, r + 1).reduce((a, b) => a + b, 0);
    const sf = (r: number) => pmf.slice(r).reduce((a, b) => a + b, 0);
    // lower critical value: largest r with P(R <= r) <= 0.025; upper: smallest r with P(R >= r) <= 0.025
    expect(cdf(6)).toBeLessThanOrEqual(0.025);
    expect(cdf(7)).toBeGreaterThan(0.025);
    expect(sf(16)).toBeLessThanOrEqual(0.025);
    expect(sf(15)).toBeGreaterThan(0.025);
  });
  it('degenerate counts: one kind only gives R = 1 with certainty', () => {
    expect(Array.from(runsDistribution(4, 0))).toEqual([0, 1, 0, 0, 0]);
    expect(runsMoments(0, 3)).toEqual({ mean: 1, variance: 0 });
  });
});

describe('runsTest', () => {
  for (const c of ref.runs.single) {
    it(`exact tails for ${c.values.length} values with ${c.runs} runs`, () => {
      const res = runsTest(c.values);
      expect(res.method).toBe('exact');
      expect(res.runs).toBe(c.runs);
      expect(res.nPositive).toBe(c.nPositive);
      expect(res.nNegative).toBe(c.nNegative);
      expect(res.zerosDropped).toBe(c.zerosDropped);
      expect(res.pTooFew).toBeCloseTo(c.pTooFew, 12);
      expect(res.pTooMany).toBeCloseTo(c.pTooMany, 12);
      expect(res.pTwoSided).toBeCloseTo(c.pTwoSided, 12);
    });
  }
  it('normal approximation with continuity correction on 120 values (runner, scipy.stats.norm)', () => {
    const c = ref.runs.normal;
    const res = runsTest(c.values);
    expect(res.method).toBe('normal');
    expect(res.runs).toBe(c.runs);
    expect(res.expectedRuns).toBeCloseTo(c.expectedRuns, 12);
    expect(res.varianceRuns).toBeCloseTo(c.varianceRuns, 12);
    expect(res.pTooFew).toBeCloseTo(c.pTooFew, 12);
    expect(res.pTooMany).toBeCloseTo(c.pTooMany, 12);
    expect(res.pTwoSided).toBeCloseTo(c.pTwoSided, 12);
  });
  it('normal approximation is close to exact at n1 = n2 = 20 (both computed here; the 0.01 bound is chosen here, no source)', () => {
    const seq = [...Array(20).fill(1), ...Array(20).fill(-1)];
    for (let i = 0; i < 40; i += 7) seq.push(seq.splice(i, 1)[0]);
    const exact = runsTest(seq, { method: 'exact' });
    const approx = runsTest(seq, { method: 'normal' });
    expect(Math.abs(exact.pTwoSided - approx.pTwoSided)).toBeLessThan(0.01);
  });
  it('a one-signed series is not applicable (NaN p-values)', () => {
    const res = runsTest([1, 2, 0, 3]);
    expect(res.method).toBe('not-applicable');
    expect(res.pTooFew).toBeNaN();
  });
  it('auto switches to the normal approximation above 50 nonzero values', () => {
    const seq = Array.from({ length: 51 }, (_, i) => (i % 3 === 0 ? 1 : -1));
    expect(runsTest(seq).method).toBe('normal');
    expect(runsTest(seq.slice(0, 50)).method).toBe('exact');
  });
});

describe('pooledRunsTest vs enumeration of all joint arrangements', () => {
  for (const c of ref.runs.pooled) {
    it(`series counts ${JSON.stringify(c.seriesCounts)}, observed ${c.observedRuns}`, () => {
      // build sign series with the given counts and the observed total number of runs
      const series = buildSeriesWithTotalRuns(c.seriesCounts as [number, number][], c.observedRuns);
      const res = pooledRunsTest(series);
      expect(res.method).toBe('exact');
      expect(res.runs).toBe(c.observedRuns);
      expect(res.pTooFew).toBeCloseTo(c.pTooFew, 12);
      expect(res.pTooMany).toBeCloseTo(c.pTooMany, 12);
      expect(res.pTwoSided).toBeCloseTo(c.pTwoSided, 12);
      let mean = 0;
      c.pmf.forEach((p, r) => { mean += p * r; });
      expect(res.expectedRuns).toBeCloseTo(mean, 12);
    });
  }
  it('normal option uses summed means and variances', () => {
    const series = [[1, 1, -1, -1, 1], [-1, 1, 1, -1, -1, -1], [1, -1]];
    const res = pooledRunsTest(series, { method: 'normal' });
    const counts = [[3, 2], [2, 4], [1, 1]];
    const sumMean = counts.reduce((a, [p, q]) => a + runsMoments(p, q).mean, 0);
    const sumVariance = counts.reduce((a, [p, q]) => a + runsMoments(p, q).variance, 0);
    expect(res.expectedRuns).toBeCloseTo(sumMean, 14);
    expect(res.varianceRuns).toBeCloseTo(sumVariance, 14);
    expect(res.runs).toBe(3 + 3 + 2);
    expect(res.method).toBe('normal');
  });
  it('one-signed series contribute one run each; all one-signed is not applicable', () => {
    const res = pooledRunsTest([[1, 1], [-1, 1, -1]]);
    expect(res.informativeSeries).toBe(1);
    expect(res.runs).toBe(4);
    expect(pooledRunsTest([[1, 1], [-2]]).method).toBe('not-applicable');
  });
});

/** Builds sign series with given (n+, n-) counts whose runs add to `target` (searching per-series runs). */
function buildSeriesWithTotalRuns(counts: [number, number][], target: number): number[][] {
  const options = counts.map(([p, q]) => {
    const pmf = runsDistribution(p, q);
    return [...pmf.keys()].filter((r) => pmf[r] > 0);
  });
  const pick = (j: number, left: number): number[] | null => {
    if (j === counts.length) return left === 0 ? [] : null;
    for (const r of options[j]) {
      const rest = pick(j + 1, left - r);
      if (rest) return [r, ...rest];
    }
    return null;
  };
  const runsEach = pick(0, target);
  if (!runsEach) throw new Error('no arrangement with that total');
  return counts.map(([p, q], j) => sequenceWithRuns(p, q, runsEach[j]));
}

/** A sequence of p positives and q negatives with exactly r runs. */
function sequenceWithRuns(p: number, q: number, r: number): number[] {
  // alternate blocks starting with the sign that needs ceil(r/2) blocks
  for (const startPositive of [true, false]) {
    const blocksPos = startPositive ? Math.ceil(r / 2) : Math.floor(r / 2);
    const blocksNeg = r - blocksPos;
    if (blocksPos > p || blocksNeg > q || (blocksPos === 0 && p > 0) || (blocksNeg === 0 && q > 0)) continue;
    const seq: number[] = [];
    let leftP = p; let leftN = q; let bp = blocksPos; let bn = blocksNeg;
    for (let b = 0; b < r; b++) {
      const positive = (b % 2 === 0) === startPositive;
      if (positive) { const len = leftP - (bp - 1); seq.push(...Array(len).fill(1)); leftP -= len; bp--; }
      else { const len = leftN - (bn - 1); seq.push(...Array(len).fill(-1)); leftN -= len; bn--; }
    }
    return seq;
  }
  throw new Error(`cannot build ${p}+/${q}- with ${r} runs`);
}
