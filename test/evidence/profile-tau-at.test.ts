/**
 * profileTausAt (the exclusion tests' statistic) agrees with the profile intervals: at an end of the
 * profile-t interval, |tau| equals the t quantile of the level by definition (Bates & Watts 1988,
 * sec. 6.1), whichever way the end was reached. Invented data (simulated, seeded).
 */
import { describe, expect, it } from 'vitest';
import { profileAllOfFit, profileTausAt } from '../../src/evidence/intervals/profile-likelihood.js';
import { fitAllMechanisms } from '../../src/fit/fit-all-mechanisms.js';
import { fitDataFromTable } from '../../src/fit/fit-data.js';
import { simulateReferenceDesign } from '../../src/simulate/reference-design.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { tQuantile } from '../../src/stats/distributions.js';
import { parameterLogScales, weightedProblem } from '../../src/fit/fit-mechanism.js';
import { levenbergMarquardt } from '../../src/fit/levenberg-marquardt.js';
import { profiledProblem, profiledQuantity } from '../../src/evidence/intervals/profiled-problem.js';
import { profileSupport } from '../../src/evidence/intervals/profile-support.js';

describe('profile t statistic at given values', () => {
  for (const seed of [3, 11]) {
    it(`equals the t quantile at the ends of the 95% alpha interval (seed ${seed})`, () => {
      const data = fitDataFromTable(tableFromPoints(simulateReferenceDesign('mixed', seed)));
      const mixed = fitAllMechanisms(data, 'proportional').find((f) => f.mechanism === 'mixed')!;
      const alpha = profileAllOfFit(mixed, data, { level: 0.95 }).find((p) => p.name === 'alpha')!;
      const [lo, hi] = alpha.interval;
      expect(lo).not.toBeNull();
      expect(hi).not.toBeNull();
      const { taus, df } = profileTausAt(mixed, data, 'alpha', [hi!, lo!]);
      const t = tQuantile(0.975, df);
      expect(taus[0]).toBeCloseTo(t, 5);
      expect(taus[1]).toBeCloseTo(-t, 5);
    });
  }
  it('with alpha estimated far beyond the support (competitive data), the taus at the exclusion bounds are the constrained minimum found from a grid of starts', () => {
    const data = fitDataFromTable(tableFromPoints(simulateReferenceDesign('competitive', 5)));
    const mixed = fitAllMechanisms(data, 'proportional').find((f) => f.mechanism === 'mixed')!;
    const lnAlpha = mixed.theta[3] - mixed.theta[2];
    // the walk starts at the edge of the support, not at the estimate
    expect(lnAlpha).toBeGreaterThan(profileSupport(data, 'alpha').high);
    const bounds = [10, 2, 0.5, 0.1];
    const { taus } = profileTausAt(mixed, data, 'alpha', bounds);
    // reference: at each bound, the lowest SSE over a 5 x 5 x 5 grid of starts for (Vmax, Km, Ki)
    // around the fit, each run to the engine's default tolerances
    const full = weightedProblem(mixed.model, data, mixed.weights.map(Math.sqrt), parameterLogScales(mixed.model, data));
    const fixed = { value: 0 };
    const problem = profiledProblem(full, profiledQuantity(mixed.model.params, 'alpha'), fixed);
    const s2 = mixed.sse / mixed.df;
    const offsets = [-2, -1, 0, 1, 2];
    bounds.forEach((bound, k) => {
      fixed.value = Math.log(bound);
      let best = Infinity;
      for (const a of offsets) for (const b of offsets) for (const c of offsets) {
        const start = Float64Array.of(mixed.theta[0] + 0.25 * a, mixed.theta[1] + 0.5 * b, mixed.theta[2] + c);
        best = Math.min(best, levenbergMarquardt(problem, start).sse);
      }
      const reference = -Math.sqrt(Math.max(0, best - mixed.sse) / s2);
      expect(Math.abs(taus[k] - reference)).toBeLessThan(1e-6 * Math.max(1, Math.abs(reference)));
    });
  });
});

