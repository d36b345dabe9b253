/**
 * The "Derived quantities" section, from real analyses of simulated tables (invented data,
 * test/helpers/sim-table.ts, [I] in uM). The IC50 shown must equal the closed form of
 * Cheng, Y. and Prusoff, W. H. (1973) Biochem. Pharmacol. 22, 3099-3108, computed here from the
 * fitted constants: competitive Ki (1 + S/Km); mixed (Km + S) / (Km/Ki + S/Kiu).
 * pKi = -log10(Ki in mol/L), so with Ki in uM pKi = 6 - log10(Ki).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { JSDOM } from 'jsdom';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import type { AnalysisResult, ModelResult } from '../../src/analysis/types.js';
import { derivedSection } from '../../src/report/html/sections/derived-section.js';
import { sig } from '../../src/text/format-number.js';
import { simulatedTable } from '../helpers/sim-table.js';

const AT_SUBSTRATE = 25;

function sectionOf(result: AnalysisResult): Element | null {
  return new JSDOM(`<body>${derivedSection(result)}</body>`).window.document.getElementById('derived');
}

function rowsOf(root: Element, tableClass: string): string[][] {
  return Array.from(root.querySelectorAll(`table.${tableClass} tbody tr`)).map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent ?? ''));
}

function fitted(model: ModelResult, name: string): number {
  return model.fit.params[model.fit.model.params.indexOf(name as never)];
}

function winner(result: AnalysisResult): ModelResult {
  return result.models.find((m) => m.mechanism === result.verdict.mechanism)!;
}

describe('derived quantities of a competitive fit', () => {
  let result: AnalysisResult;
  let section: Element;

  beforeAll(() => {
    result = analyzeTable(simulatedTable('competitive', 11), { errorModel: 'proportional', atSubstrate: AT_SUBSTRATE, profile: false });
    section = sectionOf(result)!;
  });

  it('the IC50 equals Ki (1 + [S]/Km) from the fitted constants', () => {
    expect(result.verdict.mechanism).toBe('competitive');
    const m = winner(result);
    const expected = fitted(m, 'Ki') * (1 + AT_SUBSTRATE / fitted(m, 'Km'));
    const row = rowsOf(section, 'derived').find((r) => r[0].startsWith('IC50'))!;
    expect(row[0]).toBe(`IC50 at [S] = ${AT_SUBSTRATE} µM`);
    expect(row[1]).toBe(sig(expected, 4));
    expect(row[2]).toBe('µM');
    expect(section.querySelector('p.formula')!.textContent).toContain(`IC50 = Ki (1 + [S]/Km) = ${sig(fitted(m, 'Ki'), 4)} × (1 + ${AT_SUBSTRATE}/${sig(fitted(m, 'Km'), 4)}) = ${sig(expected, 4)} µM`);
  });

  it('pKi is 6 - log10(Ki / uM), with no pKiu or alpha for a competitive model', () => {
    const m = winner(result);
    const rows = rowsOf(section, 'derived');
    expect(rows.find((r) => r[0].startsWith('pKi '))![1]).toBe(sig(6 - Math.log10(fitted(m, 'Ki')), 4));
    expect(rows.some((r) => r[0].startsWith('pKiu') || r[0].startsWith('alpha'))).toBe(false);
  });

  it('lists Km_app = Km (1 + I/Ki) at each inhibited level, its unit with its name; Vmax_app, unchanged by a competitive inhibitor, in one sentence, not in rows (issue 13)', () => {
    const m = winner(result);
    const rows = rowsOf(section, 'apparent');
    const levels = [...new Set(result.table.points.map((p) => p.inhibitor))].filter((i) => i > 0);
    expect(rows).toHaveLength(levels.length);
    const at8 = rows.find((r) => r[0] === '8')!;
    expect(at8.slice(1, 3)).toEqual(['Km_app (µM)', sig(fitted(m, 'Km') * (1 + 8 / fitted(m, 'Ki')), 4)]);
    expect(rows.some((r) => r[1].startsWith('Vmax_app'))).toBe(false);
    const headers = Array.from(section.querySelectorAll('table.apparent thead th')).map((th) => th.textContent ?? '');
    expect(headers).not.toContain('unit');
    expect(section.textContent).toContain(`Vmax_app = ${sig(fitted(m, 'Vmax'), 4)}`);
    expect(section.textContent).toContain('at every [I]: the competitive model leaves it unchanged.');
  });

  it('has no bootstrap block when no bootstrap ran', () => {
    expect(section.querySelector('table.selection')).toBeNull();
  });
});

describe('derived quantities of a mixed fit with a bootstrap', () => {
  let result: AnalysisResult;
  let section: Element;

  beforeAll(() => {
    result = analyzeTable(simulatedTable('mixed', 5), { errorModel: 'proportional', atSubstrate: AT_SUBSTRATE, bootstrap: { resamples: 40, seed: 9 } });
    section = sectionOf(result)!;
  });

  it('the IC50 equals (Km + [S]) / (Km/Ki + [S]/Kiu) from the fitted constants', () => {
    const m = winner(result);
    expect(m.mechanism).toBe('mixed');
    const [km, ki, kiu] = [fitted(m, 'Km'), fitted(m, 'Ki'), fitted(m, 'Kiu')];
    const expected = (km + AT_SUBSTRATE) / (km / ki + AT_SUBSTRATE / kiu);
    const row = rowsOf(section, 'derived').find((r) => r[0].startsWith('IC50'))!;
    expect(row[1]).toBe(sig(expected, 4));
    expect(section.querySelector('p.formula')!.textContent).toContain('IC50 = (Km + [S]) / (Km/Ki + [S]/Kiu)');
  });

  it('shows alpha with its profile and bootstrap intervals, and pKiu', () => {
    const m = winner(result);
    const alpha = m.estimates.find((e) => e.name === 'alpha')!;
    const heads = Array.from(section.querySelectorAll('table.derived th')).map((th) => th.textContent);
    expect(heads).toEqual(expect.arrayContaining(['Wald 95%', 'profile 95%', 'bootstrap 95% (percentile)', 'bootstrap 95% (BCa)']));
    const row = rowsOf(section, 'derived').find((r) => r[0].startsWith('alpha'))!;
    expect(row[1]).toBe(sig(alpha.value, 4));
    expect(row[heads.indexOf('profile 95%')]).toBe(`[${sig(alpha.profile![0], 4)}, ${sig(alpha.profile![1], 4)}]`);
    expect(row[heads.indexOf('bootstrap 95% (BCa)')]).toBe(`[${sig(alpha.bootstrapBca![0], 4)}, ${sig(alpha.bootstrapBca![1], 4)}]`);
    expect(rowsOf(section, 'derived').find((r) => r[0].startsWith('pKiu'))![1]).toBe(sig(6 - Math.log10(fitted(m, 'Kiu')), 4));
  });

  it('gives how often each mechanism ranked first across the resamples', () => {
    const b = result.bootstrap!;
    const rows = rowsOf(section, 'selection');
    expect(rows.map((r) => r[0]).sort()).toEqual(result.models.map((m) => m.mechanism).sort());
    for (const r of rows) expect(r[1]).toBe(`${(100 * (b.selection[r[0]] ?? 0)).toFixed(1)}%`);
    const total = rows.reduce((sum, r) => sum + Number(r[1].replace('%', '')), 0);
    expect(total).toBeCloseTo(100, 0);
    expect(section.textContent).toContain(`${b.resamples} bootstrap resamples (seed ${b.seed}`);
  });
});

describe('no inhibition', () => {
  it('leaves the section out, or with a bootstrap keeps only the selection shares', () => {
    const table = simulatedTable('none', 3);
    const plain = analyzeTable(table, { errorModel: 'proportional', profile: false });
    expect(plain.verdict.mechanism).toBe('none');
    expect(derivedSection(plain)).toBe('');
    const resampled = analyzeTable(table, { errorModel: 'proportional', profile: false, bootstrap: { resamples: 20, seed: 2 } });
    const section = sectionOf(resampled)!;
    expect(section.textContent).toContain('The none model has no inhibition constant to derive from.');
    expect(section.querySelector('table.derived')).toBeNull();
    expect(rowsOf(section, 'selection')).toHaveLength(resampled.models.length);
  });
});
