/**
 * Headless Chromium for the browser tests (test/browser, test/batch): Debian's /usr/bin/chromium (or $CHROMIUM_PATH),
 * driven by playwright-core with a fresh profile folder; no browser is ever downloaded. Playwright
 * takes the profile folder as the first argument of launchPersistentContext (it refuses a
 * --user-data-dir flag in `args`).
 */
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

export interface HeadlessBrowser {
  context: BrowserContext;
  close(): Promise<void>;
}

export async function launchChromium(viewport = { width: 1280, height: 1000 }): Promise<HeadlessBrowser> {
  if (!existsSync(CHROMIUM_PATH)) throw new Error(`no Chromium at ${CHROMIUM_PATH}: apt-get install -y chromium (or set CHROMIUM_PATH)`);
  const profile = mkdtempSync(join(tmpdir(), 'mechanist-chromium-'));
  const context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM_PATH, headless: true, args: CHROMIUM_ARGS, viewport });
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export interface PageWatch {
  /** Console errors and warnings, and uncaught page errors, as "type: text". */
  problems: string[];
  /** Every URL the page requested, its own file included. */
  requests: string[];
}

/** Records what a page complains about and what it fetches, from the moment it is called. */
export function watchPage(page: Page): PageWatch {
  const watch: PageWatch = { problems: [], requests: [] };
  page.on('console', (m) => {
    if (m.type() === 'error' || m.type() === 'warning') watch.problems.push(`${m.type()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => watch.problems.push(`pageerror: ${e.message}`));
  page.on('request', (r) => watch.requests.push(r.url()));
  return watch;
}

/** The URLs among `requests` that are not local files. */
export function foreignRequests(requests: string[]): string[] {
  return requests.filter((url) => !url.startsWith('file://'));
}
