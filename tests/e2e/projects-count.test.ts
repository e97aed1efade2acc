// The projects list in Chromium (issue 23): a project with nine sizing sheets says "9 sizing
// sheets" to every role (it said "0 sizing sheets" for all of them).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSheet } from '@/db/queries/sheets';
import { defaultSheetInputs } from '@/lib/sheet';
import { signInInBrowser } from './sheet-steps';
import { launchBrowser } from '../helpers/browser';
import { createTestTeam, createTestUser, type Role } from '../helpers/fixtures';
import { actorOf } from '../helpers/reviewSteps';

let browser: Browser;
const emails = {} as Record<Role, string>;

beforeAll(async () => {
  const team = await createTestTeam('e2e-count');
  for (const role of ['admin', 'designer', 'reviewer', 'viewer'] as const) emails[role] = (await createTestUser(team.id, role)).email;
  const designer = await createTestUser(team.id, 'designer');
  const project = (await createProject(team.id, designer.id, { name: 'Nine-circuit yard' })).id;
  await createProject(team.id, designer.id, { name: 'Empty yard' });
  for (let i = 1; i <= 9; i++) {
    await createSheet(team.id, actorOf(designer), { projectId: project, circuitTag: `N-${i}`, title: `Feeder ${i}`, inputs: defaultSheetInputs('cable-in-air') });
  }
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('the projects list counts sheets', () => {
  it.each(['admin', 'designer', 'reviewer', 'viewer'] as const)('for the %s: 9 sizing sheets, and 0 for an empty project', async (role) => {
    const page = await signInInBrowser(browser, emails[role]);
    await expect(page.getByRole('link', { name: /Nine-circuit yard/ }).innerText()).resolves.toMatch(/\b9 sizing sheets\b/);
    await expect(page.getByRole('link', { name: /Empty yard/ }).innerText()).resolves.toMatch(/\b0 sizing sheets\b/);
    await page.context().close();
  });
});
