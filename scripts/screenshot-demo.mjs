#!/usr/bin/env node
/**
 * Saves a screenshot of the demo report (reports/demo/report.html) as docs/demo-report.png, for
 * the README. Uses Debian's headless Chromium (/usr/bin/chromium, or $CHROMIUM_PATH) through
 * playwright-core with a fresh profile folder; never downloads a browser.
 *
 *   node dist/cli/main.js demo && node scripts/screenshot-demo.mjs [--full]
 */
import { chromium } from 'playwright-core';
import { mkdtempSync, rmSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve, dirname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const report = join(root, 'reports', 'demo', 'report.html');
const out = join(root, 'docs', 'demo-report.png');
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const full = process.argv.includes('--full');

if (!existsSync(report)) {
  console.error(`${report} is missing: run "node dist/cli/main.js demo" first`);
  process.exit(1);
}
if (!existsSync(executablePath)) {
  console.error(`no Chromium at ${executablePath}: install it with "apt-get install -y chromium" (or set CHROMIUM_PATH)`);
  process.exit(1);
}

const profile = mkdtempSync(join(tmpdir(), 'mechanist-shot-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath,
  headless: true,
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  viewport: { width: 1280, height: 1500 },
  deviceScaleFactor: 1,
  offline: true,
});
try {
  const page = await context.newPage();
  await page.goto(pathToFileURL(report).href, { waitUntil: 'load' });
  await page.screenshot({ path: out, fullPage: full });
  console.log(`wrote ${out}`);
} finally {
  await context.close();
  rmSync(profile, { recursive: true, force: true });
}
