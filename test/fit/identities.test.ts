/**
 * Identities the global fit must satisfy whatever the data, from the algebra of the rate laws
 * (BRIEF sec. 2; Segel 1975, ch. 3): the nesting of the models, exact recovery from noise-free
 * simulations, and equivariance under changes of units and row order. Data: the project's seeded
 * simulator (invented data). Good design of BRIEF sec. 7: [S] 0.2-10 x Km (8 levels),
 * [I] 0, 0.5, 1, 2, 4 x Ki, triplicates.
 */
import { describe, expect, it } from 'vitest';
import type { Mechanism, ParamName } from '../../src/models/types.js';
import { fitAllMechanisms } from '../../src/fit/fit-all-mechanisms.js';
import { fitDataFromArrays, type FitData } from '../../src/fit/fit-data.js';
import type { ErrorModel } from '../../src/fit/error-models.js';
import type { MechanismFit } from '../../src/fit/fit-mechanism.js';
import { detectionBound } from '../../src/evidence/intervals/detection-bound.js';
import { REFERENCE_INHIBITOR, REFERENCE_KM, REFERENCE_TRUTH, simulateReferenceDesign } from '../../src/simulate/reference-design.js';

const KM = REFERENCE_KM;
const MAX_I = Math.max(...REFERENCE_INHIBITOR);
const TRUTH = REFERENCE_TRUTH;
const NESTED: Mechanism[] = ['none', 'competitive', 'uncompetitive', 'noncompetitive'];

function simulate(mechanism: Mechanism, noiseLevel: number, seed: number): FitData {
  const points = simulateReferenceDesign(mechanism, seed, noiseLevel);
  return fitDataFromArrays(points.map((p) => p.substrate), points.map((p) => p.inhibitor), points.map((p) => p.rate));
}

function byMechanism(fits: MechanismFit[]): Record<Mechanism, MechanismFit> {
  return Object.fromEntries(fits.map((f) => [f.mechanism, f])) as Record<Mechanism, MechanismFit>;
}

function param(fit: MechanismFit, name: ParamName): number {
  return fit.params[fit.model.params.indexOf(name)];
}

