/**
 * Outside check of the tight-binding and partial fits: test/fixtures/families/runner.py (scipy
 * 1.17 least_squares, its own data generator with invented data, its own textbook rate laws) fits
 * each dataset's generating model; ours must reach the same minimum (SSE within 1e-6 relative) and
 * the same constants (1e-6 relative). Regenerate: python3 test/fixtures/families/runner.py
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fitMechanism } from '../../src/fit/fit-mechanism.js';
import { fitAllMechanisms } from '../../src/fit/fit-all-mechanisms.js';
import { fitFamily } from '../../src/fit/fit-family.js';
import { lookupModel } from '../../src/models/registry.js';
import type { FitData } from '../../src/fit/fit-data.js';

interface Dataset {
  name: string;
  model: string;
  enzyme: number | null;
  s: number[];
  i: number[];
  v: number[];
  fits: Record<string, { sse: number; params: Record<string, number> }>;
}
const reference = JSON.parse(readFileSync(new URL('../fixtures/families/reference.json', import.meta.url), 'utf8')) as { datasets: Dataset[] };

function dataOf(d: Dataset): FitData {
  const data: FitData = { s: Float64Array.from(d.s), i: Float64Array.from(d.i), v: Float64Array.from(d.v) };
  if (d.enzyme !== null) data.e = new Float64Array(d.s.length).fill(d.enzyme);
  return data;
}

describe('tight-binding and partial fits agree with scipy least_squares (test/fixtures/families/runner.py)', () => {
  for (const d of reference.datasets) {
    it(`${d.name}: ${d.model}`, () => {
      const model = lookupModel(d.model)!;
      expect(model).toBeDefined();
      const data = dataOf(d);
      const want = d.fits[d.model];
      // the path the analysis takes: classic fits first, then the family with warm starts and the nesting check
      const classic = fitAllMechanisms(data, 'constant');
      const viaFamily = fitFamily([model], data, 'constant', classic)[0];
      const alone = fitMechanism(model, data, 'constant');
      for (const fit of [viaFamily, alone]) {
        expect(Math.abs(fit.sse - want.sse) / want.sse).toBeLessThan(1e-6);
        model.params.forEach((name, j) => {
          expect(Math.abs(fit.params[j] - want.params[name]) / want.params[name], name).toBeLessThan(1e-6);
        });
      }
    });
  }
});
