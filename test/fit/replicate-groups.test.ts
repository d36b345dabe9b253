/**
 * Pooled replicates (src/fit/replicate-groups.ts) against the per-point fit on the same table.
 *
 * The identity checked: with weights fixed, sum_k w_k (v_k - f)^2 over the replicates of one
 * condition equals W (vbar - f)^2 + sum_k w_k (v_k - vbar)^2 (the within/between split of a
 * weighted sum of squares), so the pooled problem has the per-point SSE, J'J and J'r. Both fits
 * are run here on one replicated table (invented: 40 conditions x 30 replicates, competitive,
 * 5% proportional noise from a fixed-seed generator) and must agree: SSE, log-likelihood and AICc
 * (n = points, not conditions) to 1e-12 relative with fixed weights and 5e-9 with iterated ones
 * (the reweighting's own stopping rule); estimates to 1e-4 standard errors where they are well
 * determined (see expectSameEstimates: that is how closely any two converged fits agree, and a
 * restarted per-point fit is no closer); profile-likelihood interval ends to 1e-7 relative (each
 * end is a root found to the profile's own tolerance). The scipy, R and NIST checks (test/fit, test/nist)
 * run on tables below the pooling threshold and so stay per-point.
 */
import { describe, expect, it } from 'vitest';
import { MECHANISMS } from '../../src/models/index.js';
import { fitDataFromArrays, type FitData } from '../../src/fit/fit-data.js';
import { fitMechanism, weightedProblem, parameterLogScales, type MechanismFit } from '../../src/fit/fit-mechanism.js';
import { GROUPED_FIT_MIN_POINTS, GROUPED_FIT_MIN_REPLICATES, poolConditions, replicateGroups } from '../../src/fit/replicate-groups.js';
import { aicc } from '../../src/evidence/selection/information-criteria.js';
import { profileAllOfFit } from '../../src/evidence/intervals/profile-likelihood.js';
import { refitFromStarts } from '../../src/evidence/bootstrap/bootstrap-refit.js';
import { unscaledCovariance } from '../../src/fit/qr.js';
import { weightsDependOnFit, type ErrorModel } from '../../src/fit/error-models.js';
import { competitive } from '../../src/models/index.js';

const SUBSTRATE = [2, 4, 8, 15, 30, 60, 120, 240];
const INHIBITOR = [0, 0.5, 1, 2, 4];

function generator(seed: number): () => number {
  let state = seed;
  return () => (state = (state * 16807) % 2147483647) / 2147483647;
}

/** `replicates` points at each of the 40 conditions, interleaved as a plate export would be. */
function replicatedTable(replicates: number, withSd = false): FitData {
  const random = generator(29);
  const s: number[] = [];
  const i: number[] = [];
  const v: number[] = [];
  const sd: number[] = [];
  for (let r = 0; r < replicates; r++) {
    for (const inhibitor of INHIBITOR) {
      for (const substrate of SUBSTRATE) {
        const rate = (100 * substrate) / (10 * (1 + inhibitor / 1) + substrate);
        s.push(substrate);
        i.push(inhibitor);
        v.push(rate * (1 + 0.05 * Math.sqrt(3) * (2 * random() - 1)));
        sd.push(0.05 * rate * (0.5 + random()));
      }
    }
  }
  return fitDataFromArrays(s, i, v, withSd ? sd : undefined);
}

function relative(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), 1e-300);
}

/**
 * Estimates agree in units of their standard error (SE of ln p, from the per-point Jacobian): how
 * far apart two converged fits can stop is set by the flatness of the SSE at its minimum, which
 * the SSE resolves only to rounding (about 1e-13 relative here), i.e. to about 1e-5 SE; the
 * per-point fit restarted from elsewhere moves by as much (checked below).
 */
