/**
 * Every figure of an analysis is well-formed standalone SVG (parsed as XML by jsdom with no
 * parsererror), has a <title> and <desc>, a viewBox 85 mm (241 pt) wide, no text below 8 pt, and
 * escapes user text (85 mm for one journal column and 8 pt as the smallest printed text are common
 * practice in journal figure guidelines, no single source; 85 mm = 85/25.4·72 = 240.9 pt).
 * Figures whose inputs are absent are left out. Data: the shipped demo table
 * (invented, data/demo/) and simulated tables (test/helpers/sim-table.ts).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { JSDOM } from 'jsdom';
import { demoAnalysis } from './read-demo.js';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import type { AnalysisResult } from '../../src/analysis/types.js';
import { renderFigures } from '../../src/figures/render-figures.js';
import type { FigureOutput } from '../../src/figures/figure-output.js';
import { figureContext } from '../../src/figures/figure-context.js';
import { familyMeetingPoint } from '../../src/figures/replot-figures.js';
import { doubleReciprocalLine } from '../../src/figures/replot-geometry.js';
import { COLUMN_WIDTH } from '../../src/figures/axes.js';
import { simulatedTable } from '../helpers/sim-table.js';

function parseSvg(svg: string): Document {
  return new JSDOM(svg, { contentType: 'image/svg+xml' }).window.document;
}

let demo: AnalysisResult;
let figures: FigureOutput[];
let parsed: Map<string, Document>;
beforeAll(async () => {
  demo = await demoAnalysis();
  figures = renderFigures(demo);
  parsed = new Map(figures.map((f) => [f.id, parseSvg(f.svg)]));
});

describe('figures of the demo analysis', () => {
  it('are well-formed SVG with a title, a description and a column-wide viewBox', () => {
    expect(figures.length).toBeGreaterThanOrEqual(10);
    for (const f of figures) {
      const doc = parsed.get(f.id)!;
      expect(doc.getElementsByTagName('parsererror'), f.id).toHaveLength(0);
      const root = doc.documentElement;
      expect(root.tagName).toBe('svg');
      expect(root.getAttribute('xmlns')).toBe('http://www.w3.org/2000/svg');
      expect(root.querySelector('title')?.textContent?.length, f.id).toBeGreaterThan(5);
      expect(root.querySelector('desc')?.textContent?.length, f.id).toBeGreaterThan(20);
      const [, , w, h] = (root.getAttribute('viewBox') ?? '').split(' ').map(Number);
      expect(w).toBe(COLUMN_WIDTH);
      expect(h).toBeGreaterThan(80);
      for (const t of Array.from(root.querySelectorAll('text, g[font-size]'))) {
        const size = t.getAttribute('font-size');
        if (size !== null) expect(Number(size), `${f.id}: ${t.textContent}`).toBeGreaterThanOrEqual(8);
      }
      expect(f.svg).not.toMatch(/NaN|undefined|Infinity/);
    }
  });

  it('ids are unique across figures (they are inlined into one page)', () => {
    const ids = figures.flatMap((f) => Array.from(parsed.get(f.id)!.querySelectorAll('[id]')).map((e) => e.id));
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('every replot carries the visible qualitative badge and says the values come from the global fit', () => {
    const replots = figures.filter((f) => f.group === 'replot');
    expect(replots.map((f) => f.id)).toEqual(
      expect.arrayContaining(['fig-double-reciprocal', 'fig-dixon', 'fig-cornish-bowden', 'fig-hanes-woolf', 'fig-eadie-hofstee']),
    );
    for (const f of replots) {
      const doc = parsed.get(f.id)!;
      const texts = Array.from(doc.querySelectorAll('text')).map((t) => t.textContent ?? '');
      expect(texts.some((t) => /^Qualitative/.test(t)), f.id).toBe(true);
      expect(f.caption).toMatch(/global .* fit/);
    }
  });

  it('leaves out the slope/intercept replots, profiles and joint region when their inputs are absent', () => {
    const bare: AnalysisResult = {
      ...demo,
      seriesFits: undefined,
      models: demo.models.map((m) => ({ ...m, profiles: undefined, jointRegion: undefined })),
    };
    const ids = renderFigures(bare).map((f) => f.id);
    for (const gone of ['fig-slope-replot', 'fig-intercept-replot', 'fig-profile-ki', 'fig-profile-kiu', 'fig-joint-ki-kiu']) expect(ids).not.toContain(gone);
    expect(ids).toContain('fig-double-reciprocal');
  });

  it('escapes user text (units) in the SVG', () => {
    const hostile: AnalysisResult = { ...demo, input: { ...demo.input, units: { ...demo.input.units, rate: '<b>&"x' } } };
    const rendered = renderFigures(hostile);
    for (const f of rendered) expect(f.svg).not.toContain('<b>');
    const rates = rendered.find((f) => f.id === 'fig-rate-curves')!;
    expect(rates.svg).toContain('v (&lt;b&gt;&amp;"x)');
    expect(parseSvg(rates.svg).getElementsByTagName('parsererror')).toHaveLength(0);
  });
});

describe('figure data of a competitive fit', () => {
  it('the double-reciprocal lines drawn meet on the 1/v axis (Lineweaver & Burk 1934)', () => {
    const result = analyzeTable(simulatedTable('competitive', 11), { errorModel: 'proportional' });
    const ctx = figureContext(result);
    expect(ctx.best.mechanism).toBe('competitive');
    const p = familyMeetingPoint(ctx.bestConstants, ctx.inhibitor.values, doubleReciprocalLine)!;
    expect(Math.abs(p.x)).toBeLessThan(1e-12);
    expect(p.y).toBeCloseTo(1 / ctx.bestConstants.Vmax, 12);
    const lb = renderFigures(result).find((f) => f.id === 'fig-double-reciprocal')!;
    expect(lb.svg).toContain('class="meeting-point"');
  });
});
