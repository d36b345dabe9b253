/** Levels allowed by each dilution scheme, the plate map and concentration text. */
import { describe, expect, it } from 'vitest';
import { commonGridShape, geometricLevels, schemeLevels } from '../../src/plan/candidate-designs.js';
import { plateMapCsv, plateWells, wellName } from '../../src/plan/plate-map.js';
import { parseConcentrationRange, parseUnitConcentration } from '../../src/plan/concentration-text.js';
import { priorPoints } from '../../src/plan/plan-prior.js';

describe('levels', () => {
  it('free: geometric from low to high', () => {
    const l = geometricLevels(5, 1, 16);
    l.forEach((x, k) => expect(x).toBeCloseTo(2 ** k, 12));
  });
  it('serial dilution: each level FOLD below the next, ending at the highest', () => {
    const l = schemeLevels(4, 0.001, 100, { kind: 'serial', fold: 3 }, 'substrate');
    expect(l[3]).toBe(100);
    for (let k = 1; k < 4; k++) expect(l[k] / l[k - 1]).toBeCloseTo(3, 12);
  });
  it('list: levels are taken from the list only, at most the highest allowed', () => {
    const list = [1, 2, 5, 10, 20, 50, 100, 200];
    const l = schemeLevels(4, 1, 100, { kind: 'list', substrate: list }, 'substrate');
    expect(l).toHaveLength(4);
    expect(l.every((x) => list.includes(x) && x <= 100)).toBe(true);
    expect(l[l.length - 1]).toBe(100);
    expect(schemeLevels(3, 1, 100, { kind: 'list', substrate: list }, 'inhibitor')).toHaveLength(3);
  });
  it('the common grid is 8 x (0 + 5) at 48 points', () => {
    expect(commonGridShape(48)).toEqual({ substrate: 8, inhibitor: 5 });
  });
});

describe('prior points', () => {
  it('an IC50 at [S] becomes Ki by the Cheng-Prusoff relations (Cheng & Prusoff 1973)', () => {
    const prior = { km: [20, 20] as const, ic50: { range: [0.3, 0.3] as const, atSubstrate: 20 }, vmax: 1 };
    expect(priorPoints('competitive', prior)[0].Ki).toBeCloseTo(0.15, 12);
    expect(priorPoints('uncompetitive', prior)[0].Kiu).toBeCloseTo(0.15, 12);
    expect(priorPoints('noncompetitive', prior)[0].Ki).toBeCloseTo(0.3, 12);
    for (const p of priorPoints('mixed', prior)) {
      const ic50 = (p.Km + 20) / (p.Km / p.Ki! + 20 / p.Kiu!);
      expect(ic50).toBeCloseTo(0.3, 12);
    }
  });
  it('ranges give corners and centre', () => {
    expect(priorPoints('competitive', { km: [10, 40], ki: [1, 4], vmax: 1 })).toHaveLength(5);
    expect(priorPoints('mixed', { km: [10, 40], ki: [1, 4], vmax: 1 })).toHaveLength(10);
  });
});

describe('plate map', () => {
  it('fills row by row; 96 ends at H12 and 384 at P24', () => {
    expect(wellName(0, 96)).toBe('A1');
    expect(wellName(12, 96)).toBe('B1');
    expect(wellName(95, 96)).toBe('H12');
    expect(wellName(383, 384)).toBe('P24');
  });
  it('one row per well, replicates side by side, ordered by [I] then [S]', () => {
    const points = [
      { substrate: 10, inhibitor: 1, replicates: 2 },
      { substrate: 5, inhibitor: 0, replicates: 3 },
    ];
    const wells = plateWells(points, 96);
    expect(wells.map((w) => `${w.well}:${w.substrate}:${w.inhibitor}:${w.replicate}`)).toEqual(['A1:5:0:1', 'A2:5:0:2', 'A3:5:0:3', 'A4:10:1:1', 'A5:10:1:2']);
    expect(plateMapCsv(points, 96, { substrate: 'uM', inhibitor: 'nM' }).split('\n')[0]).toBe('well,substrate (uM),inhibitor (nM),replicate');
    expect(() => plateWells([{ substrate: 1, inhibitor: 0, replicates: 97 }], 96)).toThrow(/97 wells/);
  });
});

describe('concentrations on the command line', () => {
  it('reads a value with its unit and ranges', () => {
    expect(parseUnitConcentration('20uM')).toEqual({ value: 20, unit: 'uM' });
    expect(parseUnitConcentration('0.5 mM')).toEqual({ value: 0.5, unit: 'mM' });
    expect(parseConcentrationRange('10nM..0.5uM')).toEqual({ range: [0.01, 0.5], unit: 'uM' });
    expect(parseConcentrationRange('10..40uM')).toEqual({ range: [10, 40], unit: 'uM' });
  });
  it('refuses text without a unit, an unknown unit, a reversed range', () => {
    expect(() => parseUnitConcentration('20')).toThrow(/with its unit/);
    expect(() => parseUnitConcentration('20 kM')).toThrow(/unknown concentration unit/);
    expect(() => parseConcentrationRange('40uM..10uM')).toThrow(/low end/);
  });
});
