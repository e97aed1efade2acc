// The sheet's "Inside the enclosure" panel in Chromium against the production build: a designer who
// works in imperial units opens a bar sheet, switches the check on, enters the enclosure in feet and
// its other losses, computes, and sees the air inside, the hot spot in that air, the flags and the
// temperature plot with the limit. The figures on screen are the ones lib/sheet computeEnclosureAir
// gives for the saved inputs (run here in the test), and the saved inputs are SI.
import { flagLine, flagTitle, SEVERITY_WORDS } from '@/lib/sheet/flagWords';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { getSheet } from '@/db/queries/sheets';
import { createShare } from '@/db/queries/shares';
import { CAUTION_TEXT } from '@/lib/caution';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { computeEnclosureAir } from '@/lib/sheet/enclosureAir';
import { celsiusToFahrenheit, feetToMetres, formatNumber } from '@/lib/units';
import { addCatalogueCopperBar, createSheetFromProject, signInInBrowser, saveSheet } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';

let browser: Browser;
let teamId: string;
let designerEmail: string;
let designerId: string;
let projectId: string;

beforeAll(async () => {
  const team = await createTestTeam('e2e-enclosure');
  teamId = team.id;
  await copyStandardCatalogueToTeam(team.id);
  const designer = await createTestUser(team.id, 'designer', { name: 'Tamsin Oriel (test designer)', unitSystem: 'imperial' });
  designerEmail = designer.email;
  designerId = designer.id;
  projectId = (await createProject(team.id, designer.id, { name: 'Enclosure browser yard', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('inside the enclosure on the sheet', () => {
  it('a designer in imperial units enters the enclosure in feet, computes, and sees the air inside, the hot spot, the flags and the plot', async () => {
    const page = await signInInBrowser(browser, designerEmail);
    const context = page.context();
    const sheetId = await createSheetFromProject(page, projectId, { tag: 'BT-ENC1', title: 'Browser test panel board riser', installation: 'bar-on-edge' });
    await page.getByTestId('input-design-current').fill('1000');
    await addCatalogueCopperBar(page, '60 × 10');

    const panel = page.getByTestId('enclosure-air');
    await panel.waitFor({ timeout: 30_000 });
    await expect(panel.getByTestId('enclosure-checked').isChecked()).resolves.toBe(false);
    await expect(panel.getByTestId('run-enclosure').count()).resolves.toBe(0);
    await panel.getByTestId('enclosure-checked').check();
    // Imperial: lengths in ft, temperatures in °F (the labels say so).
    // (textContent: the labels are upper-cased by CSS, which innerText would return.)
    await expect.poll(() => panel.textContent(), { timeout: 30_000 }).toContain('Height (ft)');
    await expect(panel.textContent()).resolves.toContain('Air around it (°F)');
    await panel.getByTestId('enclosure-height').fill('6.5');
    await panel.getByTestId('enclosure-width').fill('2.5');
    await panel.getByTestId('enclosure-depth').fill('2');
    await panel.getByTestId('enclosure-outside-air').fill('95');
    await panel.getByTestId('enclosure-other-losses').fill('450');
    await panel.getByTestId('enclosure-sides').selectOption('1');
    await screenshot(page, 'enclosure-01-inputs');
    // The other optional checks follow the same switch: the run's length in ft, terminals in °F.
    const beyond = page.getByTestId('beyond-steady');
    await beyond.getByTestId('along-run-checked').check();
    await expect.poll(() => beyond.textContent(), { timeout: 30_000 }).toContain('Run length (ft)');
    await expect(beyond.textContent()).resolves.toContain('Terminal temperature (°F)');
    // 70 °C stored is shown as 158 °F.
    await expect(beyond.getByTestId('start-terminal').inputValue()).resolves.toBe('158');
    await beyond.getByTestId('along-run-checked').uncheck();
    await panel.getByTestId('run-enclosure').click();
    const result = panel.getByTestId('enclosure-result');
    await result.waitFor({ timeout: 60_000 });
    const resultText = await result.innerText();
    const flagText = await result.getByTestId('enclosure-flags').innerText();
    const plotText = () => result.locator('.js-plotly-plot').first().textContent();
    await expect.poll(plotText, { timeout: 30_000 }).toContain('Temperatures in and around the enclosure');
    await screenshot(page, 'enclosure-02-results');

    await saveSheet(page);
    const stored = (await getSheet(teamId, sheetId))!.inputs;
    // Stored in SI whatever the screen shows (6.5 ft = 1.9812 m, 95 °F = 35 °C).
    expect(stored.enclosureAir.checked).toBe(true);
    expect(stored.enclosureAir.heightM).toBeCloseTo(feetToMetres(6.5), 9);
    expect(stored.enclosureAir.widthM).toBeCloseTo(feetToMetres(2.5), 9);
    expect(stored.enclosureAir.outsideAirC).toBeCloseTo(35, 9);
    expect(stored.enclosureAir.otherLossesW).toBe(450);
    expect(stored.enclosureAir.sidesCovered).toBe(1);

    const outcome = computeEnclosureAir(stored, stored.candidates[0].id);
    if (!outcome?.ok) throw new Error(`expected the enclosure check to compute: ${JSON.stringify(outcome)}`);
    const r = outcome.result;
    const f = (c: number) => `${formatNumber(celsiusToFahrenheit(c), 4)} °F`;
    expect(resultText).toContain(`${formatNumber(r.totalLossesW, 4)} W`);
    expect(resultText).toContain(f(r.insideAirC));
    if (r.hotSpotC !== null) expect(resultText).toContain(f(r.hotSpotC));
    expect(resultText).toContain(r.passes ? '✔ passes' : '✖ fails');
    expect(r.flags.map((x) => x.code)).toContain('ENCLOSURE_AIR_ESTIMATED');
    for (const flag of r.flags) expect(flagText).toContain(`${flagTitle(flag.code)} (${SEVERITY_WORDS[flag.severity]})`);
    // The caution stays on the page that shows the result.
    await expect(page.getByRole('note', { name: 'Caution' }).count()).resolves.toBeGreaterThan(0);
    await context.close();

    // A read-only link shows the same check in words for the chosen candidate, with its flags and the caution.
    const share = await createShare(teamId, designerId, sheetId, { expiresInDays: 7 });
    const html = await (await fetch(appUrl(`/share/${share!.token}`))).text();
    const text = html.replace(/<[^>]+>/g, ' ').replace(/&#x27;/g, "'").replace(/&amp;/g, '&').replace(/\s+/g, ' ');
    expect(text).toContain('Optional checks of the chosen candidate');
    expect(text).toContain('Inside the enclosure');
    expect(text).toContain(`mean air inside ${formatNumber(r.insideAirC, 4)} °C`);
    // React's text separators leave spaces inside the brackets once the tags are stripped.
    const tight = text.replace(/\(\s+/g, '(').replace(/\s+\)/g, ')');
    for (const flag of r.flags) expect(tight).toContain(`${flagTitle(flag.code)} (${SEVERITY_WORDS[flag.severity]})`);
    for (const line of CAUTION_TEXT) expect(text).toContain(line);
  }, 300_000);
});
