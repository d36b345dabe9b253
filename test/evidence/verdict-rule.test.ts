import { describe, expect, it } from 'vitest';
import { decideVerdict, MIXED_LEVEL, type RankedModelEvidence } from '../../src/evidence/verdict/verdict.js';
import { ALPHA_FAR, EXCLUSION_LEVEL, NONCOMPETITIVE_BAND, type AlphaBoundTest, type AlphaExclusions } from '../../src/evidence/selection/alpha-exclusion.js';
import type { NestedComparison } from '../../src/evidence/selection/nested-comparisons.js';
import type { Mechanism } from '../../src/models/types.js';
import type { Caveat } from '../../src/evidence/verdict/caveat.js';

function models(aiccs: Partial<Record<Mechanism, number>>): RankedModelEvidence[] {
  return (Object.entries(aiccs) as Array<[Mechanism, number]>).map(([mechanism, aicc]) => ({ mechanism, aicc, weight: 0, converged: true }));
}
function tests(p: Partial<Record<string, number>>): NestedComparison[] {
  return Object.entries(p).map(([key, pv]) => {
    const [simpler, fuller] = key.split('>') as [Mechanism, Mechanism];
    return { simpler, fuller, extraParams: 1, f: 1, fDf: [1, 10], fP: pv!, lr: 1, lrP: pv!, primary: 'F', p: pv! };
  });
}
function bt(claim: 'above' | 'below', bound: number, p: number): AlphaBoundTest {
  return { claim, bound, tau: NaN, p, excluded: p < EXCLUSION_LEVEL };
}
/** Exclusion tests with the given one-sided p-values (competitive, uncompetitive, the two noncompetitive sides). */
function exclusions(pc: number, pu = 1, pn: [number, number] = [1, 1]): AlphaExclusions {
  return {
    competitive: bt('above', ALPHA_FAR, pc),
    uncompetitive: bt('below', 1 / ALPHA_FAR, pu),
    noncompetitive: [bt('below', NONCOMPETITIVE_BAND, pn[0]), bt('above', 1 / NONCOMPETITIVE_BAND, pn[1])],
  };
}
/** A blocking caveat without a headline of its own (the runs test). */
const runs: Caveat = { code: 'residual-runs', mechanism: 'competitive', p: 1e-4, blocking: true };
const inhibited = { 'none>competitive': 1e-9, 'none>uncompetitive': 1e-5, 'none>noncompetitive': 1e-7, 'none>mixed': 1e-9 };

