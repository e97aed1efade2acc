// Issue 22, "Input and units", in Chromium against the production build:
// (1) one number rule — under a point "1,250" and "0x4E2" are refused naming the field, the strip
//     is not current (never "Within limit") and saving is off; under a comma "212,5" is 212.5 and
//     "1.250" is refused as ambiguous;
// (2) units are shown as written (innerText applies CSS text-transform, so it reads what a person
//     sees): "µΩ", "mm²", "(A)", and the fault current in kA;
// (3) warnings naming the field for a frequency of 0 (DC), a power factor of 0, a route of 0 m and
//     an own limit below the ambient; a fault current beyond the bound is refused and the strip is
//     not current.
// The rule itself: lib/units/parse (its unit tests are tests/lib/units/parse.test.ts).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { getSheet } from '@/db/queries/sheets';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { createSheetFromProject, saveSheet, signInInBrowser } from './sheet-steps';
import { launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';

let browser: Browser;
let teamId: string;
let pointEmail: string;
let commaEmail: string;
let projectId: string;

beforeAll(async () => {
  const team = await createTestTeam('e2e-numbers');
  teamId = team.id;
  await copyStandardCatalogueToTeam(team.id);
  // The separator is set on the user (users.decimal_separator), not left to the test browser's locale.
  const point = await createTestUser(team.id, 'designer', { name: 'Tamsin Rell (test designer)', decimalSeparator: '.' });
  const comma = await createTestUser(team.id, 'designer', { name: 'Jorund Vael (test designer)', decimalSeparator: ',' });
  pointEmail = point.email;
  commaEmail = comma.email;
  projectId = (await createProject(team.id, point.id, { name: 'Number rule yard', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** A cable sheet with one catalogue cable, chosen, at 200 A. */
async function cableSheet(page: Page, tag: string): Promise<string> {
  const sheetId = await createSheetFromProject(page, projectId, { tag, title: 'Browser test number rule', installation: 'cable-in-air' });
  await page.getByTestId('input-design-current').fill('200');
  await page.getByTestId('no-candidates').getByTestId('add-candidates').click();
  const picker = page.getByTestId('candidate-picker');
  await picker.waitFor();
  await page.getByTestId('picker-search').fill('copper XLPE/PVC 95 mm²');
  await picker.getByTestId('picker-add').first().click();
  await expect.poll(() => page.getByTestId('candidate-grid').innerText(), { timeout: 30_000 }).toContain('95 mm² copper XLPE/PVC single-core');
  const grid = page.getByTestId('candidate-grid');
  const choose = grid.locator('[data-testid^="choose-"]');
  if ((await choose.count()) > 0) await choose.first().dispatchEvent('click');
  await expect.poll(() => page.getByTestId('result-strip').innerText(), { timeout: 30_000 }).toMatch(/Chosen:/);
  return sheetId;
}

/** The message under a NumberField (its error paragraph), by the input's test id. */
const fieldMessage = (page: Page, testId: string) => page.getByTestId(testId).locator('xpath=..').locator('.field-error').innerText();
/** The label of a NumberField as shown (innerText: after CSS text-transform). */
const fieldLabel = (page: Page, testId: string) => page.getByTestId(testId).locator('xpath=..').locator('label').innerText();

describe('one number rule for the whole app', () => {
  it('under a point, "1,250" and "0x4E2" in Design current are refused naming the field; the strip is not current and save is off', async () => {
    const page = await signInInBrowser(browser, pointEmail);
    await cableSheet(page, 'BT-NUM1');
    await expect.poll(() => page.getByTestId('result-strip').getAttribute('data-state'), { timeout: 30_000 }).toMatch(/within|tight|over/);

    await page.getByTestId('input-design-current').fill('1,250');
    await expect.poll(() => fieldMessage(page, 'input-design-current'), { timeout: 10_000 }).toContain('Design current: 1,250 — use 1250 or 1.25');
    await expect.poll(() => page.getByTestId('result-strip').getAttribute('data-state'), { timeout: 10_000 }).toBe('not-current');
    await expect(page.getByTestId('result-state').innerText()).resolves.not.toMatch(/Within limit/);
    await expect(page.getByTestId('result-state').innerText()).resolves.toContain('Design current: 1,250');
    await expect(page.getByTestId('save-button').isDisabled()).resolves.toBe(true);
    await screenshot(page, 'numbers-01-ambiguous-refused');

    await page.getByTestId('input-design-current').fill('0x4E2');
    await expect.poll(() => fieldMessage(page, 'input-design-current'), { timeout: 10_000 }).toMatch(/^Design current: 0x4E2 is not a decimal number/);
    await page.getByTestId('input-design-current').fill('1e3');
    await expect.poll(() => fieldMessage(page, 'input-design-current'), { timeout: 10_000 }).toMatch(/^Design current: 1e3: write the number in full/);
    await expect(page.getByTestId('save-button').isDisabled()).resolves.toBe(true);

    // A number it can read clears the refusal; the strip is current again.
    await page.getByTestId('input-design-current').fill('125');
    await expect.poll(() => fieldMessage(page, 'input-design-current'), { timeout: 10_000 }).toBe('');
    await expect.poll(() => page.getByTestId('result-strip').getAttribute('data-state'), { timeout: 30_000 }).toMatch(/within|tight|over/);
    await expect.poll(() => page.getByTestId('result-strip').innerText(), { timeout: 30_000 }).toContain('at 125 A');
    await page.context().close();
  });

  it('under a comma, "212,5" is 212.5 A (saved so) and "1.250" is refused as ambiguous', async () => {
    const page = await signInInBrowser(browser, commaEmail);
    const sheetId = await cableSheet(page, 'BT-NUM2');
    await page.getByTestId('input-design-current').fill('1.250');
    await expect.poll(() => fieldMessage(page, 'input-design-current'), { timeout: 10_000 }).toContain('Design current: 1.250 — use 1250 or 1,25');
    await expect.poll(() => page.getByTestId('result-strip').getAttribute('data-state'), { timeout: 10_000 }).toBe('not-current');

    await page.getByTestId('input-design-current').fill('212,5');
    await expect.poll(() => fieldMessage(page, 'input-design-current'), { timeout: 10_000 }).toBe('');
    await expect.poll(() => page.getByTestId('result-strip').innerText(), { timeout: 30_000 }).toContain('at 212.5 A');
    await saveSheet(page);
    expect((await getSheet(teamId, sheetId))!.inputs.circuit.designCurrentA).toBe(212.5);
    // Shown back with the user's separator.
    await page.getByTestId('input-design-current').blur();
    await expect(page.getByTestId('input-design-current').inputValue()).resolves.toBe('212,5');
    await page.context().close();
  });
});

describe('units are shown as written', () => {
  it('labels keep µΩ, mm² and A as written (no upper-casing), and the fault current is in kA', async () => {
    const page = await signInInBrowser(browser, pointEmail);
    await cableSheet(page, 'BT-NUM3');
    await expect(fieldLabel(page, 'input-design-current')).resolves.toBe('Design current (A)');
    await expect(fieldLabel(page, 'input-fault-current')).resolves.toBe('Fault current (kA)');
    // The default 25 kA reads as 25 in the kA field.
    await expect(page.getByTestId('input-fault-current').inputValue()).resolves.toBe('25');

    // The picker may still be open from adding the candidate; open it when it is not.
    const picker = page.getByTestId('candidate-picker');
    if ((await picker.count()) === 0) await page.getByTestId('add-candidates').first().click();
    await picker.waitFor();
    await expect(picker.locator('label[for="pick-min"]').innerText()).resolves.toBe('Section from (mm²)');

    const panel = page.getByTestId('beyond-steady');
    await panel.getByTestId('along-run-checked').check();
    await panel.getByRole('button', { name: 'Add a joint' }).click();
    await expect.poll(() => fieldLabel(page, 'joint-0-resistance'), { timeout: 10_000 }).toBe('Resistance (µΩ)');
    await expect(panel.innerText()).resolves.toContain('resistance empty = 10 µΩ assumed');
    await expect(panel.innerText()).resolves.not.toMatch(/MΩ/);
    await screenshot(page, 'numbers-02-units-as-written');
    await page.context().close();
  });
});

describe('warnings naming the field', () => {
  it('frequency 0 (DC), power factor 0, route length 0 and an own limit below the ambient each get a word; an absurd fault current is refused', async () => {
    const page = await signInInBrowser(browser, pointEmail);
    await cableSheet(page, 'BT-NUM4');
    await page.getByTestId('input-frequency').fill('0');
    await page.getByTestId('input-power-factor').fill('0');
    await page.getByTestId('input-length').fill('0');
    await expect.poll(() => page.getByTestId('input-frequency-warning').innerText(), { timeout: 10_000 }).toMatch(/^▲ Frequency 0 Hz: the circuit is taken as DC/);
    await expect(page.getByTestId('input-power-factor-warning').innerText()).resolves.toMatch(/^▲ Power factor 0:/);
    await expect(page.getByTestId('input-length-warning').innerText()).resolves.toMatch(/^▲ Route length 0 m:/);
    const listed = page.getByTestId('result-warnings');
    await expect.poll(() => listed.innerText(), { timeout: 10_000 }).toContain('Frequency 0 Hz');
    await expect(listed.innerText()).resolves.toContain('Power factor 0');
    await expect(listed.innerText()).resolves.toContain('Route length 0 m');

    await page.getByTestId('input-ambient').fill('45');
    await page.locator('summary', { hasText: 'Temperature limit' }).click();
    await page.getByTestId('input-own-limit').fill('40');
    await expect.poll(() => page.getByTestId('input-own-limit-warning').innerText(), { timeout: 10_000 }).toContain('Your own limit (40 °C) is not above the ambient (45 °C)');
    await screenshot(page, 'numbers-03-warnings');

    // 1e12 A cannot be typed (no exponents); a million kA is beyond the 500 kA bound (lib/inputBounds).
    await page.getByTestId('input-fault-current').fill('1e12');
    await expect.poll(() => fieldMessage(page, 'input-fault-current'), { timeout: 10_000 }).toMatch(/^Fault current: 1e12: write the number in full/);
    await page.getByTestId('input-fault-current').fill('1000000');
    await expect.poll(() => fieldMessage(page, 'input-fault-current'), { timeout: 10_000 }).toMatch(/Fault current/);
    await expect.poll(() => page.getByTestId('result-strip').getAttribute('data-state'), { timeout: 10_000 }).toBe('not-current');
    await expect(page.getByTestId('result-state').innerText()).resolves.not.toMatch(/Within limit/);
    await expect(page.getByTestId('save-button').isDisabled()).resolves.toBe(true);
    await page.context().close();
  });
});
