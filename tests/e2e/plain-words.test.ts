// Issue 22, "plain words instead of internal codes", in Chromium against the production build: a
// bus-bar sheet with the checks over time, along the run and in the enclosure switched on is
// submitted and one review flag acknowledged; the reviewer's sheet page (the approve button's
// reason, the flags, the check results, the history), the share page and its PDF, the catalogue
// and the Verification page show flag titles and published sources — no internal code
// (UPPER_CASE_WITH_UNDERSCORES) and no design file of this repository ("physics.md",
// "references.md") in what a person reads.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { acknowledgeFlag, createSheet, getSheet, transitionSheet } from '@/db/queries/sheets';
import { createShare } from '@/db/queries/shares';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { flagTitle, INTERNAL_CODE_PATTERN, REPOSITORY_FILE_PATTERN } from '@/lib/sheet/flagWords';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { testCopperBar } from '../helpers/sheetCandidates';
import { actorOf } from '../integration/share/shareFixtures';

let browser: Browser;
let teamId: string;
let designer: { id: string; role: 'designer'; email: string };
let reviewer: { id: string; role: 'reviewer'; email: string; name: string };
let sheetId: string;
let acknowledgedCode: string;

function barWithChecks(): SheetInputs {
  const bar = testCopperBar(100, 10);
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 1500, lengthM: 12 };
  i.fault = { checked: true, currentA: 30000, durationS: 1 };
  i.candidates = [bar];
  i.chosenCandidateId = bar.id;
  i.overTime = { checked: true, overloadCurrentA: 2000, overloadDurationS: 600, dailyProfileA: Array.from({ length: 24 }, (_, h) => (h >= 9 && h < 17 ? 1600 : 900)), faultWithCoverings: true };
  i.alongRun = { checked: true, lengthM: 8, startEnd: 'terminal', startTemperatureC: 80, endEnd: 'terminal', endTemperatureC: 70, joints: [{ positionM: 3, resistanceMicroOhm: null }] };
  i.enclosureAir = { ...i.enclosureAir, checked: true, otherLossesW: 200, routeLengthInsideM: 2, outsideAirC: 30, backCovered: true, sidesCovered: 1 };
  return i;
}

/** The codes and file names found in a text (empty when it reads in plain words). */
function unplain(text: string): string[] {
  return [...(text.match(INTERNAL_CODE_PATTERN) ?? []), ...(text.match(REPOSITORY_FILE_PATTERN) ?? [])];
}

async function visibleText(page: Page): Promise<string> {
  return page.evaluate(() => document.body.innerText);
}

beforeAll(async () => {
  const team = await createTestTeam('e2e-plain');
  teamId = team.id;
  await copyStandardCatalogueToTeam(team.id);
  designer = (await createTestUser(team.id, 'designer', { name: 'Oriel Pask (test designer)' })) as typeof designer;
  reviewer = (await createTestUser(team.id, 'reviewer', { name: 'Rhea Tamsin (test reviewer)' })) as typeof reviewer;
  const project = await createProject(team.id, designer.id, { name: 'Plain words yard', site: 'Test site (invented)' });
  const created = await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: 'BT-PLAIN1', title: 'Browser test busway with checks', inputs: barWithChecks() });
  sheetId = created.id;
  await transitionSheet(team.id, actorOf(designer), sheetId, 'submit');
  const sheet = (await getSheet(team.id, sheetId))!;
  const reviewFlags = sheet.result!.chosenFlags.filter((f) => f.severity === 'review');
  // Two review flags at least: one acknowledged (the history names it), one left (the approve button names it).
  expect(reviewFlags.length).toBeGreaterThan(1);
  acknowledgedCode = reviewFlags[0].code;
  await acknowledgeFlag(team.id, actorOf(reviewer), sheetId, acknowledgedCode, 'Accepted for this site (test).');
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('plain words on every person-facing surface', () => {
  it('the reviewer’s sheet page: approve reason, flags, check results and history name titles, never codes', async () => {
    const page = await signInInBrowser(browser, reviewer.email);
    await page.goto(appUrl(`/sheets/${sheetId}`));
    const reason = page.getByTestId('approve-blocked-reason');
    await expect.poll(() => reason.innerText(), { timeout: 30_000 }).toMatch(/^Acknowledge every review flag first: /);
    const sheet = (await getSheet(teamId, sheetId))!;
    const left = sheet.result!.chosenFlags.filter((f) => f.severity === 'review' && f.code !== acknowledgedCode);
    for (const f of left) await expect(reason.innerText()).resolves.toContain(flagTitle(f.code));
    await expect.poll(() => page.getByTestId('sheet-history').innerText(), { timeout: 30_000 }).toContain(`acknowledged “${flagTitle(acknowledgedCode)}”`);
    await expect.poll(() => page.getByTestId('flags-panel').innerText(), { timeout: 30_000 }).toContain(flagTitle(acknowledgedCode));
    await screenshot(page, 'plain-01-reviewer-sheet');
    expect(unplain(await visibleText(page))).toEqual([]);
    await page.context().close();
  });

  it('the share page and its PDF print titles and published sources only', async () => {
    const share = (await createShare(teamId, designer.id, sheetId, { expiresInDays: 3 }))!;
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    await page.goto(appUrl(`/share/${share.token}`));
    await expect.poll(() => visibleText(page), { timeout: 30_000 }).toContain('BT-PLAIN1');
    await screenshot(page, 'plain-02-share');
    const shown = await visibleText(page);
    expect(shown).toContain(flagTitle(acknowledgedCode));
    expect(unplain(shown)).toEqual([]);
    await context.close();

    const pdf = await fetch(appUrl(`/share/${share.token}/pdf`));
    expect(pdf.status).toBe(200);
    const { text } = await extractText(await getDocumentProxy(new Uint8Array(await pdf.arrayBuffer())), { mergePages: true });
    const pdfText = (text as string).normalize('NFKC').replace(/\s+/g, ' ');
    expect(pdfText).toContain('BT-PLAIN1');
    expect(unplain(pdfText)).toEqual([]);
  });

  it('the catalogue and the Verification page name published documents, never a design file', async () => {
    const page = await signInInBrowser(browser, designer.email);
    await page.goto(appUrl('/catalogue'));
    await expect.poll(() => page.locator('.ag-row').count(), { timeout: 30_000 }).toBeGreaterThan(0);
    expect(unplain(await visibleText(page))).toEqual([]);
    await page.goto(appUrl('/verification'));
    await expect.poll(() => visibleText(page), { timeout: 30_000 }).toMatch(/IEC 60287-1-1/);
    await screenshot(page, 'plain-03-verification');
    expect(unplain(await visibleText(page))).toEqual([]);
    await page.context().close();
  });
});
