/**
 * Exclusions (issue 3, rule 4, second kind): rows or cells kept out of the fit, each listed with
 * its line, column and reason; used + excluded = read.
 */
import { describe, expect, it } from 'vitest';
import { readFixture } from './read-fixture.js';
import { parseRateText, type RateTable } from '../../src/input/index.js';

const accounted = (t: RateTable): boolean => t.points.length + t.excluded.length === t.rowsRead;

describe('exclusions', () => {
  it('blank and non-numeric cells', () => {
    const [t] = readFixture('blank-and-text-cells.csv');
    expect(t.excluded).toMatchObject([
      { line: 8, column: 1, reason: 'substrate is blank' },
      { line: 9, column: 2, reason: 'inhibitor is blank' },
      { line: 10, column: 3, reason: 'rate "about 2" is not a number' },
      { line: 11, column: 3, reason: 'rate is blank' },
    ]);
    expect(t.points.map((p) => p.line)).toEqual([2, 3, 4, 5, 6, 7]);
    expect(accounted(t)).toBe(true);
  });

  it('a missing-value marker (NaN, undefined) is named as such, not quoted (issue 13); lower-case um and NM read', () => {
    const [t] = readFixture('missing-marker-lowercase-units.csv', { requireMechanismDesign: false });
    expect(t.units).toMatchObject({ substrate: 'uM', inhibitor: 'nM' });
    expect(t.excluded).toMatchObject([
      { line: 8, column: 3, reason: 'rate holds a missing-value marker, not a number' },
      { line: 9, column: 3, reason: 'rate holds a missing-value marker, not a number' },
    ]);
    expect(accounted(t)).toBe(true);
  });

  it('infinite values (written as Inf, infinity, or too large for a double)', () => {
    const [t] = readFixture('infinite-values.csv');
    expect(t.excluded).toMatchObject([
      { line: 8, column: 3, reason: 'rate is infinite ("Inf")' },
      { line: 9, column: 3, reason: 'rate is infinite ("1e999")' },
      { line: 10, column: 2, reason: 'inhibitor is infinite ("infinity")' },
    ]);
    expect(accounted(t)).toBe(true);
  });

  it('rows flagged in the exclude column; no/0/blank keep the row', () => {
    const [t] = readFixture('exclude-flag.csv');
    expect(t.excluded).toMatchObject(
      ['yes', 'X', 'TRUE', '1', 'excluded'].map((flag, k) => ({ line: 8 + k, column: 4, reason: `flagged in the exclude column ("${flag}")` })),
    );
    expect(t.points.map((p) => p.line)).toEqual([2, 3, 4, 5, 6, 7]);
    expect(accounted(t)).toBe(true);
  });

  it('[S] = 0 rows are blanks, not points on the curve', () => {
    const [t] = readFixture('zero-substrate.csv');
    const reason = '[S] = 0: a rate without substrate is a blank (background), not a point on the curve';
    expect(t.excluded).toMatchObject([
      { line: 2, column: 1, reason },
      { line: 3, column: 1, reason },
    ]);
    expect(t.rowsRead).toBe(8);
    expect(accounted(t)).toBe(true);
  });

  it('a row with more cells than the header has columns', () => {
    const [t] = readFixture('extra-cells.csv');
    expect(t.excluded).toMatchObject([
      { line: 8, column: 4, reason: 'row has 4 cells but the header has 3 columns (an unquoted separator inside a value?)' },
    ]);
  });

  it('a zero sd is excluded, a blank sd keeps the point without sd and warns', () => {
    const [t] = readFixture('sd-column.csv');
    expect(t.excluded).toMatchObject([{ line: 8, column: 4, reason: 'sd "0" is not above zero; a standard deviation must be positive' }]);
    expect(t.points.find((p) => p.line === 7)?.sd).toBeUndefined();
    expect(t.points.find((p) => p.line === 2)?.sd).toBe(0.05);
    expect(t.hasSd).toBe(false);
    expect(t.warnings.find((w) => w.code === 'sd-incomplete')).toEqual({
      code: 'sd-incomplete',
      message: 'the sd column is blank on 1 usable row; per-row sd weights need every sd, so choose another error model or fill them in',
      lines: [7],
    });
  });

  it('matrix layout: blank, non-numeric and [S] = 0 cells, counted per cell', () => {
    const [t] = readFixture('matrix-replicate-columns.csv');
    const zero = '[S] = 0: a rate without substrate is a blank (background), not a point on the curve';
    expect(t.rowsRead).toBe(16); // 4 data rows x 4 [I] columns
    expect(t.excluded).toMatchObject([
      { line: 3, column: 5, reason: 'rate is blank' },
      { line: 4, column: 2, reason: zero },
      { line: 4, column: 3, reason: zero },
      { line: 4, column: 4, reason: zero },
      { line: 4, column: 5, reason: zero },
      { line: 5, column: 5, reason: 'rate "x" is not a number' },
    ]);
    expect(t.points).toHaveLength(10);
  });

  it('each exclusion carries the [S], [I] and rate of its row (or matrix cell) as written', () => {
    const [long] = readFixture('blank-and-text-cells.csv');
    expect(long.excluded.map((x) => x.asWritten)).toEqual([
      { substrate: '', inhibitor: '0', rate: '1.2' },
      { substrate: '8', inhibitor: '', rate: '2.5' },
      { substrate: '8', inhibitor: '10', rate: 'about 2' },
      { substrate: '8', inhibitor: '10', rate: '' },
    ]);
    const [matrix] = readFixture('matrix-replicate-columns.csv');
    expect(matrix.excluded.find((x) => x.line === 5)?.asWritten).toEqual({ substrate: '4', inhibitor: '10', rate: 'x' });
    expect(matrix.excluded.find((x) => x.line === 4 && x.column === 3)?.asWritten).toEqual({ substrate: '0', inhibitor: '0', rate: '0.01' });
  });

  it('a decimal point in a decimal-comma file is excluded with a hint', () => {
    const text = 'substrate;inhibitor;rate\n1;0;1,0\n2;0;1,6\n4;0;2,2\n1;10;0,6\n2;10;1,1\n4;10;1.7\n';
    const [t] = readFixtureText(text);
    expect(t.decimalMark).toBe(',');
    expect(t.excluded).toMatchObject([{ line: 7, column: 3, reason: 'rate "1.7" is not a number (this file is read with decimal commas)' }]);
  });

  it('the hint also covers a decimal point written with an exponent', () => {
    const text = 'substrate;inhibitor;rate\n1;0;1,0\n2;0;1,6\n4;0;2,2\n1;10;0,6\n2;10;1,1\n4;10;1.7e0\n';
    const [t] = readFixtureText(text);
    expect(t.decimalMark).toBe(',');
    expect(t.excluded).toMatchObject([{ line: 7, column: 3, reason: 'rate "1.7e0" is not a number (this file is read with decimal commas)' }]);
  });
});

function readFixtureText(text: string): RateTable[] {
  return parseRateText(text, { source: 'inline.csv' });
}
