/**
 * Warnings (issue 3, rule 4, third kind): the analysis goes on, the finding is reported.
 * Thresholds are common practice (5 [S] levels, 3 non-zero [I] levels, 8 decades) or, for the
 * design warnings after the fit, the ranges stated in BRIEF section 7 (0.2-5 x Km; [I] to
 * several times Ki).
 */
import { describe, expect, it } from 'vitest';
import { EXAMPLES, readFixture } from './read-fixture.js';
import { designWarnings, type RateTable } from '../../src/input/index.js';

const codes = (t: RateTable): string[] => t.warnings.map((w) => w.code);
const warning = (t: RateTable, code: string) => t.warnings.find((w) => w.code === code);

describe('data warnings', () => {
  it('a well-designed table (examples/long.csv) has none', () => {
    const [t] = readFixture('long.csv', {}, EXAMPLES);
    expect(t.warnings).toEqual([]);
  });

  it('zero or negative rates stay in the fit, with their lines', () => {
    const [t] = readFixture('nonpositive-rates.csv');
    expect(t.points).toHaveLength(6);
    expect(warning(t, 'rate-not-positive')).toEqual({
      code: 'rate-not-positive',
      message: '2 rates are zero or negative (lines 5, 6); they stay in the fit, but check the background subtraction',
      lines: [5, 6],
    });
  });

  it('a single replicate everywhere', () => {
    expect(warning(readFixture('ok-minimal.csv')[0], 'single-replicate')?.message).toBe(
      'every ([S], [I]) pair has a single rate; replicates let the error model and the lack of fit be checked, so measure at least in duplicate',
    );
    expect(codes(readFixture('replicates.csv')[0])).not.toContain('single-replicate');
  });

  it('concentrations spanning more than 8 decades', () => {
    const [t] = readFixture('wide-span.csv');
    expect(warning(t, 'wide-concentration-span')?.message).toBe(
      'substrate concentrations span 9.0 decades (more than 8); check for mixed units in the substrate column',
    );
    expect(codes(readFixture('ok-minimal.csv')[0])).not.toContain('wide-concentration-span');
  });

  it('too few levels (common practice: 5 [S], 3 non-zero [I])', () => {
    const [t] = readFixture('ok-minimal.csv');
    expect(warning(t, 'few-substrate-levels')?.message).toBe(
      'only 3 substrate levels; common practice is at least 5, from about 0.2 x Km to 5 x Km or more, else Km and the mechanism are poorly determined',
    );
    expect(warning(t, 'few-inhibitor-levels')?.message).toBe(
      'only 1 non-zero inhibitor level; common practice is at least 3 (e.g. 0.5, 1, 2, 4 x Ki) besides the control, else the mechanisms are hard to tell apart',
    );
  });

  it('a missing unit and a unit replaced by an option are reported', () => {
    const [t] = readFixture('nonpositive-rates.csv', { inhibitorUnit: 'uM' });
    expect(warning(t, 'unit-overridden')?.message).toBe(
      'the header gives inhibitor in nM but the inhibitor unit option says uM; the values are read as uM',
    );
    const [bare] = readFixture('no-units.csv');
    expect(warning(bare, 'unit-missing')?.message).toBe(
      'the substrate unit is not given; constants in substrate units will be printed without a unit; write it in the header, e.g. "substrate (uM)"',
    );
  });
});

describe('designWarnings (after the fit; the same checks and words as the analysis caveats)', () => {
  const [table] = readFixture('long.csv', {}, EXAMPLES); // [S] 2-64 uM, [I] 0-160 nM

  it('no warning when [S] reaches 5 x Km and [I] exceeds Ki and Kiu', () => {
    expect(designWarnings(table, { Km: 12, Ki: 40, Kiu: 150 })).toEqual([]);
  });

  it('[S] staying below 2 x Km', () => {
    expect(designWarnings(table, { Km: 100 })).toEqual([{
      code: 'substrate-below-2km',
      message: 'the highest [S] is only 0.64 x Km: effects on the enzyme-substrate complex are barely visible',
    }]);
    expect(designWarnings(table, { Km: 32 }).map((w) => w.code)).toEqual(['substrate-below-5km']); // 64 = 2 x 32 exactly
  });

  it('lowest [S] above Km', () => {
    expect(designWarnings(table, { Km: 1.5 })).toEqual([{
      code: 'substrate-above-km',
      message: 'the lowest [S] is 1.3 x Km: effects on free enzyme are barely visible',
    }]);
  });

  it('[S] staying below 5 x Km', () => {
    expect(designWarnings(table, { Km: 20 }).map((w) => w.code)).toEqual(['substrate-below-5km']);
    expect(designWarnings(table, { Km: 12.8 })).toEqual([]); // 64 = 5 x 12.8 exactly
  });

  it('[I] staying below the smaller of Ki and Kiu; constants not detected (infinite) are skipped', () => {
    expect(designWarnings(table, { Km: 5, Ki: 200, Kiu: 180 })).toEqual([{
      code: 'inhibitor-below-k',
      message: 'the highest [I] (160 nM) stays below the fitted inhibition constant (180 nM): inhibition is weak throughout',
    }]);
    expect(designWarnings(table, { Km: 5, Ki: 200, Kiu: 160 })).toEqual([]); // 160 reaches Kiu exactly
    expect(designWarnings(table, { Km: 5, Ki: Infinity, Kiu: Number.NaN })).toEqual([]);
  });

  it('a single non-zero [I] level', () => {
    const [single] = readFixture('ok-minimal.csv');
    expect(designWarnings(single, { Km: 1 }).map((w) => w.code)).toEqual(['substrate-below-5km', 'single-inhibitor-level']);
  });

  it('is pure: the table is not changed', () => {
    const before = JSON.stringify(table);
    designWarnings(table, { Km: 100, Ki: 1000 });
    expect(JSON.stringify(table)).toBe(before);
  });
});
