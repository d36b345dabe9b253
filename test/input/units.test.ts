/**
 * Units (issue 3, rule 3): read from headers, set or replaced by options, converted on request.
 */
import { describe, expect, it } from 'vitest';
import { inputErrorOf, readFixture } from './read-fixture.js';
import { convertUnits, InputError, parseConcentrationUnit, parseRateText } from '../../src/input/index.js';
import { scaleByPowerOfTen } from '../../src/input/units.js';

describe('units', () => {
  it('parseConcentrationUnit reads M, mM, uM, µ (micro sign U+00B5), μ (Greek mu U+03BC), nM, pM', () => {
    expect(['M', 'mM', 'uM', '\u00b5M', '\u03bcM', 'nM', 'pM', ' nM '].map((u) => parseConcentrationUnit(u))).toEqual(
      ['M', 'mM', 'uM', 'uM', 'uM', 'nM', 'pM', 'nM'],
    );
  });

  it('micro, nano and pico are read in any case (issue 13): no other unit could be meant', () => {
    expect(['um', 'UM', 'Um', 'nm', 'NM', 'pm', 'PM', '\u00b5m', ' nm '].map((u) => parseConcentrationUnit(u))).toEqual(
      ['uM', 'uM', 'uM', 'nM', 'nM', 'pM', 'pM', 'uM', 'nM'],
    );
  });

  it('m and M stay strict: MM, mm, Mm and m are errors with a hint (issue 13)', () => {
    for (const bad of ['MM', 'mm', 'Mm']) {
      expect(inputErrorOf(() => parseConcentrationUnit(bad)).message).toBe(
        `concentration unit "${bad}" is ambiguous; write mM for millimolar (m and M differ: m is milli, M is molar)`,
      );
    }
    expect(inputErrorOf(() => parseConcentrationUnit('m')).message).toBe(
      'concentration unit "m" is ambiguous; write M for molar or mM for millimolar (m and M differ: m is milli, M is molar)',
    );
  });

  it('an unknown unit is an InputError naming it', () => {
    for (const bad of ['mg/mL', 'micromolar', '']) {
      const error = inputErrorOf(() => parseConcentrationUnit(bad));
      expect(error).toBeInstanceOf(InputError);
      expect(error.message).toBe(`unknown concentration unit "${bad}"; use M, mM, uM (or \u00b5M), nM or pM`);
    }
  });

  it('header units: case-insensitive names, brackets or parentheses, rate unit kept as text', () => {
    const [t] = readFixture('header-case-units.csv');
    expect(t.units).toEqual({ substrate: 'mM', inhibitor: 'nM', rate: 'AU/s' });
    const [m] = readFixture('micro-sign.csv');
    expect(m.units).toEqual({ substrate: 'uM', inhibitor: 'uM', rate: null });
  });

  it('options set missing units and replace header units', () => {
    const [t] = readFixture('no-units.csv', { substrateUnit: 'mM', inhibitorUnit: 'nM', rateUnit: 'OD/min' });
    expect(t.units).toEqual({ substrate: 'mM', inhibitor: 'nM', rate: 'OD/min' });
    expect(t.warnings.map((w) => w.code)).not.toContain('unit-missing');
  });

  it('substrate and inhibitor may be in different units, and each converts on its own', () => {
    const [t] = readFixture('header-case-units.csv'); // substrate mM, inhibitor nM
    const c = convertUnits(t, { substrate: 'uM' });
    expect(c.units).toEqual({ substrate: 'uM', inhibitor: 'nM', rate: 'AU/s' });
    expect(c.points.map((p) => p.substrate)).toEqual([1000, 2000, 4000, 1000, 2000, 4000]);
    expect(c.points.map((p) => p.inhibitor)).toEqual(t.points.map((p) => p.inhibitor));
    expect(t.units.substrate).toBe('mM'); // pure: the input table is unchanged
    expect(t.points[0].substrate).toBe(1);
  });

  it('outputUnits converts while reading', () => {
    const [t] = readFixture('ok-minimal.csv', { outputUnits: { substrate: 'mM', inhibitor: 'uM' } });
    expect(t.units).toEqual({ substrate: 'mM', inhibitor: 'uM', rate: 'uM/min' });
    expect(t.points.map((p) => p.substrate)).toEqual([0.001, 0.002, 0.004, 0.001, 0.002, 0.004]);
    expect(t.points.map((p) => p.inhibitor)).toEqual([0, 0, 0, 0.01, 0.01, 0.01]);
  });

  it('converting an axis without a known unit is an error that says what to do', () => {
    const [t] = readFixture('no-units.csv');
    expect(inputErrorOf(() => convertUnits(t, { inhibitor: 'nM' })).message).toBe(
      'no-units.csv: cannot convert inhibitor to nM: the inhibitor unit is not known; give it in the header, e.g. "inhibitor (uM)", or set it with the inhibitor unit option',
    );
  });

  it('rescaling works on decimal digits: 1500 nM is exactly the double of 1.5 uM', () => {
    expect(scaleByPowerOfTen(1500, -3)).toBe(1.5);
    expect(scaleByPowerOfTen(123.4, -3)).toBe(0.1234);
    expect(123.4 * 0.001).not.toBe(0.1234); // a multiplication gives 0.12340000000000001
    expect(2.1 / 1000).not.toBe(0.0021); // and a division gives 0.0021000000000000003
    expect(scaleByPowerOfTen(2.1, -3)).toBe(0.0021);
    expect(scaleByPowerOfTen(2.5e-7, 9)).toBe(250);
    expect(scaleByPowerOfTen(0, 6)).toBe(0);
  });

  it('an unknown unit in an option is an InputError', () => {
    expect(() => parseRateText('substrate,inhibitor,rate\n1,0,1\n', { source: 'o.csv', substrateUnit: 'mg' as never })).toThrow(
      'o.csv: unknown concentration unit "mg"; use M, mM, uM (or \u00b5M), nM or pM',
    );
  });
});
