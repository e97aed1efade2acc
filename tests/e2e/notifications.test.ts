// Review notifications in Chromium against the production build (issue 23): a designer submits a
// sheet from its page; the reviewer's header bell counts it, the Notifications page lists it with
// a link to the sheet, marking it read clears the count, the mail reached the catcher; a reviewer
// who turns in-app notices of submissions off is not counted for the next one.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { transitionSheetAndNotify } from '@/server/notifications/mail';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { actorOf, newSubmittableSheet } from '../helpers/reviewSteps';

let browser: Browser;
let teamId: string;
let projectId: string;
let designer: Awaited<ReturnType<typeof createTestUser>>;
let reviewer: Awaited<ReturnType<typeof createTestUser>>;

beforeAll(async () => {
  const team = await createTestTeam('e2e-notify');
  teamId = team.id;
  designer = await createTestUser(teamId, 'designer', { name: 'Nell Ashby (test designer)' });
  reviewer = await createTestUser(teamId, 'reviewer', { name: 'Oren Pike (test reviewer)' });
  projectId = (await createProject(teamId, designer.id, { name: 'Notification browser yard' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function mailTo(address: string, sheetId: string) {
  const catcher = process.env.MAIL_CATCHER_URL;
  if (!catcher) throw new Error('MAIL_CATCHER_URL is not set: run through npm test');
  for (let i = 0; i < 30; i++) {
    const messages = (await (await fetch(`${catcher}/messages`)).json()) as { to: string[]; subject: string; text: string }[];
    const found = messages.find((m) => m.to.includes(address) && m.text.includes(`/sheets/${sheetId}`));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`no mail to ${address} about ${sheetId}`);
}

describe('notifications in the browser', () => {
  it('a submission shows on the reviewer’s bell and list with a link; marking read clears the count; the mail was sent', async () => {
    const sheetId = await newSubmittableSheet(teamId, projectId, designer, 'Cold room feeder');
    const page = await signInInBrowser(browser, designer.email);
    await page.goto(appUrl(`/sheets/${sheetId}`));
    await page.getByTestId('submit-button').click();
    await expect.poll(() => page.locator('[data-status]').first().getAttribute('data-status'), { timeout: 30_000 }).toBe('in_review');

    const reviewerPage = await signInInBrowser(browser, reviewer.email);
    const bell = reviewerPage.getByTestId('notification-bell');
    await expect.poll(() => bell.getAttribute('aria-label')).toBe('Notifications, 1 unread');
    await expect(reviewerPage.getByTestId('notification-count').innerText()).resolves.toBe('1');
    await bell.click();
    await reviewerPage.waitForURL(/\/notifications$/);
    const item = reviewerPage.getByTestId('notification-item').first();
    await expect(item.innerText()).resolves.toMatch(/Nell Ashby \(test designer\) submitted .*Cold room feeder.* for review/);
    await expect(item.getByRole('link').getAttribute('href')).resolves.toBe(`/sheets/${sheetId}`);
    await screenshot(reviewerPage, 'notifications-01-list');
    await item.getByRole('button', { name: 'Mark read' }).click();
    await expect.poll(() => reviewerPage.getByTestId('notification-item').first().getAttribute('data-read')).toBe('yes');
    await expect.poll(() => reviewerPage.getByTestId('notification-bell').getAttribute('aria-label')).toBe('Notifications, none unread');

    const mail = await mailTo(reviewer.email, sheetId);
    expect(mail.text).toContain(appUrl(`/sheets/${sheetId}`));
    await page.context().close();
    await reviewerPage.context().close();
  });

  it('turning in-app notices of submissions off is honoured for the next submission', async () => {
    const page = await signInInBrowser(browser, reviewer.email);
    await page.goto(appUrl('/notifications'));
    await page.getByTestId('setting-sheet_submitted-inApp').uncheck();
    await page.getByRole('button', { name: 'Save these settings' }).click();
    await page.getByRole('status').filter({ hasText: 'Saved' }).waitFor();
    const sheetId = await newSubmittableSheet(teamId, projectId, designer, 'Dock door heaters');
    await transitionSheetAndNotify(teamId, actorOf(designer), sheetId, 'submit');
    await page.reload();
    await expect(page.getByTestId('notification-bell').getAttribute('aria-label')).resolves.toBe('Notifications, none unread');
    await expect(page.getByTestId('setting-sheet_submitted-inApp').isChecked()).resolves.toBe(false);
    // E-mail stayed on: the mail still went out.
    await mailTo(reviewer.email, sheetId);
    await page.context().close();
  });
});
