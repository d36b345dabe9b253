/**
 * The report page: order of the sections, every interval that exists and no column for those
 * that do not, every excluded row with its reason, methods with their sources, the cautions,
 * the reproducibility footer, self-containment (nothing fetched) and escaping of user text.
 * Data: the shipped demo table (invented, data/demo/).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { JSDOM } from 'jsdom';
import { demoAnalysis } from '../figures/read-demo.js';
import type { AnalysisResult } from '../../src/analysis/types.js';
import { renderFigures } from '../../src/figures/render-figures.js';
import type { FigureOutput } from '../../src/figures/figure-output.js';
import { reportHtml } from '../../src/report/html/report-page.js';
import { DATE_ELEMENT_PATTERN } from '../../src/report/html/sections/provenance-footer.js';
import { escapeHtml } from '../../src/report/html/escape.js';
import { sha256Hex } from '../../src/input/file-hash.js';
import { TOOL_VERSION } from '../../src/version.js';
import { wordVerdict } from '../../src/wording/verdict-words.js';

let demo: AnalysisResult;
let figures: FigureOutput[];
let html: string;
let doc: Document;
const DATE = new Date('2026-03-04T05:06:07Z');

beforeAll(async () => {
  demo = await demoAnalysis();
  figures = renderFigures(demo);
  html = reportHtml({ result: demo, figures, provenance: { generatedAt: DATE, inputSha256: 'ab'.repeat(32), seed: 17, command: 'mechanist demo' } });
  doc = new JSDOM(html).window.document;
});

function withoutIntervals(result: AnalysisResult): AnalysisResult {
  return {
    ...result,
    models: result.models.map((m) => ({
      ...m,
      profiles: undefined,
      jointRegion: undefined,
      estimates: m.estimates.map(({ profile: _p, bootstrapPercentile: _b, bootstrapBca: _c, ...rest }) => rest),
    })),
  };
}

describe('report page', () => {
  it('puts the verdict first, then the constants, and carries every section', () => {
    const ids = Array.from(doc.querySelectorAll('main section[id], footer[id]')).map((s) => s.id);
    expect(ids[0]).toBe('verdict');
    expect(ids[1]).toBe('constants');
    for (const id of ['fit', 'comparison', 'warnings', 'replots', 'data', 'methods', 'cautions', 'provenance']) expect(ids).toContain(id);
    expect(ids.indexOf('methods')).toBeLessThan(ids.indexOf('cautions'));
  });

  it('shows the verdict headline and each reason', () => {
    const verdict = doc.getElementById('verdict')!;
    const words = wordVerdict(demo.verdict);
    expect(verdict.querySelector('.headline')!.textContent).toBe(words.headline);
    const reasons = Array.from(verdict.querySelectorAll('ul.reasons li')).map((li) => li.textContent);
    expect(reasons).toEqual(words.reasons);
  });

  it('inlines every figure once, each with a title', () => {
    const svgs = doc.querySelectorAll('figure.plot svg');
    expect(svgs.length).toBe(figures.length);
    for (const svg of Array.from(svgs)) expect(svg.querySelector('title')?.textContent?.length).toBeGreaterThan(5);
  });

  it('lists the intervals that exist, and no column for those that do not', () => {
    const heads = (h: string) => Array.from(new JSDOM(h).window.document.querySelectorAll('#constants table')[0].querySelectorAll('th')).map((th) => th.textContent);
    const bare = reportHtml({ result: withoutIntervals(demo), figures, provenance: { generatedAt: DATE } });
    expect(heads(bare)).toContain('Wald 95%');
    expect(heads(bare).some((h) => /profile|bootstrap/.test(h ?? ''))).toBe(false);
    const best = demo.models.find((m) => m.mechanism === demo.verdict.mechanism)!;
    const withAll: AnalysisResult = {
      ...demo,
      models: demo.models.map((m) =>
        m !== best ? m : { ...m, estimates: m.estimates.map((e) => (e.value === null ? e : { ...e, profile: [e.value * 0.9, null] as [number, null], bootstrapPercentile: [e.value * 0.8, e.value * 1.2] as [number, number], bootstrapBca: [e.value * 0.85, e.value * 1.25] as [number, number] })) },
      ),
    };
    const full = reportHtml({ result: withAll, figures, provenance: { generatedAt: DATE } });
    expect(heads(full)).toEqual(expect.arrayContaining(['Wald 95%', 'profile 95%', 'bootstrap 95% (percentile)', 'bootstrap 95% (BCa)']));
    expect(full).toContain('open: the data do not bound the constant on that side');
  });

  it('lists every excluded row with its reason and its values as written in the file', () => {
    expect(demo.input.excluded.length).toBeGreaterThan(0);
    const rows = Array.from(doc.querySelectorAll('table.excluded tbody tr')).map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent));
    expect(rows).toHaveLength(demo.input.excluded.length);
    const written = (text: string | undefined) => (text === undefined ? '–' : text.trim() === '' ? 'blank' : text.trim());
    for (const x of demo.input.excluded) {
      expect(x.asWritten).toBeDefined();
      expect(rows).toContainEqual([String(x.line), x.column !== undefined ? String(x.column) : '–', written(x.asWritten?.substrate), written(x.asWritten?.inhibitor), written(x.asWritten?.rate), x.reason]);
    }
    // the demo's blank-rate row (line 54) shows its [S] and [I] and a blank rate, in the full table too
    const blankRate = Array.from(doc.querySelectorAll('details.full-data tbody tr')).find((tr) => tr.querySelector('td')?.textContent === '54')!;
    const cells = Array.from(blankRate.querySelectorAll('td')).map((td) => td.textContent);
    expect(cells.slice(1, 4)).toEqual([written(demo.input.excluded.find((x) => x.line === 54)!.asWritten!.substrate), written(demo.input.excluded.find((x) => x.line === 54)!.asWritten!.inhibitor), 'blank']);
  });

  it('carries the derived quantities and the checks on the fit, right after the constants and the fit', () => {
    const ids = Array.from(doc.querySelectorAll('main section[id]')).map((s) => s.id);
    expect(ids.indexOf('derived')).toBe(ids.indexOf('constants') + 1);
    expect(ids.indexOf('checks')).toBe(ids.indexOf('fit') + 1);
    const nav = Array.from(doc.querySelectorAll('nav.contents a')).map((a) => a.getAttribute('href'));
    for (const id of ids.filter((i) => i !== 'verdict')) expect(nav).toContain(`#${id}`);
  });

  it('has one data row per used point and per excluded row', () => {
    const rows = doc.querySelectorAll('details.full-data tbody tr');
    expect(rows.length).toBe(demo.input.rowsUsed + demo.input.excluded.length);
  });

  it('names the source of each method and the cautions of the brief', () => {
    const methods = doc.getElementById('methods')!.textContent ?? '';
    for (const source of ['Hurvich', 'Schwarz', 'Burnham', 'Draper', 'Wilks', 'Bates', 'Lineweaver', 'Dixon', 'Cornish-Bowden, A. (1974)', 'Moré']) expect(methods).toContain(source);
    const cautions = doc.getElementById('cautions')!.textContent ?? '';
    for (const point of ['research tool', 'initial rates', 'reversible', 'Morrison 1969', 'preincubation', 'detergent', 'Feng & Shoichet 2006', 'absorbs or fluoresces', 'replots']) expect(cautions).toContain(point);
  });

  it('records tool version, input hash, seed and date in the footer', () => {
    const footer = doc.getElementById('provenance')!.textContent ?? '';
    expect(footer).toContain(`mechanist ${TOOL_VERSION}`);
    expect(footer).toContain('ab'.repeat(32));
    expect(footer).toContain('17');
    expect(doc.querySelectorAll('time#report-date')).toHaveLength(1);
    expect(doc.querySelector('time#report-date')!.getAttribute('datetime')).toBe(DATE.toISOString());
  });

  it('the date is the only part that changes between two runs', () => {
    const again = reportHtml({ result: demo, figures: renderFigures(demo), provenance: { generatedAt: new Date('2030-01-01T00:00:00Z'), inputSha256: 'ab'.repeat(32), seed: 17, command: 'mechanist demo' } });
    expect(again).not.toBe(html);
    expect(again.replace(DATE_ELEMENT_PATTERN, '')).toBe(html.replace(DATE_ELEMENT_PATTERN, ''));
  });

  it('is self-contained: no script, no stylesheet link, nothing fetched', () => {
    expect(html).not.toMatch(/<script|<link|<iframe|<img|@import/i);
    for (const el of Array.from(doc.querySelectorAll('[src], [href]'))) {
      const url = el.getAttribute('src') ?? el.getAttribute('href') ?? '';
      expect(url, url).toMatch(/^(#|figures\/[a-z0-9-]+\.svg$)/);
    }
    expect(html).not.toMatch(/url\((?!#)/);
  });

  it('never prints JavaScript missing-value words', () => {
    expect(doc.body.textContent).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('escapes user text from the file (source, compound, reasons, units)', () => {
    const evil = '<img src=x onerror=alert(1)>&"\'';
    const hostile: AnalysisResult = {
      ...demo,
      input: {
        ...demo.input,
        source: evil,
        compound: evil,
        units: { ...demo.input.units, rate: evil },
        excluded: [...demo.input.excluded, { line: 999, reason: evil, asWritten: { substrate: evil, inhibitor: evil, rate: evil } }],
        warnings: [...demo.input.warnings, { code: 'x', message: evil }],
      },
    };
    const page = reportHtml({ result: hostile, figures: renderFigures(hostile), provenance: { generatedAt: DATE } });
    expect(page).not.toContain('<img');
    expect(page).toContain(escapeHtml(evil));
    const parsed = new JSDOM(page).window.document;
    expect(parsed.querySelectorAll('img')).toHaveLength(0);
    expect(parsed.querySelector('header.page .source')!.textContent).toContain(evil);
  });
});

describe('helpers', () => {
  it('escapeHtml escapes the five special characters', () => {
    expect(escapeHtml(`<a href="x">&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&#39;&lt;/a&gt;');
  });
  it('sha256Hex matches the FIPS 180-2 example for "abc"', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
});
