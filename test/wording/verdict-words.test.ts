/**
 * The sentences of coded findings (src/wording/): what the report, the text summary and
 * results.json print for a code and its numbers. The science tests (test/evidence/verdict-rule.test.ts,
 * test/analysis/odd-data.test.ts) assert the codes; these check the words, with every threshold
 * taken from the constant the rule uses.
 */
import { describe, expect, it } from 'vitest';
import { decideVerdict, type RankedModelEvidence } from '../../src/evidence/verdict/verdict.js';
import { ALPHA_FAR, EXCLUSION_LEVEL, NONCOMPETITIVE_BAND, type AlphaBoundTest } from '../../src/evidence/selection/alpha-exclusion.js';
import type { NestedComparison } from '../../src/evidence/selection/nested-comparisons.js';
import type { Caveat } from '../../src/evidence/verdict/caveat.js';
import type { Mechanism } from '../../src/models/types.js';
import { IMPLAUSIBLE_MOLAR } from '../../src/evidence/checks/plausibility-check.js';
import { STUDENTISED_LIMIT } from '../../src/evidence/diagnostics/residual-diagnostics.js';
import { SERIES_SE_LIMIT } from '../../src/evidence/diagnostics/series-fits.js';
import { DETECTION_FACTOR } from '../../src/evidence/intervals/detection-bound.js';
import { wordVerdict } from '../../src/wording/verdict-words.js';
import { wordCaveat } from '../../src/wording/caveat-words.js';
import { DOWN_WEIGHTED_BELOW } from '../../src/evidence/diagnostics/robust-refit.js';
import { rounded } from '../../src/text/format-number.js';

function models(aiccs: Partial<Record<Mechanism, number>>): RankedModelEvidence[] {
  return (Object.entries(aiccs) as Array<[Mechanism, number]>).map(([mechanism, aicc]) => ({ mechanism, aicc, weight: 0, converged: true }));
}
function tests(p: Record<string, number>): NestedComparison[] {
  return Object.entries(p).map(([key, pv]) => {
    const [simpler, fuller] = key.split('>') as [Mechanism, Mechanism];
    return { simpler, fuller, extraParams: 1, f: 1, fDf: [1, 10], fP: pv, lr: 1, lrP: pv, primary: 'F', p: pv };
  });
}
const bt = (claim: 'above' | 'below', bound: number, p: number): AlphaBoundTest => ({ claim, bound, tau: NaN, p, excluded: p < EXCLUSION_LEVEL });
const inhibited = { 'none>competitive': 1e-9, 'none>uncompetitive': 1e-5, 'none>noncompetitive': 1e-7, 'none>mixed': 1e-9 };
const competitiveFirst = { models: models({ competitive: 0, mixed: 2.1, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.8 }), alphaInterval: null };
const exclusions = (pc: number, pn: [number, number] = [1, 1]) => ({
  competitive: bt('above', ALPHA_FAR, pc),
  uncompetitive: bt('below', 1 / ALPHA_FAR, 1),
  noncompetitive: [bt('below', NONCOMPETITIVE_BAND, pn[0]), bt('above', 1 / NONCOMPETITIVE_BAND, pn[1])] as [AlphaBoundTest, AlphaBoundTest],
});

