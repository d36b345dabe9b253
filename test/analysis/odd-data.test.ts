/**
 * Odd but real tables (issue 15): each fixture in test/fixtures/odd-data/ (written by the committed
 * make-odd-data.mjs from invented data) and the statement the analysis must make about it.
 */
import { describe, expect, it } from 'vitest';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { readRateFile } from '../../src/input/read-rate-file.js';
import { analyzeTable, AnalysisError } from '../../src/analysis/analyze-table.js';
import { IMPLAUSIBLE_MOLAR } from '../../src/evidence/checks/plausibility-check.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { MINIMUM_ANALYSIS_POINTS } from '../../src/input/table-checks.js';
import type { Caveat } from '../../src/evidence/verdict/caveat.js';
import { SATURATED_ACTIVITY } from '../../src/evidence/checks/rate-pattern-checks.js';

const dir = join(dirname(fileURLToPath(import.meta.url)), '..', 'fixtures', 'odd-data');
async function analysed(name: string) {
  const [table] = await readRateFile(join(dir, `${name}.csv`));
  return analyzeTable(table, { detail: 'summary' });
}
type Result = Awaited<ReturnType<typeof analysed>>;
/** The caveats among the verdict's reasons, and the codes of the reasons. */
const caveatsOf = (r: Result): Caveat[] => r.verdict.reasons.flatMap((x) => (x.code === 'caveat' ? [x.caveat] : []));
const caveatCodes = (r: Result) => caveatsOf(r).map((c) => c.code);
/** The caveat whose headline leads the verdict, if one does. */
const leadingCaveat = (r: Result) => (r.verdict.headline.code === 'caveat' ? r.verdict.headline.caveat : undefined);
/** The code of the first piece of advice, and of the caveat it comes from. */
const firstAdvice = (r: Result) => {
  const a = r.verdict.suggestions.find((x) => x.code === 'caveat' && x.caveat.leading);
  return a?.code === 'caveat' ? a.caveat.code : r.verdict.suggestions[0]?.code;
};

describe('odd tables get the statement an enzymologist expects', () => {
  it('the clean reference table: a firm competitive call', async () => {
    const r = await analysed('clean-competitive');
    expect(r.verdict.decisive).toBe(true);
    expect(r.verdict.mechanism).toBe('competitive');
    expect(r.verdict.exclusion?.excluded).toBe(true);
  });

  it('one mistyped well (a rate 10^6 too large) is found, and the call names it instead of flipping', async () => {
    const r = await analysed('mistyped-well');
    expect(r.robust).toBeDefined();
    expect(r.robust!.downWeighted.map((d) => d.line)).toContain(23);
    expect(r.robust!.verdict.mechanism).toBe('competitive');
    expect(r.verdict.decisive).toBe(false);
    const lead = leadingCaveat(r);
    expect(lead).toMatchObject({ code: 'robust', change: 'changes', robustCall: 'competitive', blocking: true, leading: true });
    expect(lead?.code === 'robust' && lead.downWeighted.map((d) => d.line)).toEqual([23]);
    expect(lead?.code === 'robust' && lead.downWeighted[0].rate).toBeGreaterThan(3e7);
    expect(firstAdvice(r)).toBe('robust');
  });

  it('noise-free rates: called competitive, with no residual "miss" and no division by zero', async () => {
    const r = await analysed('noise-free-competitive');
    expect(r.verdict.mechanism).toBe('competitive');
    expect(r.verdict.decisive).toBe(true);
    expect(r.verdict.headline).toEqual({ code: 'exact', mechanism: 'competitive' });
    expect(caveatCodes(r)).not.toContain('residual-runs');
    expect(caveatCodes(r)).not.toContain('lack-of-fit');
    for (const m of r.models) expect(Number.isNaN(m.aicc)).toBe(false);
  });

  it('no activity, a constant column and negative rates are stated plainly, not ranked', async () => {
    await expect(analysed('all-zero')).rejects.toThrow(/^no activity: every rate is zero/);
    await expect(analysed('all-equal')).rejects.toThrow(/^every rate equals 12\.5: the rates do not change/);
    await expect(analysed('all-negative')).rejects.toThrow(/zero or negative .*reverse the sign/);
    await expect(analysed('all-zero')).rejects.toBeInstanceOf(AnalysisError);
  });

  it(`fewer than ${MINIMUM_ANALYSIS_POINTS} points are refused with the reason (every model must be rankable)`, async () => {
    // AICc = -2 ln L + 2k + 2k(k + 1)/(n - k - 1) is finite for n > k + 1; mixed has k = 4 + 1
    expect(MINIMUM_ANALYSIS_POINTS).toBe(4 + 1 + 2);
    await expect(analysed('five-points')).rejects.toBeInstanceOf(AnalysisError);
    await expect(analysed('five-points')).rejects.toThrow(/^only 5 usable points; ranking all five models by AICc needs at least 7/);
  });

  it('an activator is named as such, without the "test higher [I]" advice', async () => {
    const r = await analysed('activator');
    expect(r.verdict.outcome).toBe('no-inhibition');
    expect(r.verdict.headline).toEqual({ code: 'no-inhibition', activation: true });
    expect(r.verdict.suggestions.map((a) => a.code)).not.toContain('test-higher-inhibitor');
    expect(firstAdvice(r)).toBe('activation');
    const a = caveatsOf(r).find((c) => c.code === 'activation');
    expect(a?.code === 'activation' && a.levelsAbove / a.levels).toBeGreaterThanOrEqual(0.75);
    expect(a?.code === 'activation' && a.medianRatio).toBeGreaterThan(1);
  });

  it('substrate inhibition is named and blocks a firm call', async () => {
    const r = await analysed('substrate-inhibition');
    expect(r.verdict.decisive).toBe(false);
    const lead = leadingCaveat(r);
    expect(lead?.code).toBe('substrate-inhibition');
    expect(lead?.code === 'substrate-inhibition' && lead.top.mean).toBeLessThan(lead?.code === 'substrate-inhibition' ? lead.peak.mean : 0);
    expect(firstAdvice(r)).toBe('substrate-inhibition');
  });

  it('complete inhibition at the lowest [I] asks for lower [I] first', async () => {
    const r = await analysed('saturating-inhibitor');
    expect(r.verdict.decisive).toBe(false);
    const lead = leadingCaveat(r);
    expect(lead?.code).toBe('inhibitor-saturating');
    expect(lead?.code === 'inhibitor-saturating' && lead.activityPercent).toBeLessThan(100 * SATURATED_ACTIVITY);
    expect(firstAdvice(r)).toBe('inhibitor-saturating');
  });

  it('a block of rows pasted twice is noticed, with its lines, and blocks a firm call', async () => {
    const r = await analysed('pasted-block');
    const w = r.input.warnings.find((x) => x.code === 'repeated-block');
    expect(w?.message).toMatch(/^lines 82-89 repeat lines 32-39 exactly/);
    expect(r.verdict.decisive).toBe(false);
    expect(leadingCaveat(r)?.code).toBe('repeated-block');
  });

  it(`an [I] column in M holding uM values gets a plausibility note (above ${IMPLAUSIBLE_MOLAR} M)`, async () => {
    const r = await analysed('inhibitor-unit-slip');
    const c = caveatsOf(r).find((x) => x.code === 'implausible-concentration');
    expect(c?.code === 'implausible-concentration' && c.limitMolar).toBe(IMPLAUSIBLE_MOLAR);
    const flagged = c?.code === 'implausible-concentration' ? c.flagged : [];
    expect(flagged.map((f) => f.label)).toEqual(['highest [I]', 'Ki']);
    expect(flagged[0]).toMatchObject({ value: 8, unit: 'M', molar: 8 });
    expect(flagged[1].molar).toBeGreaterThan(IMPLAUSIBLE_MOLAR);
    expect(firstAdvice(r)).toBe('implausible-concentration');
  });

  it('one [S] level: no Wald interval where the profile is open, and no firm call', async () => {
    const r = await analysed('single-substrate');
    expect(r.verdict.decisive).toBe(false);
    let open = 0;
    for (const m of r.models)
      for (const e of m.estimates)
        if (e.profile && (e.profile[0] === null || e.profile[1] === null)) {
          open++;
          expect(e.wald).toBeNull();
        }
    // one [S] level leaves Km unbounded: there are open ends to check
    expect(open).toBeGreaterThan(0);
  });
});

