// Sign-in, the workspace guard and sign-out in Debian's Chromium against the production build,
// under the production Content-Security-Policy (issue 6).
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb } from '@/db/client';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** Records every CSP violation the page reports, and page errors. */
async function watch(page: Page) {
  const problems: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy|Refused to/i.test(message.text())) problems.push(message.text());
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => console.error(`Refused to run: CSP ${event.violatedDirective} ${event.blockedURI}`));
  });
  return problems;
}

describe('signing in with a browser', () => {
  it('sends a visitor of the workspace to sign-in, refuses a wrong password in words, signs in, and signs out', async () => {
    const team = await createTestTeam('browser');
    const user = await createTestUser(team.id, 'designer', { name: 'Browser Test Designer' });
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const problems = await watch(page);

    await page.goto(appUrl('/projects'), { waitUntil: 'networkidle' });
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(new URL(page.url()).searchParams.get('next')).toBe('/projects');
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Sign in');
    await screenshot(page, 'sign-in');

    await page.getByLabel('E-mail').fill(user.email);
    await page.getByLabel('Password').fill('not the password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    // (Next's route announcer is an empty role=alert too: look for ours by its words.)
    await page.getByRole('alert').filter({ hasText: /do not match an active account/ }).waitFor();
    await screenshot(page, 'sign-in-refused');

    await page.getByLabel('Password').fill(TEST_PASSWORD);
    await Promise.all([page.waitForURL((url) => url.pathname === '/projects'), page.getByRole('button', { name: 'Sign in' }).click()]);
    await page.waitForLoadState('networkidle');
    await expect(page.getByRole('button', { name: /Browser Test Designer/ }).isVisible()).resolves.toBe(true);
    await screenshot(page, 'signed-in-workspace');

    // Signed in, the landing page leads into the workspace.
    await page.goto(appUrl('/'), { waitUntil: 'networkidle' });
    expect(new URL(page.url()).pathname).toBe('/projects');

    await page.getByRole('button', { name: /Browser Test Designer/ }).click();
    await page.getByRole('radio', { name: 'Imperial' }).check({ force: true });
    await Promise.all([page.waitForURL((url) => url.pathname === '/sign-in'), page.getByRole('button', { name: 'Sign out' }).click()]);
    await page.goto(appUrl('/projects'), { waitUntil: 'networkidle' });
    expect(new URL(page.url()).pathname).toBe('/sign-in');

    expect(problems).toEqual([]);
    await context.close();
  });

  it('the members page is for admins: a designer gets the 403 page', async () => {
    const team = await createTestTeam('browser-403');
    const user = await createTestUser(team.id, 'designer');
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(appUrl('/sign-in?next=/admin/members'), { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail').fill(user.email);
    await page.getByLabel('Password').fill(TEST_PASSWORD);
    await Promise.all([page.waitForURL((url) => url.pathname === '/admin/members'), page.getByRole('button', { name: 'Sign in' }).click()]);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/role does not open this page/);
    const response = await page.reload();
    expect(response?.status()).toBe(403);
    await context.close();
  });

  it('an admin invites from the members page and the message shows in the local mailbox with its link', async () => {
    const team = await createTestTeam('browser-admin');
    const admin = await createTestUser(team.id, 'admin');
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const problems = await watch(page);
    await page.goto(appUrl('/sign-in?next=/admin/members'), { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail').fill(admin.email);
    await page.getByLabel('Password').fill(TEST_PASSWORD);
    await Promise.all([page.waitForURL((url) => url.pathname === '/admin/members'), page.getByRole('button', { name: 'Sign in' }).click()]);

    const invitee = `browser-invitee-${Date.now()}@test.example`;
    await page.getByLabel('E-mail').fill(invitee);
    await page.getByLabel('Role', { exact: true }).selectOption('reviewer');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await expect(page.getByRole('status').filter({ hasText: 'Invitation sent' }).textContent()).resolves.toContain(invitee);
    await page.getByText(invitee, { exact: true }).waitFor();
    await screenshot(page, 'members-admin');

    await page.goto(appUrl('/dev/mailbox'), { waitUntil: 'networkidle' });
    const message = page.getByRole('article', { name: `Join ${team.name} on Ampwarden` }).filter({ hasText: invitee });
    const link = message.getByRole('link', { name: /\/invite\// });
    await Promise.all([page.waitForURL((url) => url.pathname.startsWith('/invite/')), link.click()]);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(`Join ${team.name}`);
    await screenshot(page, 'invitation');
    expect(problems).toEqual([]);
    await context.close();
  });

  it('a Plotly scatter chart draws under the production CSP (no eval needed)', async () => {
    const page = await browser.newPage();
    const problems = await watch(page);
    await page.goto(appUrl('/sign-in'), { waitUntil: 'networkidle' });
    await page.addScriptTag({ path: path.resolve('node_modules/plotly.js-dist-min/plotly.min.js') });
    const traces = await page.evaluate(async () => {
      const host = document.createElement('div');
      host.style.width = '600px';
      host.style.height = '300px';
      document.body.appendChild(host);
      const plotly = (window as unknown as { Plotly: { newPlot(el: HTMLElement, data: unknown[], layout: unknown): Promise<unknown> } }).Plotly;
      await plotly.newPlot(host, [{ type: 'scatter', mode: 'lines+markers', x: [0, 1, 2, 3], y: [20, 45, 61, 70] }], { title: { text: 'profile' } });
      return host.querySelectorAll('.scatterlayer .trace').length;
    });
    expect(traces).toBe(1);
    expect(problems).toEqual([]);
    await page.close();
  });
});
