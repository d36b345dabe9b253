/**
 * The demo report in a real browser (headless Chromium): it loads with no console error and no
 * request beyond its own file, every figure has a non-zero size and a title, and no text of any
 * figure reaches outside its SVG's viewBox (text boxes from getBBox, carried to the SVG's user
 * space with the element's transform matrix). A second report, from `analyze --robust --error auto
 * --bootstrap --at-substrate` on a simulated table with an outlier and an excluded row (invented
 * data), carries every optional section; its tables and text must fit the page.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { runCli } from '../../src/cli/run-cli.js';
import { simulateRates, ratesToCsv } from '../../src/simulate/simulate-rates.js';
import { foreignRequests, launchChromium, watchPage, type HeadlessBrowser, type PageWatch } from '../helpers/chromium.js';
import { GOOD_DESIGN, TRUE_PARAMS } from '../helpers/sim-table.js';
import { silentIo } from '../helpers/cli-capture.js';

let browser: HeadlessBrowser;
let page: Page;
let watch: PageWatch;
let out: string;

beforeAll(async () => {
  out = mkdtempSync(join(tmpdir(), 'mechanist-report-'));
  expect(await runCli(['demo', '--out', out], silentIo(out))).toBe(0);
  browser = await launchChromium();
  page = await browser.context.newPage();
  watch = watchPage(page);
  await page.goto(pathToFileURL(join(out, 'report.html')).href, { waitUntil: 'load' });
});

afterAll(async () => {
  await browser?.close();
  rmSync(out, { recursive: true, force: true });
});

interface FigureCheck {
  id: string;
  width: number;
  height: number;
  title: string;
  overflow: string[];
  texts: number;
}

/** Runs in the page: size, title and text-overflow findings of every figure's SVG. */
function collectFigureChecks(selector: string): FigureCheck[] {
  const out: FigureCheck[] = [];
  for (const svg of Array.from(document.querySelectorAll<SVGSVGElement>(selector))) {
    const rect = svg.getBoundingClientRect();
    const vb = svg.viewBox.baseVal;
    const rootInverse = svg.getScreenCTM()!.inverse();
    const overflow: string[] = [];
    const texts = Array.from(svg.querySelectorAll<SVGTextElement>('text'));
    for (const t of texts) {
      if (!t.textContent) continue;
      const box = t.getBBox();
      const m = rootInverse.multiply(t.getScreenCTM()!);
      const corners = [
        [box.x, box.y],
        [box.x + box.width, box.y],
        [box.x, box.y + box.height],
        [box.x + box.width, box.y + box.height],
      ].map(([x, y]) => new DOMPoint(x, y).matrixTransform(m));
      const xs = corners.map((p) => p.x);
      const ys = corners.map((p) => p.y);
      const tol = 0.5;
      if (Math.min(...xs) < vb.x - tol || Math.max(...xs) > vb.x + vb.width + tol || Math.min(...ys) < vb.y - tol || Math.max(...ys) > vb.y + vb.height + tol) {
        overflow.push(`"${t.textContent}" x ${Math.min(...xs).toFixed(1)}..${Math.max(...xs).toFixed(1)} y ${Math.min(...ys).toFixed(1)}..${Math.max(...ys).toFixed(1)} (viewBox ${vb.width} x ${vb.height})`);
      }
    }
    out.push({ id: svg.id, width: rect.width, height: rect.height, title: svg.querySelector('title')?.textContent ?? '', overflow, texts: texts.length });
  }
  return out;
}

describe('demo report in headless Chromium', () => {
  it('loads with no console errors and fetches nothing', () => {
    expect(watch.problems).toEqual([]);
    expect(foreignRequests(watch.requests)).toEqual([]);
  });

  it('every figure has a non-zero size, a title, and all its text inside the viewBox', async () => {
    const checks = await page.evaluate(collectFigureChecks, 'figure.plot svg');
    expect(checks.length).toBeGreaterThanOrEqual(10);
    for (const c of checks) {
      expect(c.width, c.id).toBeGreaterThan(100);
      expect(c.height, c.id).toBeGreaterThan(50);
      expect(c.title.length, c.id).toBeGreaterThan(5);
      expect(c.texts, c.id).toBeGreaterThan(3);
      expect(c.overflow, c.id).toEqual([]);
    }
  });

  it('the overflow check catches text that leaves its SVG (control)', async () => {
    const probe = await browser.context.newPage();
    await probe.setContent('<svg id="probe" viewBox="0 0 100 50" width="200" height="100"><title>probe figure</title><text x="60" y="20" font-size="12">far too long a label</text><text x="5" y="30">a</text><text x="5" y="40">b</text><text x="5" y="45">c</text></svg>');
    const [c] = await probe.evaluate(collectFigureChecks, 'svg');
    await probe.close();
    expect(c.overflow).toHaveLength(1);
    expect(c.overflow[0]).toContain('far too long a label');
  });

  it('the verdict is the first thing in the page body', async () => {
    const first = await page.evaluate(() => document.querySelector('main section')?.id);
    expect(first).toBe('verdict');
  });
});

