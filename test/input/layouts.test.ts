/**
 * Layouts (issue 3, rule 1): long and matrix, detected and reported, overridable; several
 * compounds in one file give one table each. The example files are simulated data
 * (examples/make-examples.mjs).
 */
import { describe, expect, it } from 'vitest';
import { EXAMPLES, inputErrorOf, readFixture, sortedPoints } from './read-fixture.js';
import { describeTable, parseRateText } from '../../src/input/index.js';

const example = (name: string, options = {}) => readFixture(name, options, EXAMPLES);

describe('layout detection', () => {
  it('long and matrix files are told apart and the choice is reported', () => {
    expect(example('long.csv')[0].layout).toBe('long');
    expect(example('matrix.csv')[0].layout).toBe('matrix');
    expect(example('compounds-matrix.csv')[0].layout).toBe('matrix');
    expect(example('matrix.csv')[0].detection.layout).toBe('detected');
    expect(example('long.csv', { layout: 'long' })[0].detection.layout).toBe('option');
    expect(describeTable(example('matrix.csv')[0])).toMatch(/^matrix\.csv: matrix layout \(detected\), comma-separated \(detected\), decimal point \(detected\); 60 cells read, 60 used, 0 excluded; substrate in uM, inhibitor in nM, rate in uM\/min$/);
  });
});

describe('long layout', () => {
  it('keeps replicate, well and other columns as annotations', () => {
    const [t] = example('long.csv');
    expect(t.rowsRead).toBe(60);
    expect(t.points[0]).toEqual({ line: 2, substrate: 2, inhibitor: 0, rate: 0.29, replicate: '1', well: 'A1' });
    const [q] = readFixture('quoted-fields.csv');
    expect(q.points[0].annotations).toEqual({ note: 'plate 1, row A' });
  });

  it('all the long forms of the example give the same points', () => {
    const reference = sortedPoints(example('long.csv')[0]);
    expect(sortedPoints(example('long-semicolon.csv')[0])).toEqual(reference);
    const [tsv] = example('long.tsv'); // one row flagged in the exclude column
    expect(tsv.excluded).toMatchObject([{ line: 9, column: 5, reason: 'flagged in the exclude column ("yes")' }]);
    expect(sortedPoints(tsv)).toHaveLength(59);
  });
});

describe('matrix layout', () => {
  it('replicates as repeated [I] columns: replicate labels by reading order', () => {
    const [t] = readFixture('matrix-replicate-columns.csv');
    expect(t.points.slice(0, 4)).toEqual([
      { line: 2, substrate: 1, inhibitor: 0, rate: 1.0, replicate: '1' },
      { line: 2, substrate: 1, inhibitor: 0, rate: 1.1, replicate: '2' },
      { line: 2, substrate: 1, inhibitor: 10, rate: 0.6, replicate: '1' },
      { line: 2, substrate: 1, inhibitor: 10, rate: 0.7, replicate: '2' },
    ]);
    expect(t.units).toEqual({ substrate: 'uM', inhibitor: 'nM', rate: 'uM/min' });
  });

  it('the long and the matrix layout of the same data give identical points (both replicate forms)', () => {
    const long = sortedPoints(example('long.csv')[0]);
    expect(long).toHaveLength(60);
    expect(sortedPoints(example('matrix.csv')[0])).toEqual(long);
    expect(sortedPoints(example('matrix-side-by-side.csv')[0])).toEqual(long);
  });

  it('blocks must agree on units', () => {
    const text = 'substrate (uM) \\ inhibitor (nM),0,10\n1,1,0.5\n\nsubstrate (uM) \\ inhibitor (uM),0,10\n1,1,0.5\n';
    expect(inputErrorOf(() => parseRateText(text, { source: 'u.csv' })).message).toBe(
      'u.csv:4:1: this block gives inhibitor in uM but the block at line 1 in nM; use one unit throughout',
    );
  });

  it('a data cell under a blank [I] header is an error; an empty unnamed column is ignored', () => {
    const bad = 'substrate \\ inhibitor,0,,10\n1,1,2,0.5\n';
    expect(inputErrorOf(() => parseRateText(bad, { source: 'b.csv' })).message).toBe(
      'b.csv:2:3: cell has no [I] value above it (the header at line 1 is blank in column 3); add the [I] value or delete the cell',
    );
    const fine = 'substrate \\ inhibitor,0,10,\n1,1,0.5,\n2,1.5,0.9,\n4,2,1.4,\n';
    expect(parseRateText(fine, { source: 'f.csv' })[0].rowsRead).toBe(6);
  });

  it('a non-numeric [I] header is an error', () => {
    expect(inputErrorOf(() => parseRateText('substrate \\ inhibitor,0,ten\n1,1,0.5\n', { source: 'h.csv' })).message).toBe(
      'h.csv:1:3: inhibitor value "ten" in the block header is not a finite number; the header row holds the [I] of each column after the corner cell',
    );
  });
});

describe('several compounds in one file', () => {
  it('a compound column gives one table per compound, in order of appearance', () => {
    const tables = example('compounds-long.csv');
    expect(tables.map((t) => t.compound)).toEqual(['CPD-A', 'CPD-B']);
    expect(tables.map((t) => t.rowsRead)).toEqual([60, 60]);
    expect(tables[0].points.every((p) => p.compound === 'CPD-A')).toBe(true);
  });

  it('one titled block per compound gives the same tables as the compound column', () => {
    const long = example('compounds-long.csv');
    const matrix = example('compounds-matrix.csv');
    expect(matrix.map((t) => t.compound)).toEqual(['CPD-A', 'CPD-B']);
    for (let k = 0; k < 2; k++) expect(sortedPoints(matrix[k])).toEqual(sortedPoints(long[k]));
    // the first compound of the multi-compound file is the single-compound example
    expect(sortedPoints(long[0])).toEqual(sortedPoints(example('long.csv')[0]));
  });

  it('a single-compound file has compound undefined', () => {
    expect(example('long.csv')[0].compound).toBeUndefined();
    expect('compound' in example('matrix.csv')[0]).toBe(false);
  });

  it('table-level errors name the compound', () => {
    const text = 'compound,substrate,inhibitor,rate\nA,1,0,1\nA,2,0,1.5\nA,4,0,2\nA,1,5,0.5\nA,2,5,1\nB,1,0,1\n';
    expect(inputErrorOf(() => parseRateText(text, { source: 'c.csv' })).message).toBe(
      'c.csv:1:4: compound "B": only 1 usable point (1 read, 0 excluded); the mixed model has 4 parameters, so at least 5 are needed; add rates or correct the excluded rows',
    );
  });

  it('an untitled block among titled ones is an error', () => {
    const text = 'compound,A\nsubstrate \\ inhibitor,0,10\n1,1,0.5\n\nsubstrate \\ inhibitor,0,10\n1,1,0.5\n';
    expect(inputErrorOf(() => parseRateText(text, { source: 't.csv' })).message).toBe(
      't.csv:5:1: this block has no compound title while others have one; add a "compound,<name>" line above it',
    );
  });
});
