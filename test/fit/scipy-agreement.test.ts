/**
 * The engine against an independent reference: test/fixtures/scipy-fit/reference.json, written by
 * test/fixtures/scipy-fit/runner.py (scipy.optimize.least_squares, trf and lm, tight tolerances, a
 * grid of starts, the same IRLS scheme for the proportional error model) from the simulated datasets
 * in test/fixtures/scipy-fit/datasets.json (make-datasets.mjs; invented data).
 *
 * Checks, per dataset, error model and mechanism:
 * - same minimum: our weighted SSE is never above scipy's by more than 1e-7 relative, and not below
 *   it by more than 1e-7 either (which would mean the reference missed the minimum);
 * - same parameters, 1e-5 relative, where the parameter is well determined: relative SE (scipy)
 *   below 0.5 and, for an inhibition constant, not beyond the detection bound (100 x max [I]).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { MECHANISMS } from '../../src/models/index.js';
import type { Mechanism } from '../../src/models/types.js';
import { fitAllMechanisms } from '../../src/fit/fit-all-mechanisms.js';
import { fitDataFromArrays } from '../../src/fit/fit-data.js';
import type { ErrorModel } from '../../src/fit/error-models.js';
import { detectionBound } from '../../src/evidence/intervals/detection-bound.js';

const DIR = new URL('../fixtures/scipy-fit/', import.meta.url);

interface Dataset {
  name: string;
  s: number[];
  i: number[];
  v: number[];
}
interface ReferenceFit {
  sse: number;
  params: number[];
  relativeSe: (number | null)[];
}
interface ReferenceEntry {
  name: string;
  maxInhibitor: number;
  fits: Partial<Record<ErrorModel, Record<Mechanism, ReferenceFit>>>;
}

const datasets = (JSON.parse(readFileSync(new URL('datasets.json', DIR), 'utf8')) as { datasets: Dataset[] }).datasets;
const reference = (JSON.parse(readFileSync(new URL('reference.json', DIR), 'utf8')) as { results: ReferenceEntry[] }).results;

export const SSE_TOLERANCE = 1e-7;
export const PARAM_TOLERANCE = 1e-5;

describe('global fits agree with scipy.optimize.least_squares', () => {
  it('covers every dataset of the fixture', () => {
    expect(reference.map((r) => r.name)).toEqual(datasets.map((d) => d.name));
    expect(datasets.length).toBeGreaterThanOrEqual(10);
  });

  for (const entry of reference) {
    const ds = datasets.find((d) => d.name === entry.name)!;
    for (const [errorModel, byMechanism] of Object.entries(entry.fits) as [ErrorModel, Record<Mechanism, ReferenceFit>][]) {
      it(`${entry.name}, ${errorModel} error: same minimum and parameters for all five mechanisms`, () => {
        const data = fitDataFromArrays(ds.s, ds.i, ds.v);
        const fits = fitAllMechanisms(data, errorModel);
        const bound = detectionBound(entry.maxInhibitor);
        for (const fit of fits) {
          const ref = byMechanism[fit.mechanism];
          const excess = (fit.sse - ref.sse) / ref.sse;
          expect(excess, `${fit.mechanism}: our SSE above scipy's`).toBeLessThanOrEqual(SSE_TOLERANCE);
          expect(-excess, `${fit.mechanism}: scipy missed the minimum`).toBeLessThanOrEqual(SSE_TOLERANCE);
          MECHANISMS.find((m) => m.mechanism === fit.mechanism)!.params.forEach((name, j) => {
            const se = ref.relativeSe[j];
            const beyondBound = (name === 'Ki' || name === 'Kiu') && ref.params[j] > bound;
            if (se === null || !(se < 0.5) || beyondBound) return;
            const diff = Math.abs(fit.params[j] - ref.params[j]) / ref.params[j];
            expect(diff, `${fit.mechanism} ${name}`).toBeLessThanOrEqual(PARAM_TOLERANCE);
          });
        }
      });
    }
  }
});