/** Runs in the page: elements of the given sections whose content is wider than their box. */
function collectLayoutChecks(ids: string[]): { missing: string[]; pageOverflow: number; scrolledTables: string[]; clipped: string[] } {
  const missing = ids.filter((id) => !document.getElementById(id) || document.getElementById(id)!.getBoundingClientRect().height === 0);
  const scrolledTables: string[] = [];
  const clipped: string[] = [];
  for (const id of ids) {
    const section = document.getElementById(id);
    if (!section) continue;
    for (const wrap of Array.from(section.querySelectorAll<HTMLElement>('.table-wrap'))) {
      if (wrap.closest('details.full-data')) continue; // the full data table may scroll on purpose
      if (wrap.scrollWidth > wrap.clientWidth + 1) scrolledTables.push(`${id}: ${wrap.querySelector('table')?.className} ${wrap.scrollWidth} > ${wrap.clientWidth}`);
    }
    for (const el of Array.from(section.querySelectorAll<HTMLElement>('p, li, td, th, summary, h2, h3, code'))) {
      if (el.scrollWidth > el.clientWidth + 1 && getComputedStyle(el).display !== 'inline') clipped.push(`${id}: <${el.tagName.toLowerCase()}> "${(el.textContent ?? '').slice(0, 40)}"`);
      const box = el.getBoundingClientRect();
      const outer = section.getBoundingClientRect();
      if (box.width > 0 && box.right > outer.right + 1 && !el.closest('.table-wrap')) clipped.push(`${id}: <${el.tagName.toLowerCase()}> past the section edge`);
    }
  }
  return { missing, pageOverflow: document.documentElement.scrollWidth - window.innerWidth, scrolledTables, clipped };
}

describe('a full analyze report (robust, automatic error model, bootstrap, IC50) in headless Chromium', () => {
  let full: Page;
  let folder: string;
  let fullWatch: PageWatch;

  beforeAll(async () => {
    folder = mkdtempSync(join(tmpdir(), 'mechanist-full-report-'));
    const points = simulateRates({
      mechanism: 'mixed',
      params: TRUE_PARAMS.mixed,
      ...GOOD_DESIGN,
      replicates: 3,
      noise: 'proportional',
      noiseLevel: 0.05,
      seed: 23,
    });
    const k = points.findIndex((p) => p.substrate === 100 && p.inhibitor === 0);
    points[k].rate *= 0.35;
    const csv = ratesToCsv(points, { substrate: 'uM', inhibitor: 'uM' }) + '50,4,plate reader reported an overflow for this well and no value was kept,3\n';
    writeFileSync(join(folder, 'rates.csv'), csv);
    const code = await runCli(['analyze', 'rates.csv', '--out', 'out', '--robust', '--error', 'auto', '--bootstrap', '30', '--seed', '4', '--at-substrate', '20'], silentIo(folder));
    expect(code).toBe(0);
    full = await browser.context.newPage();
    fullWatch = watchPage(full);
    await full.goto(pathToFileURL(join(folder, 'out', 'report.html')).href, { waitUntil: 'load' });
    // open every collapsed block so that its tables are laid out and measured too
    await full.evaluate(() => document.querySelectorAll('details').forEach((d) => (d.open = true)));
  });

  afterAll(() => rmSync(folder, { recursive: true, force: true }));

  it('loads with no console errors and fetches nothing', () => {
    expect(fullWatch.problems).toEqual([]);
    expect(foreignRequests(fullWatch.requests)).toEqual([]);
  });

  it('has the derived quantities, the checks with the suspect and down-weighted points, and the excluded values', async () => {
    const found = await full.evaluate(() => ({
      suspects: document.querySelectorAll('#checks table.suspects tbody tr').length,
      downWeighted: document.querySelectorAll('#checks table.down-weighted tbody tr').length,
      selection: document.querySelectorAll('#derived table.selection tbody tr').length,
      ic50: Array.from(document.querySelectorAll('#derived table.derived td')).some((td) => td.textContent?.startsWith('IC50 at [S] = 20')),
      excluded: document.querySelector('#data table.excluded')?.textContent ?? '',
    }));
    expect(found.suspects).toBeGreaterThan(0);
    expect(found.downWeighted).toBeGreaterThan(0);
    expect(found.selection).toBe(5);
    expect(found.ic50).toBe(true);
    expect(found.excluded).toContain('plate reader reported an overflow');
  });

  it('every figure has a size, a title and its text inside the viewBox', async () => {
    const checks = await full.evaluate(collectFigureChecks, 'figure.plot svg');
    expect(checks.length).toBeGreaterThanOrEqual(10);
    for (const c of checks) {
      expect(c.width, c.id).toBeGreaterThan(100);
      expect(c.height, c.id).toBeGreaterThan(50);
      expect(c.title.length, c.id).toBeGreaterThan(5);
      expect(c.overflow, c.id).toEqual([]);
    }
  });

  it('the new sections fit the page: no table needs scrolling, no text leaves its box', async () => {
    const layout = await full.evaluate(collectLayoutChecks, ['derived', 'checks', 'data', 'provenance']);
    expect(layout.missing).toEqual([]);
    expect(layout.pageOverflow).toBeLessThanOrEqual(0);
    expect(layout.scrolledTables).toEqual([]);
    expect(layout.clipped).toEqual([]);
  });

  it('the layout check catches a table wider than the page (control)', async () => {
    const probe = await browser.context.newPage();
    await probe.setContent('<section id="probe" style="width:300px"><div class="table-wrap" style="overflow-x:auto"><table><tr><td style="white-space:nowrap">' + 'wide '.repeat(80) + '</td></tr></table></div><p style="white-space:nowrap;overflow:hidden">' + 'long '.repeat(80) + '</p></section>');
    const layout = await probe.evaluate(collectLayoutChecks, ['probe']);
    await probe.close();
    expect(layout.scrolledTables).toHaveLength(1);
    expect(layout.clipped.length).toBeGreaterThan(0);
  });
});

describe('the demo report\'s new sections in headless Chromium', () => {
  it('fit the page', async () => {
    const layout = await page.evaluate(collectLayoutChecks, ['derived', 'checks', 'data']);
    expect(layout.missing).toEqual([]);
    expect(layout.pageOverflow).toBeLessThanOrEqual(0);
    expect(layout.scrolledTables).toEqual([]);
    expect(layout.clipped).toEqual([]);
  });
});
