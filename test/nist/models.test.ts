/**
 * The analytic Jacobians of the NIST models (test/nist/models.ts) agree with central differences
 * (step h = 1e-6 |b_j|, a common-practice choice) at the certified values and at both starts: the
 * difference must stay within 1e-5 of the column's largest derivative plus the rounding error of the
 * difference quotient (100 eps max|f| / h). Guards the derivatives the NIST check relies on.
 */
import { describe, expect, test } from 'vitest';
import { NIST_MODEL_NAMES, listNistFixtures, loadNistFixture, modelValue } from './models.js';

describe.each(listNistFixtures())('model %s', (name) => {
  const fixture = loadNistFixture(name);
  test('has a model function', () => {
    expect(NIST_MODEL_NAMES).toContain(name);
  });
  test('analytic derivatives match central differences', () => {
    const points = [fixture.certified.values, ...fixture.starts];
    const p = fixture.parameters;
    const grad = new Float64Array(p);
    for (const point of points) {
      const b = Float64Array.from(point);
      const worst = new Float64Array(p);
      const scale = new Float64Array(p);
      const rounding = new Float64Array(p);
      for (let i = 0; i < fixture.observations; i++) {
        modelValue(fixture, b, i, grad);
        for (let j = 0; j < p; j++) {
          const h = b[j] === 0 ? 1e-6 : 1e-6 * Math.abs(b[j]);
          const keep = b[j];
          b[j] = keep + h;
          const up = modelValue(fixture, b, i);
          b[j] = keep - h;
          const down = modelValue(fixture, b, i);
          b[j] = keep;
          const numeric = (up - down) / (2 * h);
          if (!Number.isFinite(grad[j]) && !Number.isFinite(numeric)) continue;
          worst[j] = Math.max(worst[j], Math.abs(numeric - grad[j]));
          scale[j] = Math.max(scale[j], Math.abs(grad[j]));
          rounding[j] = Math.max(rounding[j], (100 * Number.EPSILON * Math.max(Math.abs(up), Math.abs(down))) / h);
        }
      }
      for (let j = 0; j < p; j++) expect(worst[j], `b${j + 1} at ${point.join(', ')}`).toBeLessThanOrEqual(1e-5 * scale[j] + rounding[j]);
    }
  });
});
