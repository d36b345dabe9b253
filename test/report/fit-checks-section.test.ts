/**
 * The "Checks on the fit" section, from real analyses of simulated tables (invented data,
 * test/helpers/sim-table.ts): a gross outlier shows up in the suspect table with its file line and
 * in the robust refit's down-weighted points; a series pushed off the global curve is marked; the
 * residual tests and error models show the analysis's own numbers.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { JSDOM } from 'jsdom';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import type { AnalysisResult } from '../../src/analysis/types.js';
import { fitChecksSection } from '../../src/report/html/sections/fit-checks-section.js';
import { pValue, sig } from '../../src/text/format-number.js';
import { simulatedTable } from '../helpers/sim-table.js';
import { wordVerdict } from '../../src/wording/verdict-words.js';

function sectionOf(result: AnalysisResult): Element {
  return new JSDOM(`<body>${fitChecksSection(result)}</body>`).window.document.getElementById('checks')!;
}

function rowsOf(root: Element, tableClass: string): string[][] {
  return Array.from(root.querySelectorAll(`table.${tableClass} tbody tr`)).map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent ?? ''));
}

describe('checks section with an injected outlier and --robust', () => {
  let result: AnalysisResult;
  let section: Element;
  let outlier: number;
  let outlierLine: number;

  beforeAll(() => {
    const table = structuredClone(simulatedTable('noncompetitive', 41));
    outlier = table.points.findIndex((p) => p.substrate === 100 && p.inhibitor === 0);
    table.points[outlier].rate *= 0.35;
    outlierLine = table.points[outlier].line;
    result = analyzeTable(table, { errorModel: 'proportional', robust: true });
    section = sectionOf(result);
  });

  it('lists the outlier among the suspect points, by its file line, with its studentised residual and leverage', () => {
    const d = result.residualChecks![result.verdict.mechanism!]!;
    const suspect = d.suspects.find((s) => s.index === outlier)!;
    expect(suspect).toBeDefined();
    const row = rowsOf(section, 'suspects').find((r) => r[0] === String(outlierLine))!;
    expect(row).toEqual([
      String(outlierLine),
      sig(suspect.substrate, 4),
      sig(suspect.inhibitor, 4),
      sig(suspect.rate, 4),
      sig(suspect.studentised, 3),
      sig(suspect.leverage, 2),
      suspect.why,
    ]);
    expect(Math.abs(suspect.studentised)).toBeGreaterThan(3);
    expect(rowsOf(section, 'suspects')).toHaveLength(d.suspects.length);
  });

  it('shows the robust refit: the down-weighted outlier with its line and weight, the ranking and whether the call changed', () => {
    const down = result.robust!.downWeighted.find((p) => p.index === outlier)!;
    expect(down.line).toBe(outlierLine);
    const row = rowsOf(section, 'down-weighted').find((r) => r[0] === String(outlierLine))!;
    expect(row[4]).toBe(down.weight === 0 ? '0 (left out)' : down.weight.toFixed(3));
    expect(row[3]).toBe(sig(down.rate, 4));
    const ranking = rowsOf(section, 'robust-ranking').map((r) => r[1]);
    expect(ranking).toEqual(result.robust!.ranking.map((m) => m.mechanism));
    const text = section.textContent ?? '';
    expect(text).toContain(wordVerdict(result.robust!.verdict).headline);
    expect(text).toContain(result.robust!.changesVerdict ? 'The call changes' : 'The call stands');
  });

  it('shows each residual test with the analysis values', () => {
    const d = result.residualChecks![result.verdict.mechanism!]!;
    const tests = rowsOf(section, 'checks-tests');
    expect(tests[0][0]).toContain('Runs');
    expect(tests[0][1]).toContain(`${d.runs.runs} runs`);
    expect(tests[0][2]).toBe(pValue(d.runs.pTooFew));
    const normality = tests.find((r) => r[0].startsWith('Normality'))!;
    expect(normality[1]).toBe(`Shapiro-Wilk W = ${d.normality!.W.toFixed(3)}`);
    expect(normality[2]).toBe(pValue(d.normality!.p));
    const lof = tests.find((r) => r[0].startsWith('Lack of fit'))!;
    if (d.lackOfFit.applicable) expect(lof[2]).toBe(pValue(d.lackOfFit.p));
    expect(tests.filter((r) => r[0].startsWith('Trend'))).toHaveLength(3);
  });

  it('gives the error model as chosen by the user, with ΔAICc per error model', () => {
    const em = result.errorModelCheck!;
    const rows = rowsOf(section, 'error-models');
    expect(rows.map((r) => r[0])).toEqual(em.scores.map((s) => s.errorModel));
    for (const s of em.scores) expect(rows.find((r) => r[0] === s.errorModel)![3]).toBe(s.delta.toFixed(1));
    expect(section.textContent).toContain('was given for this analysis');
    expect(section.textContent).not.toContain('chosen automatically');
  });

  it('collapses the other mechanisms\' checks into one table', () => {
    const others = rowsOf(section, 'other-checks').map((r) => r[0]);
    expect(others.length).toBe(Object.keys(result.residualChecks!).length - 1);
    expect(others).not.toContain(result.verdict.mechanism);
  });
});

describe('checks section: error model chosen automatically, series pushed off the global curve', () => {
  let result: AnalysisResult;
  let section: Element;

  beforeAll(() => {
    const table = structuredClone(simulatedTable('competitive', 7));
    // every rate of the highest [I] series scaled down: that series' Vmax disagrees with the global fit
    for (const p of table.points) if (p.inhibitor === 8) p.rate *= 0.7;
    result = analyzeTable(table, { errorModel: 'auto' });
    section = sectionOf(result);
  });

  it('says the error model was chosen automatically, and marks the best and the used one', () => {
    expect(result.errorModelChoice?.automatic).toBe(true);
    expect(section.textContent).toContain(`The ${result.errorModel} error model was chosen automatically`);
    const used = rowsOf(section, 'error-models').find((r) => r[4].includes('used'))!;
    expect(used[0]).toBe(result.errorModel);
  });

  it('has one row per series fit, with the disagreements marked', () => {
    const series = result.seriesFits!;
    const rows = rowsOf(section, 'series-fits');
    expect(rows.map((r) => r[0])).toEqual(series.map((s) => sig(s.inhibitor, 4)));
    const first = series[0];
    expect(rows[0][2]).toBe(`${sig(first.Vmax, 4)} ± ${sig(first.seVmax, 2)}`);
    const disagreements = result.seriesDisagreements!;
    expect(disagreements.length).toBeGreaterThan(0);
    for (const d of disagreements) {
      const row = rows.find((r) => r[0] === sig(d.inhibitor, 4))!;
      expect(row[6]).toContain(`${d.quantity} differs (z = ${d.z.toFixed(1)})`);
    }
    const marked = rows.filter((r) => r[6] !== 'agrees').length;
    expect(marked).toBe(new Set(disagreements.map((d) => d.inhibitor)).size);
  });

  it('has no robust block when no robust refit was asked for', () => {
    expect(section.querySelector('table.down-weighted')).toBeNull();
    expect(section.textContent).not.toContain('Robust refit');
  });
});