describe('verdict words', () => {
  it('a firm competitive call: headline, detection, the mixed test and the exclusion with its thresholds', () => {
    const w = wordVerdict(decideVerdict({ ...competitiveFirst, exclusions: exclusions(1e-4) }));
    expect(w.headline).toBe('The data support competitive inhibition.');
    expect(w.reasons[0]).toBe('inhibition is detected: competitive improves on no inhibition (p < 0.001)');
    expect(w.reasons).toContain('the extra constant of mixed is not supported against competitive (p = 0.800)');
    expect(w.reasons).toContain('uncompetitive: AICc 50.0 above competitive');
    expect(w.reasons).toContain(
      `binding to the enzyme-substrate complex is excluded down to ${ALPHA_FAR}-fold weaker than to free enzyme (alpha > ${ALPHA_FAR}; one-sided profile test, p < 0.001; needed p < ${EXCLUSION_LEVEL})`,
    );
    expect(w.suggestions).toEqual([]);
  });
  it('a hidden component not excluded: its headline, the alpha that fits as well, and the experiment', () => {
    const w = wordVerdict(decideVerdict({ ...competitiveFirst, exclusions: exclusions(0.2) }));
    expect(w.headline).toBe('Competitive ranks first, but a weak uncompetitive component is not excluded.');
    expect(w.reasons).toContain(
      `a weak uncompetitive component is not excluded: alpha = ${ALPHA_FAR} (Kiu = ${ALPHA_FAR} x Ki) fits about as well (one-sided profile test, p = 0.200; needed p < ${EXCLUSION_LEVEL})`,
    );
    expect(w.suggestions).toEqual(['add substrate concentrations above 5 x Km to measure the effect on the enzyme-substrate complex']);
    expect(wordVerdict(decideVerdict(competitiveFirst)).reasons).toContain('the mixed model was not fitted, so a hidden component of the competitive call cannot be excluded');
  });
  it('noncompetitive with one side of the band open names the bound not excluded', () => {
    const nc = { models: models({ noncompetitive: 0, mixed: 2.1, uncompetitive: 30, competitive: 50, none: 80 }), nested: tests({ ...inhibited, 'noncompetitive>mixed': 0.8 }), alphaInterval: null };
    const w = wordVerdict(decideVerdict({ ...nc, exclusions: exclusions(1, [1e-4, 0.3]) }));
    expect(w.headline).toBe('Noncompetitive ranks first, but Ki and Kiu may differ (mixed) by more than the data resolve.');
    expect(w.reasons.join(' ')).toContain(`Ki and Kiu may differ by more than a factor of ${NONCOMPETITIVE_BAND}: alpha = ${rounded(1 / NONCOMPETITIVE_BAND, 3)} is not excluded`);
  });
  it('a rival within reach: the list of candidates and the separating experiment', () => {
    const v = decideVerdict({ models: models({ competitive: 0, noncompetitive: 3, mixed: 2, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 0.3 }), alphaInterval: null });
    const w = wordVerdict(v);
    expect(w.headline).toBe('Not decided between competitive, noncompetitive and mixed; competitive ranks first.');
    expect(w.reasons).toContain('noncompetitive: AICc 3.0 above competitive (still substantially supported)');
    expect(w.suggestions[0]).toBe('add substrate concentrations well above Km (up to 10 x Km): only there does a competitive inhibitor lose its effect');
  });
  it('mixed leaning competitive reads the lower end of the alpha interval', () => {
    const v = decideVerdict({ models: models({ mixed: 0, competitive: 20, noncompetitive: 30, uncompetitive: 50, none: 80 }), nested: tests({ ...inhibited, 'competitive>mixed': 1e-6 }), alphaInterval: [2.5, 9] });
    const w = wordVerdict(v);
    expect(w.headline).toBe('The data support mixed inhibition, leaning competitive.');
    expect(w.reasons).toContain('the interval for alpha lies above 1 (from 2.50): the inhibitor prefers free enzyme');
  });
  it('no inhibition: the advice to test higher [I], the error-model choice first and the reach of [I] last', () => {
    const v = decideVerdict({
      models: models({ none: 10, competitive: 12, uncompetitive: 12, noncompetitive: 12, mixed: 14 }),
      nested: tests({ 'none>competitive': 0.6 }),
      alphaInterval: null,
      leadingReasons: [{ code: 'error-model-chosen', chosen: 'proportional', runnerUp: 'sqrt', aiccMargin: 8.44 }],
      inhibitorReach: () => ({ code: 'inhibitor-reach', highest: 200, unit: 'nM', bound: { kind: 'runs-past', mechanism: 'competitive', name: 'Ki', exceeds: 20000 } }),
    });
    const w = wordVerdict(v);
    expect(w.headline).toBe('No inhibition detected in the tested inhibitor range.');
    expect(w.reasons).toEqual([
      'error model chosen automatically: proportional (AICc 8.4 lower than sqrt)',
      'the model without inhibition has the lowest AICc',
      `highest [I] tested: 200 nM; under competitive the fitted Ki runs past 20000 nM (${DETECTION_FACTOR} x the highest [I])`,
    ]);
    expect(w.suggestions).toEqual(['test higher inhibitor concentrations (several times the expected Ki or the IC50)']);
  });
  it('advice: a leading caveat first, each sentence once, a caveat without advice adds none', () => {
    const slip: Caveat = { code: 'implausible-concentration', flagged: [{ label: 'highest [I]', value: 8, unit: 'M', molar: 8 }], limitMolar: IMPLAUSIBLE_MOLAR, blocking: false, leading: true };
    const trend: Caveat = { code: 'trend-inhibitor', mechanism: 'competitive', rho: 0.4123, p: 0.002, blocking: false };
    const design = { code: 'substrate-below-5km', blocking: false, text: { message: 'low [S]', suggestion: 'add substrate concentrations up to 5-10 x Km' } };
    const v = decideVerdict({ ...competitiveFirst, exclusions: exclusions(0.2), caveats: [design, trend, slip, design] });
    const w = wordVerdict(v);
    expect(w.suggestions).toEqual([
      'check the concentration units in the column headers (or --substrate-unit / --inhibitor-unit)',
      'add substrate concentrations above 5 x Km to measure the effect on the enzyme-substrate complex',
      'add substrate concentrations up to 5-10 x Km',
    ]);
    expect(w.reasons).toContain('the competitive residuals drift with [I] (Spearman rho 0.41, p = 0.002)');
  });
});