function relative(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

/** A constant this far past the largest [I] (ln units) has run to the edge of the fitting domain. */
const AT_EDGE = MAX_I * Math.exp(20);

describe('noise-free data: every model of the right family recovers the truth exactly', () => {
  for (const errorModel of ['constant', 'proportional'] as ErrorModel[]) {
    for (const mechanism of Object.keys(TRUTH) as Mechanism[]) {
      it(`${mechanism} data, ${errorModel} error: own model and mixed recover the truth; undetected arms run off`, () => {
        const fits = byMechanism(fitAllMechanisms(simulate(mechanism, 0, 1), errorModel));
        const own = fits[mechanism];
        let scale = 0;
        for (const v of own.fitted) scale += v * v;
        expect(own.sse).toBeLessThan(1e-20 * (errorModel === 'constant' ? scale : 1));
        for (const [name, value] of Object.entries(TRUTH[mechanism])) expect(relative(param(own, name as ParamName), value!)).toBeLessThan(1e-6);

        const mixed = fits.mixed;
        const t = TRUTH[mechanism];
        expect(relative(param(mixed, 'Vmax'), 100)).toBeLessThan(1e-6);
        expect(relative(param(mixed, 'Km'), KM)).toBeLessThan(1e-6);
        // mixed contains every mechanism: Ki and Kiu are the truth, or beyond the detection bound
        const expectedKi = mechanism === 'noncompetitive' ? t.Ki : mechanism === 'uncompetitive' || mechanism === 'none' ? undefined : t.Ki;
        const expectedKiu = mechanism === 'noncompetitive' ? t.Ki : mechanism === 'competitive' || mechanism === 'none' ? undefined : t.Kiu;
        for (const [name, expected] of [['Ki', expectedKi], ['Kiu', expectedKiu]] as [ParamName, number | undefined][]) {
          if (expected === undefined) expect(param(mixed, name)).toBeGreaterThan(detectionBound(MAX_I));
          else expect(relative(param(mixed, name), expected)).toBeLessThan(1e-6);
        }
      });
    }
  }
});

describe('noisy data: nesting of the models (constant error, so weights are equal across models)', () => {
  const seeds = [11, 12, 13, 14, 15];
  for (const mechanism of Object.keys(TRUTH) as Mechanism[]) {
    it(`${mechanism} data (5% noise, ${seeds.length} seeds): mixed is never worse than a nested model; a run-off arm gives the nested SSE`, () => {
      for (const seed of seeds) {
        const fits = byMechanism(fitAllMechanisms(simulate(mechanism, 0.05, seed), 'constant'));
        for (const nested of NESTED) expect(fits.mixed.sse).toBeLessThanOrEqual(fits[nested].sse * (1 + 1e-9));
        for (const three of ['competitive', 'uncompetitive', 'noncompetitive'] as Mechanism[])
          expect(fits[three].sse).toBeLessThanOrEqual(fits.none.sse * (1 + 1e-9));
        // an arm at the edge of the domain contributes nothing: mixed equals the nested model
        const ki = param(fits.mixed, 'Ki');
        const kiu = param(fits.mixed, 'Kiu');
        if (kiu > AT_EDGE && ki <= AT_EDGE) expect(relative(fits.mixed.sse, fits.competitive.sse)).toBeLessThan(1e-6);
        if (ki > AT_EDGE && kiu <= AT_EDGE) expect(relative(fits.mixed.sse, fits.uncompetitive.sse)).toBeLessThan(1e-6);
        if (ki > AT_EDGE && kiu > AT_EDGE) expect(relative(fits.mixed.sse, fits.none.sse)).toBeLessThan(1e-6);
        for (const three of ['competitive', 'uncompetitive', 'noncompetitive'] as Mechanism[]) {
          const k = fits[three].params[2];
          if (k > AT_EDGE) expect(relative(fits[three].sse, fits.none.sse)).toBeLessThan(1e-6);
        }
      }
    });
  }

  it('competitive data fitted by mixed: Kiu is not detected at 1% noise in most datasets (measured 36/40)', () => {
    // With noise, 1/Kiu is estimated near 0 with sampling error; a positive estimate small enough is
    // still read as not detected. Measured: 36 of seeds 1-40 (90%) give Kiu > 100 x max [I]; the
    // bound below (75%) leaves room for changes of the engine's starting values, not of the law.
    let notDetected = 0;
    const n = 40;
    for (let seed = 1; seed <= n; seed++) {
      const mixed = fitAllMechanisms(simulate('competitive', 0.01, seed), 'constant')[4];
      if (param(mixed, 'Kiu') > detectionBound(MAX_I)) notDetected++;
    }
    expect(notDetected / n).toBeGreaterThanOrEqual(0.75);
  });
});

describe('equivariance', () => {
  const data = simulate('mixed', 0.05, 21);
  for (const errorModel of ['constant', 'proportional'] as ErrorModel[]) {
    it(`${errorModel} error: rescaling rates and concentrations rescales the parameters and the SSE`, () => {
      const [a, b, c] = [1000, 1e-3, 50]; // rate, substrate and inhibitor unit factors
      const scaled = fitDataFromArrays(data.s.map((x) => x * b), data.i.map((x) => x * c), data.v.map((x) => x * a));
      const base = fitAllMechanisms(data, errorModel);
      const other = fitAllMechanisms(scaled, errorModel);
      const factor: Record<ParamName, number> = { Vmax: a, Km: b, Ki: c, Kiu: c };
      base.forEach((fit, k) => {
        const sseFactor = errorModel === 'constant' ? a * a : 1; // proportional weights are 1/f^2
        expect(relative(other[k].sse, fit.sse * sseFactor)).toBeLessThan(1e-8);
        fit.model.params.forEach((name, j) => {
          if ((name === 'Ki' || name === 'Kiu') && fit.params[j] > detectionBound(MAX_I)) return;
          expect(relative(other[k].params[j], fit.params[j] * factor[name])).toBeLessThan(1e-6);
        });
      });
    });
  }

  it('row order does not change the fit', () => {
    const order = Array.from(data.v, (_, k) => k).reverse();
    const shuffled = fitDataFromArrays(order.map((k) => data.s[k]), order.map((k) => data.i[k]), order.map((k) => data.v[k]));
    const base = fitAllMechanisms(data, 'proportional');
    const other = fitAllMechanisms(shuffled, 'proportional');
    base.forEach((fit, k) => expect(relative(other[k].sse, fit.sse)).toBeLessThan(1e-9));
  });
});
