/**
 * Stages return new records (docs/decisions/coded-findings.md): the intervals stage leaves the
 * ranked models it is given as they were and returns completed copies; the verdict of an analysis
 * is built once, with the error-model choice leading its reasons. Data simulated (invented truth).
 */
import { describe, expect, it } from 'vitest';
import { rankModels, analyzeTable } from '../../src/analysis/analyze-table.js';
import { addIntervals } from '../../src/analysis/stage-intervals.js';
import { fitAllMechanisms } from '../../src/fit/fit-all-mechanisms.js';
import { fitDataFromTable } from '../../src/fit/fit-data.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';

const points = simulateRates({
  mechanism: 'competitive',
  params: { Vmax: 100, Km: 20, Ki: 5 },
  substrate: [5, 10, 20, 40, 80, 160],
  inhibitor: [0, 2.5, 5, 10, 20],
  replicates: 2,
  noise: 'proportional',
  noiseLevel: 0.04,
  seed: 1402,
});
const table = tableFromPoints(points, { units: { substrate: 'uM', inhibitor: 'uM', rate: 'nM/s' } });

describe('stages return new records', () => {
  it('addIntervals completes copies and leaves the ranked models untouched', () => {
    const data = fitDataFromTable(table);
    const ranked = rankModels(fitAllMechanisms(data, 'proportional'), data, 0.95);
    const before = JSON.stringify(ranked.map((m) => ({ estimates: m.estimates, profiles: m.profiles, derived: m.derived, jointRegion: m.jointRegion })));
    const { models } = addIntervals(ranked, data, table.units, { level: 0.95 });
    expect(JSON.stringify(ranked.map((m) => ({ estimates: m.estimates, profiles: m.profiles, derived: m.derived, jointRegion: m.jointRegion })))).toBe(before);
    expect(models).not.toBe(ranked);
    const ki = models.find((m) => m.mechanism === 'competitive')!.estimates.find((e) => e.name === 'Ki')!;
    expect(ki.profile?.[0]).toBeLessThan(5 * 1.5);
    expect(ki.profile?.[1]).toBeGreaterThan(5 / 1.5);
    expect(ranked.find((m) => m.mechanism === 'competitive')!.estimates.find((e) => e.name === 'Ki')!.profile).toBeUndefined();
    expect(models.every((m, k) => m !== ranked[k] && m.fit === ranked[k].fit)).toBe(true);
    expect(models.find((m) => m.mechanism === 'competitive')!.derived?.length).toBeGreaterThan(0);
  });
  it('the verdict of an analysis has the error-model choice first, from the one build', () => {
    const r = analyzeTable(table, { errorModel: 'auto', profile: false });
    expect(r.verdict.reasons[0]).toMatchObject({ code: 'error-model-chosen', chosen: r.errorModel });
    expect(r.verdict.reasons.filter((x) => x.code === 'error-model-chosen')).toHaveLength(1);
    const given = analyzeTable(table, { errorModel: 'proportional', profile: false });
    expect(given.verdict.reasons.map((x) => x.code)).not.toContain('error-model-chosen');
  });
});
