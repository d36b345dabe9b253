/**
 * Headless Chromium for the browser tests: Debian's /usr/bin/chromium (or $CHROMIUM_PATH),
 * driven by playwright-core with a fresh profile folder; no browser is ever downloaded. Playwright
 * takes the profile folder as the first argument of launchPersistentContext (it refuses a
 * --user-data-dir flag in `args`).
 */
import { chromium, type BrowserContext } from 'playwright-core';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export const CHROMIUM_ARGS = [
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
