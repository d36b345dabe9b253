/** The whole plan on a small invented scenario: contract, budget, seeding, and the real pipeline behind the predictions. */
import { describe, expect, it } from 'vitest';
import { chooseRecommendation, planExperiment, type PlanRequest } from '../../src/plan/plan-experiment.js';
import { planJson } from '../../src/plan/plan-json.js';
import { planText } from '../../src/plan/plan-text.js';
import { drawTruth, monteCarloAnalysisOptions, simulateDesign, simulationSeed } from '../../src/plan/monte-carlo.js';
import { seededRandom } from '../../src/simulate/random.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { wellCount } from '../../src/plan/design-types.js';

const request = (simulations: number, seed = 3): PlanRequest => ({
  prior: { km: [10, 30], ki: [0.1, 0.4], vmax: 1 },
  mechanisms: ['competitive', 'mixed'],
  noise: { model: 'proportional', level: 0.08 },
  constraints: { maxSubstrate: 300, maxInhibitor: 5, wells: 48, replicates: 2, plate: 96, dilution: { kind: 'free' } },
  units: { substrate: 'uM', inhibitor: 'uM' },
  simulations,
  seed,
});

describe('planExperiment', () => {
  const plan = planExperiment(request(4));

  it('the JSON has the contract: recommended wells with units, candidates with predicted shares per mechanism', () => {
    const json = planJson(plan);
    expect(json.recommended.units).toEqual({ substrate: 'uM', inhibitor: 'uM' });
    expect(json.recommended.wells.reduce((s, w) => s + w.replicates, 0)).toBe(48);
    const roles = json.candidates.map((c) => c.role);
    expect(roles).toEqual(expect.arrayContaining(['recommended', 'common-grid', 'single-inhibitor']));
    for (const c of json.candidates.filter((x) => x.role !== 'ds-optimum')) {
      expect(c.wellCount).toBe(c.wells.reduce((s, w) => s + w.replicates, 0));
      for (const m of ['competitive', 'mixed']) {
        const p = c.predicted![m];
        expect(p.simulations).toBe(4);
        expect(p.decisiveCorrect + p.decisiveWrong).toBeLessThanOrEqual(1);
        expect(p.decisiveCorrect * 4).toBe(Math.round(p.decisiveCorrect * 4));
      }
      expect(c.predicted!.competitive.kiuFoldWidth).toBeNull();
    }
  });
  it('the recommended design uses the whole budget, within the constraints, with 5 [S] and 3 non-zero [I] levels at least', () => {
    const r = plan.recommended;
    expect(r.wellCount).toBe(48);
    expect(Math.max(...r.points.map((p) => p.substrate))).toBeLessThanOrEqual(300);
    expect(Math.max(...r.points.map((p) => p.inhibitor))).toBeLessThanOrEqual(5);
    expect(new Set(r.points.map((p) => p.substrate)).size).toBeGreaterThanOrEqual(5);
    expect(new Set(r.points.filter((p) => p.inhibitor > 0).map((p) => p.inhibitor)).size).toBeGreaterThanOrEqual(3);
    expect(r.points.every((p) => p.replicates % 2 === 0)).toBe(true);
  });
  it('the common grid spans Km/5..5 Km and IC50/3..3 IC50 plus zero; the single-[I] design has one level at 2 x IC50', () => {
    const common = plan.candidates.find((c) => c.role === 'common-grid')!;
    const s = common.points.map((p) => p.substrate);
    const km = Math.sqrt(10 * 30);
    const ic50 = Math.sqrt(0.1 * 0.4);
    expect(Math.min(...s)).toBeCloseTo(km / 5, 2);
    expect(Math.max(...s)).toBeCloseTo(5 * km, 1);
    const i = [...new Set(common.points.map((p) => p.inhibitor))].sort((a, b) => a - b);
    expect(i[0]).toBe(0);
    expect(i[1]).toBeCloseTo(ic50 / 3, 3);
    expect(i[i.length - 1]).toBeCloseTo(3 * ic50, 3);
    const single = plan.candidates.find((c) => c.role === 'single-inhibitor')!;
    expect([...new Set(single.points.map((p) => p.inhibitor))].sort((a, b) => a - b)).toEqual([0, Number((2 * ic50).toPrecision(4))]);
    expect(single.wellCount).toBe(48);
  });
  it('the same seed gives the same plan; the shares come from analyzeTable on the simulated tables', () => {
    expect(planJson(planExperiment(request(4)))).toEqual(planJson(plan));
    const design = { name: 'recommended', description: '', points: plan.recommended.points };
    let correct = 0;
    for (let k = 0; k < 4; k++) {
      const rng = seededRandom(simulationSeed(3, 'mixed', k));
      const truth = drawTruth('mixed', request(4).prior, k, rng);
      const table = tableFromPoints(simulateDesign(design, truth, request(4).noise, rng), { units: { substrate: 'uM', inhibitor: 'uM' } });
      const v = analyzeTable(table, monteCarloAnalysisOptions(request(4).noise)).verdict;
      if (v.decisive && v.mechanism === 'mixed') correct++;
    }
    expect(plan.recommended.predicted!.mixed!.decisiveCorrect).toBe(correct / 4);
    expect(monteCarloAnalysisOptions({ model: 'proportional', level: 0.05 })).toEqual({ errorModel: 'proportional', level: 0.95, detail: 'summary' });
  });
  it('without simulation the plan still ranks by information, predicted is null, and the text says so', () => {
    const info = planExperiment(request(0));
    expect(info.candidates.every((c) => c.predicted === null)).toBe(true);
    expect(planJson(info).candidates[0].predicted).toBeNull();
    expect(planText(info)).toMatch(/expected information only/);
    expect(wellCount({ name: '', description: '', points: info.recommended.points })).toBe(48);
  });
  it('[E] is recorded and said to be unused; the text lists the assumptions', () => {
    const withE = planExperiment({ ...request(0), enzyme: 0.005 });
    expect(withE.notes.join(' ')).toMatch(/\[E\] was given but is not yet used/);
    expect(planText(withE)).toMatch(/The plan rests on these assumptions/);
  });
  it('refuses a budget too small for the mixed model', () => {
    expect(() => planExperiment({ ...request(0), constraints: { ...request(0).constraints, wells: 10 } })).toThrow(/fewer than 6 design points/);
  });
});

