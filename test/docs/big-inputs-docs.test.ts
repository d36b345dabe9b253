/** README, "Big inputs", states the pooling threshold the code uses (src/fit/replicate-groups.ts). */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { GROUPED_FIT_MIN_POINTS, GROUPED_FIT_MIN_REPLICATES } from '../../src/fit/replicate-groups.js';

const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8').replace(/\s+/g, ' ');
const decision = readFileSync(new URL('../../docs/decisions/grouped-replicates.md', import.meta.url), 'utf8').replace(/\s+/g, ' ');

describe('big-input documents and constants agree', () => {
  it('README and the decision name the pooling threshold', () => {
    expect(readme).toContain(`from ${GROUPED_FIT_MIN_POINTS} points with at least ${GROUPED_FIT_MIN_REPLICATES} points per condition on average`);
    expect(decision).toContain(`\`GROUPED_FIT_MIN_POINTS\` = ${GROUPED_FIT_MIN_POINTS}`);
    expect(decision).toContain(`\`GROUPED_FIT_MIN_REPLICATES\` = ${GROUPED_FIT_MIN_REPLICATES}`);
  });
});
