/**
 * The demo report in a real browser (headless Chromium): it loads with no console error and no
 * request beyond its own file, every figure has a non-zero size and a title, and no text of any
 * figure reaches outside its SVG's viewBox (text boxes from getBBox, carried to the SVG's user
 * space with the element's transform matrix).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { runCli } from '../../src/cli/run-cli.js';
import { launchChromium, type HeadlessBrowser } from './chromium.js';

let browser: HeadlessBrowser;
let page: Page;
let out: string;
const consoleErrors: string[] = [];
const foreignRequests: string[] = [];

beforeAll(async () => {
  out = mkdtempSync(join(tmpdir(), 'mechanist-report-'));
  expect(await runCli(['demo', '--out', out], { out: () => {}, err: () => {}, errIsTTY: false, cwd: out })).toBe(0);
  browser = await launchChromium();
  page = await browser.context.newPage();
  page.on('console', (m) => {
    if (m.type() === 'error' || m.type() === 'warning') consoleErrors.push(m.text());
  });
  page.on('pageerror', (e) => consoleErrors.push(String(e)));
  page.on('request', (r) => {
    if (!r.url().startsWith('file://')) foreignRequests.push(r.url());
  });
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
    expect(consoleErrors).toEqual([]);
    expect(foreignRequests).toEqual([]);
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