describe('dilution schemes in a plan', () => {
  const base = request(0);
  it('serial dilution: every candidate level is the top level over a power of the fold', () => {
    const plan = planExperiment({ ...base, constraints: { ...base.constraints, dilution: { kind: 'serial', fold: 3 } } });
    for (const c of plan.candidates.filter((x) => x.role === 'recommended' || x.role === 'runner-up')) {
      for (const key of ['substrate', 'inhibitor'] as const) {
        const levels = [...new Set(c.points.map((p) => p[key]))].filter((x) => x > 0).sort((a, b) => a - b);
        for (let k = 1; k < levels.length; k++) expect(Math.log(levels[k] / levels[k - 1]) / Math.log(3)).toBeCloseTo(1, 3);
      }
    }
  });
  it('a free list: the levels come from the lists only', () => {
    const substrate = [1, 2, 4, 8, 16, 32, 64, 128, 256];
    const inhibitor = [0.05, 0.1, 0.2, 0.4, 0.8, 1.6, 3.2];
    const plan = planExperiment({ ...base, constraints: { ...base.constraints, dilution: { kind: 'list', substrate, inhibitor } } });
    const r = plan.recommended.points;
    expect(r.every((p) => substrate.includes(p.substrate))).toBe(true);
    expect(r.every((p) => p.inhibitor === 0 || inhibitor.includes(p.inhibitor))).toBe(true);
  });
});

describe('choosing the recommendation from the check', () => {
  const p = (correct: number, wrong: number, fold: number | null) => ({
    competitive: { simulations: 50, decisiveCorrect: correct, decisiveWrong: wrong, kiFoldWidth: fold, kiuFoldWidth: null, calls: {} },
  });
  it('a clearly more decisive design wins whatever its intervals', () => {
    expect(chooseRecommendation([p(0.8, 0, 1.1), p(0.95, 0, 1.5)])).toBe(1);
  });
  it('within the tie band the narrower intervals win; wrong calls count against', () => {
    expect(chooseRecommendation([p(0.99, 0, 1.46), p(0.98, 0, 1.15)])).toBe(1);
    expect(chooseRecommendation([p(0.99, 0.05, 1.1), p(0.98, 0, 1.3)])).toBe(1);
    expect(chooseRecommendation([p(0.98, 0, 1.2), p(0.98, 0, 1.2)])).toBe(0);
    expect(chooseRecommendation([p(0.98, 0, null), p(0.98, 0, 3)])).toBe(1);
  });
});
