// Issue 23, the small items, against the production build: every page has an icon that is served
// (no 404 for it, nor for a browser asking /favicon.ico); the empty "What the circuit feeds" field
// is named in its message; a small loss reads in the unit its size calls for (the figure lib/
// computes for the saved inputs, formatted here); and the lines of the hot-spot plot differ by
// marker shape and by clearly different colours, none of them the design-current line's copper.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Response } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSheet } from '@/db/queries/sheets';
import { computeSheet, defaultSheetInputs } from '@/lib/sheet';
import { formatPower } from '@/lib/units';
import { can } from '@/lib/auth/permissions';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { testCopperBar } from '../helpers/sheetCandidates';

let browser: Browser;
let teamId: string;
let designerEmail: string;
let designerId: string;
let projectId: string;

beforeAll(async () => {
  const team = await createTestTeam('e2e-small');
  teamId = team.id;
  const designer = await createTestUser(team.id, 'designer', { name: 'Piran Hale (test designer)' });
  designerEmail = designer.email;
  designerId = designer.id;
  projectId = (await createProject(team.id, designer.id, { name: 'Small items yard', site: 'Test site (invented)' })).id;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** sRGB hex or rgb() → CIE L*a*b* (D65), for the colour difference ΔE*ab (CIE 1976). */
function lab(colour: string): [number, number, number] {
  const rgb = colour.startsWith('#')
    ? [1, 3, 5].map((i) => Number.parseInt(colour.slice(i, i + 2), 16) / 255)
    : (colour.match(/[\d.]+/g) ?? []).slice(0, 3).map((v) => Number(v) / 255);
  const [r, g, b] = rgb.map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  const xyz = [
    (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047,
    0.2126 * r + 0.7152 * g + 0.0722 * b,
    (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883,
  ].map((t) => (t > 216 / 24389 ? Math.cbrt(t) : (24389 / 27 * t + 16) / 116));
  return [116 * xyz[1] - 16, 500 * (xyz[0] - xyz[1]), 200 * (xyz[1] - xyz[2])];
}
const deltaE = (a: string, b: string) => Math.hypot(...lab(a).map((v, i) => v - lab(b)[i]));

describe('the small items of issue 23', () => {
  it('the landing and sign-in pages name an icon that is served, and none of their requests answers 404', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const missing: string[] = [];
    page.on('response', (response: Response) => {
      if (response.status() === 404) missing.push(response.url());
    });
    for (const path of ['/', '/sign-in']) {
      await page.goto(appUrl(path), { waitUntil: 'networkidle' });
      const href = await page.locator('link[rel~="icon"]').first().getAttribute('href');
      expect(href).toBeTruthy();
      const icon = await page.request.get(new URL(href!, appUrl()).toString());
      expect(icon.status()).toBe(200);
      expect(icon.headers()['content-type']).toMatch(/^image\/svg\+xml/);
      expect(await icon.text()).toMatch(/<svg[\s>]/);
    }
    // Clients that ask /favicon.ico without reading the page get the same icon.
    const ico = await page.request.get(appUrl('/favicon.ico'));
    expect(ico.status()).toBe(200);
    expect(ico.headers()['content-type']).toMatch(/^image\/svg\+xml/);
    expect(missing).toEqual([]);
    await context.close();
  }, 120_000);

  it('an empty "What the circuit feeds" is refused with a message that names that field', async () => {
    const page = await signInInBrowser(browser, designerEmail);
    await page.goto(appUrl(`/projects/${projectId}`));
    await page.fill('#sheet-tag', 'SI-T1');
    await page.click('button:has-text("Create sheet")');
    const message = page.locator('#sheet-title-error');
    await message.waitFor({ timeout: 30_000 });
    await expect(message.textContent()).resolves.toMatch(/What the circuit feeds/);
    await expect(page.locator('label[for="sheet-title"]').textContent()).resolves.toBe('What the circuit feeds');
    await page.context().close();
  }, 120_000);

  it('a small loss reads in the unit its size calls for, and the plot lines differ by marker shape and clearly by colour', async () => {
    // 2 A in a 100 × 10 mm copper bar over 30 m: a loss of milliwatts (test inputs, not check values).
    const inputs = defaultSheetInputs('bar-on-edge');
    inputs.circuit.designCurrentA = 2;
    inputs.circuit.lengthM = 30;
    inputs.candidates = [testCopperBar(100, 10), testCopperBar(80, 10), testCopperBar(60, 10), testCopperBar(40, 10)];
    inputs.chosenCandidateId = inputs.candidates[0].id;
    const actor = { userId: designerId, can: (p: Parameters<typeof can>[1]) => can('designer', p) };
    const sheetId = (await createSheet(teamId, actor, { projectId, circuitTag: 'SI-L1', title: 'Small loss', inputs })).id;
    const computed = computeSheet(inputs);
    if (!computed.ok) throw new Error(computed.error.message);
    const chosen = computed.comparison.evaluations.find((e) => e.id === inputs.candidates[0].id)!;
    if (!chosen.ok || chosen.lossWPerM === null) throw new Error('the chosen candidate has no loss');
    const routeW = chosen.lossWPerM * inputs.circuit.lengthM;
    expect(routeW).toBeLessThan(1);

    const page = await signInInBrowser(browser, designerEmail);
    await page.goto(appUrl(`/sheets/${sheetId}`));
    // Found by its label, as a reader finds it.
    const loss = page.locator('dt', { hasText: 'Loss of the circuit' }).locator('xpath=following-sibling::dd');
    await loss.waitFor({ timeout: 60_000 });
    await expect.poll(() => loss.innerText(), { timeout: 30_000 }).toContain(`${formatPower(routeW)} over the route`);
    await expect(loss.innerText()).resolves.toMatch(/\d mW over the route/);
    await expect(loss.innerText()).resolves.not.toMatch(/0\.000/);

    const plot = page.getByTestId('curve-plot');
    await plot.locator('.main-svg').first().waitFor({ timeout: 30_000 });
    const traces = plot.locator('.scatterlayer .trace').filter({ has: page.locator('path.js-line') });
    await expect.poll(() => traces.count(), { timeout: 30_000 }).toBe(inputs.candidates.length);
    const lines: { stroke: string; marker: string }[] = [];
    for (let i = 0; i < inputs.candidates.length; i += 1) {
      const trace = traces.nth(i);
      const stroke = await trace.locator('path.js-line').first().evaluate((el) => getComputedStyle(el).stroke);
      const points = trace.locator('.points path.point');
      expect(await points.count()).toBeGreaterThan(0);
      lines.push({ stroke, marker: (await points.first().getAttribute('d')) ?? '' });
    }
    await screenshot(page, 'small-01-loss-and-plot');
    // Each line its own marker shape (Plotly draws each symbol as its own path).
    expect(new Set(lines.map((l) => l.marker)).size).toBe(lines.length);
    // Colours clearly apart: ΔE*ab ≥ 20 between any two lines (about the "clearly different" of
    // Sharma's CIE colour-difference notes; from memory), and apart from the design line's copper.
    for (let i = 0; i < lines.length; i += 1) {
      expect(deltaE(lines[i].stroke, '#b8703d')).toBeGreaterThanOrEqual(20);
      for (let j = i + 1; j < lines.length; j += 1) expect(deltaE(lines[i].stroke, lines[j].stroke)).toBeGreaterThanOrEqual(20);
    }
    await page.context().close();
  }, 180_000);
});
