// Managing documents in Chromium against the production build (issue 23): on a project page a
// designer renames a draft, duplicates an approved sheet (a new draft naming its origin), archives
// a sheet (it moves to "Archived") and deletes a draft; the approved sheet's Delete is refused with
// the reason; an admin finds the deleted draft under "Recently deleted" and restores it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { transitionSheet } from '@/db/queries/sheets';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { acknowledgeEveryReviewFlag, actorOf, newSubmittableSheet } from '../helpers/reviewSteps';

let browser: Browser;
let projectId: string;
let designerEmail: string;
let adminEmail: string;
const ids = {} as Record<'draft' | 'approved' | 'toArchive' | 'toDelete', string>;

beforeAll(async () => {
  const team = await createTestTeam('e2e-docs');
  const designer = await createTestUser(team.id, 'designer', { name: 'Ida Marsh (test designer)' });
  const reviewer = await createTestUser(team.id, 'reviewer');
  const admin = await createTestUser(team.id, 'admin');
  designerEmail = designer.email;
  adminEmail = admin.email;
  projectId = (await createProject(team.id, designer.id, { name: 'Documents browser yard' })).id;
  ids.draft = await newSubmittableSheet(team.id, projectId, designer, 'Old title');
  ids.approved = await newSubmittableSheet(team.id, projectId, designer, 'Signed feeder');
  await transitionSheet(team.id, actorOf(designer), ids.approved, 'submit');
  await acknowledgeEveryReviewFlag(team.id, ids.approved, reviewer);
  await transitionSheet(team.id, actorOf(reviewer), ids.approved, 'approve');
  ids.toArchive = await newSubmittableSheet(team.id, projectId, designer, 'Spare feeder');
  ids.toDelete = await newSubmittableSheet(team.id, projectId, designer, 'Mistaken feeder');
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

const menu = (page: Page, id: string) => page.locator(`details[data-document-id="${id}"]`);
async function openMenu(page: Page, id: string) {
  const details = menu(page, id);
  await details.locator('summary').click();
  return details;
}
const sheetTable = (page: Page) => page.locator('table').first();

describe('documents on the project page', () => {
  it('rename, duplicate, archive and delete, with approved revisions never deletable', async () => {
    const page = await signInInBrowser(browser, designerEmail);
    await page.goto(appUrl(`/projects/${projectId}`));

    // The approved sheet refuses Delete and says why.
    const approvedMenu = await openMenu(page, ids.approved);
    await expect(approvedMenu.getByTestId('doc-delete').isDisabled()).resolves.toBe(true);
    await expect(approvedMenu.getByTestId('doc-delete-why').innerText()).resolves.toMatch(/Approved revisions are never deleted; archive it instead/);

    // Duplicate it: a new draft naming its origin.
    await approvedMenu.getByTestId('doc-duplicate').click();
    await expect.poll(() => approvedMenu.getByTestId('doc-message').innerText(), { timeout: 30_000 }).toMatch(/Duplicated as “Copy of Signed feeder from revision 1”/);
    await expect.poll(() => sheetTable(page).innerText()).toContain('Copy of Signed feeder from revision 1');
    await screenshot(page, 'documents-01-duplicated');

    // Rename the draft.
    const draftMenu = await openMenu(page, ids.draft);
    await draftMenu.getByTestId('doc-rename').click();
    await draftMenu.getByTestId('doc-rename-input').fill('Chiller plant feeder');
    await draftMenu.getByTestId('doc-rename-save').click();
    await expect.poll(() => sheetTable(page).innerText(), { timeout: 30_000 }).toContain('Chiller plant feeder');
    expect(await sheetTable(page).innerText()).not.toContain('Old title');

    // Archive one: it leaves the list for the Archived section.
    const archiveMenu = await openMenu(page, ids.toArchive);
    await archiveMenu.getByTestId('doc-archive').click();
    await page.getByTestId('archived-in-project').waitFor({ timeout: 30_000 });
    await expect(page.getByTestId('archived-in-project').innerText()).resolves.toContain('Spare feeder');
    await expect.poll(() => sheetTable(page).innerText()).not.toContain('Spare feeder');

    // Delete a draft (asked to confirm first).
    const deleteMenu = await openMenu(page, ids.toDelete);
    await deleteMenu.getByTestId('doc-delete').click();
    await deleteMenu.getByTestId('doc-delete-confirm').click();
    await expect.poll(() => sheetTable(page).innerText(), { timeout: 30_000 }).not.toContain('Mistaken feeder');
    // Its page is gone for members.
    const gone = await page.goto(appUrl(`/sheets/${ids.toDelete}`));
    expect(await page.getByText(/not found|no such/i).count()).toBeGreaterThan(0);
    expect(gone?.status()).not.toBe(500);
    await page.context().close();
  });

  it('an admin restores the deleted draft from "Recently deleted"', async () => {
    const page = await signInInBrowser(browser, adminEmail);
    await page.getByRole('link', { name: 'Recently deleted' }).click();
    await page.waitForURL(/\/admin\/deleted$/);
    const row = page.getByTestId('deleted-item').filter({ hasText: 'Mistaken feeder' });
    await expect(row.innerText()).resolves.toMatch(/Sizing sheet[\s\S]*Documents browser yard[\s\S]*Ida Marsh/);
    await screenshot(page, 'documents-02-recently-deleted');
    await row.getByRole('button', { name: /Restore/ }).click();
    await expect.poll(() => page.getByTestId('deleted-item').filter({ hasText: 'Mistaken feeder' }).count(), { timeout: 30_000 }).toBe(0);
    await page.goto(appUrl(`/projects/${projectId}`));
    await expect(sheetTable(page).innerText()).resolves.toContain('Mistaken feeder');
    await page.context().close();
  });
});
