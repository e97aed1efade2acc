// The rated cross-section on the sheet, in Chromium against the production build (issue 17):
// - a designer lays the buried circuit flat and spaced beside one other circuit, sees the drawing
//   with every cable's temperatures and the governing cable, saves, reloads and sees the same; the
//   figures on screen are those lib/sheet computes for the saved inputs (run here in the test) and
//   the saved inputs are SI;
// - an overlapping arrangement is refused on the field, cannot be saved from the page, and the save
//   API answers 400 naming the field while the stored sheet stays as it was. Hand geometry: two
//   touching trefoils of D_e 25.2 mm (testCable240) need their centres ≥ 2·D_e = 50.4 mm apart;
// - a real version-4 sheet with the snapshot solver 0.1.0 made (tests/fixtures, Ampwarden commit
//   e533b42) shows "Saved with an earlier method — re-evaluate" with the saved and the current
//   figures, on the sheet and on its share link.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb, getDb } from '@/db/client';
import { sheets } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { createSheet, getSheet } from '@/db/queries/sheets';
import { createShare } from '@/db/queries/shares';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { computeSheet } from '@/lib/sheet/compute';
import { cableTitle, governingCableOf, governingText } from '@/lib/sheet/groupWords';
import { figuresText, reEvaluationOf } from '@/lib/sheet/reEvaluation';
import { formatNumber, formatQuantity } from '@/lib/units';
import { signInInBrowser, saveSheet } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { testCable240 } from '../helpers/sheetCandidates';
import storedV4 from '../fixtures/sheet-v4-solver-0.1.0.json';

let browser: Browser;
let teamId: string;
let designer: { id: string; email: string; role: 'designer' };
let projectId: string;

const actor = () => ({ userId: designer.id, can: () => true });
const t = (c: number) => formatQuantity(c, 'temperature', 'si', { digits: 4 });

