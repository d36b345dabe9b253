/** The methods text states the verdict thresholds from the constants the rule uses (issue 15, issue 14). */
import { describe, expect, it } from 'vitest';
import { methodsVerdictText } from '../../src/report/html/sections/methods-section.js';
import { INHIBITION_LEVEL, MIXED_LEVEL, RIVAL_DELTA } from '../../src/evidence/verdict/verdict.js';
import { ALPHA_FAR, EXCLUSION_LEVEL, NONCOMPETITIVE_BAND } from '../../src/evidence/selection/alpha-exclusion.js';

describe('methods text and verdict constants', () => {
  it('every threshold the verdict uses appears in the methods sentence', () => {
    const t = methodsVerdictText();
    expect(t).toContain(`p &lt; ${INHIBITION_LEVEL};`);
    expect(t).toContain(`best three-constant model at p &lt; ${MIXED_LEVEL};`);
    expect(t).toContain(`within ${RIVAL_DELTA} AICc units`);
    expect(t).toContain(`at p &lt; ${EXCLUSION_LEVEL}:`);
    expect(t).toContain(`alpha &le; ${ALPHA_FAR} for competitive`);
    expect(t).toContain(`outside ${1 / NONCOMPETITIVE_BAND}-${NONCOMPETITIVE_BAND}`);
  });
});
