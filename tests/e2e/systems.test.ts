// Bus-bar systems and protection on the sheet, in Chromium against the production build (issues
// 18 and 21):
// - a designer adds a pack of three 100 × 10 mm copper bars per phase from the team's catalogue,
//   describes the system (phases 200 mm apart, supports every 500 mm continuous, rated 25 kN, the
//   fault's R/X 0.1) partly from the keyboard, and sees the drawing, the table of every bar and
//   the Forces panel; enters an adjustable breaker and sees the Protection verdicts; saves and
//   reloads and sees the same. The figures on screen must equal what lib/sheet computes for the
//   saved inputs (run here in the test), the saved inputs are SI, and the server's snapshot holds
//   the same forces; κ is checked by hand: κ = 1.02 + 0.98·e^(−3·0.1) = 1.746 (IEC 60909-0 eq. 55);
// - the same sheet in imperial units shows the phase spacing in inches (200 mm / 25.4 = 7.874 in, four figures as a converted value shows).
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { getSheet } from '@/db/queries/sheets';
import { createShare } from '@/db/queries/shares';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { computeSheet } from '@/lib/sheet/compute';
import { forcesLines, hottestBarText, packBarRows } from '@/lib/sheet/systemWords';
import { formatNumber, formatQuantity } from '@/lib/units';
import { chooseOnlyCandidate, createSheetFromProject, signInInBrowser, saveSheet } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';

let browser: Browser;
let teamId: string;
let designer: { id: string; email: string };
let imperialDesigner: { id: string; email: string };
let projectId: string;
let sheetId: string;

const t = (c: number) => formatQuantity(c, 'temperature', 'si', { digits: 4 });
const axeSource = fs.readFileSync(path.join(path.dirname(createRequire(path.resolve('package.json')).resolve('axe-core')), 'axe.min.js'), 'utf8');

