/**
 * The bootstrap: reproducible for a seed whatever the chunking of tasks (the same code runs in
 * worker threads, each task seeded from (seed, index)), different for different seeds; interval
 * formulas of Efron (1987) checked on constructed replicates.
 */
import { describe, expect, it } from 'vitest';
import { MECHANISMS } from '../../src/models/index.js';
import { fitAllMechanisms } from '../../src/fit/fit-all-mechanisms.js';
import { fitDataFromArrays } from '../../src/fit/fit-data.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { bootstrapPlan, runBootstrap, bootstrapIntervalsOf } from '../../src/evidence/bootstrap/bootstrap.js';
import { rowWidth, runTasks, resampleSeed, wildResample } from '../../src/evidence/bootstrap/bootstrap-tasks.js';
import { bcaInterval, jackknifeAcceleration, percentileInterval, sortedQuantile } from '../../src/evidence/bootstrap/bootstrap-intervals.js';

const points = simulateRates({
  mechanism: 'mixed',
  params: { Vmax: 10, Km: 20, Ki: 4, Kiu: 16 },
  substrate: [4, 8, 16, 32, 64, 128],
  inhibitor: [0, 2, 4, 8, 16],
  replicates: 2,
  noise: 'proportional',
  noiseLevel: 0.05,
  seed: 11,
});
const data = fitDataFromArrays(points.map((p) => p.substrate), points.map((p) => p.inhibitor), points.map((p) => p.rate));
const fits = fitAllMechanisms(data, 'proportional', MECHANISMS);

describe('bootstrap reproducibility', () => {
  it('the same rows for one chunk, two chunks, or chunks run in reverse order', () => {
    const plan = bootstrapPlan(fits, data, { resamples: 12, seed: 5, jackknife: false });
    const width = rowWidth(plan);
    const whole = new Float64Array(12 * width);
    runTasks(plan, 0, 12, whole);
    const split = new Float64Array(12 * width);
    runTasks(plan, 7, 12, split);
    runTasks(plan, 0, 7, split);
    expect(Array.from(split)).toEqual(Array.from(whole));
  });
  it('the same seed gives the same intervals and selection; another seed differs', () => {
    const a = runBootstrap(fits, data, { resamples: 30, seed: 3, jackknife: false });
    const b = runBootstrap(fits, data, { resamples: 30, seed: 3, jackknife: false });
    const c = runBootstrap(fits, data, { resamples: 30, seed: 4, jackknife: false });
    expect(Array.from(a.replicates.get('mixed')![2])).toEqual(Array.from(b.replicates.get('mixed')![2]));
    expect(a.selection).toEqual(b.selection);
    expect(Array.from(a.replicates.get('mixed')![2])).not.toEqual(Array.from(c.replicates.get('mixed')![2]));
    const total = Object.values(a.selection).reduce((x, y) => x + y, 0);
    expect(total).toBeCloseTo(1, 12);
  });
  it('task seeds differ between indices and between seeds', () => {
    const seeds = new Set<number>();
    for (let s = 0; s < 4; s++) for (let k = 0; k < 250; k++) seeds.add(resampleSeed(s, k));
    expect(seeds.size).toBe(1000);
  });
  it('a Rademacher resample moves each rate by exactly its scaled residual, up or down', () => {
    const plan = bootstrapPlan(fits, data, { resamples: 1, seed: 9 });
    const v = wildResample(plan, 0, new Float64Array(data.v.length));
    let ups = 0;
    v.forEach((x, k) => {
      expect(Math.abs(Math.abs(x - plan.fitted[k]) - Math.abs(plan.scaledResiduals[k]))).toBeLessThan(1e-12);
      if ((x - plan.fitted[k]) * plan.scaledResiduals[k] > 0) ups++;
    });
    // derived in the test: 60 points, each up with probability 1/2, so ups ~ Binomial(60, 1/2)
    // (mean 30, SD 3.9); 16..44 is about +/- 3.6 SD, false alarm under 1 in 1000
    expect(ups).toBeGreaterThan(15);
    expect(ups).toBeLessThan(45);
  });
  it('the mixed data are recognised as mixed in most resamples, and the Ki interval holds the estimate', () => {
    const run = runBootstrap(fits, data, { resamples: 60, seed: 1 });
    expect(run.generatingModel).toBe('mixed');
    // this test's choice (no source): data simulated from mixed with Kiu/Ki = 4 should pick mixed in a majority
    expect(run.selection.mixed).toBeGreaterThan(0.5);
    const ki = fits[4].params[2];
    const b = bootstrapIntervalsOf(run, 'mixed', (p) => p[2], ki, 0.95);
    expect(b.percentile![0]).toBeLessThan(ki);
    expect(b.percentile![1]).toBeGreaterThan(ki);
    expect(b.bca![0]).toBeLessThan(b.bca![1]);
  });
});

describe('bootstrap interval formulas (Efron 1987)', () => {
  it('quantiles interpolate between order statistics (Hyndman and Fan definition 7)', () => {
    expect(sortedQuantile([1, 2, 3, 4, 5], 0.5)).toBe(3);
    expect(sortedQuantile([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(sortedQuantile([0, 10], 0.25)).toBe(2.5);
  });
  it('BCa equals the percentile interval when the replicates are centred on the estimate and the jackknife is symmetric', () => {
    const reps = Array.from({ length: 201 }, (_, k) => k - 100);
    const bca = bcaInterval(reps, 0, [-1, 0, 1], 0.9)!;
    expect(bca.biasCorrection).toBeCloseTo(0, 12);
    expect(bca.acceleration).toBe(0);
    const pct = percentileInterval(reps, 0.9)!;
    expect(bca.interval[0]).toBeCloseTo(pct[0], 9);
    expect(bca.interval[1]).toBeCloseTo(pct[1], 9);
  });
  it('acceleration: sum d^3 / (6 (sum d^2)^1.5) with d = mean - jackknife value', () => {
    const jack = [1, 2, 3, 10];
    const mean = 4;
    const d = jack.map((x) => mean - x);
    const expected = d.reduce((s, x) => s + x ** 3, 0) / (6 * d.reduce((s, x) => s + x * x, 0) ** 1.5);
    expect(jackknifeAcceleration(jack)).toBeCloseTo(expected, 14);
  });
  it('replicates mostly below the estimate (z0 > 0) shift the BCa ends upward of the percentile ones', () => {
    const reps = Array.from({ length: 400 }, (_, k) => k / 400);
    const bca = bcaInterval(reps, 0.6, [0, 0, 0], 0.9)!;
    const pct = percentileInterval(reps, 0.9)!;
    // 240 replicates below 0.6 and one equal: share (240 + 0.5) / 400, z0 = Phi^-1(0.60125) = 0.25658
    expect(bca.biasCorrection).toBeCloseTo(0.25658, 4);
    expect(bca.interval[0]).toBeGreaterThan(pct[0]);
    expect(bca.interval[1]).toBeGreaterThan(pct[1]);
  });
});
