/**
 * The long-layout reader takes its rows one at a time (docs/decisions/reader-memory.md): the
 * checks that used to look at all rows first still give the same answers and the same messages.
 */
import { describe, expect, it } from 'vitest';
import { parseRateText } from '../../src/input/parse-rate-text.js';
import { repeatedRowWarnings } from '../../src/input/repeated-rows.js';
import { textRows, tokenize } from '../../src/input/tokenize.js';
import type { RatePoint } from '../../src/input/types.js';

function messageOf(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    return (error as Error).message;
  }
  return 'no error';
}

const GRID = ['1,0', '2,0', '4,0', '8,0', '1,1', '2,1', '4,1', '8,1', '1,3', '2,3', '4,3', '8,3'];

describe('streaming long-layout reader', () => {
  it('rows one at a time are the rows all at once', () => {
    const text = 'a,b\r\n"x\r\ny",2\r3,4\n\n5,6';
    expect([...textRows(text, ',', 't.csv')]).toEqual(tokenize(text, ',', 't.csv'));
  });

  it('a blank compound before the first named one is named at its own line', () => {
    const text = ['compound,substrate,inhibitor,rate', ',1,0,5', 'K-1,2,0,6', 'K-1,2,1,4'].join('\n');
    expect(messageOf(() => parseRateText(text, { source: 'c.csv' }))).toBe('c.csv:2:1: compound is blank here but other rows name a compound; fill it in');
  });

  it('a compound column left blank on every row gives one unnamed table', () => {
    const rows = GRID.map((pair, k) => `,${pair},${10 - k * 0.5}`);
    const [table, ...rest] = parseRateText(['compound,substrate,inhibitor,rate', ...rows].join('\n'), { source: 'u.csv' });
    expect(rest).toEqual([]);
    expect(table.compound).toBeUndefined();
    expect(table.points.map((p) => p.line)).toEqual(GRID.map((_, k) => k + 2));
  });

  it('an unnamed column with data is still named at the first row that fills it', () => {
    const text = ['substrate,inhibitor,rate,', ...GRID.map((pair, k) => `${pair},${10 - k * 0.5},${k === 3 ? 'x' : ''}`)].join('\n');
    expect(messageOf(() => parseRateText(text, { source: 'e.csv' }))).toBe('e.csv:1:4: column 4 has data (line 5) but no name in the header; name it or delete it');
  });

  it('keeps groups, points and exclusions in file order across compounds', () => {
    const rows = GRID.flatMap((pair, k) => [`B,${pair},${9 - k * 0.4}`, `A,${pair},${k === 2 ? 'n/a' : 8 - k * 0.3}`]);
    const tables = parseRateText(['compound,substrate,inhibitor,rate', ...rows].join('\n'), { source: 'o.csv' });
    expect(tables.map((t) => t.compound)).toEqual(['B', 'A']);
    expect(tables[1].excluded.map((e) => e.line)).toEqual([7]);
    expect(tables[1].rowsRead).toBe(GRID.length);
    expect(tables[0].points.map((p) => p.line)).toEqual(GRID.map((_, k) => 2 + 2 * k));
  });
});

describe('repeated blocks, keyed by the rate', () => {
  const point = (line: number, substrate: number, inhibitor: number, rate: number): RatePoint => ({ line, substrate, inhibitor, rate });

  it('finds a pasted block and not the same rates at other concentrations', () => {
    const block = [point(2, 1, 0, 5.1), point(3, 2, 0, 6.2), point(4, 4, 0, 7.3), point(5, 8, 0, 8.4)];
    // the same four rates at other [S]: not a copy
    const shifted = block.map((p, k) => point(6 + k, p.substrate * 3, 0, p.rate));
    expect(repeatedRowWarnings([...block, ...shifted])).toEqual([]);
    const copy = block.map((p, k) => ({ ...p, line: 10 + k }));
    const warnings = repeatedRowWarnings([...block, ...shifted, ...copy]);
    expect(warnings.map((w) => w.lines)).toEqual([[10, 11, 12, 13]]);
    expect(warnings[0].message).toMatch(/^lines 10-13 repeat lines 2-5 exactly \(4 rows/);
  });
});
