/** Several compounds per plate and several plates per run (invented compounds; straight simulated curves). */
import { describe, expect, it } from 'vitest';
import { parseKineticReads, parsePlateMap, ratesFromReads, rateTableText } from '../../src/reads/index.js';
import { InputError } from '../../src/input/types.js';
import { seededRandom } from '../../src/simulate/random.js';

const times = [0, 1, 2, 3, 4, 5, 6, 7];

function longReads(plates: Record<string, Record<string, number>>): string {
  const rng = seededRandom(5);
  const lines = ['plate,well,time (min),signal'];
  for (const [plate, wells] of Object.entries(plates)) {
    for (const [well, slope] of Object.entries(wells)) for (const t of times) lines.push(`${plate},${well},${t},${(0.2 + slope * t + 0.0005 * rng.normal()).toFixed(6)}`);
  }
  return lines.join('\n') + '\n';
}

describe('plates and compounds', () => {
  it('a plate column in reads and map: wells matched per plate; the rate table keeps plate and compound', () => {
    const reads = parseKineticReads(longReads({ P1: { A1: 0.01, A2: 0.02, B1: 0 }, P2: { A1: 0.03, A2: 0.04, B1: 0 } }), { source: 'r.csv' });
    const map = parsePlateMap(
      'plate,well,compound,substrate (uM),inhibitor (nM),role\n' +
        'P1,A1,QX-1,10,0,\nP1,A2,QX-2,10,0,\nP1,B1,,10,,blank\nP2,A1,QX-1,20,0,\nP2,A2,QX-2,20,0,\nP2,B1,,20,,blank\n',
      'm.csv',
    );
    const result = ratesFromReads([reads], map, { conversion: { signalPerUnit: 1, givenUnit: 'uM', description: '' } });
    expect(result.wells.map((w) => [w.plate, w.well, w.compound])).toEqual([['P1', 'A1', 'QX-1'], ['P1', 'A2', 'QX-2'], ['P2', 'A1', 'QX-1'], ['P2', 'A2', 'QX-2']]);
    result.wells.forEach((w, k) => expect(Math.abs(w.rate! / (0.01 * (k + 1)) - 1)).toBeLessThan(0.05));
    expect(result.wells.map((w) => w.excludeReason)).toEqual([null, null, null, null]);
    expect(result.wells[2].blank).toBe('minus the mean of blank well B1 (same [S], [I] not given)');
    const lines = rateTableText(result).split('\n');
    expect(lines[0]).toMatch(/^plate,well,compound,substrate \(uM\),inhibitor \(nM\),rate \(uM\/min\),sd \(uM\/min\),exclude,note,/);
    expect(lines.slice(1, 5).map((l) => l.split(',').slice(0, 5).join(','))).toEqual(['P1,A1,QX-1,10,0', 'P1,A2,QX-2,10,0', 'P2,A1,QX-1,20,0', 'P2,A2,QX-2,20,0']);
  });
  it('a map without a plate column applies to every plate', () => {
    const reads = parseKineticReads(longReads({ P1: { A1: 0.01 }, P2: { A1: 0.02 } }), { source: 'r.csv' });
    const map = parsePlateMap('well,substrate (uM),inhibitor (uM)\nA1,10,0\n', 'm.csv');
    const result = ratesFromReads([reads], map);
    expect(result.wells.map((w) => `${w.plate}/${w.well}`)).toEqual(['P1/A1', 'P2/A1']);
  });
  it('two files without plate names cannot share wells; named by file they can', () => {
    const text = 'time (min),A1\n0,0\n1,1\n2,2\n3,3\n4,4\n';
    const map = parsePlateMap('well,substrate (uM),inhibitor (uM)\nA1,10,0\n', 'm.csv');
    expect(() => ratesFromReads([parseKineticReads(text, { source: 'a.csv' }), parseKineticReads(text, { source: 'b.csv' })], map)).toThrow(InputError);
    expect(() => ratesFromReads([parseKineticReads(text, { source: 'a.csv' }), parseKineticReads(text, { source: 'b.csv' })], map)).toThrow(/^b\.csv:2: well A1 also has reads in a\.csv/);
    const named = ratesFromReads([parseKineticReads(text, { source: 'a.csv', plate: 'a' }), parseKineticReads(text, { source: 'b.csv', plate: 'b' })], map);
    expect(named.wells.map((w) => w.plate)).toEqual(['a', 'b']);
  });
  it('files in different time units are put in the first one\'s unit', () => {
    const map = parsePlateMap('well,substrate (uM),inhibitor (uM)\nA1,10,0\n', 'm.csv');
    const minutes = parseKineticReads('time (min),A1\n0,0\n1,1\n2,2\n3,3\n4,4\n', { source: 'a.csv', plate: 'a' });
    const seconds = parseKineticReads('time (s),A1\n0,0\n60,1\n120,2\n180,3\n240,4\n', { source: 'b.csv', plate: 'b' });
    const result = ratesFromReads([minutes, seconds], map);
    expect(result.units.time).toBe('min');
    expect(result.wells.map((w) => w.rate)).toEqual([1, 1].map((x) => expect.closeTo(x, 12)));
  });
});
