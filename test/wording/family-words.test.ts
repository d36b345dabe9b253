/**
 * The words of the family comparison (src/wording/family-words.ts), from codes and numbers, with
 * the levels taken from src/evidence/selection/family-comparison.ts. The sentences are those the analysis
 * printed before the findings became codes (simulated tight-binding and partial tables of
 * test/analysis/families.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { FAMILY_LEVEL, PARTIAL_AICC_MARGIN, TIGHT_BINDING_RATIO } from '../../src/evidence/selection/family-comparison.js';
import type { Advice, VerdictHeadline, VerdictReason } from '../../src/evidence/verdict/verdict-findings.js';
import { wordVerdict } from '../../src/wording/verdict-words.js';

const words = (headline: VerdictHeadline, reasons: VerdictReason[] = [], suggestions: Advice[] = []) => wordVerdict({ headline, reasons, suggestions });
const ki = { name: 'Ki', value: 0.98962, interval: [0.95712, 1.0312] as const };

describe('family words', () => {
  it('tight binding with [E]t given: the ratio, the headline with the constant and its interval', () => {
    const w = words({ code: 'tight-binding', decisive: true, mechanism: 'competitive', constant: ki, unit: 'nM' }, [
      { code: 'enzyme-near-constant', enzyme: 5, unit: 'nM', ratio: TIGHT_BINDING_RATIO, name: 'Ki' },
      { code: 'within-family', models: 'tight-binding', reason: { code: 'mixed-not-supported', against: 'competitive', p: 0.138 } },
    ]);
    expect(w.headline).toBe('The data support tight-binding competitive inhibition, Ki = 0.99 nM [0.957, 1.03].');
    expect(w.reasons).toEqual([
      `[E]t (5 nM) is within ${TIGHT_BINDING_RATIO}-fold of Ki: the inhibitor bound depletes the free inhibitor, so the tight-binding (Morrison) equations apply`,
      'tight-binding models: the extra constant of mixed is not supported against competitive (p = 0.138)',
    ]);
    const lean = words({ code: 'tight-binding', decisive: false, mechanism: 'mixed', lean: 'uncompetitive', constant: { name: 'Ki', value: null, interval: null }, unit: 'nM' });
    expect(lean.headline).toBe('Best supported, not firm: tight-binding mixed, leaning uncompetitive inhibition, Ki not detected.');
  });
  it('[E]t negligible, identified or not identifiable', () => {
    const w = words({ code: 'decisive', mechanism: 'competitive' }, [
      { code: 'enzyme-negligible', enzyme: 0.01, unit: 'nM', ratio: TIGHT_BINDING_RATIO, constant: { name: 'Ki', value: 1.0213, interval: [0.9681, 1.0799] } },
      { code: 'enzyme-identified', et: { name: 'Et', value: 5.9412, interval: [5.6213, 6.2534] }, unit: 'nM', mechanism: 'noncompetitive', p: 1e-6 },
      { code: 'enzyme-not-identifiable', intervalClosed: false },
      { code: 'enzyme-not-identifiable', intervalClosed: true },
      { code: 'tight-no-inhibition' },
    ]);
    expect(w.reasons).toEqual([
      `[E]t (0.01 nM) is below 1/${TIGHT_BINDING_RATIO} of the tight-binding Ki = 1.02 nM [0.968, 1.08]: depletion of free inhibitor is negligible and the classic equations stand`,
      '[E]t is identified (Et = 5.94 nM [5.62, 6.25]) and the tight-binding fit improves on the classic noncompetitive model (p < 0.001, boundary test)',
      '[E]t is not identifiable from these data (its profile interval is open): measure the active-site concentration, or extend [I] around [E]t; the classic call stands',
      '[E]t is not identifiable from these data (the tight-binding fit does not improve on the classic one): measure the active-site concentration, or extend [I] around [E]t; the classic call stands',
      'tight-binding family: no inhibition detected, so the enzyme concentration does not matter',
    ]);
  });
  it('partial calls: beta, the boundary test, the AICc gain and the levels used', () => {
    const beta = { name: 'beta', value: 0.19912, interval: [0.19311, 0.20577] as const };
    const nc = words({ code: 'partial', decisive: true, mechanism: 'noncompetitive', constant: { name: 'Ki', value: 48.81, interval: [45.62, 52.33] }, beta, unit: 'nM' }, [
      { code: 'partial-improves', mechanism: 'noncompetitive', p: 1e-9, aiccGain: 361.43, beta },
      { code: 'partial-mixed-not-better', model: 'partial noncompetitive', level: FAMILY_LEVEL },
    ]);
    expect(nc.headline).toBe('The data support partial noncompetitive inhibition, Ki = 48.8 nM [45.6, 52.3], residual activity beta = 0.199 [0.193, 0.206].');
    expect(nc.reasons).toEqual([
      'partial noncompetitive improves on full noncompetitive inhibition (p < 0.001, boundary test) and on the best model so far (AICc lower by 361.4); the rate levels off at a residual activity, beta = 0.199 [0.193, 0.206]',
      `partial mixed does not improve on partial noncompetitive at p < ${FAMILY_LEVEL}`,
    ]);
    const c = words({ code: 'partial', decisive: false, mechanism: 'competitive', constant: { name: 'Ki', value: 20.01, interval: [18.81, 21.3] }, beta: null, unit: 'nM' }, [
      { code: 'partial-improves', mechanism: 'competitive', p: 0.004, aiccGain: 5.04, beta: null },
      { code: 'partial-rival', rival: 'partial noncompetitive', delta: 4 },
    ], [{ code: 'partial-plateau' }]);
    expect(c.headline).toBe('Best supported, not firm: partial competitive inhibition, Ki = 20 nM [18.8, 21.3].');
    expect(c.reasons[0]).toBe('partial competitive improves on full competitive inhibition (p = 0.004, boundary test) and on the best model so far (AICc lower by 5.0); the rate levels off at a residual activity, beta = 1 (the complex turns over at full speed)');
    expect(c.reasons[1]).toBe('partial noncompetitive stays within 4 AICc units: the partial mechanism is not settled');
    expect(c.suggestions).toEqual(['extend [I] to well above Ki to measure the plateau of the residual activity, and replicate']);
  });
  it('partial not supported: each of the three reasons, with its level or margin', () => {
    const no = (why: 'no-improvement' | 'residual-zero' | 'aicc-margin') =>
      words({ code: 'decisive', mechanism: 'competitive' }, [{ code: 'partial-not-supported', why, model: 'partial competitive', level: FAMILY_LEVEL, margin: PARTIAL_AICC_MARGIN }]).reasons[0];
    expect(no('no-improvement')).toBe(`partial inhibition is not supported: the best partial model (partial competitive) does not improve on full inhibition at p < ${FAMILY_LEVEL}`);
    expect(no('residual-zero')).toBe('partial inhibition is not supported: the residual activity is consistent with zero');
    expect(no('aicc-margin')).toBe(`partial inhibition is not supported: its AICc is not lower by ${PARTIAL_AICC_MARGIN} than that of the best model so far`);
  });
  it('the hint to give [E]t names the constant with its unit', () => {
    const w = words({ code: 'decisive', mechanism: 'competitive' }, [], [{ code: 'give-enzyme', constant: { name: 'Ki', value: 20.312, interval: null }, unit: 'nM' }]);
    expect(w.suggestions).toEqual([
      'Ki (20.3 nM) lies below the lowest [I] tested: if the enzyme concentration is within tenfold of it, tight binding biases Ki; give [E]t (--enzyme CONC, an enzyme column, or --enzyme fit)',
    ]);
  });
});