describe('caveat words', () => {
  it('the robust refit that changes the call leads with the lines it down-weighted (four shown)', () => {
    const points = [23, 40, 41, 42, 57, 60].map((line, k) => ({ line, rate: 1.5 + k }));
    const c: Caveat = { code: 'robust', change: 'changes', downWeighted: points, robustCall: 'mixed', robustLean: 'competitive', leastSquaresCall: 'competitive', blocking: true, leading: true };
    const w = wordCaveat(c);
    const which = 'line 23, rate 1.5, line 40, rate 2.5, line 41, rate 3.5, line 42, rate 4.5 and 2 more';
    expect(w.headline).toBe(`The call depends on 6 outlying points (${which}): with them down-weighted the data point to mixed, leaning competitive, not competitive.`);
    expect(w.message).toBe(`a robust (bisquare) refit down-weights 6 point(s) (${which}) and then calls it mixed: the call depends on those points`);
    expect(w.suggestion).toBe(`inspect or repeat the down-weighted wells (${which}); exclude a mistyped value and analyse again`);
    const one = wordCaveat({ ...c, downWeighted: [{ line: 23, rate: 3.15e7 }], robustLean: undefined });
    expect(one.headline).toBe('The call depends on one outlying point (line 23, rate 3.15e7): with it down-weighted the data point to mixed, not competitive.');
    expect(wordCaveat({ ...c, change: 'stays', robustCall: 'competitive', blocking: false }).headline).toBeUndefined();
    // the weight that counts as down-weighted is the refit's own constant
    expect(wordCaveat({ ...c, change: 'none-down-weighted', downWeighted: [], robustCall: 'competitive', blocking: false }).message).toBe(
      `a robust (bisquare) refit, run because a point stands out, gives no point a weight below ${DOWN_WEIGHTED_BELOW}; the call stays competitive`,
    );
  });
  it('the limits in the sentences are the constants the checks use', () => {
    expect(wordCaveat({ code: 'suspect-points', count: 2, limit: STUDENTISED_LIMIT, robustRefitRuns: false, blocking: false }).message).toBe(
      `2 points have a studentised residual beyond ${STUDENTISED_LIMIT} (listed in the report)`,
    );
    expect(wordCaveat({ code: 'series-disagree', mechanism: 'mixed', count: 1, seLimit: SERIES_SE_LIMIT, blocking: false }).message).toBe(
      `fitted alone, 1 apparent constant differs from the mixed global fit by more than ${SERIES_SE_LIMIT} SE`,
    );
    const slip = wordCaveat({ code: 'implausible-concentration', flagged: [{ label: 'Ki', value: 0.25, unit: 'mM', molar: 2.5e-4 }, { label: 'highest [I]', value: 8, unit: 'M', molar: 8 }], limitMolar: IMPLAUSIBLE_MOLAR, blocking: false });
    expect(slip.message).toMatch(new RegExp(`^Ki = 0\\.25 mM \\(0\\.00025 M\\), highest \\[I\\] = 8 M: above ${IMPLAUSIBLE_MOLAR} M, which no enzyme assay reaches`));
  });
  it('an error model clearly worse: the call under the better one decides the advice', () => {
    const base = { code: 'error-model' as const, chosen: 'constant' as const, best: 'proportional' as const, aiccGap: 12.345 };
    expect(wordCaveat({ ...base, callUnderBest: 'mixed', blocking: true })).toEqual({
      message: 'the constant error model fits the scatter clearly worse than proportional (AICc 12.3 higher), and under proportional the call would be mixed',
      suggestion: 'rerun with --error proportional (or --error auto)',
    });
    expect(wordCaveat({ ...base, callUnderBest: null, blocking: false }).suggestion).toBe('rerun with --error proportional (or --error auto) for better intervals');
  });
  it('an input finding keeps the sentences it came with', () => {
    const text = { message: 'lines 82-89 repeat lines 32-39 exactly', headline: 'Pasted.' };
    expect(wordCaveat({ code: 'repeated-block', blocking: true, text })).toBe(text);
  });
});
