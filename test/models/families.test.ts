import { describe, expect, it } from 'vitest';
import { expectGradientMatchesDifferences } from '../helpers/gradient-check.js';
import { MECHANISMS, competitive, mixed, noncompetitive, uncompetitive } from '../../src/models/index.js';
import { TIGHT_BINDING_FITTED, TIGHT_BINDING_GIVEN } from '../../src/models/tight-binding.js';
import { PARTIAL_MODELS, partialCompetitive, partialMixed, partialNoncompetitive } from '../../src/models/partial.js';
import { morrisonFractions } from '../../src/models/morrison.js';
import { embedByRules, modelId, nestedPairsAmong, registeredModels } from '../../src/models/registry.js';
import type { MechanismModel } from '../../src/models/types.js';

const points: Array<[number, number, number]> = [
  [0.3, 0, 0.5], [2, 0, 2], [15, 0.2, 1], [0.5, 1.5, 3], [4, 3, 0.7], [40, 7.5, 5], [1, 20, 2.5], [8, 2, 9],
];
function trial(model: MechanismModel): number[] {
  const value: Record<string, number> = { Vmax: 12.5, Km: 3.2, Ki: 2.1, Kiu: 9.7, beta: 0.27, Et: 1.7 };
  return model.params.map((n) => value[n]);
}

describe('analytic gradients of the tight-binding and partial models (central differences)', () => {
  for (const model of [...TIGHT_BINDING_GIVEN, ...TIGHT_BINDING_FITTED, ...PARTIAL_MODELS]) {
    it(`${modelId(model)}: agree to 1e-7`, () => {
      const p = trial(model);
      expectGradientMatchesDifferences(model, p, points);
    });
  }
});

describe('Morrison quadratic (Morrison 1969; BRIEF section 12)', () => {
  it('as [E] -> 0 each tight-binding model is the classic rate law to 1e-9 (relative)', () => {
    const classic: Record<string, MechanismModel> = { competitive, uncompetitive, noncompetitive, mixed };
    for (const tb of TIGHT_BINDING_GIVEN) {
      const c = classic[tb.mechanism];
      const p = trial(tb);
      for (const [s, i] of points) {
        for (const e of [1e-9, 1e-12, 0]) {
          const want = c.rate(p, s, i);
          expect(Math.abs(tb.rate(p, s, i, e) - want)).toBeLessThanOrEqual(1e-9 * want);
        }
      }
    }
  });
  it('the cancellation-free fractions equal the textbook form where that form is accurate, and stay exact where it fails', () => {
    // textbook: bound = ((E + I + K) - sqrt((E + I + K)^2 - 4 E I)) / (2 E)  (Copeland 2013, ch. 7)
    for (const [E, I, K] of [[1, 1, 1], [5, 2, 0.5], [0.3, 10, 2], [2, 0.1, 0.05]]) {
      const b = E + I + K;
      const textbook = (b - Math.sqrt(b * b - 4 * E * I)) / (2 * E);
      const f = morrisonFractions(E, I, K);
      expect(Math.abs(f.bound - textbook)).toBeLessThan(1e-13);
      expect(Math.abs(f.activity + f.bound - 1)).toBeLessThan(1e-15);
    }
    // E = 1e-12 of I + K: the textbook form has lost all digits, ours gives I/(I + K)
    const f = morrisonFractions(1e-12, 3, 1);
    expect(Math.abs(f.bound - 0.75)).toBeLessThan(1e-12);
    const b = 1e-12 + 4;
    const textbook = (b - Math.sqrt(b * b - 4e-12 * 3)) / 2e-12;
    expect(Math.abs(textbook - 0.75)).toBeGreaterThan(1e-6);
  });
  it('titration: with Ki << E the activity falls linearly, 1 - I/E, until I = E (stoichiometric limit)', () => {
    for (const I of [0.1, 0.5, 0.9]) expect(morrisonFractions(1, I, 1e-9).activity).toBeCloseTo(1 - I, 7);
    expect(morrisonFractions(1, 2, 1e-9).activity).toBeLessThan(1e-8);
  });
});

