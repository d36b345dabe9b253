/**
 * The joint (Ki, Kiu) likelihood region against a brute-force reference:
 * test/fixtures/scipy-region/runner.py (scipy.optimize.least_squares re-optimised on a grid along
 * each ray, crossings refined by brentq; simulated data written into reference.json by the runner).
 * The outline points must agree to 1e-6 relative: the rays are the same (angles 2 pi r / R scaled by
 * the Wald SEs, which both sides compute from the Jacobian at the solution), and the crossing along
 * a ray is found to 1e-8 here and to 1e-13 by the reference.
 * Also checked at the default 72 rays: every outline point lies on the contour (the profiled SSE,
 * re-optimised here from the estimate, equals the region's threshold).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { modelFor } from '../../src/models/index.js';
import { fitMechanism, parameterLogScales, weightedProblem } from '../../src/fit/fit-mechanism.js';
import { fitDataFromArrays } from '../../src/fit/fit-data.js';
import { levenbergMarquardt } from '../../src/fit/levenberg-marquardt.js';
import { fQuantile } from '../../src/stats/distributions.js';
import { jointRegionKiKiu } from '../../src/evidence/intervals/joint-region.js';

interface Reference {
  level: number;
  rays: number;
  cases: { name: string; s: number[]; i: number[]; v: number[]; sse: number; params: number[]; ki: number[]; kiu: number[] }[];
}

const reference = JSON.parse(readFileSync(new URL('../fixtures/scipy-region/reference.json', import.meta.url), 'utf8')) as Reference;

describe('joint (Ki, Kiu) region matches the scipy brute-force reference', () => {
  for (const c of reference.cases) {
    const data = fitDataFromArrays(c.s, c.i, c.v);
    const fit = fitMechanism(modelFor('mixed'), data, 'constant');
    it(`${c.name}: the same fit, and the same outline on ${reference.rays} rays`, () => {
      expect(Math.abs(fit.sse - c.sse) / c.sse).toBeLessThan(1e-10);
      const region = jointRegionKiKiu(fit, data, { level: reference.level, rays: reference.rays })!;
      expect(region.open).toBe(false);
      expect(region.ki).toHaveLength(reference.rays + 1);
      for (let r = 0; r < reference.rays; r++) {
        expect(Math.abs(region.ki[r] - c.ki[r]) / c.ki[r]).toBeLessThan(1e-6);
        expect(Math.abs(region.kiu[r] - c.kiu[r]) / c.kiu[r]).toBeLessThan(1e-6);
      }
    });
    it(`${c.name}: at 72 rays every outline point is on the contour`, () => {
      const region = jointRegionKiKiu(fit, data, { level: reference.level })!;
      const threshold = fit.sse * (1 + (2 / fit.df) * fQuantile(reference.level, 2, fit.df));
      const full = weightedProblem(fit.model, data, fit.weights.map(Math.sqrt), parameterLogScales(fit.model, data));
      const theta = new Float64Array(4);
      for (let r = 0; r < 72; r++) {
        const held = [Math.log(region.ki[r]), Math.log(region.kiu[r])];
        const problem = {
          n: full.n,
          m: 2,
          residuals: (z: Float64Array, out: Float64Array) => full.residuals(Float64Array.of(z[0], z[1], held[0], held[1]), out),
          jacobian: (z: Float64Array, J: Float64Array) => {
            theta.set([z[0], z[1], held[0], held[1]]);
            const jFull = new Float64Array(full.n * 4);
            full.jacobian(theta, jFull);
            for (let k = 0; k < full.n; k++) {
              J[2 * k] = jFull[4 * k];
              J[2 * k + 1] = jFull[4 * k + 1];
            }
          },
        };
        const sse = levenbergMarquardt(problem, fit.theta.slice(0, 2)).sse;
        expect(Math.abs(sse - threshold) / threshold).toBeLessThan(1e-8);
      }
    });
  }
});
