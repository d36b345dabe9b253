/**
 * Input errors (issue 3, rule 4, first kind): each stops reading with one line naming file,
 * line and column, and saying what to do. The fixtures in test/fixtures/input are hand-written.
 */
import { describe, expect, it } from 'vitest';
import { readFixture, inputErrorOf } from './read-fixture.js';
import { readRateFile, parseRateText, MINIMUM_USABLE_POINTS } from '../../src/input/index.js';
import { FIXTURES } from './read-fixture.js';

const message = (name: string, options = {}): string => inputErrorOf(() => readFixture(name, options)).message;

describe('input errors', () => {
  it('binary file: a control character is refused with its place', () => {
    expect(message('binary.csv')).toBe(
      'binary.csv:2:5: not a text table (control character 0x00); this looks like a binary file, export the data as CSV or TSV',
    );
  });

  it('another encoding: the first byte that is not UTF-8 is named (column counts characters)', () => {
    expect(message('latin1.csv')).toBe(
      'latin1.csv:1:12: byte 0xb5 is not valid UTF-8; this is a binary file or another encoding, save it as UTF-8',
    );
  });

  it('UTF-16 is refused with a hint to save as UTF-8', () => {
    expect(message('utf16.csv')).toBe('utf16.csv:1:1: the file is UTF-16; save it as UTF-8 (or CSV UTF-8) and read it again');
  });

  it('unreadable file: a missing path and a folder are InputErrors', async () => {
    await expect(readRateFile(`${FIXTURES}does-not-exist.csv`)).rejects.toThrow(/does-not-exist\.csv: no such file; check the path$/);
    await expect(readRateFile(FIXTURES)).rejects.toThrow(/this is a folder, not a file/);
    await expect(readRateFile(`${FIXTURES}binary.csv`)).rejects.toMatchObject({ name: 'InputError', exitCode: 2, line: 2, column: 5 });
  });

  it('empty file', () => {
    expect(inputErrorOf(() => parseRateText('\n\n', { source: 'e.csv' })).message).toBe(
      'e.csv:1: the file is empty; it needs a header line and data rows',
    );
    // lines of separators and spaces only: empty too, for either layout
    for (const layout of ['long', 'matrix'] as const) {
      expect(inputErrorOf(() => parseRateText(',,\n , \n', { source: 's.csv', layout })).message).toBe(
        's.csv:1: the file is empty; it needs a header line and data rows',
      );
    }
  });

  it('missing required column names the columns found', () => {
    expect(message('missing-column.csv')).toBe(
      'missing-column.csv:1: missing required column "rate" (the header has "substrate (uM)", "inhibitor (nM)", "velocity"); name a column "rate"',
    );
  });

  it('a file without header says the first line looks like data', () => {
    expect(message('no-header.csv')).toMatch(/^no-header\.csv:1: missing required column "substrate" .*the first line looks like data; add a header line/);
  });

  it('duplicate column names (the exact wording of the issue)', () => {
    expect(message('duplicate-column.csv')).toBe('duplicate-column.csv:1:3: duplicate column name "rate" (also column 2); rename one');
  });

  it('negative concentration', () => {
    const error = inputErrorOf(() => readFixture('negative-concentration.csv'));
    expect(error.message).toBe(
      'negative-concentration.csv:4:2: negative inhibitor concentration "-10"; concentrations cannot be below zero, correct the value',
    );
    expect([error.file, error.line, error.column, error.exitCode]).toEqual(['negative-concentration.csv', 4, 2, 2]);
  });

  it('negative inhibitor in a matrix header', () => {
    expect(message('matrix-negative-inhibitor.csv')).toBe(
      'matrix-negative-inhibitor.csv:1:3: negative inhibitor concentration "-10"; concentrations cannot be below zero, correct the value',
    );
  });

  it('fewer than two inhibitor levels (only the control)', () => {
    expect(message('one-inhibitor-level.csv')).toBe(
      'one-inhibitor-level.csv:1:2: only the inhibitor-free control ([I] = 0) among the usable points; a mechanism analysis needs at least one non-zero [I] too; add rates measured with inhibitor (or turn off the mechanism-design check)',
    );
  });

  it('no inhibitor-free control', () => {
    expect(message('no-control.csv')).toBe(
      'no-control.csv:1:2: no inhibitor-free control ([I] = 0) among the usable points; a mechanism analysis compares rates with and without inhibitor; add [I] = 0 rows (or turn off the mechanism-design check)',
    );
  });

  it('the mechanism-design check can be turned off', () => {
    const [table] = readFixture('one-inhibitor-level.csv', { requireMechanismDesign: false });
    expect(table.points).toHaveLength(5);
    expect(readFixture('no-control.csv', { requireMechanismDesign: false })[0].points).toHaveLength(6);
  });

  it(`fewer than ${MINIMUM_USABLE_POINTS} usable points (mixed has 4 parameters)`, () => {
    expect(MINIMUM_USABLE_POINTS).toBe(5);
    expect(message('too-few-points.csv')).toBe(
      'too-few-points.csv:1:3: only 4 usable points (6 read, 2 excluded); the mixed model has 4 parameters, so at least 5 are needed; add rates or correct the excluded rows' +
        '; excluded because: 1 row at line 4 column 3: rate is blank (fix: fill in the blank cells)' +
        '; 1 row at line 7 column 3: rate "n/a" is not a number (fix: write numbers in these cells, or leave them blank)',
    );
    // the point floor holds even without the mechanism-design check
    expect(message('too-few-points.csv', { requireMechanismDesign: false })).toMatch(/only 4 usable points/);
  });

  it('unknown unit names it', () => {
    expect(message('unknown-unit.csv')).toBe('unknown-unit.csv:1:1: unknown concentration unit "mg/mL"; use M, mM, uM (or \u00b5M), nM or pM');
  });

  it('a quoted cell never closed names where it opened', () => {
    expect(message('unclosed-quote.csv')).toBe('unclosed-quote.csv:3:2: quoted cell is never closed; add the closing quote (")');
  });

  it('an exclude value that is not understood', () => {
    expect(message('exclude-not-understood.csv')).toBe(
      'exclude-not-understood.csv:3:4: exclude value "maybe" not understood; write yes to leave the row out (yes/y/true/t/1/x/exclude/excluded/omit/omitted/drop/skip) or leave it blank',
    );
  });

  it('a blank compound among named ones', () => {
    expect(message('compound-blank.csv')).toBe('compound-blank.csv:3:1: compound is blank here but other rows name a compound; fill it in');
  });

  it('a corner cell written with a slash gets a hint about the matrix layout', () => {
    expect(message('matrix-bad-corner.csv')).toMatch(/for the matrix layout, write the corner cell with a backslash: "substrate \(uM\) \\ inhibitor \(nM\)"$/);
  });

  it('forcing the matrix layout on a long file says what a block header looks like', () => {
    expect(message('ok-minimal.csv', { layout: 'matrix' })).toBe(
      'ok-minimal.csv:1:1: matrix layout: the first block must start with a corner cell such as "substrate (uM) \\ inhibitor (nM)"; add it',
    );
  });

  it('every message is one line without "undefined" or "NaN"', () => {
    const names = ['binary.csv', 'latin1.csv', 'missing-column.csv', 'duplicate-column.csv', 'negative-concentration.csv',
      'one-inhibitor-level.csv', 'no-control.csv', 'too-few-points.csv', 'unknown-unit.csv', 'unclosed-quote.csv'];
    for (const name of names) {
      const text = message(name);
      expect(text).not.toMatch(/\n|undefined|NaN|    at /);
      expect(text.startsWith(`${name}:`)).toBe(true);
    }
  });
});
