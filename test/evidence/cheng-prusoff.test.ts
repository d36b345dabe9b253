/**
 * IC50 closed forms (Cheng, Y. and Prusoff, W. H. (1973) Biochem. Pharmacol. 22, 3099-3108; as listed
 * in the project brief, section 8) against the IC50 found numerically from each rate law: the root
 * in I of v(S, I) = v(S, 0) / 2. Apparent constants (Segel 1975, ch. 3) against the rate law itself.
 */
import { describe, expect, it } from 'vitest';
import { modelFor } from '../../src/models/index.js';
import type { Mechanism } from '../../src/models/types.js';
import { ic50AtSubstrate } from '../../src/evidence/constants/cheng-prusoff.js';
import { apparentKm, apparentVmax } from '../../src/evidence/constants/apparent-constants.js';
import { findRoot } from '../../src/evidence/intervals/find-root.js';

const TRUTH: Record<Exclude<Mechanism, 'none'>, number[]> = {
  competitive: [12, 30, 0.8],
  uncompetitive: [12, 30, 2.5],
  noncompetitive: [12, 30, 1.7],
  mixed: [12, 30, 0.8, 6],
};

/** IC50 by Brent's method on ln I. */
function numericIc50(mechanism: Mechanism, p: number[], s: number): number {
  const model = modelFor(mechanism);
  const half = model.rate(p, s, 0) / 2;
  const g = (lnI: number) => model.rate(p, s, Math.exp(lnI)) - half;
  return Math.exp(findRoot(g, -30, 30, g(-30), g(30), 1e-14, 200).x);
}

describe('Cheng-Prusoff closed forms equal the numerical IC50 of each model', () => {
  for (const [mechanism, p] of Object.entries(TRUTH) as [Mechanism, number[]][]) {
    it(mechanism, () => {
      const names = modelFor(mechanism).params;
      for (const s of [0.5, 3, 30, 300]) {
        const closed = ic50AtSubstrate(mechanism, names, p, s);
        expect(Math.abs(closed - numericIc50(mechanism, p, s)) / closed).toBeLessThan(1e-10);
      }
    });
  }
  it('no inhibition has no IC50', () => {
    expect(ic50AtSubstrate('none', modelFor('none').params, [1, 2], 3)).toBe(Infinity);
  });
});

describe('apparent Vmax and Km reproduce the rate at each [I]', () => {
  for (const [mechanism, p] of Object.entries(TRUTH) as [Mechanism, number[]][]) {
    it(mechanism, () => {
      const model = modelFor(mechanism);
      for (const inhibitor of [0, 1, 5, 20]) {
        const vapp = apparentVmax(mechanism, model.params, p, inhibitor);
        const kapp = apparentKm(mechanism, model.params, p, inhibitor);
        for (const s of [1, 10, 100]) {
          const v = model.rate(p, s, inhibitor);
          expect(Math.abs(v - (vapp * s) / (kapp + s)) / v).toBeLessThan(1e-12);
        }
      }
    });
  }
});
