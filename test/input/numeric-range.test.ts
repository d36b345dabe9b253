/**
 * The numeric range of real exports (issue 16, item 5). Fixtures: one simulated competitive table
 * (INVENTED data from the project's seeded simulator) written at ordinary scale and with its
 * concentrations, rates or sd multiplied by powers of ten. Expected result: at the documented
 * limits (1e-150, 1e150) the analysis gives the same call and the same constants, scaled (a
 * change of unit changes no result); beyond them the table is refused while it is read
 * (InputError, exit 2), naming the line and the value, before any fit runs.
 */
import { describe, expect, it } from 'vitest';
import { parseRateText, InputError } from '../../src/input/index.js';
import { LARGEST_MAGNITUDE, SMALLEST_MAGNITUDE } from '../../src/input/table-checks.js';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';

const points = simulateRates({
  mechanism: 'competitive', params: { Vmax: 100, Km: 10, Ki: 1 },
  substrate: [2, 4, 8, 15, 30, 60, 120, 240], inhibitor: [0, 0.5, 1, 2, 4],
  replicates: 2, noise: 'proportional', noiseLevel: 0.05, seed: 7,
});

/** The table as CSV text, with [S] and [I] times `conc`, rates times `rate`, and sd = 5% of the rate times `sd` (when given). */
function scaledCsv(conc: number, rate: number, sd?: number): string {
  const lines = [`substrate,inhibitor,rate${sd !== undefined ? ',sd' : ''}`];
  for (const p of points) {
    const v = p.rate * rate;
    lines.push([p.substrate * conc, p.inhibitor * conc, v, ...(sd !== undefined ? [Math.abs(v) * 0.05 * sd] : [])].join(','));
  }
  return lines.join('\n') + '\n';
}

function refusal(text: string): InputError {
  try {
    parseRateText(text, { source: 'export.csv' });
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error('read without an error');
}

function summary(text: string, errorModel: 'constant' | 'column' = 'constant') {
  const [table] = parseRateText(text, { source: 'export.csv' });
  const r = analyzeTable(table, { errorModel, profile: false });
  const top = r.models.find((m) => m.mechanism === r.verdict.mechanism)!;
  const value = (name: string) => top.estimates.find((e) => e.name === name)?.value ?? NaN;
  return { outcome: r.verdict.outcome, mechanism: r.verdict.mechanism, Km: value('Km'), Ki: value('Ki'), Vmax: value('Vmax') };
}

describe('values at the documented limits are fitted like ordinary ones', () => {
  const base = summary(scaledCsv(1, 1));
  const cases: Array<[string, number, number, 'constant' | 'column', number | undefined]> = [
    // the smallest [I] (0.5) lands on SMALLEST_MAGNITUDE, the largest rate (about 100) near LARGEST_MAGNITUDE
    ['concentrations x 2e-150, rates x 5e147', 2 * SMALLEST_MAGNITUDE, LARGEST_MAGNITUDE / 200, 'constant', undefined],
    // the largest [S] (240) lands just below LARGEST_MAGNITUDE, the smallest rate (about 4) well above SMALLEST_MAGNITUDE
    ['concentrations x 4e147, rates x 1e-148', 4e147, 1e-148, 'constant', undefined],
    ['rates x 1e-140 with sd weights', 1, 1e-140, 'column', 1],
  ];
  for (const [name, conc, rate, model, sd] of cases) {
    it(name, () => {
      const ref = model === 'column' ? summary(scaledCsv(1, 1, 1), 'column') : base;
      const s = summary(scaledCsv(conc, rate, sd), model);
      expect([s.outcome, s.mechanism]).toEqual([ref.outcome, ref.mechanism]);
      expect(s.Km / conc / ref.Km).toBeCloseTo(1, 5);
      expect(s.Ki / conc / ref.Ki).toBeCloseTo(1, 5);
      expect(s.Vmax / rate / ref.Vmax).toBeCloseTo(1, 5);
    });
  }
});

describe('values beyond them are refused while reading, naming line and value', () => {
  it('rates near 1e300', () => {
    const e = refusal(scaledCsv(1, 1e300));
    expect([e.line, e.column]).toEqual([2, 3]);
    expect(e.message).toMatch(/^export\.csv:2:3: rate [\d.]+e\+30\d is outside the range that can be fitted reliably \(non-zero magnitudes from 1e-150 to 1e\+150\); rescale the rate column/);
  });
  it('concentrations near 1e-300, with the header unit in the cure', () => {
    const text = scaledCsv(1e-300, 1).replace('substrate,inhibitor', 'substrate (mM),inhibitor (mM)');
    const e = refusal(text);
    expect(e.message).toMatch(/^export\.csv:2:1: substrate [\d.]+e-30\d is outside the range .*; give the substrate in another unit \(the header says mM\)$/);
  });
  it('an sd of 1e-300', () => {
    const text = scaledCsv(1, 1, 1).replace(/\n([^\n]*),([^,\n]*)\n/, '\n$1,1e-300\n');
    expect(refusal(text).message).toMatch(/^export\.csv:2: sd 1e-300 is outside the range/);
  });
  it('an sd far from its rate (the fit squares rate/sd)', () => {
    expect(refusal(scaledCsv(1, 1e100, 1e-160)).message).toMatch(/^export\.csv:2: sd .* times its rate .*; sd weights need sd\/rate within 1e-150 to 1e\+150/);
  });
  it('zero is not out of range ([I] = 0 controls, zero rates)', () => {
    expect(() => parseRateText(scaledCsv(1, 1).replace(/\n(2,0,)[^\n]*/, '\n$10'), { source: 'export.csv' })).not.toThrow();
  });
});
