// Issue 23, "the comparison grid hides its conclusions", in Chromium against the production build:
// at 1024 px (and 1440 px) the candidate's name and its marks (smallest passing, lowest
// life-cycle cost — the marks the library gives for these inputs, computed here in the test) are
// pinned on the left and in view while the other columns scroll; names are whole (wrapped, not
// cut); the columns sit in Thermal / Electrical / Cost groups; every check's verdict is words with
// an icon; and the columns a user picks are remembered for that user after a reload.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { closeDb, getDb } from '@/db/client';
import { users } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { createSheet } from '@/db/queries/sheets';
import { computeSheet, defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { candidateRecords } from '@/lib/sheet/sheetTables';
import { can } from '@/lib/auth/permissions';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { testCopperBar } from '../helpers/sheetCandidates';

let browser: Browser;
let teamId: string;
let designer: { id: string; email: string };
let otherDesignerEmail: string;
let sheetId: string;
let inputs: SheetInputs;

beforeAll(async () => {
  const team = await createTestTeam('e2e-grid');
  teamId = team.id;
  designer = await createTestUser(team.id, 'designer', { name: 'Ossian Brae (test designer)' });
  otherDesignerEmail = (await createTestUser(team.id, 'designer', { name: 'Lune Carrick (test designer)' })).email;
  const project = await createProject(team.id, designer.id, { name: 'Comparison grid yard', site: 'Test site (invented)' });
  inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit.designCurrentA = 1200;
  // Test inputs, invented: a copper price per kg and the density of copper (8 890 kg/m³, common
  // practice) so that the life-cycle cost, and with it its mark, exists.
  inputs.economics.included = true;
  const costs = { conductorPricePerKg: '9.50', densityKgPerM3: 8890 };
  inputs.candidates = [testCopperBar(40, 10), testCopperBar(60, 10), testCopperBar(80, 10), testCopperBar(100, 10), testCopperBar(120, 10)].map((c) => ({ ...c, costs }));
  inputs.chosenCandidateId = inputs.candidates[2].id;
  const actor = { userId: designer.id, can: (p: Parameters<typeof can>[1]) => can('designer', p) };
  sheetId = (await createSheet(team.id, actor, { projectId: project.id, circuitTag: 'CG-1', title: 'Comparison grid', inputs })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** What the library marks for these inputs: candidate id → its marks. */
function expectedMarks(): Map<string, string[]> {
  const computed = computeSheet(inputs);
  if (!computed.ok) throw new Error(computed.error.message);
  const records = candidateRecords(inputs.candidates, { evaluations: computed.comparison.evaluations, chosenCandidateId: inputs.chosenCandidateId });
  return new Map(records.filter((r) => r.marks.length > 0).map((r) => [r.id, r.marks]));
}

async function openGrid(page: Page): Promise<void> {
  await page.goto(appUrl(`/sheets/${sheetId}`));
  const grid = page.getByTestId('candidate-grid');
  await grid.waitFor({ timeout: 60_000 });
  for (const c of inputs.candidates) await expect.poll(() => grid.innerText(), { timeout: 30_000 }).toContain(c.label);
  await expect.poll(() => grid.locator('[col-id="state"]').filter({ hasText: /limit|Margin under|fails/ }).count(), { timeout: 30_000 }).toBeGreaterThanOrEqual(inputs.candidates.length);
}

/** Checks that the name and marks are pinned, whole and inside the window's width; returns the grid section for a screenshot. */
async function checkPinnedInView(page: Page, widthPx: number) {
  const marks = expectedMarks();
  expect(marks.size).toBeGreaterThan(0);
  const section = page.locator('section[aria-labelledby="compare-heading"]');
  await section.scrollIntoViewIfNeeded();
  // AG Grid 36 draws each row's pinned cells in its own sticky `.ag-grid-pinned-left-cells` part.
  const grid = page.getByTestId('candidate-grid');
  const pinnedCell = (id: string, colId: string) => grid.locator(`.ag-row[row-id="${id}"] .ag-grid-pinned-left-cells [col-id="${colId}"]`);
  for (const c of inputs.candidates) {
    const name = pinnedCell(c.id, 'label');
    await expect(name.innerText()).resolves.toBe(c.label);
    // Whole, not cut with an ellipsis: the text fits its cell.
    const fits = await name.evaluate((el) => el.scrollWidth <= el.clientWidth + 1);
    expect(fits).toBe(true);
    const box = (await name.boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(widthPx);
  }
  for (const [id, words] of marks) {
    const cell = pinnedCell(id, 'marks');
    for (const word of words) await expect(cell.innerText()).resolves.toContain(word);
    const box = (await cell.boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(widthPx);
  }
  return section;
}

/** Screenshots for the README (docs/screenshots); also a test artefact in test-results/. */
async function gridScreenshot(section: ReturnType<Page['locator']>, name: string): Promise<void> {
  const dir = path.resolve('test-results', 'screenshots');
  fs.mkdirSync(dir, { recursive: true });
  await section.screenshot({ path: path.join(dir, `${name}.png`) });
}

describe('the candidate comparison grid', () => {
  it('at 1024 px the name and its marks are pinned on the left and in view while the other columns scroll; names are whole', async () => {
    const page = await signInInBrowser(browser, designer.email);
    await page.setViewportSize({ width: 1024, height: 900 });
    await openGrid(page);
    // The other columns do not fit beside them at this width: they scroll, the pinned ones do not.
    // (AG Grid 36 scrolls the body in `.ag-grid-viewport`; scrolled to its right end here.)
    const overflowPx = await page.getByTestId('candidate-grid').evaluate((root) => {
      let most = 0;
      for (const el of root.querySelectorAll<HTMLElement>('.ag-grid-viewport, .ag-body-horizontal-scroll-viewport')) {
        most = Math.max(most, el.scrollWidth - el.clientWidth);
        el.scrollLeft = el.scrollWidth;
      }
      return most;
    });
    expect(overflowPx).toBeGreaterThan(0);
    await page.waitForTimeout(300);
    const section = await checkPinnedInView(page, 1024);
    await gridScreenshot(section, 'comparison-grid-1024');
    await page.context().close();
  }, 180_000);

  it('at 1440 px the same, with the columns grouped Thermal, Electrical, Cost and every verdict in words with an icon', async () => {
    const page = await signInInBrowser(browser, designer.email);
    await openGrid(page);
    const section = await checkPinnedInView(page, 1440);
    const grid = page.getByTestId('candidate-grid');
    const groupHeaders = await grid.locator('.ag-header-group-cell').allInnerTexts();
    for (const group of ['Candidate', 'Thermal', 'Electrical', 'Cost']) expect(groupHeaders.map((t) => t.trim())).toContain(group);

    for (const c of inputs.candidates) {
      const row = grid.locator(`.ag-row[row-id="${c.id}"] .ag-grid-scrolling-cells`);
      // State, short circuit, voltage drop and flags: an icon and words in each, not colour alone.
      await expect(row.locator('[col-id="state"]').innerText()).resolves.toMatch(/^[✔▲✖]\s*(Within limit|Margin under 10 %|Over limit)/);
      await expect(row.locator('[col-id="shortCircuit"]').innerText()).resolves.toMatch(/^(✔ passes|✖ fails|not checked)$/);
      await expect(row.locator('[col-id="voltageDrop"]').innerText()).resolves.toMatch(/(✔ within|✖ over) \d/);
      await expect(row.locator('[col-id="flags"]').innerText()).resolves.toMatch(/^(✔ none|([✖▲i] \d+ (blockers?|review|notes?))( · [✖▲i] \d+ (blockers?|review|notes?))*)$/);
    }
    await gridScreenshot(section, 'comparison-grid-1440');
    await page.context().close();
  }, 180_000);

  it('the columns a user picks are remembered for that user after a reload, and not for a colleague', async () => {
    const page = await signInInBrowser(browser, designer.email);
    await openGrid(page);
    const grid = page.getByTestId('candidate-grid');
    await expect(grid.locator('.ag-header-cell[col-id="mass"]').count()).resolves.toBe(1);
    await page.getByTestId('column-picker-toggle').click();
    await page.getByTestId('column-mass').uncheck();
    await page.getByTestId('column-arrangement').uncheck();
    await expect.poll(() => grid.locator('.ag-header-cell[col-id="mass"]').count()).toBe(0);
    // Stored on the user's row once the server action has answered.
    await expect
      .poll(async () => {
        const [row] = await getDb().select({ preferences: users.preferences }).from(users).where(and(eq(users.teamId, teamId), eq(users.id, designer.id)));
        return row?.preferences;
      }, { timeout: 15_000 })
      .toMatchObject({ candidateGridColumns: { mass: false, arrangement: false } });

    await page.reload();
    await openGrid(page);
    await expect(grid.locator('.ag-header-cell[col-id="mass"]').count()).resolves.toBe(0);
    await expect(grid.locator('.ag-header-cell[col-id="arrangement"]').count()).resolves.toBe(0);
    await expect(grid.locator('.ag-header-cell[col-id="lifeCycleCost"]').count()).resolves.toBe(1);
    await expect(page.getByTestId('column-picker-toggle').innerText()).resolves.toContain('2 hidden');
    await page.getByTestId('column-picker-toggle').click();
    await expect(page.getByTestId('column-mass').isChecked()).resolves.toBe(false);
    await page.context().close();

    const colleague = await signInInBrowser(browser, otherDesignerEmail);
    await openGrid(colleague);
    await expect(colleague.getByTestId('candidate-grid').locator('.ag-header-cell[col-id="mass"]').count()).resolves.toBe(1);
    await colleague.context().close();
  }, 180_000);
});
