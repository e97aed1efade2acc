// The production build served by scripts/test.sh, seen through Debian's Chromium (issue 2).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('landing page and health over HTTP', () => {
  it('says what Ampwarden is for, shows the caution, and loads no resource from another origin', async () => {
    const page = await browser.newPage();
    const foreign: string[] = [];
    page.on('request', (request) => {
      const url = new URL(request.url());
      if (url.origin !== new URL(appUrl()).origin && url.protocol.startsWith('http')) foreign.push(request.url());
    });
    await page.goto(appUrl('/'), { waitUntil: 'networkidle' });
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/bus bars and cables/i);
    await expect(page.getByRole('note', { name: 'Caution' }).textContent()).resolves.toMatch(/licensed engineer/);
    // The fonts are our own files, served from the app's origin.
    const fontsLoaded = await page.evaluate(() => document.fonts.check('16px "plexSans"') || document.fonts.size > 0);
    expect(fontsLoaded).toBe(true);
    await screenshot(page, 'landing');
    expect(foreign).toEqual([]);
    await page.close();
  });

  it('/api/health reports the database round trip', async () => {
    const response = await fetch(appUrl('/api/health'));
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toMatchObject({ status: 'ok', db: 'ok' });
    expect(body.dbRoundTripMs).toBeGreaterThan(0);
  });
});
