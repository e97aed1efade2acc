// Issue 22, "results that match the checks", in Chromium against the production build: the first
// candidate added is not chosen for the designer — the sheet asks them to choose, and cannot be
// submitted until they do; a chosen candidate with a blocker cannot be submitted either: the
// submit button is disabled and says why, naming the blocker by its title, and the server refuses
// the same submission (409) with the same words. With a passing chosen candidate it submits.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { getSheet } from '@/db/queries/sheets';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { flagTitle } from '@/lib/sheet/flagWords';
import { createSheetFromProject, saveSheet, signInInBrowser } from './sheet-steps';
import { launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';

let browser: Browser;
let teamId: string;
let designerEmail: string;
let projectId: string;

beforeAll(async () => {
  const team = await createTestTeam('e2e-choice');
  teamId = team.id;
  await copyStandardCatalogueToTeam(team.id);
  const designer = await createTestUser(team.id, 'designer', { name: 'Oriel Pask (test designer)' });
  designerEmail = designer.email;
  projectId = (await createProject(team.id, designer.id, { name: 'Candidate choice yard', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** Saves at once (Ctrl+S), whether or not an autosave has started. */
const save = (page: Page): Promise<void> => saveSheet(page);

/** The server's answer to a submission asked for from the page (same origin, the designer's session). */
async function submitOverHttp(page: Page, sheetId: string): Promise<{ status: number; body: { error?: { code: string; message: string } } }> {
  return page.evaluate(async (id) => {
    const response = await fetch(`/api/sheets/${id}/transitions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ action: 'submit' }) });
    return { status: response.status, body: await response.json() };
  }, sheetId);
}

describe('an explicit candidate choice, and no submission with a blocker', () => {
  it('asks the designer to choose, refuses submission without a choice and with a blocker (button and server), then submits a passing choice', async () => {
    const page = await signInInBrowser(browser, designerEmail);
    const sheetId = await createSheetFromProject(page, projectId, { tag: 'BT-CHOOSE1', title: 'Browser test riser choice', installation: 'bar-on-edge' });
    // 60 × 10 mm copper carries about a thousand amperes on edge in still air: 1500 A is over its limit.
    await page.getByTestId('input-design-current').fill('1500');
    await page.getByTestId('no-candidates').getByTestId('add-candidates').click();
    const picker = page.getByTestId('candidate-picker');
    await picker.locator('#pick-kind').selectOption('bar');
    await picker.locator('#pick-material').selectOption('copper');
    await page.getByTestId('picker-search').fill('60 × 10');
    await picker.getByRole('button', { name: 'Add 1 × 60 × 10 mm Copper bar', exact: true }).click();
    const grid = page.getByTestId('candidate-grid');
    await expect.poll(() => grid.innerText(), { timeout: 30_000 }).toContain('60 × 10 mm Copper bar');

    // Nothing chosen: a prompt, a "Choose" link, no "Chosen" mark.
    await expect.poll(() => page.getByTestId('choose-prompt').count(), { timeout: 30_000 }).toBe(1);
    await expect(page.getByTestId('choose-prompt').innerText()).resolves.toContain('No candidate is chosen yet');
    await expect(grid.locator('[data-testid^="chosen-"]').count()).resolves.toBe(0);
    await save(page);
    expect((await getSheet(teamId, sheetId))!.inputs.chosenCandidateId).toBeNull();
    const submit = page.getByTestId('submit-button');
    await expect.poll(() => submit.isDisabled(), { timeout: 30_000 }).toBe(true);
    await expect(page.getByTestId('submit-blocked-reason').innerText()).resolves.toBe('Choose a candidate before submitting the sheet: none is chosen yet.');
    const unchosen = await submitOverHttp(page, sheetId);
    expect(unchosen.status).toBe(409);
    expect(unchosen.body.error?.code).toBe('not_ready');
    await screenshot(page, 'choice-01-nothing-chosen');

    // Chosen, but over its limit: still refused, the blocker named by its title.
    await grid.locator('[data-testid^="choose-"]').first().dispatchEvent('click');
    await expect.poll(() => page.getByTestId('result-strip').innerText(), { timeout: 30_000 }).toMatch(/Chosen:/);
    await expect(page.getByTestId('choose-prompt').count()).resolves.toBe(0);
    await save(page);
    const blocker = flagTitle('OVER_LIMIT');
    await expect.poll(() => page.getByTestId('submit-blocked-reason').innerText(), { timeout: 30_000 }).toContain(`The chosen candidate has a blocker, so the sheet cannot be submitted: ${blocker}`);
    await expect(submit.isDisabled()).resolves.toBe(true);
    const blocked = await submitOverHttp(page, sheetId);
    expect(blocked.status).toBe(409);
    expect(blocked.body.error?.code).toBe('blocked');
    expect(blocked.body.error?.message).toContain(blocker);
    expect((await getSheet(teamId, sheetId))!.status).toBe('draft');
    await screenshot(page, 'choice-02-blocker-refused');

    // A current the bar carries: the button submits.
    await page.getByTestId('input-design-current').fill('500');
    await save(page);
    await expect.poll(() => submit.isDisabled(), { timeout: 30_000 }).toBe(false);
    await expect(page.getByTestId('submit-blocked-reason').count()).resolves.toBe(0);
    await submit.click();
    await expect.poll(() => page.locator('[data-status]').first().getAttribute('data-status'), { timeout: 30_000 }).toBe('in_review');
    await page.context().close();
  });
});
