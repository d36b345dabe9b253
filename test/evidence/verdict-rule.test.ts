import { describe, expect, it } from 'vitest';
import { decideVerdict, type RankedModelEvidence } from '../../src/evidence/verdict.js';
import type { NestedComparison } from '../../src/evidence/nested-comparisons.js';
import type { Mechanism } from '../../src/models/types.js';

function models(aiccs: Partial<Record<Mechanism, number>>): RankedModelEvidence[] {
  return (Object.entries(aiccs) as Array<[Mechanism, number]>).map(([mechanism, aicc]) => ({ mechanism, aicc, weight: 0, converged: true }));
}
function tests(p: Partial<Record<string, number>>): NestedComparison[] {
  return Object.entries(p).map(([key, pv]) => {
    const [simpler, fuller] = key.split('>') as [Mechanism, Mechanism];
    return { simpler, fuller, extraParams: 1, f: 1, fDf: [1, 10], fP: pv!, lr: 1, lrP: pv!, primary: 'F', p: pv! };
  });
}
const inhibited = { 'none>competitive': 1e-9, 'none>uncompetitive': 1e-5, 'none>noncompetitive': 1e-7, 'none>mixed': 1e-9 };

describe('verdict rule (DEVELOPERS.md, "The verdict rule")', () => {
  it('no inhibition when none ranks first', () => {
    const v = decideVerdict({ models: models({ none: 10, competitive: 12, uncompetitive: 12, noncompetitive: 12, mixed: 14 }), nested: tests({ 'none>competitive': 0.6 }), alphaInterval: null });
    expect(v.outcome).toBe('no-inhibition');
    expect(v.decisive).toBe(false);
  });
  it('decisive when rivals are 4 or more AICc units behind and mixed is not supported', () => {
    const v = decideVerdict({ models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }), alphaInterval: [3, null] });
    expect(v.outcome).toBe('decisive');
    expect(v.mechanism).toBe('competitive');
    expect(v.decisive).toBe(true);
  });
  it('undecided, with a separating experiment, when a rival is within 4', () => {
    const v = decideVerdict({ models: models({ competitive: 0, noncompetitive: 3, mixed: 2, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.3 }), alphaInterval: null });
    expect(v.outcome).toBe('undecided');
    expect(v.candidates).toEqual(['competitive', 'noncompetitive']);
    expect(v.suggestions.join(' ')).toMatch(/above Km/);
    expect(v.headline).toMatch(/Not decided between competitive and noncompetitive/);
  });
  it('mixed leaning competitive when alpha lies above 1, leaning uncompetitive below', () => {
    const base = { models: models({ mixed: 0, competitive: 20, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 1e-6 }) };
    const up = decideVerdict({ ...base, alphaInterval: [2.5, 9] });
    expect(up.outcome).toBe('mixed-lean');
    expect(up.lean).toBe('competitive');
    expect(up.decisive).toBe(true);
    const down = decideVerdict({ ...base, alphaInterval: [0.05, 0.4] });
    expect(down.lean).toBe('uncompetitive');
    const across = decideVerdict({ ...base, alphaInterval: [0.5, 2] });
    expect(across.outcome).toBe('undecided');
    expect(across.candidates).toContain('noncompetitive');
  });
  it('mixed needs p < 0.01 against the best three-parameter model', () => {
    const v = decideVerdict({ models: models({ mixed: 0, competitive: 1.5, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.03 }), alphaInterval: [2, 9] });
    expect(v.mechanism).toBe('competitive');
  });
  it('a blocking caveat turns a decisive call into undecided, and is listed', () => {
    const v = decideVerdict({
      models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }),
      nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }),
      alphaInterval: null,
      caveats: [{ code: 'x', message: 'systematic residuals', blocking: true, suggestion: 'look again' }],
    });
    expect(v.outcome).toBe('undecided');
    expect(v.reasons).toContain('systematic residuals');
    expect(v.suggestions).toContain('look again');
  });
  it('says so when nothing converged', () => {
    const v = decideVerdict({ models: [{ mechanism: 'none', aicc: Infinity, weight: 0, converged: false }], nested: [], alphaInterval: null });
    expect(v.mechanism).toBeNull();
    expect(v.decisive).toBe(false);
  });
});
