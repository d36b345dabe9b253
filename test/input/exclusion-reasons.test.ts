/**
 * A table with too few usable points says why (issue 16, item 7): the commonest exclusion reasons,
 * each with a count, the first line and column, the cell as written, and the setting that fixes
 * it. Data: invented tables written in the test.
 */
import { describe, expect, it } from 'vitest';
import { parseRateText, InputError } from '../../src/input/index.js';
import { groupExclusions } from '../../src/input/exclusion-summary.js';

function errorOf(text: string, options: Parameters<typeof parseRateText>[1] = {}): InputError {
  try {
    parseRateText(text, { source: 'plate.csv', ...options });
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error('the table was read without an error');
}

const rows = (cells: string[]) => ['substrate,inhibitor,rate', ...cells].join('\n') + '\n';

describe('too few usable points: the reasons and the fix', () => {
  it('decimal commas in a comma-separated file: names --decimal-mark comma, the first line and the cell', () => {
    const e = errorOf(rows(['"1,5",0,"0,3"', '"2,5",0,"0,4"', '"3,5",1,"0,5"', '"4,5",1,"0,6"', '"5,5",2,"0,7"', '"6,5",2,"0,8"']));
    expect(e.message).toMatch(/only 0 usable points \(6 read, 6 excluded\)/);
    expect(e.message).toContain('6 rows, first at line 2 column 1: substrate "1,5" is not a number');
    expect(e.message).toContain('--decimal-mark comma');
    expect(e.message).not.toMatch(/\n/);
    // and the option does fix it
    expect(parseRateText(rows(['"1,5",0,"0,3"', '"2,5",0,"0,4"', '"3,5",1,"0,5"', '"4,5",1,"0,6"', '"5,5",2,"0,7"', '"6,5",2,"0,8"']), { decimalMark: ',' })[0].points).toHaveLength(6);
  });

  it('thousands separators: both readings of "1,500" are offered', () => {
    const e = errorOf(rows(['"1,500",0,3', '"2,500",0,4', '"3,500",1,5', '"4,500",1,6', '"5,500",2,7', '"6,500",2,8']));
    expect(e.message).toContain('substrate "1,500" is not a number');
    expect(e.message).toMatch(/--decimal-mark comma.*remove the thousands separators/);
  });

  it('every [S] zero: the [S] = 0 reason and what to check', () => {
    const e = errorOf(rows(['0,0,3', '0,0,4', '0,1,5', '0,1,6', '0,2,7', '0,2,8']));
    expect(e.message).toContain('6 rows, first at line 2 column 1: [S] = 0');
    expect(e.message).toContain('name that column "substrate"');
  });

  it('decimal points in a semicolon file read with decimal commas: names --decimal-mark point', () => {
    const text = ['substrate;inhibitor;rate', '1.5;0;3', '2.5;0;4', '3,5;1;5', '4.5;1;6', '5.5;2;7', '6.5;2;8'].join('\n');
    const e = errorOf(text, { decimalMark: ',' });
    expect(e.message).toContain('5 rows, first at line 2 column 1: substrate "1.5" is not a number');
    expect(e.message).toContain('--decimal-mark point');
  });

  it('several reasons: the commonest first, at most three, with the rest counted', () => {
    const e = errorOf(rows(['0,0,3', '0,0,4', '0,1,5', '1,1,6 uM', '1,,7', 'x,2,8', '2,2,9,9']));
    const reasons = e.message.slice(e.message.indexOf('excluded because:'));
    expect(reasons.indexOf('3 rows, first at line 2 column 1: [S] = 0')).toBeGreaterThan(0);
    expect(reasons).toMatch(/and 2 other reasons/);
    expect(reasons).toContain('units and percent signs belong in the header');
  });

  it('groups by reason whatever the cell value, commonest first', () => {
    const groups = groupExclusions([
      { line: 3, column: 1, reason: 'substrate "a" is not a number' },
      { line: 4, column: 3, reason: 'rate is blank' },
      { line: 5, column: 1, reason: 'substrate "b" is not a number' },
    ]);
    expect(groups.map((g) => [g.count, g.first.line])).toEqual([[2, 3], [1, 4]]);
  });
});