describe('verdict rule (DEVELOPERS.md, "The verdict rule")', () => {
  it('no inhibition when none ranks first', () => {
    const v = decideVerdict({ models: models({ none: 10, competitive: 12, uncompetitive: 12, noncompetitive: 12, mixed: 14 }), nested: tests({ 'none>competitive': 0.6 }), alphaInterval: null });
    expect(v.outcome).toBe('no-inhibition');
    expect(v.decisive).toBe(false);
  });
  it('decisive when rivals are 4 or more AICc units behind and mixed is not supported', () => {
    const v = decideVerdict({ models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }), alphaInterval: [3, null], exclusions: exclusions(1e-4) });
    expect(v.outcome).toBe('decisive');
    expect(v.mechanism).toBe('competitive');
    expect(v.decisive).toBe(true);
    expect(v.exclusion?.excluded).toBe(true);
  });
  it('a three-parameter call is not firm when the mixed alternative it could hide is not rejected', () => {
    const base = { models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }), alphaInterval: null };
    const weak = decideVerdict({ ...base, exclusions: exclusions(0.2) });
    expect(weak.outcome).toBe('undecided');
    expect(weak.decisive).toBe(false);
    expect(weak.mechanism).toBe('competitive');
    expect(weak.candidates).toEqual(['competitive', 'mixed']);
    expect(weak.headline).toEqual({ code: 'hidden-component', winner: 'competitive', component: 'uncompetitive' });
    const step = weak.reasons.find((r) => r.code === 'exclusion');
    expect(step).toMatchObject({ winner: 'competitive', finding: { component: 'uncompetitive', excluded: false } });
    expect(step?.code === 'exclusion' && step.finding.tests.map((t) => [t.claim, t.bound, t.p])).toEqual([['above', ALPHA_FAR, 0.2]]);
    expect(weak.suggestions).toContainEqual({ code: 'separate', pair: 'competitive|mixed' });
    // the p-value must be below the level, not at it
    expect(decideVerdict({ ...base, exclusions: exclusions(EXCLUSION_LEVEL) }).decisive).toBe(false);
    // without the mixed fit nothing can be excluded
    const none = decideVerdict({ ...base });
    expect(none.decisive).toBe(false);
    expect(none.reasons).toContainEqual({ code: 'exclusion', winner: 'competitive', finding: { component: 'uncompetitive', excluded: false, tests: [] } });
    // nothing to settle by experiment when the test was never run
    expect(none.suggestions.filter((a) => a.code === 'separate')).toEqual([]);
  });
  it('uncompetitive needs alpha below 1/ALPHA_FAR excluded; noncompetitive needs both sides of the band', () => {
    const unc = { models: models({ uncompetitive: 0, mixed: 2.1, noncompetitive: 30, competitive: 50, none: 80 }), nested: tests({ ...inhibited, 'uncompetitive>mixed': 0.8 }), alphaInterval: null };
    expect(decideVerdict({ ...unc, exclusions: exclusions(1, 1e-4) }).decisive).toBe(true);
    expect(decideVerdict({ ...unc, exclusions: exclusions(1e-4, 0.1) }).decisive).toBe(false);
    const nc = { models: models({ noncompetitive: 0, mixed: 2.1, uncompetitive: 30, competitive: 50, none: 80 }), nested: tests({ ...inhibited, 'noncompetitive>mixed': 0.8 }), alphaInterval: null };
    expect(decideVerdict({ ...nc, exclusions: exclusions(1, 1, [1e-4, 1e-4]) }).decisive).toBe(true);
    const oneSide = decideVerdict({ ...nc, exclusions: exclusions(1, 1, [1e-4, 0.3]) });
    expect(oneSide.decisive).toBe(false);
    expect(oneSide.headline).toEqual({ code: 'hidden-component', winner: 'noncompetitive', component: 'unequal-constants' });
    const step = oneSide.reasons.find((r) => r.code === 'exclusion');
    const open = step?.code === 'exclusion' ? step.finding.tests.filter((t) => !t.excluded) : [];
    expect(open.map((t) => t.bound)).toEqual([1 / NONCOMPETITIVE_BAND]);
  });
  it('undecided, with a separating experiment, when a rival is within 4', () => {
    const v = decideVerdict({ models: models({ competitive: 0, noncompetitive: 3, mixed: 2, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.3 }), alphaInterval: null });
    expect(v.outcome).toBe('undecided');
    // the rival, and mixed: without exclusion tests the mixed alternative is not excluded either
    expect(v.candidates).toEqual(['competitive', 'noncompetitive', 'mixed']);
    expect(v.suggestions).toContainEqual({ code: 'separate', pair: 'competitive|noncompetitive' });
    expect(v.headline).toEqual({ code: 'not-decided', winner: 'competitive', candidates: ['competitive', 'noncompetitive', 'mixed'] });
    expect(v.reasons).toContainEqual({ code: 'aicc-gap', mechanism: 'noncompetitive', winner: 'competitive', gap: 3, rival: true });
    expect(v.reasons).toContainEqual({ code: 'aicc-gap', mechanism: 'uncompetitive', winner: 'competitive', gap: 50, rival: false });
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
  it('mixed needs p < MIXED_LEVEL against the best three-parameter model', () => {
    const at = (p: number) => decideVerdict({ models: models({ mixed: 0, competitive: 1.5, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': p }), alphaInterval: [2, 9] });
    expect(at(3 * MIXED_LEVEL).mechanism).toBe('competitive');
    expect(at(MIXED_LEVEL / 3).mechanism).toBe('mixed');
  });
  it('a blocking caveat turns a decisive call into undecided, and is listed', () => {
    const v = decideVerdict({
      models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }),
      nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }),
      alphaInterval: null,
      caveats: [runs],
    });
    expect(v.outcome).toBe('undecided');
    expect(v.reasons).toContainEqual({ code: 'caveat', caveat: runs });
    expect(v.suggestions).toContainEqual({ code: 'caveat', caveat: runs });
    expect(v.caveats).toEqual([{ code: 'residual-runs', blocking: true }]);
  });
  it('the headline of a blocking caveat leads, a caveat marked leading first', () => {
    const base = { models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }), alphaInterval: null, exclusions: exclusions(1e-4) };
    const design = { code: 'd', blocking: true, text: { message: 'design', headline: 'Design first.' } };
    const outlier: Caveat = { code: 'substrate-inhibition', peak: { s: 50, mean: 10 }, top: { s: 100, mean: 6 }, standardErrors: 5, blocking: true, leading: true };
    expect(decideVerdict({ ...base, caveats: [design] }).headline).toEqual({ code: 'caveat', caveat: design });
    expect(decideVerdict({ ...base, caveats: [design, outlier] }).headline).toEqual({ code: 'caveat', caveat: outlier });
    // a blocking caveat without a headline of its own leaves the usual one
    expect(decideVerdict({ ...base, caveats: [runs] }).headline).toEqual({ code: 'not-firm', winner: 'competitive' });
    // a caveat that does not block never takes the headline
    expect(decideVerdict({ ...base, caveats: [{ ...outlier, blocking: false }] }).headline).toEqual({ code: 'decisive', mechanism: 'competitive' });
  });
  it('says so when nothing converged', () => {
    const v = decideVerdict({ models: [{ mechanism: 'none', aicc: Infinity, weight: 0, converged: false }], nested: [], alphaInterval: null });
    expect(v.mechanism).toBeNull();
    expect(v.decisive).toBe(false);
    expect(v.headline).toEqual({ code: 'no-fit' });
  });
  it('the leading reasons come first, and how far [I] reached is read only for a no-inhibition call', () => {
    const chosen = { code: 'error-model-chosen' as const, chosen: 'proportional' as const, runnerUp: 'constant' as const, aiccMargin: 6.2 };
    const reach = { code: 'inhibitor-reach' as const, highest: 40, unit: 'uM', bound: { kind: 'unbounded' as const } };
    let asked = 0;
    const inhibitorReach = () => (asked++, reach);
    const noInh = decideVerdict({ models: models({ none: 10, competitive: 12, uncompetitive: 12, noncompetitive: 12, mixed: 14 }), nested: tests({ 'none>competitive': 0.6 }), alphaInterval: null, leadingReasons: [chosen], inhibitorReach });
    expect(noInh.reasons.map((r) => r.code)).toEqual(['error-model-chosen', 'none-ranks-first', 'inhibitor-reach']);
    expect(noInh.suggestions).toEqual([{ code: 'test-higher-inhibitor' }]);
    const inh = decideVerdict({ models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }), alphaInterval: null, exclusions: exclusions(1e-4), leadingReasons: [chosen], inhibitorReach });
    expect(inh.reasons[0]).toEqual(chosen);
    expect(inh.reasons[1]).toEqual({ code: 'inhibition-detected', mechanism: 'competitive', p: 1e-9 });
    expect(asked).toBe(1);
  });
});
