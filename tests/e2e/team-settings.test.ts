// Issue 22: "a minimum section for parallel runs (team setting, default from common practice,
// said so)" — in Chromium against the production build: an admin reads the default (50 mm²,
// common practice) on the Members page, a section outside the bounds of lib/inputBounds is refused
// with the field's name, 95 mm² is saved (the database holds it, the page shows it after a reload)
// and emptying the field restores the default.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '@/db/client';
import { teamSizingOptions } from '@/db/queries/teams';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { signInInBrowser } from './sheet-steps';

let browser: Browser;
let teamId: string;
let adminEmail: string;

beforeAll(async () => {
  const team = await createTestTeam('e2e-team-settings');
  teamId = team.id;
  adminEmail = (await createTestUser(team.id, 'admin', { name: 'Oda Renner (test admin)' })).email;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe("the team's smallest section for parallel runs", () => {
  it('an admin sees the default, is refused out of bounds with the field named, saves 95 mm², and clears it again', async () => {
    const page = await signInInBrowser(browser, adminEmail);
    await page.goto(appUrl('/admin/members'));
    const panel = page.getByTestId('team-sizing-settings');
    await expect(panel.innerText()).resolves.toMatch(/50 mm², the default \(common practice\)/);
    const input = panel.getByTestId('min-parallel-section');

    await input.fill('0.5');
    await panel.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => panel.getByRole('alert').innerText(), { timeout: 15_000 }).toMatch(/^Smallest section run in parallel must be/);
    expect(await teamSizingOptions(teamId)).toEqual({});

    await input.fill('95');
    await panel.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => panel.getByRole('status').innerText(), { timeout: 15_000 }).toContain('only from 95 mm²');
    expect(await teamSizingOptions(teamId)).toEqual({ minParallelSectionMm2: 95 });
    await page.reload();
    await expect(page.getByTestId('min-parallel-section').inputValue()).resolves.toBe('95');
    await screenshot(page, 'team-settings-01-min-parallel');

    await page.getByTestId('min-parallel-section').fill('');
    await page.getByTestId('team-sizing-settings').getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => page.getByTestId('team-sizing-settings').getByRole('status').innerText(), { timeout: 15_000 }).toContain('default again');
    expect(await teamSizingOptions(teamId)).toEqual({});
    await page.context().close();
  });
});
