// Issue 22, "a document a licensed engineer can sign", in Chromium against the production build:
// a reviewer enters their licence number and jurisdiction on their profile (reached from the user
// menu) and approves a submitted bus-bar sheet on its page; the sheet's PDF, fetched with the
// reviewer's session, reads back (unpdf) as a calculation package: document number on every
// page, the revision table with who edited, submitted and reviewed, the approval statement with
// the reviewer's name, licence and jurisdiction, the signature and stamp area, "Page n of N", and
// the plots (hot spot against current, over time, along the run).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { acknowledgeFlag, createSheet, getSheet, transitionSheet } from '@/db/queries/sheets';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { documentNumberOf } from '@/lib/sheet/records';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { testCopperBar } from '../helpers/sheetCandidates';
import { actorOf } from '../integration/share/shareFixtures';

let browser: Browser;
let teamId: string;
let designer: { id: string; role: 'designer'; name: string };
let reviewer: { id: string; role: 'reviewer'; name: string; email: string };
let sheetId: string;

function barInputs(): SheetInputs {
  const bar = testCopperBar(100, 10);
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 1200, lengthM: 12 };
  i.environment = { ...i.environment, ambientC: 35 };
  i.candidates = [bar];
  i.chosenCandidateId = bar.id;
  i.overTime = { checked: true, overloadCurrentA: 1400, overloadDurationS: 600, dailyProfileA: Array.from({ length: 24 }, (_, h) => (h >= 9 && h < 17 ? 1250 : 700)), faultWithCoverings: false };
  i.alongRun = { checked: true, lengthM: 8, startEnd: 'terminal', startTemperatureC: 70, endEnd: 'terminal', endTemperatureC: 65, joints: [{ positionM: 4, resistanceMicroOhm: 10 }] };
  return i;
}

beforeAll(async () => {
  const team = await createTestTeam('e2e-package');
  teamId = team.id;
  designer = (await createTestUser(team.id, 'designer', { name: 'Ines Marlow (test designer)' })) as typeof designer;
  reviewer = (await createTestUser(team.id, 'reviewer', { name: 'Rhea Tamsin (test reviewer)' })) as typeof reviewer;
  const project = await createProject(team.id, designer.id, { name: 'Package yard', site: 'Test site (invented)' });
  sheetId = (await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: 'BT-PKG1', title: 'Browser test busway package', inputs: barInputs() })).id;
  await transitionSheet(team.id, actorOf(designer), sheetId, 'submit');
  const sheet = (await getSheet(team.id, sheetId))!;
  for (const f of sheet.result!.chosenFlags.filter((x) => x.severity === 'review')) await acknowledgeFlag(team.id, actorOf(reviewer), sheetId, f.code, 'Accepted for this site (test).');
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('the calculation package', () => {
  it('the reviewer enters a licence on their profile, approves, and the PDF carries every element a signature needs', async () => {
    const page = await signInInBrowser(browser, reviewer.email);
    await page.getByRole('button', { name: /Rhea Tamsin/ }).click();
    await page.getByTestId('profile-link').click();
    await page.waitForURL(/\/profile$/);
    await page.fill('#licence-number', 'PE-40417 (test)');
    await page.fill('#licence-jurisdiction', 'Invented Province Board of Engineers');
    await page.getByTestId('profile-save').click();
    await expect.poll(() => page.getByTestId('profile-message').innerText(), { timeout: 30_000 }).toContain('Saved');
    await screenshot(page, 'package-01-profile');

    await page.goto(appUrl(`/sheets/${sheetId}`));
    const approve = page.getByTestId('approve-button');
    await expect.poll(() => approve.isDisabled(), { timeout: 30_000 }).toBe(false);
    await approve.click();
    await expect.poll(() => page.locator('[data-status]').first().getAttribute('data-status'), { timeout: 30_000 }).toBe('approved');

    const bytes = await page.evaluate(async (id) => {
      const response = await fetch(`/api/sheets/${id}/pdf`);
      return { status: response.status, data: Array.from(new Uint8Array(await response.arrayBuffer())) };
    }, sheetId);
    expect(bytes.status).toBe(200);
    const { text } = await extractText(await getDocumentProxy(new Uint8Array(bytes.data)), { mergePages: false });
    const pages = (text as string[]).map((p) => p.normalize('NFKC').replace(/\s+/g, ' '));
    const all = pages.join(' ');
    const number = documentNumberOf(sheetId);
    pages.forEach((p, n) => {
      expect(p).toContain(number);
      expect(p).toContain(`Page ${n + 1} of ${pages.length}`);
    });
    expect(all).toContain('Revisions Rev. Status What changed Edited by Submitted by Reviewed by Decision');
    expect(all).toContain(`1 Approved First issue ${designer.name} ${designer.name} ${reviewer.name} Approved`);
    expect(all).toContain('I have checked this calculation package');
    expect(all).toContain(`Approved by ${reviewer.name}, licence or registration PE-40417 (test) (Invented Province Board of Engineers), on`);
    for (const words of ['Signature', 'Professional stamp or seal', 'Licence or registration number: PE-40417 (test)', 'Jurisdiction: Invented Province Board of Engineers']) expect(all).toContain(words);
    for (const plot of ['Plot: Hot spot against current', 'Plot: Hot spot during the overload', 'Plot: Hot spot over the daily load cycle', 'Plot: Temperature along the run between the terminals']) expect(all).toContain(plot);
    await page.context().close();
  });
});