function expectSameEstimates(a: MechanismFit, b: MechanismFit, label: string, within = SAME_ESTIMATE_SE): number {
  const cov = unscaledCovariance(b.jacobian, b.n, b.p).matrix;
  const s2 = b.sse / b.df;
  let worst = 0;
  for (let j = 0; j < b.p; j++) {
    const se = Math.sqrt(s2 * cov[j * b.p + j]);
    if (!(se < 0.5)) continue; // a parameter that is not determined (relative SE 50% or more)
    const apart = Math.abs(a.theta[j] - b.theta[j]) / se;
    worst = Math.max(worst, apart);
    expect(apart, `${label} ${b.model.params[j]}`).toBeLessThan(within);
  }
  return worst;
}
const SAME_ESTIMATE_SE = 1e-4;
/** fixed weights: the same sum of squares to rounding */
const FIXED_WEIGHT_SSE = 1e-12;
/**
 * weights iterated to a fixed point (proportional, sqrt): the iteration stops when the weights
 * change by less than 1e-10, so the SSE is settled to about 1e-9 relative; on this table the
 * per-point fit started elsewhere ends up to 4e-10 apart from itself, the pooled one up to 1.2e-9
 */
const IRLS_SSE = 5e-9;

/** The same table, fitted with every point its own residual (the reference for the pooled form). */
const perPoint = (data: FitData): FitData => ({ ...data, perPointFit: true });

