/**
 * The grid (matrix) layout as the README and examples show it (issue 13, item 8): one block per
 * plate read. The README's own example must read as a matrix with replicates 1 and 2, and the
 * side-by-side form (repeated [I] columns) must still give the same points.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseRateText } from '../../src/input/index.js';
import { EXAMPLES, readFixture, sortedPoints } from './read-fixture.js';

const readme = readFileSync(fileURLToPath(new URL('../../README.md', import.meta.url)), 'utf8');

describe('grid layout: one block per plate read', () => {
  it("the README's matrix example is blocks, read with replicates 1 and 2", () => {
    const section = readme.slice(readme.indexOf('**Matrix**'));
    const block = /```\n([\s\S]*?)```/.exec(section)![1];
    expect(block.split('\n\n')).toHaveLength(2);
    const [t] = parseRateText(block, { source: 'README', requireMechanismDesign: false });
    expect(t.layout).toBe('matrix');
    expect(t.points).toHaveLength(20);
    expect(new Set(t.points.map((p) => p.replicate))).toEqual(new Set(['1', '2']));
    expect(t.points.find((p) => p.substrate === 2 && p.inhibitor === 0 && p.replicate === '2')!.rate).toBe(0.299);
  });
  it('examples/matrix.csv is in blocks; the side-by-side file gives the same points', () => {
    const text = readFileSync(EXAMPLES + 'matrix.csv', 'utf8');
    expect(text.split('\n\n')).toHaveLength(2);
    expect(text.split('\n')[0].split(',').slice(1)).toEqual(['0', '20', '40', '80', '160']);
    expect(sortedPoints(readFixture('matrix-side-by-side.csv', {}, EXAMPLES)[0])).toEqual(sortedPoints(readFixture('matrix.csv', {}, EXAMPLES)[0]));
  });
});
