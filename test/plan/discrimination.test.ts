/** The T-criterion noncentrality (Atkinson & Fedorov 1975) and the rough chance built on it. */
import { describe, expect, it } from 'vitest';
import { competitive, mixed, noncompetitive, uncompetitive } from '../../src/models/index.js';
import { chanceRivalSetAside, rivalNoncentrality, rivalsOf } from '../../src/plan/discrimination.js';
import { gridPoints } from '../../src/plan/candidate-designs.js';
import type { PriorPoint } from '../../src/plan/design-types.js';

const points = gridPoints([2, 5, 10, 20, 50, 100], [0, 0.5, 1, 3], 2);
const noise = { model: 'proportional', level: 0.05 } as const;
const comp: PriorPoint = { mechanism: 'competitive', Vmax: 10, Km: 10, Ki: 1 };

describe('rival noncentrality', () => {
  it('is zero for a rival that contains the truth (mixed around competitive data)', () => {
    expect(rivalNoncentrality({ mechanism: 'noncompetitive', Vmax: 10, Km: 10, Ki: 1 }, mixed, points, noise)).toBeLessThan(1e-12);
  });
  it('is positive for a rival that cannot mimic the truth, and equals the weighted SSE of its best fit', () => {
    const lambda = rivalNoncentrality(comp, uncompetitive, points, noise);
    expect(lambda).toBeGreaterThan(10);
    // no rival parameter set does better than the reported minimum (a coarse search around it)
    let best = Infinity;
    for (const vm of [8, 9, 10, 11, 12])
      for (const km of [3, 5, 8, 12, 20])
        for (const k of [0.3, 1, 3, 10]) {
          let sse = 0;
          for (const p of points) {
            const t = competitive.rate([10, 10, 1], p.substrate, p.inhibitor);
            sse += (p.replicates * (t - uncompetitive.rate([vm, km, k], p.substrate, p.inhibitor)) ** 2) / (0.05 * t) ** 2;
          }
          best = Math.min(best, sse);
        }
    expect(lambda).toBeLessThanOrEqual(best * (1 + 1e-9));
  });
  it('doubles with the replicates and quarters when the noise doubles', () => {
    const a = rivalNoncentrality(comp, noncompetitive, points, noise);
    const b = rivalNoncentrality(comp, noncompetitive, points.map((p) => ({ ...p, replicates: 4 })), noise);
    const c = rivalNoncentrality(comp, noncompetitive, points, { model: 'proportional', level: 0.1 });
    expect(b / a).toBeCloseTo(2, 5);
    expect(c / a).toBeCloseTo(0.25, 5);
  });
});

describe('the rough chance of setting a rival aside', () => {
  it('nested rival: the power of the 1-df test (noncentral chi-square) at its level', () => {
    expect(chanceRivalSetAside(0, 'nested', 0.05)).toBe(0);
    // lambda = (1.96 + 1.2816)^2 gives power 0.9 at level 0.05 (plus the negligible far tail)
    expect(chanceRivalSetAside((1.959964 + 1.281552) ** 2, 'nested', 0.05)).toBeCloseTo(0.9, 3);
  });
  it('same-size rival: one half at lambda = the AICc gap, rising with lambda', () => {
    expect(chanceRivalSetAside(4, 'same-size', 0)).toBeCloseTo(0.5, 10);
    expect(chanceRivalSetAside(40, 'same-size', 0)).toBeGreaterThan(0.99);
  });
  it('rivals follow the nesting: mixed against the three-parameter models, the others against each other', () => {
    const all = ['none', 'competitive', 'uncompetitive', 'noncompetitive', 'mixed'] as const;
    expect(rivalsOf('mixed', all).map((r) => r.rival)).toEqual(['none', 'competitive', 'uncompetitive', 'noncompetitive']);
    expect(rivalsOf('competitive', all).map((r) => r.rival)).toEqual(['none', 'uncompetitive', 'noncompetitive']);
    expect(rivalsOf('competitive', ['competitive', 'mixed'])).toEqual([]);
  });
});
