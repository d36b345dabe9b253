/**
 * The tight-binding and partial families in the analysis, on invented simulated data: the family
 * and mechanism called, the enzyme concentration from the option, a column or fitted, the JSON
 * contract additions, the batch row, and that a classic-only analysis is unchanged.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { analysisJson } from '../../src/report/results-json.js';
import { summarizeAnalysis } from '../../src/batch/summarize.js';
import { simulateModelRates } from '../../src/simulate/simulate-model.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { lookupModel } from '../../src/models/registry.js';
import { parseRateText } from '../../src/input/parse-rate-text.js';
import { oneParameterTest, TIGHT_BINDING_RATIO } from '../../src/evidence/selection/family-comparison.js';
import { morrisonFractions } from '../../src/models/morrison.js';
import { renderFigures } from '../../src/figures/render-figures.js';
import { fractionalActivity } from '../../src/figures/fractional-activity.js';
import type { RatePoint } from '../../src/input/types.js';
import { runCaptured } from '../helpers/cli-capture.js';


const S = [2, 4, 7, 10, 15, 25, 50, 100];
const sim = (model: string, params: Record<string, number>, inhibitor: number[], seed: number, enzyme?: number): RatePoint[] =>
  simulateModelRates({ model: lookupModel(model)!, params, substrate: S, inhibitor, enzyme, replicates: 3, noise: 'proportional', noiseLevel: 0.04, seed });
const tableOf = (points: RatePoint[]) => tableFromPoints(points, { source: 'sim.csv', units: { substrate: 'uM', inhibitor: 'nM', rate: 'nM/s' } });

const tbPoints = sim('tight-binding competitive', { Vmax: 100, Km: 10, Ki: 1 }, [0, 2.5, 5, 10, 20, 40], 2024, 5);

describe('tight binding, [E]t given', () => {
  const result = analyzeTable(tableOf(tbPoints), { errorModel: 'proportional', enzyme: { value: 5, unit: 'nM' } });
  it('calls tight-binding competitive with the true Ki inside the profile interval, where the classic models do not', () => {
    expect(result.family.family).toBe('tight-binding');
    expect(result.verdict.mechanism).toBe('competitive');
    expect(result.verdict.headline).toMatchObject({ code: 'tight-binding', mechanism: 'competitive', unit: 'nM', constant: { name: 'Ki' } });
    expect(result.verdict.reasons[0]).toEqual({ code: 'enzyme-near-constant', enzyme: 5, unit: 'nM', ratio: TIGHT_BINDING_RATIO, name: 'Ki' });
    const m = result.familyModels!.find((x) => x.modelId === 'tight-binding competitive')!;
    const ki = m.estimates.find((e) => e.name === 'Ki')!;
    expect(ki.profile![0]!).toBeLessThan(1);
    expect(ki.profile![1]!).toBeGreaterThan(1);
    const classic = analyzeTable(tableOf(tbPoints), { errorModel: 'proportional' });
    // ignoring depletion, the classic models do not reach the right firm call (issue 10: "mixed ranks first, not firm")
    expect(classic.family.family).toBe('classic');
    expect(classic.verdict.decisive && classic.verdict.mechanism === 'competitive').toBe(false);
  });
  it('writes the JSON contract additions', () => {
    const json = analysisJson(result) as any;
    expect(json.input.enzyme).toEqual({ value: 5, unit: 'nM', source: 'option' });
    expect(json.verdict.family).toBe('tight-binding');
    expect(json.verdict.mechanism).toBe('competitive');
    expect(json.models.filter((m: any) => m.family === 'classic')).toHaveLength(5);
    expect(json.models.filter((m: any) => m.family === 'tight-binding').map((m: any) => m.mechanism).sort()).toEqual(['competitive', 'mixed', 'noncompetitive', 'uncompetitive']);
    const row = summarizeAnalysis(result);
    expect(row.family).toBe('tight-binding');
    expect(row.Ki!.interval).toBe('profile');
  });
  it('reads [E]t from an enzyme column (with its unit) exactly as from the option', () => {
    const csv = ['substrate (uM),inhibitor (nM),rate (nM/s),enzyme (uM)', ...tbPoints.map((p) => `${p.substrate},${p.inhibitor},${p.rate},0.005`)].join('\n');
    const [table] = parseRateText(csv, { source: 'col.csv' });
    const fromColumn = analyzeTable(table, { errorModel: 'proportional' });
    expect(fromColumn.enzyme).toEqual({ value: 5, unit: 'nM', source: 'column' });
    expect(fromColumn.verdict.headline).toEqual(result.verdict.headline);
  });
  it('a classic inhibitor with [E]t far below Ki keeps the classic call, verdict unchanged', () => {
    const points = sim('competitive', { Vmax: 100, Km: 10, Ki: 1 }, [0, 0.5, 1, 2, 4], 77);
    const plain = analyzeTable(tableOf(points), { errorModel: 'proportional' });
    const withE = analyzeTable(tableOf(points), { errorModel: 'proportional', enzyme: { value: 0.01, unit: 'nM' } });
    expect(withE.family.family).toBe('classic');
    expect(withE.verdict).toEqual(plain.verdict);
    expect(withE.family.reasons[0]).toMatchObject({ code: 'enzyme-negligible', enzyme: 0.01, ratio: TIGHT_BINDING_RATIO });
  });
  it('the fractional-activity figure draws the fitted curves from the model itself (v/v0 = Ef/E)', () => {
    const m = result.familyModels!.find((x) => x.modelId === 'tight-binding competitive')!;
    const [vmax, km, ki] = m.fit.params;
    void vmax;
    for (const [s, i] of [[2, 5], [50, 10], [10, 40]]) {
      expect(fractionalActivity(m, s, i, 5)).toBeCloseTo(morrisonFractions(5, i, ki * (1 + s / km)).activity, 12);
    }
    const fig = renderFigures(result).find((f) => f.id === 'fig-fractional-activity')!;
    expect(fig).toBeDefined();
    expect((fig.svg.match(/class="model-line"/g) ?? []).length).toBe(S.length);
    expect((fig.svg.match(/class="runner-up-line"/g) ?? []).length).toBe(S.length);
  });
});

describe('tight binding, [E]t fitted', () => {
  it('identifies [E]t when [I] spans it, and says so plainly when it cannot', () => {
    const points = sim('tight-binding noncompetitive (Et fitted)', { Vmax: 60, Km: 10, Ki: 0.5, Et: 4 }, [0, 1, 2, 3, 4, 6, 8], 31);
    const r = analyzeTable(tableOf(points), { errorModel: 'proportional', enzyme: 'fit' });
    expect(r.family.family).toBe('tight-binding');
    expect(r.verdict.mechanism).toBe('noncompetitive');
    const et = r.familyModels!.find((x) => x.modelId === r.family.model)!.estimates.find((e) => e.name === 'Et')!;
    expect(et.profile![0]!).toBeLessThan(4);
    expect(et.profile![1]!).toBeGreaterThan(4);
    const classicPoints = sim('noncompetitive', { Vmax: 60, Km: 10, Ki: 50 }, [0, 25, 50, 100, 200], 32);
    const c = analyzeTable(tableOf(classicPoints), { errorModel: 'proportional', enzyme: 'fit' });
    expect(c.family.family).toBe('classic');
    expect(c.family.reasons.map((r) => r.code)).toContain('enzyme-not-identifiable');
    expect((analysisJson(c) as any).input.enzyme).toBe('fitted');
  });
});

describe('partial inhibition', () => {
  it('partial noncompetitive, Ki 50 nM, 20% residual activity: named with beta and its interval', () => {
    const points = sim('partial noncompetitive', { Vmax: 100, Km: 10, Ki: 50, beta: 0.2 }, [0, 25, 50, 100, 200, 400, 800], 5);
    const r = analyzeTable(tableOf(points), { errorModel: 'proportional', partial: true });
    expect(r.family.family).toBe('partial');
    expect(r.verdict.mechanism).toBe('noncompetitive');
    expect(r.verdict.headline).toMatchObject({ code: 'partial', mechanism: 'noncompetitive', constant: { name: 'Ki' }, beta: { name: 'beta' } });
    const json = analysisJson(r) as any;
    const m = json.models.find((x: any) => x.model === 'partial noncompetitive');
    expect(m.params.beta.profile95[0]).toBeLessThan(0.2);
    expect(m.params.beta.profile95[1]).toBeGreaterThan(0.2);
    expect(Object.keys(m.params.beta)).toEqual(expect.arrayContaining(['value', 'se', 'ci95', 'profile95']));
    expect(summarizeAnalysis(r).beta!.interval).toBe('profile');
  });
  it('bootstrap intervals cover every new parameter of the called model (beta included)', () => {
    const points = sim('partial noncompetitive', { Vmax: 100, Km: 10, Ki: 50, beta: 0.2 }, [0, 25, 50, 100, 200, 400, 800], 6);
    const r = analyzeTable(tableOf(points), { errorModel: 'proportional', partial: true, profile: false, bootstrap: { resamples: 40, seed: 3 } });
    const m = r.familyModels!.find((x) => x.modelId === r.family.model)!;
    for (const e of m.estimates) {
      expect(e.bootstrapPercentile, e.name).toBeDefined();
      expect(e.bootstrapPercentile![0]).toBeLessThanOrEqual(e.value!);
      expect(e.bootstrapPercentile![1]).toBeGreaterThanOrEqual(e.value!);
    }
    const json = analysisJson(r) as any;
    expect(json.models.find((x: any) => x.model === r.family.model).params.beta.bootPercentile95).toHaveLength(2);
  });
  it('full inhibition is a boundary: p is half the chi-square(1) tail (Self & Liang 1987, case 5)', () => {
    // chi-square(1) upper 10% point 2.7055 (standard tables)
    expect(oneParameterTest(0, 2.7055 / 2, true).p).toBeCloseTo(0.05, 4);
    expect(oneParameterTest(0, 2.7055 / 2, false).p).toBeCloseTo(0.1, 4);
    expect(oneParameterTest(0, 0, true).p).toBe(1);
  });
});

describe('classic-only analysis is unchanged', () => {
  it('no family fitted, the verdict is the classic one, nothing added but the classic family', () => {
    const points = sim('mixed', { Vmax: 100, Km: 10, Ki: 2, Kiu: 10 }, [0, 1, 2, 4, 8], 9);
    const r = analyzeTable(tableOf(points), { errorModel: 'proportional' });
    expect(r.familyModels).toBeUndefined();
    expect(r.enzyme).toBeNull();
    expect(r.family.family).toBe('classic');
    expect(r.family.mechanism).toBe(r.verdict.mechanism);
    expect(renderFigures(r).some((f) => f.id === 'fig-fractional-activity')).toBe(false);
  });
  it('a Ki below the lowest [I] without [E]t gives the hint to supply it', () => {
    const r = analyzeTable(tableOf(tbPoints), { errorModel: 'proportional' });
    expect(r.family.suggestions).toContainEqual(expect.objectContaining({ code: 'give-enzyme', unit: 'nM', constant: expect.objectContaining({ name: 'Ki' }) }));
  });
});

describe('command line', () => {
  const dir = mkdtempSync(join(tmpdir(), 'mechanist-families-'));
  const file = join(dir, 'tb.csv');
  writeFileSync(file, ['substrate (uM),inhibitor (nM),rate', ...tbPoints.map((p) => `${p.substrate},${p.inhibitor},${p.rate}`)].join('\n') + '\n');
  const run = (args: string[]) => runCaptured(args, dir);
  it('--enzyme 5nM gives the tight-binding call; a value without a unit is a usage error (exit 2)', async () => {
    const ok = await run(['analyze', file, '--error', 'proportional', '--enzyme', '5nM', '--json', '--no-profile']);
    expect(ok.code).toBe(0);
    expect(JSON.parse(ok.out).verdict.family).toBe('tight-binding');
    const bad = await run(['analyze', file, '--enzyme', '5']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--enzyme: "5" needs a unit/);
    for (const text of ['abc', '0nM']) {
      const r = await run(['analyze', file, '--enzyme', text]);
      expect(r.code).toBe(2);
      expect(r.err).toBe(`mechanist: option --enzyme: "${text}" is not a positive concentration with a unit (for example 5nM) or "fit"\n`);
    }
    // the unit is read by the same reader as every other concentration: any case where unambiguous
    const lower = await run(['analyze', file, '--error', 'proportional', '--enzyme', '5nm', '--json', '--no-profile']);
    expect(JSON.parse(lower.out).verdict.family).toBe(JSON.parse(ok.out).verdict.family);
  });
  it('a bad enzyme cell stops with file and line (exit 2)', async () => {
    const f = join(dir, 'bad.csv');
    writeFileSync(f, 'substrate,inhibitor,rate,enzyme\n1,0,1,5\n2,0,1.5,5\n4,0,2,x\n8,1,2,5\n16,1,3,5\n1,2,0.5,5\n32,2,1.2,5\n'); // 7 points: the analysis floor
    const r = await run(['analyze', f]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/bad\.csv:4: the enzyme column holds "x"/);
  });
});

describe('figure curves come from the model itself', () => {
  it('the rate curves and the fractional-activity curves call the drawn model\'s own rate function', () => {
    const result = analyzeTable(tableOf(tbPoints), { errorModel: 'proportional', enzyme: { value: 5, unit: 'nM' }, profile: false });
    const drawn = result.familyModels!.find((x) => x.modelId === result.family.model)!;
    const own = drawn.fit.model;
    let calls = 0;
    const seen = new Set<number | undefined>();
    drawn.fit = { ...drawn.fit, model: { ...own, rate: (p, s, i, e) => (calls++, seen.add(e), own.rate(p, s, i, e)) } };
    const figures = renderFigures(result);
    expect(calls).toBeGreaterThan(2 * 81 * 6); // two rate-curve figures x 81 points x 6 [I] levels, plus the fractional activity
    expect([...seen]).toEqual([5]); // always with the analysis' [E]t
    expect(figures.find((f) => f.id === 'fig-rate-curves')!.svg).toContain('tight-binding competitive (global fit)');
  });
});

describe('report page', () => {
  it('shows the hint to give [E]t in the verdict section when the call stays classic', async () => {
    const { verdictSection } = await import('../../src/report/html/sections/verdict-section.js');
    const r = analyzeTable(tableOf(tbPoints), { errorModel: 'proportional', profile: false });
    expect(verdictSection(r)).toContain('--enzyme');
    const plain = analyzeTable(tableOf(sim('mixed', { Vmax: 100, Km: 10, Ki: 2, Kiu: 10 }, [0, 1, 2, 4, 8], 9)), { errorModel: 'proportional', profile: false });
    expect(verdictSection(plain)).not.toContain('Tight binding and partial inhibition');
  });
});

describe('cautions', () => {
  it('replace the "[E] well below Ki" caution when [E]t was given, and add the plateau caution for partial fits', async () => {
    const { cautionsSection, CAUTIONS } = await import('../../src/report/html/sections/cautions-section.js');
    const r = analyzeTable(tableOf(tbPoints), { errorModel: 'proportional', enzyme: { value: 5, unit: 'nM' }, partial: true, profile: false });
    const html = cautionsSection(r);
    expect(html).toContain('active-site titration');
    expect(html).not.toContain('must be well below Ki');
    expect(html).toContain('solubility limit');
    expect(cautionsSection()).toContain('must be well below Ki');
    expect(CAUTIONS.length).toBe(8);
  });
});
