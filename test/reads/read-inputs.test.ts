/** Reading kinetic reads and plate maps: both shapes, units, and bad input with file:line:column. */
import { describe, expect, it } from 'vitest';
import { parseKineticReads, parsePlateMap, ratesFromReads, rateTableText } from '../../src/reads/index.js';
import { InputError } from '../../src/input/types.js';

const LONG = `well,time (min),signal
A1,0,0.100
A1,1,0.110
A1,2,0.120
B01,0,0.2
B01,1,0.2
`;

const WIDE = `time (s),A1,B1,temperature
0:00,0.1,0.2,25
0:30,0.11,0.2,25
1:00,0.12,OVER,25
`;

function errorOf(fn: () => unknown): InputError {
  try {
    fn();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('no error');
}

describe('kinetic reads', () => {
  it('long shape: wells, times in the header unit, well names made canonical', () => {
    const r = parseKineticReads(LONG, { source: 'r.csv' });
    expect(r.layout).toBe('long');
    expect(r.timeUnit).toBe('min');
    expect(r.curves.map((c) => c.well)).toEqual(['A1', 'B1']);
    expect(r.curves[0].times).toEqual([0, 1, 2]);
    expect(r.curves[0].lines).toEqual([2, 3, 4]);
  });
  it('wide shape: clock times, a column that is not a well is listed, an overflow marker is a listed exclusion', () => {
    const r = parseKineticReads(WIDE, { source: 'w.csv' });
    expect(r.layout).toBe('wide');
    expect(r.curves[0].times).toEqual([0, 30, 60]);
    expect(r.notes.join('\n')).toContain('w.csv:1:4: column "temperature" is not a well name');
    expect(r.excluded).toEqual([{ line: 4, column: 3, plate: '', well: 'B1', reason: expect.stringContaining('signal "OVER" is not a number') }]);
    expect(r.curves[1].signals).toEqual([0.2, 0.2]);
  });
  it('semicolon files with decimal commas, as the rate-table reader', () => {
    const r = parseKineticReads('time (min);A1\n0;0,1\n1;0,15\n', { source: 's.csv' });
    expect(r.curves[0].signals).toEqual([0.1, 0.15]);
  });
  it('errors name file, line and column', () => {
    expect(errorOf(() => parseKineticReads('well,time (s),signal\nZ,0,1\n', { source: 'r.csv' })).message).toMatch(/^r\.csv:2:1: "Z" is not a well name/);
    expect(errorOf(() => parseKineticReads('well,time (days),signal\nA1,0,1\n', { source: 'r.csv' })).message).toMatch(/^r\.csv:1:2: unknown time unit "days"/);
    expect(errorOf(() => parseKineticReads('well,time (s),signal\nA1,0,1\nA1,0,2\n', { source: 'r.csv' })).message).toMatch(/^r\.csv:3:2: well A1 has a second read at the same time \(also line 2\)/);
    expect(errorOf(() => parseKineticReads('A1,B1\n1,2\n', { source: 'r.csv' })).message).toMatch(/^r\.csv:1: no "time" column/);
    expect(errorOf(() => parseKineticReads('', { source: 'r.csv' })).message).toMatch(/^r\.csv: the file is empty/);
  });
  it('a negative or blank time is a listed exclusion', () => {
    const r = parseKineticReads('well,time (s),signal\nA1,-1,1\nA1,,2\nA1,3,3\n', { source: 'r.csv' });
    expect(r.excluded.map((e) => [e.line, e.column])).toEqual([[2, 2], [3, 2]]);
    expect(r.excluded[0].reason).toContain('negative');
  });
});

describe('plate map', () => {
  const MAP = 'well,compound,substrate (uM),inhibitor (nM),role\nA1,QX-7,10,0,\nB1,,10,,blank\nC1,QX-7,20,5,exclude\n';
  it('roles, units and a blank without [I]', () => {
    const m = parsePlateMap(MAP, 'm.csv');
    expect(m.units).toEqual({ substrate: 'uM', inhibitor: 'nM' });
    expect(m.entries.map((e) => [e.well, e.role, e.inhibitor])).toEqual([['A1', 'sample', 0], ['B1', 'blank', null], ['C1', 'exclude', 5]]);
  });
  it('errors name file, line and column', () => {
    expect(errorOf(() => parsePlateMap('well,substrate (uM),inhibitor (uM),role\nA1,1,0,enzyme\n', 'm.csv')).message).toMatch(/^m\.csv:2:4: role "enzyme" not understood/);
    expect(errorOf(() => parsePlateMap('well,substrate (uM)\nA1,1\n', 'm.csv')).message).toMatch(/^m\.csv:1: the plate map has no "inhibitor" column/);
    expect(errorOf(() => parsePlateMap('well,substrate (uM),inhibitor (uM)\nA1,1,0\nA01,2,0\n', 'm.csv')).message).toMatch(/^m\.csv:3:1: well A1 is in the map twice \(also line 2\)/);
    expect(errorOf(() => parsePlateMap('well,substrate (uM),inhibitor (uM)\nA1,-1,0\n', 'm.csv')).message).toMatch(/^m\.csv:2:2: substrate "-1" is negative/);
    expect(errorOf(() => parsePlateMap('well,substrate (xM),inhibitor (uM)\nA1,1,0\n', 'm.csv')).message).toMatch(/^m\.csv:1:2: unknown concentration unit "xM"/);
    expect(errorOf(() => parsePlateMap('well,compound,substrate (uM),inhibitor (uM)\nA1,Q,1,0\nA2,,1,0\n', 'm.csv')).message).toMatch(/^m\.csv:3:2: compound is blank for sample well A2/);
  });
});

describe('matching reads to the map: nothing dropped silently', () => {
  it('map wells without reads and reads without a map entry are listed; the first are rows of the rate table', () => {
    const times = [0, 1, 2, 3, 4, 5, 6];
    const lines = ['time (min),A1,A2,H12'];
    for (const t of times) lines.push(`${t},${0.1 + 0.01 * t},${0.1 + 0.02 * t},${0.3}`);
    const reads = parseKineticReads(lines.join('\n'), { source: 'r.csv' });
    const map = parsePlateMap('well,substrate (uM),inhibitor (uM)\nA1,10,0\nA2,10,1\nB5,20,0\n', 'm.csv');
    const result = ratesFromReads([reads], map);
    expect(result.mapWellsWithoutReads.map((m) => [m.label, m.line])).toEqual([['B5', 4]]);
    expect(result.readsWithoutMap.map((r) => r.label)).toEqual(['H12']);
    expect(result.notes.join('\n')).toContain('1 plate-map well has no reads: B5');
    expect(result.notes.join('\n')).toContain('1 well has reads but no plate-map entry, and no rate: H12');
    const text = rateTableText(result);
    expect(text).toContain('B5,20,0,,,yes,no reads for this well (plate map line 4)');
    // without a conversion the rates are signal per time, straight lines recovered exactly
    expect(result.units.rate).toBe('signal/min');
    expect(result.wells[0].rate).toBeCloseTo(0.01, 12);
    expect(result.wells[1].rate).toBeCloseTo(0.02, 12);
  });
});
