// The sheet's "Over time and along the run" panel in Chromium against the production build: a
// designer opens a saved cable sheet, switches the over-time checks on, enters an overload, uploads
// an hourly daily-load CSV through the file input, computes, and sees the results, their flags and
// the hot-spot plot. The figures on screen are the ones lib/sheet computeBeyondSteady gives for the
// same inputs, run here in the test. A bad CSV is refused with a message naming the row and the
// cell, and leaves the good profile in place. Saved and reloaded, the inputs are still there.
import { flagLine, flagTitle, SEVERITY_WORDS } from '@/lib/sheet/flagWords';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { getSheet } from '@/db/queries/sheets';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { computeBeyondSteady } from '@/lib/sheet/beyondSteady';
import { formatNumber } from '@/lib/units';
import { addCatalogueCopperBar, chooseOnlyCandidate, createSheetFromProject, signInInBrowser, saveSheet } from './sheet-steps';
import { launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';

let browser: Browser;
let teamId: string;
let designerEmail: string;
let projectId: string;

/** Invented daily load of the feeder, A per hour from midnight (input only). */
const dailyA = Array.from({ length: 24 }, (_, hour) => (hour >= 7 && hour < 19 ? 330 : 180));
const OVERLOAD_A = 700;
const OVERLOAD_MIN = 45;

beforeAll(async () => {
  const team = await createTestTeam('e2e-beyond');
  teamId = team.id;
  await copyStandardCatalogueToTeam(team.id);
  const designer = await createTestUser(team.id, 'designer', { name: 'Iona Brask (test designer)' });
  designerEmail = designer.email;
  projectId = (await createProject(team.id, designer.id, { name: 'Beyond steady browser yard', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

const signIn = (email: string): Promise<Page> => signInInBrowser(browser, email);

const csvFile = (name: string, text: string) => ({ name, mimeType: 'text/csv', buffer: Buffer.from(text, 'utf8') });

describe('over time on the sheet', () => {
  it('a designer switches the checks on, uploads a daily load, computes, sees results, flags and plot; a bad file is refused; the inputs survive save and reload', async () => {
    const page = await signIn(designerEmail);
    // A new cable sheet with one catalogue candidate, made through the screens (as sheet-workflow does).
    const sheetId = await createSheetFromProject(page, projectId, { tag: 'BT-OT1', title: 'Browser test feeder over time', installation: 'cable-in-air' });
    await page.getByTestId('input-design-current').fill('250');
    await page.getByTestId('no-candidates').getByTestId('add-candidates').click();
    await page.getByTestId('candidate-picker').waitFor();
    await page.getByTestId('picker-search').fill('copper XLPE/PVC 120 mm²');
    await page.getByTestId('candidate-picker').getByTestId('picker-add').first().click();
    await expect.poll(() => page.getByTestId('candidate-grid').innerText(), { timeout: 30_000 }).toContain('120 mm² copper XLPE/PVC single-core');
    await chooseOnlyCandidate(page);

    const panel = page.getByTestId('beyond-steady');
    await panel.waitFor({ timeout: 30_000 });
    // Off on a new sheet: no compute button.
    await expect(panel.getByTestId('over-time-checked').isChecked()).resolves.toBe(false);
    await expect(panel.getByTestId('run-beyond').count()).resolves.toBe(0);

    await panel.getByTestId('over-time-checked').check();
    await panel.getByTestId('overload-current').fill(String(OVERLOAD_A));
    await panel.getByTestId('overload-minutes').fill(String(OVERLOAD_MIN));
    // A profile typed into the box first, then replaced by the uploaded file.
    await panel.getByTestId('daily-profile').fill(Array(24).fill(99).join('\n'));
    await panel.getByTestId('daily-profile').blur();
    const upload = panel.getByLabel('Upload a daily load CSV');
    await upload.setInputFiles(csvFile('feeder-day.csv', ['hour,current_A', ...dailyA.map((a, hour) => `${hour},${a}`)].join('\n')));
    // The typed profile also has 24 values, so wait for the box to show what the file held (the
    // file is read asynchronously), not for the count; then passing through the box keeps it.
    await expect.poll(() => panel.getByTestId('daily-profile').inputValue(), { timeout: 30_000 }).toBe(dailyA.join('\n'));
    await expect(panel.innerText()).resolves.toContain('24 values entered.');
    await panel.getByTestId('daily-profile').focus();
    await panel.getByTestId('daily-profile').blur();
    await expect(panel.innerText()).resolves.toContain('24 values entered.');
    await screenshot(page, 'beyond-01-inputs');

    await panel.getByTestId('run-beyond').click();
    const result = panel.getByTestId('over-time-result');
    await result.waitFor({ timeout: 60_000 });
    const resultText = await result.innerText();
    const flagText = await result.getByTestId('beyond-flags').innerText();
    // The hot spot against time is drawn (Plotly's SVG); its title and limit label sit in a second SVG layer of the plot.
    await result.locator('.main-svg').first().waitFor({ timeout: 30_000 });
    const plotText = () => result.locator('.js-plotly-plot').first().textContent();
    await expect.poll(plotText, { timeout: 30_000 }).toContain('Hot spot over time');
    const plotted = (await plotText()) ?? '';
    await screenshot(page, 'beyond-02-results');

    // A file with a word where a current should be: refused, naming the row and the cell; the good profile stays.
    const bad = ['hour,current_A', ...dailyA.map((a, hour) => `${hour},${hour === 4 ? 'twelve' : a}`)].join('\n');
    await upload.setInputFiles(csvFile('feeder-day-bad.csv', bad));
    await expect.poll(() => panel.locator('.field-error').allInnerTexts(), { timeout: 30_000 }).toContain('Row 6: "twelve" is not a current in A');
    await expect(panel.innerText()).resolves.toContain('24 values entered.');
    await screenshot(page, 'beyond-03-bad-csv');

    // Save: the server holds what was entered.
    await saveSheet(page);
    const stored = (await getSheet(teamId, sheetId))!.inputs;
    expect(stored.overTime).toEqual({ checked: true, overloadCurrentA: OVERLOAD_A, overloadDurationS: OVERLOAD_MIN * 60, dailyProfileA: dailyA, faultWithCoverings: false });

    // The figures on screen are the library's for the saved inputs (the panel runs the same function in the browser).
    expect(stored.candidates).toHaveLength(1);
    const expected = computeBeyondSteady(stored, stored.candidates[0].id)!.overTime!;
    if (!expected.ok) throw new Error(`expected the over-time check to compute: ${expected.message}`);
    const { overload, daily, flags, limitC } = expected.result;
    // 700 A is far above a 120 mm² cable's rating in air: the limit comes within the 45 min.
    expect(overload!.timeToLimitS).not.toBeNull();
    expect(overload!.passes).toBe(false);
    expect(resultText).toContain(`Overload ${formatNumber(OVERLOAD_A, 4)} A for ${formatNumber(OVERLOAD_MIN, 3)} min`);
    expect(resultText).toContain(`limit after ${formatNumber(overload!.timeToLimitS! / 60, 3)} min`);
    expect(resultText).toContain('✖ fails');
    expect(resultText).toContain(`Daily load, peak after ${daily!.days} days`);
    expect(resultText).toContain(`${formatNumber(daily!.peakC, 4)} °C at ${formatNumber(daily!.peakTimeS / 3600, 3)} h`);
    expect(flags.map((f) => f.code)).toContain('OVERLOAD_LIMIT_REACHED');
    for (const flag of flags) expect(flagText).toContain(`${flagTitle(flag.code)} (${SEVERITY_WORDS[flag.severity]})`);
    expect(plotted).toContain(`limit ${formatNumber(limitC, 3)} °C`);

    // Reload: the checks and their inputs come back from the server.
    await page.reload();
    const reloaded = page.getByTestId('beyond-steady');
    await reloaded.waitFor({ timeout: 30_000 });
    await expect(reloaded.getByTestId('over-time-checked').isChecked()).resolves.toBe(true);
    await expect(reloaded.getByTestId('overload-current').inputValue()).resolves.toBe(String(OVERLOAD_A));
    await expect(reloaded.getByTestId('overload-minutes').inputValue()).resolves.toBe(String(OVERLOAD_MIN));
    await expect(reloaded.getByTestId('daily-profile').inputValue()).resolves.toBe(dailyA.join('\n'));
    await expect(reloaded.innerText()).resolves.toContain('24 values entered.');
    await screenshot(page, 'beyond-04-reloaded');
    await page.context().close();
  }, 300_000);

  it('along the run: a bar sheet with a joint whose resistance is left empty shows the hot spot and where, the assumed-joint flag and the profile along the run', async () => {
    const page = await signIn(designerEmail);
    const sheetId = await createSheetFromProject(page, projectId, { tag: 'BT-RUN1', title: 'Browser test busway along the run', installation: 'bar-on-edge' });
    await page.getByTestId('input-design-current').fill('1200');
    await addCatalogueCopperBar(page, '100 × 10');

    const panel = page.getByTestId('beyond-steady');
    await panel.getByTestId('along-run-checked').check();
    await panel.getByTestId('run-length').fill('5');
    await panel.getByRole('button', { name: 'Add a joint' }).click();
    await panel.getByTestId('joint-0-position').fill('2');
    await panel.getByTestId('run-beyond').click();
    const result = panel.getByTestId('along-run-result');
    await result.waitFor({ timeout: 60_000 });
    const resultText = await result.innerText();
    const flagText = await result.getByTestId('beyond-flags').innerText();
    const plotText = () => result.locator('.js-plotly-plot').first().textContent();
    await expect.poll(plotText, { timeout: 30_000 }).toContain('Temperature along the run');
    await screenshot(page, 'beyond-05-along-the-run');

    await saveSheet(page);
    const stored = (await getSheet(teamId, sheetId))!.inputs;
    expect(stored.alongRun).toMatchObject({ checked: true, lengthM: 5, joints: [{ positionM: 2, resistanceMicroOhm: null }] });
    const expected = computeBeyondSteady(stored, stored.candidates[0].id)!.alongRun!;
    if (!expected.ok) throw new Error(`expected the run to compute: ${expected.message}`);
    const { hotSpot, limitC, flags, joints } = expected.result;
    expect(resultText).toContain(`${formatNumber(hotSpot.temperatureC, 4)} °C at ${formatNumber(hotSpot.positionM, 3)} m of ${formatNumber(limitC, 4)} °C`);
    expect(joints[0].assumed).toBe(true);
    expect(flags.map((f) => f.code)).toContain('JOINT_RESISTANCE_ASSUMED');
    for (const flag of flags) expect(flagText).toContain(`${flagTitle(flag.code)} (${SEVERITY_WORDS[flag.severity]})`);
    await page.context().close();
  }, 300_000);
});
