/**
 * index.html of a batch run in headless Chromium (Debian's /usr/bin/chromium through
 * playwright-core; no browser download): no console errors, no network request, sorting by a
 * column heading (numbers as numbers, blanks last, again to reverse) and filtering.
 * The page is built from hand-made summary rows (invented values) by indexPage().
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { foreignRequests, launchChromium, watchPage, type HeadlessBrowser, type PageWatch } from '../helpers/chromium.js';
import { indexPage } from '../../src/batch/index-page.js';
import { failedSummary } from '../../src/batch/summarize.js';
import type { CompoundSummary, ConstantSummary } from '../../src/batch/types.js';

function analysedRow(position: number, compound: string, ki: ConstantSummary | null, outcome: CompoundSummary['outcome']): CompoundSummary {
  return {
    ...failedSummary({ position, compound, nameInFile: compound, source: 'screen.csv' }, ''),
    status: 'analysed',
    error: null,
    outcome,
    mechanism: ki ? 'competitive' : 'none',
    decisive: outcome === 'decisive',
    headline: 'invented row',
    errorModel: 'constant',
    topModel: ki ? 'competitive' : 'none',
    topWeight: 0.8,
    gapToSecond: 3,
    constantsOf: ki ? 'competitive' : 'none',
    Ki: ki,
    Km: 10,
    Vmax: 100,
    rowsUsed: 80,
    rowsExcluded: 0,
    report: `compounds/${compound}/report.html`,
    flags: position === 2 ? ['a <b>flag</b> & more'] : [],
  };
}

const wald = (value: number): ConstantSummary => ({ value, low: value * 0.8, high: value * 1.2, interval: 'wald' });

const rows: CompoundSummary[] = [
  analysedRow(1, 'CPD-9', wald(9), 'decisive'),
  analysedRow(2, 'CPD-10', wald(10), 'decisive'),
  analysedRow(3, 'CPD-2', wald(2), 'undecided'),
  analysedRow(4, 'NONE-1', null, 'no-inhibition'),
  analysedRow(5, 'WEAK', { value: null, low: 400, high: null, interval: 'not-detected' }, 'decisive'),
  failedSummary({ position: 6, compound: 'BAD', nameInFile: null, source: 'bad.csv' }, 'bad.csv:3:2: rate "x" is not a number'),
];

describe('batch index page in headless Chromium', () => {
  let browser: HeadlessBrowser;
  let page: Page;
  let watch: PageWatch;
  let dir: string;

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'mechanist-index-'));
    const file = join(dir, 'index.html');
    writeFileSync(file, indexPage(rows, { settings: { errorModel: 'constant', level: 0.95, reports: true, analysis: {} }, finishedAt: new Date(0) }));
    browser = await launchChromium();
    page = await browser.context.newPage();
    watch = watchPage(page);
    await page.goto(pathToFileURL(file).href);
  });

  afterAll(async () => {
    await browser?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  const column = (heading: string) =>
    page.evaluate((h) => {
      const table = document.getElementById('compound-table') as HTMLTableElement;
      const index = Array.from(table.tHead!.rows[0].cells).findIndex((c) => c.textContent!.trim() === h);
      return Array.from(table.tBodies[0].rows)
        .filter((r) => !r.hidden)
        .map((r) => r.cells[index].textContent!.trim());
    }, heading);

  it('loads without console errors and fetches nothing', async () => {
    expect(await page.textContent('#shown')).toBe('6 of 6 compounds shown');
    expect(watch.problems).toEqual([]);
    expect(foreignRequests(watch.requests)).toEqual([]);
    expect(watch.requests).toHaveLength(1);
    // escaped text, not markup
    expect(await page.locator('details li').first().textContent()).toBe('a <b>flag</b> & more');
    expect(await page.locator('a', { hasText: 'CPD-10' }).getAttribute('href')).toBe('compounds/CPD-10/report.html');
  });

  const heading = (name: string) => page.locator('th').filter({ has: page.getByRole('button', { name, exact: true }) });
  const sortButton = (name: string) => page.getByRole('button', { name, exact: true });

  it('sorts Ki numerically with blanks last, and reverses on a second click', async () => {
    await sortButton('Ki').click();
    expect(await column('Compound')).toEqual(['CPD-2', 'CPD-9', 'CPD-10', 'WEAK', 'NONE-1', 'BAD']);
    expect(await heading('Ki').getAttribute('aria-sort')).toBe('ascending');
    await sortButton('Ki').click();
    expect(await column('Compound')).toEqual(['WEAK', 'CPD-10', 'CPD-9', 'CPD-2', 'NONE-1', 'BAD']);
    expect(await heading('Ki').getAttribute('aria-sort')).toBe('descending');
    await sortButton('Compound').click();
    expect(await column('Compound')).toEqual(['BAD', 'CPD-10', 'CPD-2', 'CPD-9', 'NONE-1', 'WEAK']);
    await sortButton('#').click();
    expect(await column('#')).toEqual(['1', '2', '3', '4', '5', '6']);
    expect(watch.problems).toEqual([]);
  });

  it('filters by outcome and by search text', async () => {
    await page.selectOption('#outcome', 'failed');
    expect(await column('Compound')).toEqual(['BAD']);
    expect(await column('Headline')).toEqual(['bad.csv:3:2: rate "x" is not a number']);
    await page.selectOption('#outcome', 'decisive');
    expect(await column('Compound')).toEqual(['CPD-9', 'CPD-10', 'WEAK']);
    await page.fill('#search', 'cpd-1');
    expect(await column('Compound')).toEqual(['CPD-10']);
    expect(await page.textContent('#shown')).toBe('1 of 6 compounds shown');
    await page.selectOption('#outcome', '');
    await page.fill('#search', '');
    expect(await column('Compound')).toHaveLength(6);
    expect(watch.problems).toEqual([]);
  });
});

describe('batch index page at 1280 px with units, long paths and headlines (issue 13)', () => {
  let browser: HeadlessBrowser;
  let page: Page;
  let dir: string;
  const units = { substrate: 'uM', inhibitor: 'nM', rate: 'nM/s' };
  const many: CompoundSummary[] = Array.from({ length: 20 }, (_, k) => ({
    ...analysedRow(k + 1, `KT-${1000 + k}-hydroxy-variant`, k === 3 ? { value: null, low: 40000, high: null, interval: 'not-detected' } : wald(10 + k), 'decisive'),
    source: `campaign-2026/plates/day-${k % 3}/reader-export-${k}-with-a-long-name.csv`,
    headline: 'The data support mixed inhibition, leaning competitive.',
    units: k === 5 ? { substrate: null, inhibitor: null, rate: null } : units,
  }));

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'mechanist-index-wide-'));
    const file = join(dir, 'index.html');
    writeFileSync(file, indexPage(many, { settings: { errorModel: 'constant', level: 0.95, reports: true, analysis: {} }, finishedAt: new Date(0) }));
    browser = await launchChromium({ width: 1280, height: 900 });
    page = await browser.context.newPage();
    await page.goto(pathToFileURL(file).href);
  });
  afterAll(async () => {
    await browser?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('fits the screen: no sideways scrolling at 1280 px', async () => {
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(1280);
  });
  it('headings carry the run units; a constant not detected reads "> bound unit"; paths are shortened, the whole path in the title', async () => {
    const headings = await page.locator('th').allTextContents();
    expect(headings).toContain('Ki (nM)');
    expect(headings).toContain('Km (uM)');
    expect(headings).toContain('Vmax (nM/s)');
    expect(headings).toContain('Headline');
    const row4 = page.locator('tbody tr').nth(3);
    const cells = await row4.locator('td').allTextContents();
    expect(cells).toContain('> 40000');
    const file = row4.locator('td').nth(2);
    expect(await file.textContent()).toBe('…/reader-export-3-with-a-long-name.csv');
    expect(await file.getAttribute('title')).toBe('campaign-2026/plates/day-0/reader-export-3-with-a-long-name.csv');
    // a compound whose unit is not known says so in the cell rather than passing for the heading's unit
    expect(await page.locator('tbody tr').nth(5).textContent()).toContain('(unit not known)');
  });
});
