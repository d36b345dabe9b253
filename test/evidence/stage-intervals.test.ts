/**
 * The intervals stage through the analysis: open profile ends for an arm the data do not detect
 * (shown as "Kiu > x" and written as null in JSON), the joint (Ki, Kiu) region, derived quantities
 * (pKi as the mapped Ki profile, IC50 from the Cheng-Prusoff form) and the bootstrap summary.
 * Data simulated (invented truth).
 */
import { describe, expect, it } from 'vitest';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import type { AnalysisResult } from '../../src/analysis/types.js';
import type { RateTable } from '../../src/input/types.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import type { Mechanism, ParamName } from '../../src/models/types.js';
import { analysisJson } from '../../src/report/results-json.js';
import { profileText, textSummary } from '../../src/report/text-summary.js';
import { ic50AtSubstrate } from '../../src/evidence/constants/cheng-prusoff.js';
import { profileSupport } from '../../src/evidence/intervals/profile-support.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';

function table(mechanism: Mechanism, params: Partial<Record<ParamName, number>>, seed: number, inhibitorUnit: 'uM' | null = 'uM'): RateTable {
  const points = simulateRates({
    mechanism,
    params,
    substrate: [5, 10, 20, 40, 80, 160],
    inhibitor: [0, 2.5, 5, 10, 20],
    replicates: 2,
    noise: 'constant',
    noiseLevel: 0.2,
    seed,
  });
  return tableFromPoints(points, { units: { substrate: 'uM', inhibitor: inhibitorUnit, rate: 'nM/s' } });
}

const model = (r: AnalysisResult, m: Mechanism) => r.models.find((x) => x.mechanism === m)!;

describe('intervals stage', () => {
  const competitiveData = analyzeTable(table('competitive', { Vmax: 10, Km: 20, Ki: 4 }, 3), { atSubstrate: 20 });
  it('an undetected Kiu in the mixed fit gets a lower profile end and an open upper end', () => {
    const kiu = model(competitiveData, 'mixed').estimates.find((e) => e.name === 'Kiu')!;
    if (kiu.detected) throw new Error('test data should leave Kiu undetected');
    expect(kiu.profile![0]).toBeGreaterThan(0);
    expect(kiu.profile![1]).toBeNull();
    const json = analysisJson(competitiveData) as any;
    const mixedJson = json.models.find((m: any) => m.mechanism === 'mixed');
    expect(mixedJson.params.Kiu.profile95[1]).toBeNull();
    expect(profileText('Kiu', kiu.profile!, 'uM', '95%')).toBe(`profile 95%: Kiu > ${Number(kiu.profile![0]!.toPrecision(4))} uM`);
    expect(model(competitiveData, 'mixed').jointRegion!.open).toBe(true);
  });
  it('pKi is the mapped Ki profile, and the IC50 the Cheng-Prusoff value', () => {
    const comp = model(competitiveData, 'competitive');
    const ki = comp.estimates.find((e) => e.name === 'Ki')!;
    const pki = comp.derived!.find((d) => d.name === 'pKi')!;
    expect(pki.value).toBeCloseTo(6 - Math.log10(ki.value!), 12);
    expect(pki.profile![0]).toBeCloseTo(6 - Math.log10(ki.profile![1]!), 12);
    expect(pki.profile![1]).toBeCloseTo(6 - Math.log10(ki.profile![0]!), 12);
    expect(pki.se).toBeCloseTo(ki.se! / ki.value! / Math.LN10, 6);
    const ic50 = comp.derived!.find((d) => d.name === 'IC50')!;
    expect(ic50.value).toBeCloseTo(ic50AtSubstrate('competitive', comp.fit.model.params, comp.fit.params, 20), 10);
    expect(ic50.wald![0]).toBeLessThan(ic50.value!);
    const apparent = comp.derived!.filter((d) => d.name === 'Km_app');
    expect(apparent.map((d) => d.inhibitor)).toEqual([2.5, 5, 10, 20]);
  });
  it('without an [I] unit, pKi is skipped with a note', () => {
    const r = analyzeTable(table('competitive', { Vmax: 10, Km: 20, Ki: 4 }, 3, null));
    const pki = model(r, 'competitive').derived!.find((d) => d.name === 'pKi')!;
    expect(pki.value).toBeNull();
    expect(pki.note).toMatch(/unit/);
  });
  it('mixed data: a closed joint region whose projection contains the one-parameter profile intervals', () => {
    const r = analyzeTable(table('mixed', { Vmax: 10, Km: 20, Ki: 4, Kiu: 12 }, 8));
    const mixed = model(r, 'mixed');
    const region = mixed.jointRegion!;
    expect(region.open).toBe(false);
    const ki = mixed.estimates.find((e) => e.name === 'Ki')!.profile!;
    const kiu = mixed.estimates.find((e) => e.name === 'Kiu')!.profile!;
    expect(Math.min(...region.ki)).toBeLessThan(ki[0]!);
    expect(Math.max(...region.ki)).toBeGreaterThan(ki[1]!);
    expect(Math.min(...region.kiu)).toBeLessThan(kiu[0]!);
    expect(Math.max(...region.kiu)).toBeGreaterThan(kiu[1]!);
    const box = profileSupport(r.data, 'Ki');
    for (const x of region.ki) expect(Math.log(x)).toBeLessThan(box.high);
  });
  it('with a bootstrap: selection frequencies in JSON and the text, intervals on the estimates', () => {
    const r = analyzeTable(table('mixed', { Vmax: 10, Km: 20, Ki: 4, Kiu: 12 }, 8), { bootstrap: { resamples: 40, seed: 2 } });
    expect(r.bootstrap!.resamples).toBe(40);
    const json = analysisJson(r) as any;
    const total = Object.values(json.bootstrap.selectionFrequency as Record<string, number>).reduce((a, b) => a + b, 0);
    expect(total).toBeCloseTo(1, 12);
    expect(json.models.find((m: any) => m.mechanism === 'mixed').params.Ki.bootBca95).toHaveLength(2);
    expect(textSummary(r)).toMatch(/bootstrap \(40 resamples, seed 2/);
  });
  it('--no-profile leaves the profile fields out', () => {
    const r = analyzeTable(table('competitive', { Vmax: 10, Km: 20, Ki: 4 }, 3), { profile: false });
    expect(r.models.every((m) => m.estimates.every((e) => e.profile === undefined) && m.profiles === undefined)).toBe(true);
  });
});