/** Serious or critical axe-core findings on the page as it stands (WCAG 2.1 A/AA and best practice, as tests/e2e/accessibility.test.ts runs them). */
async function graveAxeFindings(page: import('playwright-core').Page): Promise<string[]> {
  await page.evaluate(axeSource);
  const violations = (await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(context: Document, options: unknown): Promise<{ violations: unknown[] }> } }).axe;
    return (await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice'] }, resultTypes: ['violations'] })).violations;
  })) as Array<{ id: string; impact: string; nodes: Array<{ target: string[] }> }>;
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} [${v.impact}]: ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(' | ')}`);
}

beforeAll(async () => {
  const team = await createTestTeam('e2e-systems');
  teamId = team.id;
  await copyStandardCatalogueToTeam(team.id);
  const user = await createTestUser(team.id, 'designer', { name: 'Oriel Vantage (test designer)', unitSystem: 'si' });
  designer = { id: user.id, email: user.email };
  const imperial = await createTestUser(team.id, 'designer', { name: 'Tamsin Orle (test designer)', unitSystem: 'imperial' });
  imperialDesigner = { id: imperial.id, email: imperial.email };
  projectId = (await createProject(team.id, designer.id, { name: 'Bus-bar browser hall', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** What the page must show, from the library for the saved inputs. */
async function expectedEvaluation(): Promise<CandidateEvaluationOk> {
  const stored = (await getSheet(teamId, sheetId))!;
  const computed = computeSheet(stored.inputs);
  if (!computed.ok || !computed.comparison.evaluations[0].ok) throw new Error('the saved sheet must compute');
  return computed.comparison.evaluations[0];
}

describe('a bus-bar pack and its protection on the sheet', () => {
  it('a designer enters a three-bar pack, sees the drawing, the pack table and the Forces panel; enters a breaker, sees the Protection verdicts; saves and reloads', async () => {
    const page = await signInInBrowser(browser, designer.email);
    sheetId = await createSheetFromProject(page, projectId, { tag: `BS-${Math.random().toString(36).slice(2, 6).toUpperCase()}`, title: 'Transformer to board, pack of three (browser test)', installation: 'bar-on-edge' });
    await page.getByTestId('input-design-current').fill('2000');
    await page.getByTestId('input-ambient').fill('35');

    // The pack: three catalogue bars per phase.
    await page.getByTestId('no-candidates').getByTestId('add-candidates').click();
    const picker = page.getByTestId('candidate-picker');
    await picker.locator('#pick-kind').selectOption('bar');
    await picker.locator('#pick-material').selectOption('copper');
    await page.getByTestId('picker-search').fill('100 × 10');
    await page.getByTestId('picker-per-phase').fill('3');
    await picker.getByRole('button', { name: 'Add 3 × 100 × 10 mm Copper bar', exact: true }).click();
    await expect.poll(() => page.getByTestId('candidate-grid').innerText(), { timeout: 30_000 }).toContain('3 × 100 × 10 mm Copper bar');
    await picker.getByRole('button', { name: 'Done' }).click();
    await chooseOnlyCandidate(page);

    // The system: typed, and the supports chosen from the keyboard.
    await page.getByTestId('input-phase-spacing').fill('200');
    await page.getByTestId('input-support-spacing').fill('500');
    await page.locator('#busbar-supports').focus();
    for (let k = 0; k < 5; k++) await page.keyboard.press('ArrowDown');
    await expect.poll(() => page.locator('#busbar-supports').inputValue()).toBe('continuous-three-or-more-spans');
    await page.keyboard.press('Tab');
    await expect(page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).resolves.toBe('input-support-strength');
    await page.keyboard.type('25000');
    await page.getByTestId('input-peak-by').selectOption('r-over-x');
    await page.getByTestId('input-r-over-x').fill('0.1');

    await page.getByTestId('pack-table').waitFor({ timeout: 60_000 });
    await page.getByTestId('forces-panel').getByText('stress ratio').first().waitFor({ timeout: 60_000 });

    // The protection: an adjustable breaker set to 2000 A.
    // The Protection block starts folded on a sheet without a device: open it from the keyboard.
    await page.getByTestId('protection-inputs').locator('summary').focus();
    await page.keyboard.press('Enter');
    await page.getByTestId('input-protection-included').check();
    await page.getByTestId('input-device-kind').selectOption('breaker-iec60947-2');
    await page.getByTestId('input-device-rating').fill('2500');
    await page.getByTestId('input-device-setting').fill('2000');
    await page.getByTestId('input-device-instantaneous').fill('20000');
    await page.getByTestId('protection-panel').waitFor({ timeout: 60_000 });
    await screenshot(page, 'systems-01-pack-forces-protection');

    await saveSheet(page);

    // Saved SI, as entered.
    const stored = (await getSheet(teamId, sheetId))!;
    expect(stored.inputs.candidates[0]).toMatchObject({ kind: 'bar', barsPerPhase: 3, widthM: 0.1, thicknessM: 0.01 });
    expect(stored.inputs.busbarSystem).toMatchObject({ phaseSpacingM: 0.2, supportSpacingM: 0.5, supports: 'continuous-three-or-more-spans', supportStrengthN: 25000, peakFactorBy: 'r-over-x', rOverX: 0.1 });
    expect(stored.inputs.protection).toMatchObject({ included: true, device: { kind: 'breaker-iec60947-2', ratedCurrentA: 2500, settingCurrentA: 2000, instantaneousCurrentA: 20000 } });

    const e = await expectedEvaluation();
    // IEC 60909-0 eq. (55) by hand.
    expect(e.forces!.kappa).toBeCloseTo(1.02 + 0.98 * Math.exp(-0.3), 9);
    // The server's snapshot holds the same forces and pack as the browser showed.
    const savedEvaluation = stored.result!.evaluations[0] as CandidateEvaluationOk;
    expect(savedEvaluation.forces).toEqual(e.forces);
    expect(savedEvaluation.pack).toEqual(e.pack);

    const check = async () => {
      // The drawing: nine bars, the governing one marked, the run with its supports.
      await page.getByTestId('busbar-drawing').waitFor({ timeout: 60_000 });
      await expect(page.getByTestId('busbar-drawing').locator('[data-role="bar"], [data-role="governing"]').count()).resolves.toBe(9);
      await expect(page.getByTestId('busbar-drawing').locator('[data-role="governing"]').count()).resolves.toBe(1);
      await expect(page.getByTestId('busbar-elevation').count()).resolves.toBe(1);
      // The pack table: every bar's temperature and share as the library gives them.
      await expect.poll(() => page.getByTestId('pack-governing').innerText(), { timeout: 30_000 }).toContain(hottestBarText(e.pack!, t));
      for (const row of packBarRows(e.pack!)) {
        const text = await page.getByTestId(`pack-bar-${row.phase}-${row.positionInPack}`).innerText();
        expect(text).toContain(formatNumber(row.temperatureC, 4));
        expect(text).toContain(formatNumber(row.shareOfPhase * 100, 3));
        if (row.governs) expect(text).toContain('(governs)');
      }
      // The Forces panel: each line's figures and the verdict.
      const forces = await page.getByTestId('forces-panel').innerText();
      for (const line of forcesLines(e.forces!, 0.5)) expect(forces).toContain(line.value);
      await expect(page.getByTestId('forces-verdict').innerText()).resolves.toContain(e.forces!.passes ? 'withstand the fault' : 'Fails under the fault');
      // The Protection verdicts.
      const coordination = e.protection!.coordination!.verdict === 'pass' ? 'passes' : 'fails';
      const verdictText = (await page.getByTestId('protection-verdict-coordination').innerText()).replace(/\s+/g, ' ').trim();
      expect(verdictText).toBe(`${coordination === 'passes' ? '✔' : '✖'} Overload coordination: ${coordination}`);
      await expect(page.getByTestId('protection-verdict-disconnection').innerText()).resolves.toContain('not checked');
      // The grid: the stress ratio and the device.
      await expect.poll(() => page.getByTestId('candidate-grid').innerText(), { timeout: 30_000 }).toContain(formatNumber(e.forces!.stressRatio, 3));
      await expect(page.getByTestId('candidate-grid').innerText()).resolves.toContain(`2000 A ${coordination === 'passes' ? '✔ coordinated' : '✖ not coordinated'}`);
    };
    await check();
    await page.reload();
    await check();
    await screenshot(page, 'systems-02-after-reload');
    // The new inputs (the Protection block open: it has a device) and panels carry their labels and roles: axe-core finds nothing serious.
    await expect(page.getByTestId('input-device-rating').isVisible()).resolves.toBe(true);
    expect(await graveAxeFindings(page)).toEqual([]);
    await page.context().close();
  });

  it('the share link shows the same drawing, pack table, forces and protection verdicts from the saved snapshot', async () => {
    const e = await expectedEvaluation();
    const share = await createShare(teamId, designer.id, sheetId, { expiresInDays: 7 });
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    await page.goto(appUrl(`/share/${share!.token}`));
    await page.getByTestId('pack-table').waitFor({ timeout: 60_000 });
    await expect(page.getByTestId('pack-governing').innerText()).resolves.toContain(hottestBarText(e.pack!, t));
    const forces = await page.getByTestId('forces-panel').innerText();
    for (const line of forcesLines(e.forces!, 0.5)) expect(forces).toContain(line.value);
    await expect(page.getByTestId('protection-verdict-coordination').innerText()).resolves.toContain('Overload coordination');
    await expect(page.getByTestId('busbar-drawing').locator('[data-role="governing"]').count()).resolves.toBe(1);
    await screenshot(page, 'systems-03-share');
    await context.close();
  });

  it('a designer working in imperial units sees the phase spacing in inches (200 mm / 25.4 = 7.874 in to four figures), stored SI', async () => {
    const page = await signInInBrowser(browser, imperialDesigner.email);
    await page.goto(appUrl(`/sheets/${sheetId}`));
    await page.getByTestId('input-phase-spacing').waitFor({ timeout: 60_000 });
    await expect(page.getByTestId('input-phase-spacing').inputValue()).resolves.toBe('7.874');
    await page.getByTestId('input-phase-spacing').fill('10');
    await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: 30_000 }).toBe('Not saved');
    await saveSheet(page);
    // 10 in = 254 mm, stored in metres.
    expect((await getSheet(teamId, sheetId))!.inputs.busbarSystem.phaseSpacingM).toBeCloseTo(0.254, 12);
    await page.context().close();
  });
});
