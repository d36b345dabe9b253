/**
 * The plan page in headless Chromium: no console error, no request beyond its own file, both
 * figures drawn with a non-zero size, no text of a figure outside its viewBox, no sideways scroll.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { runCli } from '../../src/cli/run-cli.js';
import { foreignRequests, launchChromium, watchPage, type HeadlessBrowser, type PageWatch } from '../helpers/chromium.js';
import { silentIo } from '../helpers/cli-capture.js';

let browser: HeadlessBrowser;
let page: Page;
let watch: PageWatch;
let out: string;

beforeAll(async () => {
  out = mkdtempSync(join(tmpdir(), 'mechanist-plan-page-'));
  const io = silentIo(out);
  expect(await runCli(['plan', '--km', '10uM..40uM', '--ki', '50nM..500nM', '--max-substrate', '400uM', '--wells', '48', '--simulations', '2', '--mechanisms', 'competitive,mixed', '--out', out], io)).toBe(0);
  browser = await launchChromium();
  page = await browser.context.newPage();
  watch = watchPage(page);
  await page.goto(pathToFileURL(join(out, 'plan.html')).href, { waitUntil: 'load' });
}, 60_000);

afterAll(async () => {
  await browser?.close();
  rmSync(out, { recursive: true, force: true });
});

describe('plan.html in Chromium', () => {
  it('loads cleanly and fetches nothing', () => {
    expect(watch.problems).toEqual([]);
    expect(foreignRequests(watch.requests)).toEqual([]);
  });
  it('both figures are drawn and keep their text inside', async () => {
    for (const id of ['fig-plan-grid', 'fig-plan-wells']) {
      const check = await page.evaluate((figId) => {
        const svg = document.getElementById(figId) as unknown as SVGSVGElement | null;
        if (!svg) return { found: false, width: 0, outside: [] as string[] };
        const vb = svg.viewBox.baseVal;
        const outside: string[] = [];
        for (const t of Array.from(svg.querySelectorAll('text'))) {
          const b = (t as SVGGraphicsElement).getBBox();
          const m = (t as SVGGraphicsElement).getCTM();
          const root = svg.getCTM();
          if (!m || !root) continue;
          const rel = root.inverse().multiply(m);
          const x0 = rel.a * b.x + rel.c * b.y + rel.e;
          const x1 = rel.a * (b.x + b.width) + rel.c * b.y + rel.e;
          if (Math.min(x0, x1) < vb.x - 0.5 || Math.max(x0, x1) > vb.x + vb.width + 0.5) outside.push(t.textContent ?? '');
        }
        return { found: true, width: svg.getBoundingClientRect().width, outside };
      }, id);
      expect(check.found, id).toBe(true);
      expect(check.width, id).toBeGreaterThan(100);
      expect(check.outside, id).toEqual([]);
    }
  });
  it('the page does not scroll sideways at 1280 px', async () => {
    const wide = await page.evaluate(() => document.documentElement.scrollWidth > document.documentElement.clientWidth);
    expect(wide).toBe(false);
  });
});
