/**
 * Outside check of the expected information: on well-conditioned designs, the standard errors of
 * ln Km and ln Ki from the Fisher information agree with the spread of the estimates over
 * simulated datasets fitted by the project's global fit, within 15% (the criterion).
 * Invented truth and designs, for simulation only.
 */
import { describe, expect, it } from 'vitest';
import { competitive, mixed } from '../../src/models/index.js';
import type { MechanismModel } from '../../src/models/types.js';
import { fitMechanism } from '../../src/fit/fit-mechanism.js';
import { fitDataFromTable } from '../../src/fit/fit-data.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { seededRandom } from '../../src/simulate/random.js';
import { expectedLogStandardErrors, fisherInformation } from '../../src/plan/fisher-information.js';
import { simulateDesign } from '../../src/plan/monte-carlo.js';
import { gridPoints } from '../../src/plan/candidate-designs.js';
import type { PlanNoise, PriorPoint } from '../../src/plan/design-types.js';

function spread(model: MechanismModel, truth: PriorPoint, noise: PlanNoise, simulations: number) {
  const design = { name: 'check', description: '', points: gridPoints([2, 5, 10, 20, 50, 100, 200], [0, 0.5, 1, 2, 4], 3) };
  const p = model.params.map((n) => truth[n]!);
  const se = expectedLogStandardErrors(fisherInformation(model, p, design.points, noise), p.length);
  const draws: number[][] = model.params.map(() => []);
  for (let k = 0; k < simulations; k++) {
    const rng = seededRandom(1000 + k);
    const data = fitDataFromTable(tableFromPoints(simulateDesign(design, truth, noise, rng)));
    const fit = fitMechanism(model, data, noise.model);
    fit.theta.forEach((t, j) => draws[j].push(t));
  }
  const sd = draws.map((xs) => {
    const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
    return Math.sqrt(xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (xs.length - 1));
  });
  return { se, sd };
}

describe('Fisher-information SEs against the Monte Carlo spread of the fitted constants', () => {
  it('competitive, 5% proportional noise, 105 wells: every ln-parameter SD within 15%', () => {
    const { se, sd } = spread(competitive, { mechanism: 'competitive', Vmax: 10, Km: 15, Ki: 1 }, { model: 'proportional', level: 0.05 }, 300);
    se.forEach((s, j) => expect(Math.abs(sd[j] / s - 1), `parameter ${competitive.params[j]}: SD ${sd[j]}, SE ${s}`).toBeLessThan(0.15));
  });
  it('mixed (alpha 4), constant noise: every ln-parameter SD within 15%', () => {
    const { se, sd } = spread(mixed, { mechanism: 'mixed', Vmax: 10, Km: 15, Ki: 1, Kiu: 4 }, { model: 'constant', level: 0.2 }, 300);
    se.forEach((s, j) => expect(Math.abs(sd[j] / s - 1), `parameter ${mixed.params[j]}: SD ${sd[j]}, SE ${s}`).toBeLessThan(0.15));
  });
});
