/** The follow-up plan: prior, mechanisms and noise from an earlier analysis; measured wells kept. Invented data. */
import { describe, expect, it } from 'vitest';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { analysisJson } from '../../src/report/results-json.js';
import { followUpBasis, summaryFromJson, summaryFromResult } from '../../src/plan/follow-up.js';
import { planExperiment } from '../../src/plan/plan-experiment.js';
import { planJson } from '../../src/plan/plan-json.js';
import { criterionTerms, meanLogDs } from '../../src/plan/design-search.js';

// a short [S] range (highest [S] below Km): the analysis cannot settle the mechanism
const points = simulateRates({
  mechanism: 'noncompetitive',
  params: { Vmax: 1, Km: 40, Ki: 0.5 },
  substrate: [3, 6, 12, 20],
  inhibitor: [0, 0.25, 0.5, 1],
  replicates: 2,
  noise: 'proportional',
  noiseLevel: 0.05,
  seed: 21,
});
const result = analyzeTable(tableFromPoints(points, { units: { substrate: 'uM', inhibitor: 'uM' } }), { errorModel: 'proportional' });

describe('follow-up basis', () => {
  it('the mechanisms in play are the verdict candidates; the measured wells are counted', () => {
    expect(result.verdict.decisive).toBe(false);
    const basis = followUpBasis(summaryFromResult(result));
    expect(basis.mechanisms).toEqual(result.verdict.candidates.filter((m) => m !== 'none'));
    expect(basis.fixedPoints.reduce((s, p) => s + p.replicates, 0)).toBe(32);
    expect(basis.noise.model).toBe('proportional');
    const lead = result.models.find((m) => m.mechanism === basis.mechanisms[0])!;
    expect(basis.noise.level).toBeCloseTo(Math.sqrt(lead.residualVariance), 12);
    expect(basis.prior.km[0]).toBeLessThan(basis.prior.km[1]);
  });
  it('the JSON of the same analysis gives the same prior and mechanisms, without measured wells', () => {
    const fromResult = followUpBasis(summaryFromResult(result));
    const fromJson = followUpBasis(summaryFromJson(JSON.parse(JSON.stringify(analysisJson(result))), 'results.json'));
    expect(fromJson.mechanisms).toEqual(fromResult.mechanisms);
    expect(fromJson.prior.km[0]).toBeCloseTo(fromResult.prior.km[0], 10);
    expect(fromJson.prior.ki![1]).toBeCloseTo(fromResult.prior.ki![1], 10);
    expect(fromJson.fixedPoints).toEqual([]);
    expect(fromJson.notes.join(' ')).toMatch(/new plate/);
  });
  it('refuses an analysis without inhibition', () => {
    const none = simulateRates({ mechanism: 'none', params: { Vmax: 1, Km: 10 }, substrate: [2, 5, 10, 20, 50], inhibitor: [0, 1, 2], replicates: 2, noise: 'proportional', noiseLevel: 0.03, seed: 2 });
    const r = analyzeTable(tableFromPoints(none), { errorModel: 'proportional' });
    expect(r.verdict.outcome).toBe('no-inhibition');
    expect(() => followUpBasis(summaryFromResult(r))).toThrow(/no inhibition/);
  });
});

describe('planning the wells to add', () => {
  const basis = followUpBasis(summaryFromResult(result));
  const request = {
    prior: basis.prior,
    mechanisms: basis.mechanisms,
    noise: basis.noise,
    fixedPoints: basis.fixedPoints,
    constraints: { maxSubstrate: 400, maxInhibitor: 5, wells: 32, replicates: 2, plate: 96 as const, dilution: { kind: 'free' as const } },
    units: { substrate: 'uM' as const, inhibitor: 'uM' as const },
    simulations: 3,
    seed: 5,
    notes: basis.notes,
  };
  const plan = planExperiment(request);
  it('the plate map lists the added wells only; the JSON counts the measured ones', () => {
    expect(plan.recommended.wellCount).toBe(32);
    expect(planJson(plan).settings.measuredWells).toBe(32);
    expect(plan.notes.join(' ')).toMatch(/already measured are part of every candidate/);
  });
  it('the measured wells add to the information of every candidate', () => {
    const terms = criterionTerms(request);
    const added = plan.recommended.points;
    expect(plan.recommended.meanLogDs).toBeCloseTo(meanLogDs([...basis.fixedPoints, ...added], terms, request.noise), 10);
    expect(plan.recommended.meanLogDs).toBeGreaterThan(meanLogDs(added, terms, request.noise));
  });
});
