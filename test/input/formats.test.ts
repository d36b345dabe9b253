/**
 * Text formats (issue 3, rule 2): CSV, TSV, BOM, CRLF, quoted fields, trailing blank lines,
 * semicolons with decimal commas; the separator and decimal mark found are stated in the table.
 */
import { describe, expect, it } from 'vitest';
import { inputErrorOf, readFixture, sortedPoints } from './read-fixture.js';
import { describeTable, parseRateText } from '../../src/input/index.js';
import { tokenize } from '../../src/input/tokenize.js';

const reference = sortedPoints(readFixture('ok-minimal.csv')[0]);

describe('text formats', () => {
  it('UTF-8 with BOM and CRLF line ends read like the plain file', () => {
    const [t] = readFixture('bom-crlf.csv');
    expect(sortedPoints(t)).toEqual(reference);
    expect(t.units.substrate).toBe('uM'); // the BOM did not stick to the first header name
    expect(t.points.map((p) => p.line)).toEqual([2, 3, 4, 5, 6, 7]);
  });

  it('trailing blank lines (and separator-only lines) are not rows', () => {
    const [t] = readFixture('trailing-blank-lines.csv');
    expect(t.rowsRead).toBe(6);
    expect(sortedPoints(t)).toEqual(reference);
  });

  it('quoted fields: separators, doubled quotes and line breaks inside quotes; line numbers stay exact', () => {
    const [t] = readFixture('quoted-fields.csv');
    expect(sortedPoints(t)).toEqual(reference);
    expect(t.points.map((p) => p.line)).toEqual([2, 3, 4, 6, 7, 8]);
    expect(t.points.map((p) => p.annotations?.note)).toEqual(['plate 1, row A', 'said "ok"', 'two\nlines', undefined, undefined, undefined]);
  });

  it('tab-separated', () => {
    const [t] = readFixture('tab-separated.tsv');
    expect(t.separator).toBe('\t');
    expect(t.decimalMark).toBe('.');
    expect(sortedPoints(t)).toEqual(reference);
  });

  it('semicolons with decimal commas are detected and stated', () => {
    const [t] = readFixture('semicolon-decimal-comma.csv');
    expect([t.separator, t.decimalMark, t.detection.separator, t.detection.decimalMark]).toEqual([';', ',', 'detected', 'detected']);
    expect(t.points.map((p) => p.substrate)).toEqual([0.5, 1, 2, 0.5, 1, 2]);
    expect(t.points.map((p) => p.rate)).toEqual([1.0, 1.6, 2.2, 0.6, 1.1, 1.7]);
    expect(describeTable(t)).toBe(
      'semicolon-decimal-comma.csv: long layout (detected), semicolon-separated (detected), decimal comma (detected); 6 rows read, 6 used, 0 excluded; substrate in uM, inhibitor in nM, rate in uM/min',
    );
  });

  it('options override separator and decimal mark (quoted decimal commas in a comma file)', () => {
    const text = 'substrate,inhibitor,rate\n"0,5",0,"1,0"\n1,0,"1,6"\n2,0,"2,2"\n"0,5",10,"0,6"\n1,10,"1,1"\n2,10,"1,7"\n';
    const [t] = parseRateText(text, { source: 'q.csv', decimalMark: ',' });
    expect(t.points.map((p) => p.rate)).toEqual([1.0, 1.6, 2.2, 0.6, 1.1, 1.7]);
    expect(t.detection).toEqual({ layout: 'detected', separator: 'detected', decimalMark: 'option' });
    const [s] = parseRateText(text.replaceAll(',', ';').replaceAll('"0;5"', '0.5').replaceAll(/"(\d);(\d)"/g, '$1.$2'), { source: 's.csv', separator: ';', decimalMark: '.' });
    expect(s.points.map((p) => p.rate)).toEqual([1.0, 1.6, 2.2, 0.6, 1.1, 1.7]);
  });

  it('text after a closing quote is an error with its place', () => {
    expect(inputErrorOf(() => parseRateText('substrate,inhibitor,rate\n1,"0"x,1\n', { source: 'x.csv' })).message).toBe(
      'x.csv:2:2: text after the closing quote of a quoted cell; put the whole cell inside the quotes',
    );
  });
});

describe('tokenize', () => {
  it('keeps the start line of each row, across CR, LF, CRLF and quoted line breaks', () => {
    const rows = tokenize('a,b\r\n"x\r\ny",2\r3,4\n\n5,6', ',', 't.csv');
    expect(rows).toEqual([
      { line: 1, cells: ['a', 'b'] },
      { line: 2, cells: ['x\ny', '2'] },
      { line: 4, cells: ['3', '4'] },
      { line: 5, cells: [''] },
      { line: 6, cells: ['5', '6'] },
    ]);
  });

  it('keeps empty cells and a trailing separator', () => {
    expect(tokenize('a,,c,\n', ',', 't.csv')).toEqual([{ line: 1, cells: ['a', '', 'c', ''] }]);
  });
});
