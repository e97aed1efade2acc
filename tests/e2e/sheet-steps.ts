/**
 * Steps the browser tests of the sizing sheet share: signing in through the sign-in page, making
 * a sheet from a project page, and adding a catalogue bar through the candidate picker.
 */
import { expect } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { appUrl } from '../helpers/browser';
import { TEST_PASSWORD } from '../helpers/fixtures';

/** A new window signed in as `email` (test password), on the projects page. */
export async function signInInBrowser(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  await page.goto(appUrl('/sign-in'));
  await page.fill('#email', email);
  await page.fill('#password', TEST_PASSWORD);
  await page.click('button[type=submit]');
  await page.waitForURL(/\/projects/);
  return page;
}

/** Makes a sheet from the project page's form and opens it; returns the new sheet's id. */
export async function createSheetFromProject(page: Page, projectId: string, sheet: { tag: string; title: string; installation: string }): Promise<string> {
  await page.goto(appUrl(`/projects/${projectId}`));
  await page.fill('#sheet-tag', sheet.tag);
  await page.fill('#sheet-title', sheet.title);
  await page.selectOption('#sheet-installation', sheet.installation);
  await page.click('button:has-text("Create sheet")');
  await page.waitForURL(/\/sheets\/[0-9a-f-]{36}$/);
  return page.url().split('/').pop()!;
}

/**
 * Chooses the sheet's one candidate with its "Choose" link, as a designer must: nothing is chosen
 * for them (issue 22).
 */
export async function chooseOnlyCandidate(page: Page): Promise<void> {
  const choose = page.getByTestId('candidate-grid').locator('[data-testid^="choose-"]');
  await expect.poll(() => choose.count(), { timeout: 30_000 }).toBeGreaterThan(0);
  // dispatched: the sticky result strip may cover the grid after Playwright scrolls to it
  await choose.first().dispatchEvent('click');
  await expect.poll(() => page.getByTestId('result-strip').innerText(), { timeout: 30_000 }).toMatch(/Chosen:/);
}

/** Adds one copper bar of the team's catalogue to a sheet that has no candidates yet, and chooses it. */
export async function addCatalogueCopperBar(page: Page, size: string): Promise<void> {
  await page.getByTestId('no-candidates').getByTestId('add-candidates').click();
  const picker = page.getByTestId('candidate-picker');
  await picker.waitFor();
  await picker.locator('#pick-kind').selectOption('bar');
  await picker.locator('#pick-material').selectOption('copper');
  await page.getByTestId('picker-search').fill(size);
  await picker.getByRole('button', { name: `Add 1 × ${size} mm Copper bar`, exact: true }).click();
  await expect.poll(() => page.getByTestId('candidate-grid').innerText(), { timeout: 30_000 }).toContain(`${size} mm Copper bar`);
  await chooseOnlyCandidate(page);
}

/**
 * Saves the open sheet and waits for "Saved". A draft also saves itself two seconds after the last
 * edit (issue 23), so the Save button may already be disabled by then: Ctrl+S saves what is unsaved
 * and does nothing when the autosave got there first.
 */
export async function saveSheet(page: Page, timeoutMs = 30_000): Promise<void> {
  await page.keyboard.press('Control+s');
  await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: timeoutMs }).toBe('Saved');
}
