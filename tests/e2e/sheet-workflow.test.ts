// The sizing sheet in Chromium against the production build (scripts/test.sh): a designer signs in,
// creates a sheet, adds three candidates from the catalogue, sees the profile plot and the grid,
// changes the current and sees the hot spot change without saving, saves and submits; a reviewer
// acknowledges the review flags and approves; the author never sees an approve button.
// Screenshots of each step go to test-results/screenshots (git-ignored).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { createSheetFromProject, signInInBrowser, saveSheet } from './sheet-steps';
import { launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';

let browser: Browser;
let designerEmail: string;
let reviewerEmail: string;
let projectId: string;
let sheetUrl: string;

beforeAll(async () => {
  const team = await createTestTeam('e2e-sheet');
  await copyStandardCatalogueToTeam(team.id);
  const designer = await createTestUser(team.id, 'designer', { name: 'Edda Vale (test designer)' });
  const reviewer = await createTestUser(team.id, 'reviewer', { name: 'Ravi Okonkwo (test reviewer)' });
  designerEmail = designer.email;
  reviewerEmail = reviewer.email;
  projectId = (await createProject(team.id, designer.id, { name: 'Browser test yard', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

const signIn = (email: string): Promise<Page> => signInInBrowser(browser, email);

const hotSpotText = (page: Page) => page.getByTestId('hot-spot').innerText();

// Generous guards only (this is a loaded 2-core machine running the whole suite); nothing is timed.


describe('the sizing sheet in the browser', () => {
  it('a designer creates a sheet, compares three candidates live, saves and submits', async () => {
    const page = await signIn(designerEmail);
    await createSheetFromProject(page, projectId, { tag: 'BT-CH1', title: 'Browser test chiller feeder', installation: 'cable-in-air' });
    sheetUrl = page.url();
    // The empty state teaches what a candidate is; the caution is on the page.
    await page.getByTestId('no-candidates').waitFor();
    await expect(page.getByRole('note', { name: 'Caution' }).innerText()).resolves.toMatch(/licensed engineer/);
    await screenshot(page, 'sheet-01-new-sheet');

    // Design current 250 A for the comparison.
    await page.getByTestId('input-design-current').fill('250');
    await page.getByTestId('no-candidates').getByTestId('add-candidates').click();
    const picker = page.getByTestId('candidate-picker');
    await picker.waitFor();
    for (const section of ['95', '120', '150']) {
      await page.getByTestId('picker-search').fill(`copper XLPE/PVC ${section} mm²`);
      await picker.getByTestId('picker-add').first().click();
    }
    await screenshot(page, 'sheet-02-candidates-added');

    // The grid lists the three, and the profile plot is drawn (Plotly's SVG inside the plot box).
    const grid = page.getByTestId('candidate-grid');
    for (const section of ['95', '120', '150']) {
      await expect.poll(() => grid.innerText(), { timeout: 30_000 }).toContain(`${section} mm² copper XLPE/PVC single-core`);
    }
    await page.getByTestId('profile-plot').locator('.main-svg').first().waitFor({ timeout: 30_000 });
    await page.getByTestId('curve-plot').locator('.main-svg').first().waitFor({ timeout: 30_000 });

    // Choose the 150 mm² cable; the strip shows it.
    // (dispatched: the sticky result strip may cover the grid after Playwright scrolls to it)
    await grid.locator('[data-testid^="choose-demo-cu-150"]').dispatchEvent('click');
    await expect.poll(() => page.getByTestId('result-strip').innerText()).toMatch(/Chosen: 150 mm²/);
    await expect.poll(() => page.getByTestId('result-state').innerText(), { timeout: 30_000 }).toMatch(/Within limit|Margin under 10 %/);
    const before = await hotSpotText(page);
    expect(before).toMatch(/°C$/);
    await screenshot(page, 'sheet-03-profile-and-grid');

    // More current, hotter conductor — computed in the browser at once, not saved until the
    // draft saves itself (issue 23) or Save is pressed.
    await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: 30_000 }).toBe('Saved');
    const versionBefore = Number(await page.getByTestId('sheet-version').innerText());
    await page.getByTestId('input-design-current').fill('320');
    await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: 1_500 }).toBe('Not saved');
    await expect.poll(() => hotSpotText(page), { timeout: 30_000 }).not.toBe(before);
    const after = await hotSpotText(page);
    expect(Number.parseFloat(after)).toBeGreaterThan(Number.parseFloat(before));
    await screenshot(page, 'sheet-04-current-changed-unsaved');

    await saveSheet(page);
    await expect.poll(() => page.getByTestId('sheet-version').innerText()).toBe(String(versionBefore + 1));
    await page.getByTestId('submit-button').click();
    await expect.poll(() => page.locator('[data-status]').first().getAttribute('data-status'), { timeout: 30_000 }).toBe('in_review');
    // The author has no approve button, and the inputs are read-only in review.
    await expect(page.getByTestId('approve-button').count()).resolves.toBe(0);
    await expect(page.getByTestId('input-design-current').isDisabled()).resolves.toBe(true);
    await screenshot(page, 'sheet-05-submitted');
    await page.context().close();
  }, 300_000);

  it('a reviewer acknowledges each review flag and approves; the author still has no approve button', async () => {
    const page = await signIn(reviewerEmail);
    // The sheet waits in the reviewer's queue.
    await expect(page.getByRole('region', { name: /Waiting for your review/ }).innerText()).resolves.toMatch(/BT-CH1/);
    await page.click('a:has-text("BT-CH1")');
    await page.waitForURL(sheetUrl);
    await page.getByTestId('review-decision').waitFor();
    await expect(page.getByTestId('approve-button').isDisabled()).resolves.toBe(true);
    await expect(page.getByTestId('approve-blocked-reason').innerText()).resolves.toMatch(/Acknowledge every review flag/);
    await screenshot(page, 'sheet-06-reviewer-opens');

    const reviewFlags = page.locator('[data-testid^="flag-"][data-severity="review"]');
    const count = await reviewFlags.count();
    expect(count).toBeGreaterThan(0);
    const codes: string[] = [];
    for (let i = 0; i < count; i += 1) codes.push(((await reviewFlags.nth(i).getAttribute('data-testid')) ?? '').replace('flag-', ''));
    for (const code of codes) {
      await page.getByTestId(`ack-input-${code}`).fill('Accepted: checked against the plant room survey (browser test).');
      await page.getByTestId(`ack-button-${code}`).click();
      await page.getByTestId(`ack-${code}`).waitFor({ timeout: 30_000 });
    }
    await expect.poll(() => page.getByTestId('approve-button').isDisabled(), { timeout: 30_000 }).toBe(false);
    await screenshot(page, 'sheet-07-flags-acknowledged');
    await page.getByTestId('approve-button').click();
    await expect.poll(() => page.locator('[data-status]').first().getAttribute('data-status'), { timeout: 30_000 }).toBe('approved');
    await expect.poll(() => page.getByTestId('sheet-history').innerText()).toMatch(/approved it/);
    await screenshot(page, 'sheet-08-approved');
    await page.context().close();

    const author = await signIn(designerEmail);
    await author.goto(sheetUrl);
    await author.getByTestId('sheet-history').waitFor();
    await expect(author.getByTestId('approve-button').count()).resolves.toBe(0);
    await expect(author.getByTestId('revise-button').isVisible()).resolves.toBe(true);
    await expect(author.getByTestId('input-design-current').isDisabled()).resolves.toBe(true);
    await screenshot(author, 'sheet-09-author-sees-approved');
    await author.context().close();
  }, 300_000);
});
