import { describe, expect, it } from 'vitest';
import { expectGradientMatchesDifferences } from '../helpers/gradient-check.js';
import { MECHANISMS, competitive, mixed, noncompetitive, uncompetitive, noInhibition } from '../../src/models/index.js';

const points: Array<[number, number]> = [
  [0.3, 0], [2, 0], [15, 0], [0.5, 1.5], [4, 3], [40, 7.5], [1, 20],
];
const trial: Record<string, number[]> = {
  none: [12.5, 3.2],
  competitive: [12.5, 3.2, 2.1],
  uncompetitive: [12.5, 3.2, 6.4],
  noncompetitive: [12.5, 3.2, 4.4],
  mixed: [12.5, 3.2, 2.1, 9.7],
};

describe('analytic gradients with respect to ln(parameter)', () => {
  for (const model of MECHANISMS) {
    it(`${model.label}: agree with central differences to 1e-7`, () => {
      const p = trial[model.mechanism];
      expectGradientMatchesDifferences(model, p, points);
    });
  }
});

describe('nesting identities (BRIEF section 2; Segel 1975 ch. 3)', () => {
  const V = 12.5, Km = 3.2, K = 2.1;
  it('mixed with Kiu -> infinity is competitive', () => {
    for (const [s, i] of points)
      expect(mixed.rate([V, Km, K, 1e300], s, i)).toBeCloseTo(competitive.rate([V, Km, K], s, i), 12);
  });
  it('mixed with Ki -> infinity is uncompetitive', () => {
    for (const [s, i] of points)
      expect(mixed.rate([V, Km, 1e300, K], s, i)).toBeCloseTo(uncompetitive.rate([V, Km, K], s, i), 12);
  });
  it('mixed with Ki = Kiu is noncompetitive', () => {
    for (const [s, i] of points)
      expect(mixed.rate([V, Km, K, K], s, i)).toBeCloseTo(noncompetitive.rate([V, Km, K], s, i), 12);
  });
  it('every model at I = 0 is Michaelis-Menten', () => {
    for (const model of MECHANISMS) {
      const p = trial[model.mechanism];
      for (const s of [0.1, 1, 10, 100])
        expect(model.rate(p, s, 0)).toBeCloseTo(noInhibition.rate([p[0], p[1]], s, 0), 12);
    }
  });
  it('half-saturation: v = Vmax/2 at S = Km without inhibitor', () => {
    expect(noInhibition.rate([V, Km], Km, 0)).toBeCloseTo(V / 2, 14);
  });
});

describe('starting values', () => {
  it('are positive and finite with the right length for every model', () => {
    const s = Float64Array.from([1, 2, 4, 8, 1, 2, 4, 8]);
    const i = Float64Array.from([0, 0, 0, 0, 5, 5, 5, 5]);
    const v = Float64Array.from([3, 5, 7, 8, 2, 3.5, 5, 6.5]);
    for (const model of MECHANISMS) {
      const starts = model.starts({ s, i, v });
      expect(starts.length).toBeGreaterThan(0);
      for (const st of starts) {
        expect(st).toHaveLength(model.params.length);
        for (const x of st) expect(x > 0 && Number.isFinite(x)).toBe(true);
      }
    }
  });
});