describe('partial (hyperbolic) models (Segel 1975, ch. 4; BRIEF section 13)', () => {
  it('beta -> 0 gives the full mixed and noncompetitive laws; beta = 1, Kiu -> inf competitive', () => {
    for (const [s, i] of points) {
      expect(partialMixed.rate([12.5, 3.2, 2.1, 9.7, 0], s, i)).toBeCloseTo(mixed.rate([12.5, 3.2, 2.1, 9.7], s, i), 12);
      expect(partialNoncompetitive.rate([12.5, 3.2, 2.1, 0], s, i)).toBeCloseTo(noncompetitive.rate([12.5, 3.2, 2.1], s, i), 12);
      expect(partialCompetitive.rate([12.5, 3.2, 2.1, 1e300], s, i)).toBeCloseTo(competitive.rate([12.5, 3.2, 2.1], s, i), 12);
      expect(partialMixed.rate([12.5, 3.2, 2.1, 9.7, 1], s, i)).toBeCloseTo(partialCompetitive.rate([12.5, 3.2, 2.1, 9.7], s, i), 12);
      expect(partialMixed.rate([12.5, 3.2, 2.1, 2.1, 0.27], s, i)).toBeCloseTo(partialNoncompetitive.rate([12.5, 3.2, 2.1, 0.27], s, i), 12);
    }
  });
  it('the rate levels off at the residual activity at saturating [I]', () => {
    for (const m of PARTIAL_MODELS) {
      const p = trial(m);
      for (const s of [0.5, 3, 30]) {
        const v0 = m.rate(p, s, 0);
        expect(m.rate(p, s, 1e12) / v0).toBeCloseTo(m.capabilities!.residualActivity!(p, s), 9);
      }
    }
  });
});

describe('the registry', () => {
  it('derives exactly the seven classic nested pairs (BRIEF sec. 2: none in all, the three-parameter models in mixed)', () => {
    const pairs = nestedPairsAmong(MECHANISMS).map((p) => `${p.simpler.mechanism}<${p.fuller.mechanism}`).sort();
    expect(pairs).toEqual(
      ['none<competitive', 'none<uncompetitive', 'none<noncompetitive', 'none<mixed', 'competitive<mixed', 'uncompetitive<mixed', 'noncompetitive<mixed'].sort(),
    );
  });
  it('embeds a smaller solution so that the larger model reproduces its rates', () => {
    const all = registeredModels();
    const lookup = (id: string) => all.find((m) => modelId(m) === id);
    const pairs = nestedPairsAmong(all, lookup);
    expect(pairs.length).toBeGreaterThanOrEqual(7 + 2 * 7 + 5);
    for (const pair of pairs) {
      const p = trial(pair.simpler);
      const embedded = embedByRules(pair.simpler, pair.fuller, p, (_n, to) => (to === 'zero' ? 1e-300 : 1e300));
      // 'none' inside a model that fits Et: Et has no value there (nothing binds), so no embedding
      if (pair.fuller.params.includes('Et') && !pair.simpler.params.includes('Et')) {
        expect(embedded).toBeNull();
        continue;
      }
      expect(embedded).not.toBeNull();
      for (const [s, i, e] of points) {
        const want = pair.simpler.rate(p, s, i, e);
        // the Et-fitted tight-binding models contain 'none' (E irrelevant when nothing binds)
        expect(pair.fuller.rate(embedded!, s, i, e)).toBeCloseTo(want, 9);
      }
    }
  });
  it('knows every parameter of every new model', () => {
    for (const m of [...TIGHT_BINDING_GIVEN, ...TIGHT_BINDING_FITTED, ...PARTIAL_MODELS]) {
      expect(m.specs!.map((s) => s.name)).toEqual([...m.params]);
      expect(m.starts({ s: Float64Array.of(1, 2, 4), i: Float64Array.of(0, 1, 3), v: Float64Array.of(1, 1.5, 1) }).every((st) => st.length === m.params.length)).toBe(true);
    }
  });
});
