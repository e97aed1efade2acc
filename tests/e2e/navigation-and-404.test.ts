// Issue 23, navigation: the API tokens page and the API guide are reached from the user menu (they
// were linked from nowhere), and a page for an unknown or another team's id answers HTTP 404 with
// the not-found page — the same answer for both, so that ids of other teams do not leak.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule } from '@/db/queries/schedules';
import { createSheet } from '@/db/queries/sheets';
import { can } from '@/lib/auth/permissions';
import { newLinkToken } from '@/lib/auth/linkTokens';
import { defaultSheetInputs } from '@/lib/sheet';
import { appUrl, launchBrowser } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD, type Role } from '../helpers/fixtures';
import { signInOverHttp, type HttpClient } from './auth-http';

let browser: Browser;
let adminEmail: string;
let designerEmail: string;
let designer: HttpClient;
/** The designer signed in in Chromium: the status a browser gets (its user agent streams metadata) is what counts. */
let designerPage: Page;
const ownIds = { project: '', sheet: '', schedule: '' };
const foreignIds = { project: '', sheet: '', schedule: '' };

async function teamDocuments(teamId: string, adminId: string, designerId: string) {
  const project = await createProject(teamId, adminId, { name: `404 project ${randomUUID().slice(0, 8)}` });
  const actor = { userId: designerId, can: (p: Parameters<typeof can>[1]) => can('designer' satisfies Role, p) };
  const sheet = await createSheet(teamId, actor, { projectId: project.id, circuitTag: `NF-${randomUUID().slice(0, 6)}`, title: '404 sheet', inputs: defaultSheetInputs('cable-in-air') });
  const schedule = await createSchedule(teamId, designerId, { projectId: project.id, name: '404 schedule' });
  return { project: project.id, sheet: sheet.id, schedule: schedule.id };
}

beforeAll(async () => {
  const team = await createTestTeam('nav-404-a');
  const other = await createTestTeam('nav-404-b');
  const admin = await createTestUser(team.id, 'admin');
  const designerUser = await createTestUser(team.id, 'designer');
  adminEmail = admin.email;
  designerEmail = designerUser.email;
  Object.assign(ownIds, await teamDocuments(team.id, admin.id, designerUser.id));
  const otherAdmin = await createTestUser(other.id, 'admin');
  const otherDesigner = await createTestUser(other.id, 'designer');
  Object.assign(foreignIds, await teamDocuments(other.id, otherAdmin.id, otherDesigner.id));
  const answer = await signInOverHttp(designerEmail, TEST_PASSWORD);
  expect(answer.signedIn).toBe(true);
  designer = answer.client;
  browser = await launchBrowser();
  designerPage = await (await browser.newContext()).newPage();
  await designerPage.goto(appUrl('/projects'));
  await designerPage.waitForURL(/\/sign-in/);
  await designerPage.getByLabel('E-mail').fill(designerEmail);
  await designerPage.getByLabel('Password').fill(TEST_PASSWORD);
  await designerPage.getByRole('button', { name: 'Sign in' }).click();
  await designerPage.waitForURL(/\/projects/);
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('the user menu leads to the API pages', () => {
  it('an admin reaches the API tokens page and the API guide from the menu on any page', async () => {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    await page.goto(appUrl('/catalogue'));
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(adminEmail);
    await page.getByLabel('Password').fill(TEST_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/catalogue/);
    await page.getByRole('button', { name: /admin/ }).first().click();
    const menu = page.getByRole('navigation', { name: 'Administration' });
    await menu.getByRole('link', { name: 'API tokens' }).click();
    await page.waitForURL(/\/admin\/tokens$/);
    await page.getByRole('heading', { name: /^API tokens of / }).waitFor();
    await page.getByRole('button', { name: /admin/ }).first().click();
    await page.getByRole('navigation', { name: 'Administration' }).getByRole('link', { name: 'API guide' }).click();
    await page.waitForURL(/\/api-docs$/);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await context.close();
  });

  it('a designer gets the API guide but no API tokens link (the page is for admins)', async () => {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    await page.goto(appUrl('/projects'));
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(designerEmail);
    await page.getByLabel('Password').fill(TEST_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/projects/);
    await page.getByRole('button', { name: /designer/ }).first().click();
    const help = page.getByRole('navigation', { name: 'Help' });
    await help.getByRole('link', { name: 'API guide' }).waitFor();
    expect(await page.getByRole('link', { name: 'API tokens' }).count()).toBe(0);
    await context.close();
  });
});

describe('unknown and foreign ids answer 404', () => {
  const pages = {
    project: (id: string) => `/projects/${id}`,
    sheet: (id: string) => `/sheets/${id}`,
    schedule: (id: string) => `/schedules/${id}`,
  } as const;

  it('the team’s own documents answer 200 (the control)', async () => {
    for (const [kind, path] of Object.entries(pages)) {
      const response = await designer.request(path(ownIds[kind as keyof typeof ownIds]));
      expect(response.status, kind).toBe(200);
      expect((await designerPage.goto(appUrl(path(ownIds[kind as keyof typeof ownIds]))))?.status(), `${kind} in Chromium`).toBe(200);
    }
  });

  for (const [kind, path] of Object.entries(pages)) {
    it(`a ${kind} page: unknown uuid, malformed id and another team’s id all answer 404 with the not-found page`, async () => {
      const cases = { unknown: randomUUID(), malformed: 'not-an-id', foreign: foreignIds[kind as keyof typeof foreignIds] };
      const bodies: string[] = [];
      for (const [label, id] of Object.entries(cases)) {
        const response = await designer.request(path(id));
        expect(response.status, `${kind} ${label}`).toBe(404);
        const inBrowser = await designerPage.goto(appUrl(path(id)));
        expect(inBrowser?.status(), `${kind} ${label} in Chromium`).toBe(404);
        const body = await response.text();
        expect(body, `${kind} ${label}`).toMatch(/does not exist, or it belongs to another team/);
        bodies.push(body.replace(/[0-9a-f-]{36}/g, '').replace(/not-an-id/g, ''));
      }
      // The answer for another team's id says no more than the one for an id nobody has.
      expect(bodies[2].includes('404 project') || bodies[2].includes('404 sheet') || bodies[2].includes('404 schedule')).toBe(false);
    });
  }

  it('a share link, an invitation and a password-reset link with an unknown token answer 404', async () => {
    for (const path of [`/share/${newLinkToken()}`, `/invite/${newLinkToken()}`, `/reset/${newLinkToken()}`]) {
      const response = await fetch(appUrl(path), { redirect: 'manual' });
      expect(response.status, path).toBe(404);
      expect((await designerPage.goto(appUrl(path)))?.status(), `${path} in Chromium`).toBe(404);
    }
  });
});
