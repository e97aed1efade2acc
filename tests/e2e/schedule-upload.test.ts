// Issue 23, schedule upload: after a refused upload the page kept the previous file's preview and
// its "Size all" button, and the project list called the schedule "waiting for a file". In
// Chromium against the built app: the refused upload clears the old preview (also after a reload),
// says why the file was refused, and the project list gives the schedule's real state.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule } from '@/db/queries/schedules';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { circuitRows, scheduleCsv } from '../integration/schedules/helpers';

let browser: Browser;
let page: Page;
let projectId: string;
let scheduleId: string;

beforeAll(async () => {
  const team = await createTestTeam('schedule-upload-e2e');
  await copyStandardCatalogueToTeam(team.id);
  const designer = await createTestUser(team.id, 'designer');
  projectId = (await createProject(team.id, designer.id, { name: 'Upload refusals (e2e)' })).id;
  scheduleId = (await createSchedule(team.id, designer.id, { projectId, name: 'Feeders, second floor' })).id;
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1440, height: 1000 } })).newPage();
  await page.goto(appUrl(`/schedules/${scheduleId}`));
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(designer.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/schedules\//);
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function upload(name: string, bytes: Uint8Array) {
  await page.getByLabel(/^Schedule file/).setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(bytes) });
  await page.getByRole('button', { name: 'Read and check the file' }).click();
}

async function scheduleStateOnProjectPage(): Promise<string> {
  await page.goto(appUrl(`/projects/${projectId}`));
  return page.getByRole('listitem').filter({ hasText: 'Feeders, second floor' }).getByTestId('schedule-state').innerText();
}

describe('a refused schedule upload', () => {
  it('a checked file shows its preview, and the project list says it is ready to size (not "waiting for a file")', async () => {
    await upload('feeders.csv', scheduleCsv(circuitRows(3)));
    await page.getByRole('button', { name: 'Size all 3 circuits' }).waitFor();
    await page.getByRole('region', { name: 'Clean rows' }).waitFor();
    expect(await scheduleStateOnProjectPage()).toBe('✓ file checked: 3 circuits ready to size');
  });

  it('clears the previous preview and its button, says why, and stays cleared after a reload', async () => {
    await page.goto(appUrl(`/schedules/${scheduleId}`));
    await page.getByRole('button', { name: 'Size all 3 circuits' }).waitFor();
    await upload('photo.csv', new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46]));
    await page.getByRole('alert').filter({ hasText: 'binary' }).waitFor();
    const refused = page.getByRole('region', { name: 'Refused upload' });
    await refused.waitFor();
    expect(await refused.innerText()).toContain('photo.csv was refused');
    expect(await page.getByRole('button', { name: /^Size all/ }).count()).toBe(0);
    expect(await page.getByRole('region', { name: 'Clean rows' }).count()).toBe(0);
    expect(await page.getByText('Preview of feeders.csv').count()).toBe(0);
    await screenshot(page, 'schedule-upload-refused');
    await page.reload();
    await page.getByRole('region', { name: 'Refused upload' }).waitFor();
    expect(await page.getByRole('button', { name: /^Size all/ }).count()).toBe(0);
  });

  it('the project list says the last file was refused', async () => {
    expect(await scheduleStateOnProjectPage()).toBe('✕ file refused (photo.csv): upload a corrected one');
  });
});
