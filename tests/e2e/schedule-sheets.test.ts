// "Make sizing sheets" from chosen schedule rows in Chromium against the production build (issue
// 23): a designer ticks three rows of a sized schedule, asks for their sheets in one action, sees
// the progress while a worker makes them, and gets the list of the made sheets with links.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule, getSchedule, previewScheduleUpload, queueSchedule } from '@/db/queries/schedules';
import { listSheetsForProject } from '@/db/queries/sheets';
import { enqueueScheduleBatches, stopWebBoss } from '@/server/jobs/boss';
import { startScheduleWorker, type RunningWorker } from '@/server/jobs/scheduleWorker';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { circuitRows, scheduleCsv, seedSmallCatalogue, waitFor } from '../integration/schedules/helpers';

let browser: Browser;
let worker: RunningWorker | undefined;
let teamId: string;
let projectId: string;
let scheduleId: string;
let designerEmail: string;

beforeAll(async () => {
  teamId = (await createTestTeam('e2e-batch')).id;
  const designer = await createTestUser(teamId, 'designer');
  designerEmail = designer.email;
  await seedSmallCatalogue(teamId);
  projectId = (await createProject(teamId, designer.id, { name: 'Batch sheets browser yard' })).id;
  scheduleId = (await createSchedule(teamId, designer.id, { projectId, name: 'Eight feeders' })).id;
  await previewScheduleUpload(teamId, designer.id, scheduleId, { fileName: 'eight.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(8, 'E')) });
  await queueSchedule(teamId, designer.id, scheduleId, { dropBadRows: false }, enqueueScheduleBatches);
  worker = await startScheduleWorker({ workerId: 'batch-sheets-e2e' });
  await waitFor('the schedule to be sized', async () => (await getSchedule(teamId, scheduleId))?.status === 'done', 90_000, 250);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await stopWebBoss();
  await closeDb();
});

describe('sizing sheets for chosen schedule rows', () => {
  it('ticks three rows, makes their sheets in the background with progress, and lists them', async () => {
    const page = await signInInBrowser(browser, designerEmail);
    await page.goto(appUrl(`/schedules/${scheduleId}`));
    const button = page.getByTestId('make-sheets-button');
    await button.waitFor({ timeout: 60_000 });
    await expect(button.isDisabled()).resolves.toBe(true);
    for (const rowNumber of [2, 4, 7]) {
      await page.locator(`.ag-row[row-id="${rowNumber}"] input[type="checkbox"]`).first().check();
    }
    await expect.poll(() => button.innerText()).toBe('Make sizing sheets for the 3 chosen rows');
    await button.click();
    await expect.poll(() => page.getByTestId('make-sheets-progress').innerText(), { timeout: 60_000 }).toMatch(/Done: 3 of 3/);
    await expect(page.getByRole('progressbar', { name: 'Sheets made' }).getAttribute('aria-valuenow')).resolves.toBe('3');
    const made = page.getByTestId('made-sheets').getByRole('link');
    await expect(made.allInnerTexts()).resolves.toEqual([expect.stringMatching(/^E-0001\b/), expect.stringMatching(/^E-0003\b/), expect.stringMatching(/^E-0006\b/)]);
    await screenshot(page, 'schedule-sheets-01-made');

    const sheets = await listSheetsForProject(teamId, projectId);
    expect(sheets.map((s) => s.circuitTag).sort()).toEqual(['E-0001', 'E-0003', 'E-0006']);
    await made.first().click();
    await page.waitForURL(/\/sheets\/[0-9a-f-]{36}$/);
    expect(sheets.map((s) => s.id)).toContain(page.url().split('/').pop());
    await page.context().close();
  });
});
