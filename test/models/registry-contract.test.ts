/**
 * The registry contract: a model described only by its registry entry (parameters with their
 * dimension, rate, analytic log-gradient, the smaller model it contains and by which limit) goes
 * end to end (fit, profile intervals, verdict, JSON report, batch row) without any other source
 * file knowing it. The toy is a "partial uncompetitive" law, invented for this test:
 *   v = Vmax·S·(1 + beta·I/Kiu) / (Km + S·(1 + I/Kiu)),  beta -> 0 gives classic uncompetitive.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MechanismModel } from '../../src/models/types.js';
import { registerModel } from '../../src/models/registry.js';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { analysisJson } from '../../src/report/results-json.js';
import { summarizeAnalysis } from '../../src/batch/summarize.js';
import { summaryCsv } from '../../src/batch/summary-files.js';
import { simulateModelRates } from '../../src/simulate/simulate-model.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { wordVerdict } from '../../src/wording/verdict-words.js';

const toy: MechanismModel = {
  mechanism: 'uncompetitive',
  family: 'partial',
  id: 'toy partial uncompetitive',
  label: 'toy partial uncompetitive',
  equation: 'v = Vmax·S·(1 + beta·I/Kiu) / (Km + S·(1 + I/Kiu))',
  params: ['Vmax', 'Km', 'Kiu', 'beta'],
  specs: [
    { name: 'Vmax', dimension: 'rate' },
    { name: 'Km', dimension: 'substrate' },
    { name: 'Kiu', dimension: 'inhibitor' },
    { name: 'beta', dimension: 'dimensionless' },
  ],
  contains: [{ model: 'uncompetitive', rules: [{ kind: 'limit', param: 'beta', to: 'zero' }] }],
  rate(p, s, i) {
    return (p[0] * s * (1 + (p[3] * i) / p[2])) / (p[1] + s * (1 + i / p[2]));
  },
  gradLog(p, s, i, out, o) {
    const n = 1 + (p[3] * i) / p[2];
    const d = p[1] + s * (1 + i / p[2]);
    const v = (p[0] * s * n) / d;
    out[o] = v;
    out[o + 1] = (-v * p[1]) / d;
    out[o + 2] = (-p[0] * s * ((p[3] * i) / p[2])) / d + (v * s * i) / (p[2] * d);
    out[o + 3] = (p[0] * s * ((p[3] * i) / p[2])) / d;
  },
  starts: (data) => {
    let vmax = 0;
    for (const x of data.v) vmax = Math.max(vmax, x);
    return [[1.2 * vmax, 10, 50, 0.3]];
  },
};

let unregister: () => void;
beforeAll(() => {
  unregister = registerModel(toy);
});
afterAll(() => unregister());

describe('a model registered from outside goes end to end', () => {
  const points = simulateModelRates({
    model: toy,
    params: { Vmax: 100, Km: 10, Kiu: 40, beta: 0.3 },
    substrate: [2, 4, 7, 10, 15, 25, 50, 100],
    inhibitor: [0, 20, 40, 80, 160, 320, 640],
    replicates: 3,
    noise: 'proportional',
    noiseLevel: 0.03,
    seed: 4242,
  });
  const table = tableFromPoints(points, { source: 'toy.csv', units: { substrate: 'uM', inhibitor: 'nM', rate: 'nM/s' } });

  it('is fitted, profiled, called, reported and summarised', () => {
    const result = analyzeTable(table, { errorModel: 'proportional', partial: true });
    const m = result.familyModels!.find((x) => x.modelId === 'toy partial uncompetitive')!;
    expect(m.converged).toBe(true);
    const kiu = m.estimates.find((e) => e.name === 'Kiu')!;
    const beta = m.estimates.find((e) => e.name === 'beta')!;
    // profile intervals of every parameter, each containing the truth
    expect(kiu.profile![0]!).toBeLessThan(40);
    expect(kiu.profile![1]!).toBeGreaterThan(40);
    expect(beta.profile![0]!).toBeLessThan(0.3);
    expect(beta.profile![1]!).toBeGreaterThan(0.3);
    // verdict
    expect(result.family.family).toBe('partial');
    expect(result.family.model).toBe('toy partial uncompetitive');
    expect(result.verdict.mechanism).toBe('uncompetitive');
    expect(wordVerdict(result.verdict).headline).toContain('partial uncompetitive');
    // JSON report
    const json = analysisJson(result) as any;
    const entry = json.models.find((x: any) => x.model === 'toy partial uncompetitive');
    expect(entry.family).toBe('partial');
    expect(Object.keys(entry.params)).toEqual(['Vmax', 'Km', 'Kiu', 'beta']);
    expect(entry.params.beta.profile95).toHaveLength(2);
    expect(json.verdict.family).toBe('partial');
    // batch row
    const row = summarizeAnalysis(result);
    expect(row.family).toBe('partial');
    expect(row.beta!.value).toBeCloseTo(beta.value!, 12);
    expect(row.Kiu!.interval).toBe('profile');
    const csv = summaryCsv([row], 0.95).split('\n');
    const header = csv[0].split(',');
    expect(csv[1].split(',')[header.indexOf('family')]).toBe('partial');
  });
});
