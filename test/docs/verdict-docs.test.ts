/** README and DEVELOPERS.md state the verdict thresholds the code uses (issue 15). */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ALPHA_FAR, EXCLUSION_LEVEL, NONCOMPETITIVE_BAND } from '../../src/evidence/selection/alpha-exclusion.js';
import { INHIBITION_LEVEL, MIXED_LEVEL, RIVAL_DELTA } from '../../src/evidence/verdict/verdict.js';
import { DIAGNOSTIC_LEVEL } from '../../src/analysis/stage-diagnostics.js';
import { MINIMUM_ANALYSIS_POINTS } from '../../src/input/table-checks.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const readme = readFileSync(join(root, 'README.md'), 'utf8');
const guide = readFileSync(join(root, 'DEVELOPERS.md'), 'utf8');

describe('documents and constants agree', () => {
  it('README: the exclusion bounds and the analysis point floor', () => {
    expect(readme).toContain(`(alpha = ${ALPHA_FAR})`);
    expect(readme).toContain(`with alpha = ${1 / ALPHA_FAR}`);
    expect(readme).toContain(`agree within a factor of ${NONCOMPETITIVE_BAND}`);
    expect(readme).toContain(`The mechanism analysis\n  needs ${MINIMUM_ANALYSIS_POINTS}`);
  });
  it('DEVELOPERS.md: the verdict rule with its levels', () => {
    expect(guide).toContain(`in the nested test at p < ${INHIBITION_LEVEL}`);
    expect(guide).toContain(`p < ${MIXED_LEVEL}`);
    expect(guide).toContain(`lack-of-fit F test at p < ${DIAGNOSTIC_LEVEL}`);
    expect(guide).toContain(`within ${RIVAL_DELTA} AICc units`);
    expect(guide).toContain(`one-sided p < ${EXCLUSION_LEVEL}`);
    expect(guide).toContain(`alpha ≤ ${ALPHA_FAR}`);
  });
});