describe('pooling replicates', () => {
  it('pools only large tables with several points per condition', () => {
    expect(replicateGroups(replicatedTable(30))?.count).toBe(40);
    // below the point count: 40 x 24 = 960 points
    expect(40 * 24).toBeLessThan(GROUPED_FIT_MIN_POINTS);
    expect(replicateGroups(replicatedTable(24))).toBeNull();
    // enough points but too few per condition: every point its own condition
    const distinct = fitDataFromArrays(Array.from({ length: 2000 }, (_, k) => 1 + k), new Array(2000).fill(0), new Array(2000).fill(1));
    expect(replicateGroups(distinct)).toBeNull();
    expect(GROUPED_FIT_MIN_REPLICATES).toBeGreaterThan(1);
    // switched off per table for the comparisons below
    expect(replicateGroups(perPoint(replicatedTable(30)))).toBeNull();
  });

  it('splits the weighted sum of squares exactly into between and within conditions', () => {
    const data = replicatedTable(30);
    const groups = replicateGroups(data)!;
    const sqrtW = Float64Array.from(data.v, (x, k) => 1 / (x * (1 + (k % 7) / 10)));
    const pooled = poolConditions(groups, data.v, sqrtW);
    const f = Float64Array.from({ length: groups.count }, (_, g) => 0.9 * pooled.mean[g] + 0.3);
    let pointSum = 0;
    for (let k = 0; k < data.v.length; k++) pointSum += (sqrtW[k] * (data.v[k] - f[groups.groupOf[k]])) ** 2;
    let split = pooled.sqrtWithin ** 2;
    for (let g = 0; g < groups.count; g++) split += (pooled.sqrtW[g] * (pooled.mean[g] - f[g])) ** 2;
    expect(relative(split, pointSum)).toBeLessThan(1e-13);
    // the pooled problem's residual vector has that sum of squares at any parameters
    const problem = weightedProblem(competitive, data, sqrtW, parameterLogScales(competitive, data));
    expect(problem.n).toBe(groups.count + 1);
    const r = new Float64Array(problem.n);
    const x = Float64Array.from([Math.log(90), Math.log(12), Math.log(0.8)]);
    problem.residuals(x, r);
    const direct = weightedProblem(competitive, perPoint(data), sqrtW, parameterLogScales(competitive, data));
    const rp = new Float64Array(direct.n);
    direct.residuals(x, rp);
    const sum = (a: Float64Array) => a.reduce((t, y) => t + y * y, 0);
    expect(relative(sum(r), sum(rp))).toBeLessThan(1e-13);
  });

  const cases: [ErrorModel, boolean][] = [['constant', false], ['proportional', false], ['sqrt', false], ['column', true]];
  for (const [errorModel, withSd] of cases) {
    it(`gives the per-point fit of every mechanism (${errorModel} error)`, () => {
      const data = replicatedTable(30, withSd);
      expect(replicateGroups(data)).not.toBeNull();
      for (const model of MECHANISMS) {
        const pooled = fitMechanism(model, data, errorModel);
        const unpooled = fitMechanism(model, perPoint(data), errorModel);
        expect(pooled.n).toBe(data.v.length);
        const close = weightsDependOnFit(errorModel) ? IRLS_SSE : FIXED_WEIGHT_SSE;
        expect(relative(pooled.sse, unpooled.sse), model.mechanism).toBeLessThan(close);
        expect(relative(pooled.logLik, unpooled.logLik)).toBeLessThan(close);
        expect(relative(aicc(pooled.logLik, pooled.p + 1, pooled.n), aicc(unpooled.logLik, unpooled.p + 1, unpooled.n))).toBeLessThan(close);
        expectSameEstimates(pooled, unpooled, model.mechanism);
      }
    });
  }

  it('gives the per-point fit with per-point weight multipliers (robust refits)', () => {
    const data = replicatedTable(30);
    const multipliers = Float64Array.from(data.v, (_, k) => (k % 11 === 0 ? 0.3 : 1));
    const pooled = fitMechanism(competitive, data, 'proportional', { weightMultipliers: multipliers });
    const unpooled = fitMechanism(competitive, perPoint(data), 'proportional', { weightMultipliers: multipliers });
    expect(relative(pooled.sse, unpooled.sse)).toBeLessThan(1e-9);
    expect(relative(pooled.logLik, unpooled.logLik)).toBeLessThan(1e-9);
    expectSameEstimates(pooled, unpooled, 'robust');
  });

  it('stops as close to the per-point fit as the per-point fit does to itself from another start', () => {
    const data = replicatedTable(30);
    const unpooled = fitMechanism(competitive, perPoint(data), 'constant');
    const restarted = fitMechanism(competitive, perPoint(data), 'constant', { extraStarts: [[70, 30, 3]] });
    const pooled = fitMechanism(competitive, data, 'constant');
    const self = expectSameEstimates(restarted, unpooled, 'restart');
    const across = expectSameEstimates(pooled, unpooled, 'pooled');
    // both far inside the tolerance (seen: 8e-8 and 3e-8 SE), and of one size
    expect(across).toBeLessThan(10 * Math.max(self, 1e-9));
  });

  it('gives the per-point profile-likelihood intervals and bootstrap refits', () => {
    const data = replicatedTable(30);
    const fit = fitMechanism(competitive, data, 'proportional');
    const pooled = profileAllOfFit(fit, data);
    const unpooled = profileAllOfFit(fit, perPoint(data));
    expect(pooled.length).toBe(3);
    pooled.forEach((profile, j) => {
      for (let end = 0; end < 2; end++) {
        const a = profile.interval[end];
        const b = unpooled[j].interval[end];
        expect(a).not.toBeNull();
        expect(relative(a!, b!), `${profile.name} end ${end}`).toBeLessThan(1e-7);
      }
    });
    const start = [Array.from(fit.params, (x) => x * 1.2)];
    const refit = refitFromStarts(competitive, data, 'proportional', start);
    const refitPerPoint = refitFromStarts(competitive, perPoint(data), 'proportional', start);
    expect(relative(refit.sse, refitPerPoint.sse)).toBeLessThan(1e-9);
    for (let j = 0; j < 3; j++) expect(Math.abs(Math.log(refit.params[j] / refitPerPoint.params[j]))).toBeLessThan(1e-4 * Math.sqrt((fit.sse / fit.df) * unscaledCovariance(fit.jacobian, fit.n, fit.p).matrix[j * 4]));
  });
});
