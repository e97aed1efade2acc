import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

/** The app under test: scripts/test.sh serves the production build here. */
export function appUrl(pathname = '/'): string {
  const base = process.env.APP_URL;
  if (!base) throw new Error('APP_URL is not set: run the browser tests through `npm test`');
  return new URL(pathname, base).toString();
}

/** Debian's Chromium, headless, with the flags this closed network needs (stack.md). */
export async function launchBrowser(): Promise<Browser> {
  // Playwright gives each launch a fresh, empty profile of its own (no --user-data-dir needed).
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** Screenshots are test artefacts, kept in test-results/ (git-ignored). */
export async function screenshot(page: Page, name: string): Promise<void> {
  const dir = path.resolve('test-results', 'screenshots');
  fs.mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}