describe('constants the data cannot determine', () => {
  it('a constant running to zero along a ridge is "not determined", never a precise number', async () => {
    const r = await analysed('substrate-far-below-km');
    const unc = r.models.find((m) => m.mechanism === 'uncompetitive')!;
    const kiu = unc.estimates.find((e) => e.name === 'Kiu')!;
    expect(kiu.detected).toBe(false);
    expect(kiu.value).toBeNull();
    expect(kiu.below).toBeCloseTo(0.01, 12); // lowest non-zero [I] (1 uM) / DETECTION_FACTOR
    expect(kiu.note).toMatch(/^Kiu < 0\.01: not determined/);
    const vmax = unc.estimates.find((e) => e.name === 'Vmax')!;
    expect(vmax.se).toBeNull();
    expect(vmax.wald).toBeNull();
    expect(vmax.note).toMatch(/Vmax is not determined: the fit runs along a ridge/);
    expect(r.verdict.decisive).toBe(false);
    // the design shortfall behind the ridge leads the verdict
    expect(leadingCaveat(r)?.code).toBe('substrate-below-2km');
  });
  it('Wald intervals of positive constants are formed on the log scale and stay positive', async () => {
    const r = await analysed('clean-competitive');
    const ki = r.models.find((m) => m.mechanism === 'competitive')!.estimates.find((e) => e.name === 'Ki')!;
    const [lo, hi] = ki.wald!;
    expect(lo).toBeGreaterThan(0);
    // symmetric about the estimate on the log scale: value^2 = lo * hi
    expect(Math.log(lo) + Math.log(hi)).toBeCloseTo(2 * Math.log(ki.value!), 12);
  });
});

describe('tables built in memory get the reader\'s refusals too', () => {
  const grid = (rate: (k: number) => number) =>
    Array.from({ length: 12 }, (_, k) => ({ line: k + 2, substrate: [1, 3, 10, 30][k % 4], inhibitor: [0, 1, 4][Math.floor(k / 4)], rate: rate(k) }));
  it('a rate outside 1e-150..1e150 is refused with its line', () => {
    expect(() => analyzeTable(tableFromPoints(grid((k) => (k === 5 ? 5e-324 : 0)))))
      .toThrow(/^line 7: rate 5e-324 is outside the range that can be fitted reliably/);
  });
  it('fewer than 3 positive rates: no activity to fit', () => {
    expect(() => analyzeTable(tableFromPoints(grid((k) => (k < 2 ? 10 : 0))))).toThrow(/^no activity to fit: only 2 of 12 rates are positive/);
  });
});
