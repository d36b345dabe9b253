/**
 * Checks a model's analytic log-parameter gradient (p_k dv/dp_k) against central differences in
 * ln p_k, step 1e-5, to 1e-7 relative (truncation error of order h^2 = 1e-10, far inside the bound).
 */
import { expect } from 'vitest';
import type { MechanismModel } from '../../src/models/types.js';

export function expectGradientMatchesDifferences(model: MechanismModel, p: number[], points: ReadonlyArray<readonly [number, number, number?]>): void {
  const grad = new Float64Array(p.length);
  const h = 1e-5;
  for (const [s, i, e] of points) {
    model.gradLog(p, s, i, grad, 0, e);
    for (let j = 0; j < p.length; j++) {
      const up = p.slice();
      const down = p.slice();
      up[j] = p[j] * Math.exp(h);
      down[j] = p[j] * Math.exp(-h);
      const numeric = (model.rate(up, s, i, e) - model.rate(down, s, i, e)) / (2 * h);
      expect(Math.abs(grad[j] - numeric)).toBeLessThan(1e-7 * Math.max(1, Math.abs(numeric)));
    }
  }
}