beforeAll(async () => {
  const team = await createTestTeam('e2e-groups');
  teamId = team.id;
  const user = await createTestUser(team.id, 'designer', { name: 'Ines Carrow (test designer)', unitSystem: 'si' });
  designer = { id: user.id, email: user.email, role: 'designer' };
  projectId = (await createProject(team.id, designer.id, { name: 'Groups browser yard', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** A buried draft with the 240 mm² test cable chosen (a touching trefoil alone, as a new sheet starts). */
async function buriedSheet(tag: string): Promise<string> {
  const inputs = defaultSheetInputs('buried');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 300, lengthM: 90 };
  inputs.installation = { ...inputs.installation, depthM: 0.8, soilResistivityKmPerW: 1.2, groundC: 20 };
  inputs.candidates = [testCable240];
  inputs.chosenCandidateId = testCable240.id;
  const created = await createSheet(teamId, actor(), { projectId, circuitTag: `${tag}-${Math.random().toString(36).slice(2, 6)}`.toUpperCase(), title: 'Buried feeder (browser test)', inputs });
  return created.id;
}

describe('the cross-section on the sheet', () => {
  it('a designer lays the cables flat and spaced beside another circuit, sees the drawing and the governing cable, saves and reloads', async () => {
    const sheetId = await buriedSheet('BG1');
    const page = await signInInBrowser(browser, designer.email);
    await page.goto(appUrl(`/sheets/${sheetId}`));
    await page.getByTestId('cross-section').waitFor({ timeout: 60_000 });
    // The new sheet's trefoil alone, as computed.
    await expect.poll(() => page.getByTestId('result-governing').innerText(), { timeout: 30_000 }).toContain('every cable of this circuit alike');

    // Keyboard: choose the formation with the keyboard, type the spacings.
    await page.locator('#formation').focus();
    await page.keyboard.press('ArrowDown'); // trefoil → flat, horizontal row
    await expect.poll(() => page.locator('#formation').inputValue()).toBe('flat');
    await page.keyboard.press('Tab'); // on to the axis spacing
    await expect(page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).resolves.toBe('input-spacing');
    await page.keyboard.type('70');
    await page.getByTestId('add-other-circuit').focus();
    await page.keyboard.press('Enter');
    await page.locator('#other-label-0').waitFor();
    await page.locator('#other-label-0').fill('Pump house feeder');
    await page.getByTestId('other-current-0').fill('200');
    await page.getByTestId('input-circuit-spacing').fill('300');

    // What the library gives for exactly these inputs.
    const expected: SheetInputs = structuredClone((await getSheet(teamId, sheetId))!.inputs);
    expected.installation = {
      ...expected.installation,
      formation: 'flat',
      spacingM: 0.07,
      otherCircuits: [{ label: 'Pump house feeder', currentA: 200, sameCable: true, externalDiameterM: null, lossWPerM: null }],
      circuitSpacingM: 0.3,
    };
    const computed = computeSheet(expected);
    if (!computed.ok || !computed.comparison.evaluations[0].ok) throw new Error('the arrangement must compute');
    const group = computed.comparison.evaluations[0].group!;
    const governing = governingCableOf(group, ['Pump house feeder'])!;
    const governingLine = governingText(governing, t);

    await expect.poll(() => page.getByTestId('result-governing').innerText(), { timeout: 30_000 }).toBe(governingLine);
    await expect(page.getByTestId('group-governing').innerText()).resolves.toContain(governingLine);
    await expect(page.getByTestId('cross-section-governing').innerText()).resolves.toBe(governingLine);
    // Six cables drawn, each with its temperatures as its title (hover).
    for (let i = 0; i < group.cables.length; i++) {
      await expect(page.getByTestId(`cross-section-cable-${i}`).locator('title').textContent()).resolves.toBe(cableTitle(group, i, ['Pump house feeder'], t));
    }
    await page.getByTestId(`cross-section-cable-${governing.cable}`).hover({ force: true });
    await expect(page.getByTestId('cross-section').locator('[data-role="governing"]').count()).resolves.toBe(1);
    // The table beside the drawing: every cable's conductor temperature.
    const table = await page.getByTestId('group-cables').innerText();
    for (const cable of group.cables) expect(table).toContain(formatNumber(cable.conductorC as number, 4));
    expect(table).toContain('centre cable of other circuit 1 (Pump house feeder)');
    // The grid names the governing cable too.
    await expect.poll(() => page.getByTestId('candidate-grid').innerText(), { timeout: 30_000 }).toContain(governing.words);
    await screenshot(page, 'groups-01-flat-beside-another');

    await saveSheet(page);
    const stored = (await getSheet(teamId, sheetId))!;
    expect(stored.inputs.installation).toMatchObject({ formation: 'flat', spacingM: 0.07, circuitSpacingM: 0.3, circuitRow: 'horizontal' });
    expect(stored.inputs.installation.otherCircuits).toEqual(expected.installation.otherCircuits);
    const saved = stored.result!.evaluations[0];
    expect(saved.ok && saved.group && governingText(governingCableOf(saved.group, ['Pump house feeder'])!, t)).toBe(governingLine);

    await page.reload();
    await page.getByTestId('cross-section').waitFor({ timeout: 60_000 });
    await expect(page.locator('#formation').inputValue()).resolves.toBe('flat');
    await expect(page.getByTestId('input-spacing').inputValue()).resolves.toBe('70');
    await expect(page.getByTestId('other-current-0').inputValue()).resolves.toBe('200');
    await expect(page.locator('#other-label-0').inputValue()).resolves.toBe('Pump house feeder');
    await expect(page.getByTestId('input-circuit-spacing').inputValue()).resolves.toBe('300');
    await expect.poll(() => page.getByTestId('result-governing').innerText(), { timeout: 30_000 }).toBe(governingLine);
    await expect(page.getByTestId('save-state').innerText()).resolves.toBe('Saved');
    await page.context().close();
  }, 300_000);

  it('an overlapping arrangement is refused on its field and the save API answers 400; nothing is saved', async () => {
    const sheetId = await buriedSheet('BG2');
    const before = (await getSheet(teamId, sheetId))!;
    const page = await signInInBrowser(browser, designer.email);
    await page.goto(appUrl(`/sheets/${sheetId}`));
    await page.getByTestId('cross-section').waitFor({ timeout: 60_000 });
    await page.getByTestId('add-other-circuit').click();
    await page.getByTestId('other-current-0').fill('200');
    await page.getByTestId('input-circuit-spacing').fill('40');
    // The field says why, the installation says it in one line, and the page does not offer to save.
    const field = page.getByTestId('input-circuit-spacing');
    await expect.poll(() => field.getAttribute('aria-invalid'), { timeout: 30_000 }).toBe('true');
    const errorId = ((await field.getAttribute('aria-describedby')) ?? '').split(' ').find((id) => id.endsWith('-error'))!;
    await expect(page.locator(`[id="${errorId}"]`).innerText()).resolves.toMatch(/overlap/);
    await expect(page.getByTestId('arrangement-problem').innerText()).resolves.toMatch(/do not lie as entered: .*overlap/);
    await expect(page.getByTestId('save-button').isDisabled()).resolves.toBe(true);
    await screenshot(page, 'groups-02-overlap-refused');

    // The server refuses it too, naming the field.
    const overlapping = structuredClone(before.inputs);
    overlapping.installation.otherCircuits = [{ label: '', currentA: 200, sameCable: true, externalDiameterM: null, lossWPerM: null }];
    overlapping.installation.circuitSpacingM = 0.04;
    const answer = await page.request.put(appUrl(`/api/sheets/${sheetId}`), { data: { expectedVersion: before.version, inputs: overlapping } });
    expect(answer.status()).toBe(400);
    const body = (await answer.json()) as { error: { code: string; message: string; fieldPath: string } };
    expect(body.error.code).toBe('invalid_arrangement');
    expect(body.error.fieldPath).toBe('installation.circuitSpacingM');
    expect(body.error.message).toMatch(/overlap/);
    const after = (await getSheet(teamId, sheetId))!;
    expect(after.version).toBe(before.version);
    expect(after.inputs).toEqual(before.inputs);
    expect(after.result).toEqual(before.result);

    // 60 mm apart fits (≥ 50.4 mm): the field clears and the sheet can be saved.
    await page.getByTestId('input-circuit-spacing').fill('60');
    await expect.poll(() => field.getAttribute('aria-invalid'), { timeout: 30_000 }).toBe(null);
    await expect.poll(() => page.getByTestId('save-button').isDisabled(), { timeout: 30_000 }).toBe(false);
    await page.context().close();
  }, 300_000);

  it('a sheet saved by the isolated-cable solver is marked for re-evaluation with both figures, on the sheet and its share link', async () => {
    const [row] = await getDb()
      .insert(sheets)
      .values({
        teamId,
        projectId,
        circuitTag: `OLD-${Math.random().toString(36).slice(2, 6)}`.toUpperCase(),
        title: 'Saved before cable groups (browser test)',
        inputs: storedV4.inputs,
        result: storedV4.snapshot,
        schemaVersion: 4,
        solverVersion: storedV4.snapshot.solverVersion,
        authorId: designer.id,
      })
      .returning({ id: sheets.id });
    const sheet = (await getSheet(teamId, row.id))!;
    const mark = reEvaluationOf(sheet.inputs, sheet.result)!;
    expect(mark.now!.ampacityA).toBeLessThan(mark.saved!.ampacityA);

    const page = await signInInBrowser(browser, designer.email);
    await page.goto(appUrl(`/sheets/${row.id}`));
    const notice = page.getByTestId('re-evaluation');
    await notice.waitFor({ timeout: 60_000 });
    await expect(notice.innerText()).resolves.toContain('Saved with an earlier method — re-evaluate');
    await expect(notice.getByTestId('re-evaluation-saved').innerText()).resolves.toBe(figuresText(mark.saved, t));
    await expect(notice.getByTestId('re-evaluation-now').innerText()).resolves.toBe(figuresText(mark.now, t));
    expect(await notice.innerText()).not.toMatch(/lib\/|[A-Z]{3,}_[A-Z]/);
    await screenshot(page, 'groups-03-re-evaluate');

    const share = await createShare(teamId, designer.id, row.id, { expiresInDays: 7 });
    await page.goto(appUrl(`/share/${share!.token}`));
    const shared = page.getByTestId('re-evaluation');
    await shared.waitFor({ timeout: 60_000 });
    await expect(shared.getByTestId('re-evaluation-saved').innerText()).resolves.toBe(figuresText(mark.saved, t));
    await expect(shared.getByTestId('re-evaluation-now').innerText()).resolves.toBe(figuresText(mark.now, t));

    // Saving it again as it stands stores a result by the current method; the mark goes.
    await page.goto(appUrl(`/sheets/${row.id}`));
    await page.getByTestId('re-evaluation').waitFor({ timeout: 60_000 });
    await page.getByTestId('save-button').click();
    await expect.poll(() => page.getByTestId('re-evaluation').count(), { timeout: 30_000 }).toBe(0);
    const resaved = (await getSheet(teamId, row.id))!;
    expect(resaved.result!.solverVersion).not.toBe(storedV4.snapshot.solverVersion);
    await page.context().close();
  }, 300_000);
});
