// /verification in Chromium against the production build (issue 10): a signed-in member opens
// the page, every case of the registry runs in the browser, and all of them pass; the plots of
// the field cases render; the CSV and PDF downloads carry the same checks.
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import Papa from 'papaparse';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { verificationCases } from '@/lib/verification';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';

let browser: Browser;
let page: Page;

beforeAll(async () => {
  const team = await createTestTeam('verification');
  const viewer = await createTestUser(team.id, 'viewer');
  browser = await launchBrowser();
  const context = await browser.newContext({ acceptDownloads: true, viewport: { width: 1440, height: 1000 } });
  page = await context.newPage();
  // Anonymous visitors are sent to sign in first, and come back here afterwards.
  await page.goto(appUrl('/verification'));
  await page.waitForURL((url) => url.pathname === '/sign-in', { timeout: 120_000 });
  await page.getByLabel('E-mail').fill(viewer.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === '/verification', { timeout: 240_000 });
}, 300_000);

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('/verification', () => {
  it('runs every case in the browser and all of them pass', { timeout: 300_000 }, async () => {
    const summary = page.getByTestId('verification-summary');
    await page.waitForSelector('[data-testid="verification-summary"][data-state="done"]', { timeout: 240_000 });
    const total = Number(await summary.getAttribute('data-total'));
    const passed = Number(await summary.getAttribute('data-passed'));
    const failed = Number(await summary.getAttribute('data-failed'));
    expect(total).toBe(verificationCases.length);
    expect(total).toBeGreaterThanOrEqual(25);
    expect(failed).toBe(0);
    expect(passed).toBe(total);
    // The table agrees with the summary, row by row, and says so in words, not colour alone.
    expect(await page.locator('tr[data-case-result="pass"]').count()).toBe(total);
    expect(await page.locator('tr[data-case-result="fail"], tr[data-case-result="waiting"]').count()).toBe(0);
    await expect(summary.textContent()).resolves.toContain(`All ${total} checks pass`);
    // The field cases show the profile and the log-log convergence plot with the measured order.
    const fieldIds = verificationCases.filter((c) => c.field).map((c) => c.id);
    expect(fieldIds.length).toBeGreaterThanOrEqual(3);
    for (const id of fieldIds) {
      const figure = page.getByTestId(`field-plots-${id}`);
      await figure.locator('.js-plotly-plot').nth(1).waitFor({ timeout: 30_000 });
      expect(await figure.locator('.js-plotly-plot').count()).toBe(2);
      await expect(figure.textContent()).resolves.toMatch(/measured order 1\.9\d\d|measured order 2\.0\d\d/);
    }
    await screenshot(page, 'verification');
  });

  it('a link to one case (as the sizing sheet makes with casesForMethod) lands on its row', { timeout: 300_000 }, async () => {
    const id = 'skin-effect-cu-240-90c-50hz';
    const linked = await page.context().newPage();
    await linked.goto(appUrl(`/verification#case-${id}`));
    await linked.waitForSelector('[data-testid="verification-summary"][data-state="done"]', { timeout: 240_000 });
    const target = linked.locator(`#case-${id}`);
    await expect(target.getAttribute('data-case-result')).resolves.toBe('pass');
    await expect(target.textContent()).resolves.toContain('IEC 60287-1-1');
    await linked.waitForFunction(
      (rowId) => {
        const box = document.getElementById(rowId)?.getBoundingClientRect();
        return Boolean(box && box.top >= 0 && box.top < window.innerHeight);
      },
      `case-${id}`,
      { timeout: 10_000 },
    );
    await linked.close();
  });

  it('downloads the CSV of what ran here: one row per compared value, all passing', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-csv').click()]);
    const file = await download.path();
    const csv = fs.readFileSync(file, 'utf8');
    const table = csv.split('\r\n\r\n')[1];
    const [columns, ...rows] = Papa.parse<string[]>(table.trim(), { skipEmptyLines: true }).data;
    const resultColumn = columns.indexOf('result');
    const expectedRows = verificationCases.reduce((n, c) => n + c.quantities.length, 0);
    expect(rows.length).toBe(expectedRows);
    expect(rows.every((r) => r[resultColumn] === 'pass')).toBe(true);
  });

  it('the PDF report is served to a signed-in member, not to anonymous callers', { timeout: 240_000 }, async () => {
    // The server renders the PDF once per process (all cases, then react-pdf): give it time on a busy machine.
    const response = await page.request.get(appUrl('/api/verification/report?format=pdf'), { timeout: 180_000 });
    expect(response.status()).toBe(200);
    expect(response.headers()['content-type']).toBe('application/pdf');
    const pdf = await response.body();
    const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: true });
    expect(text).toContain(`${verificationCases.length} of ${verificationCases.length} cases pass`);
    expect(text).toContain('licensed engineer');
    const anonymous = await fetch(appUrl('/api/verification/report'));
    expect(anonymous.status).toBe(401);
  });
});
