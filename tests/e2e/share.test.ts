// Sharing end to end against the production build (scripts/test.sh) and the real SMTP catcher:
// a designer makes a link over HTTP, anyone opens it without signing in and sees the sheet
// read-only (noindex, no way into the team's pages); revoked, expired and wrong links are refused
// in plain words; the link of team A shows nothing of team B; the PDF opens through the token; an
// e-mail with the PDF attached reaches the catcher and its link opens the sheet; the candidate
// exports download. In Chromium: the designer makes a link from the share panel and a stranger
// opens it. Screenshots of the share page (and of the PDF's first page where pdftoppm exists) go to
// test-results/screenshots.
import { execFileSync } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createShare } from '@/db/queries/shares';
import { CAUTION_TEXT } from '@/lib/caution';
import { signInInBrowser } from './sheet-steps';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { makeSharedSheet } from '../integration/share/shareFixtures';
import { httpClient, signInOverHttp, type HttpClient } from './auth-http';

interface CaughtMessage {
  id: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
  attachments: { filename: string; contentType: string; size: number; contentBase64?: string }[];
}

const catcher = () => {
  const url = process.env.MAIL_CATCHER_URL;
  if (!url) throw new Error('MAIL_CATCHER_URL is not set: run through npm test');
  return url;
};

async function waitForMail(address: string): Promise<CaughtMessage> {
  for (let attempt = 0; attempt < 150; attempt += 1) {
    const messages = (await (await fetch(`${catcher()}/messages`)).json()) as CaughtMessage[];
    const found = messages.find((m) => m.to.includes(address));
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no mail to ${address} reached the catcher`);
}

async function pdfText(bytes: ArrayBuffer | Uint8Array): Promise<string> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(bytes)), { mergePages: true });
  return (text as string).replace(/\s+/g, ' ');
}

/** Every href and src of a page, to show it leads nowhere but its own PDF and the app's static files. */
function linksIn(html: string): string[] {
  return [...html.matchAll(/\s(?:href|src|action)="([^"]*)"/g)].map((m) => m[1]);
}

let browser: Browser;
let designer: HttpClient;
let designerEmail: string;
let teamA: { id: string };
let designerA: { id: string; role: 'designer' };
let sheetA: Awaited<ReturnType<typeof makeSharedSheet>>;
let sheetB: Awaited<ReturnType<typeof makeSharedSheet>>;

beforeAll(async () => {
  teamA = await createTestTeam('share-e2e-a');
  const teamB = await createTestTeam('share-e2e-b');
  const designerUser = await createTestUser(teamA.id, 'designer', { name: 'Ines Marlow (test designer)' });
  designerA = { id: designerUser.id, role: 'designer' };
  designerEmail = designerUser.email;
  const adminB = (await createTestUser(teamB.id, 'admin')) as { id: string; role: 'admin' };
  sheetA = await makeSharedSheet(teamA.id, designerA, 'Aster');
  sheetB = await makeSharedSheet(teamB.id, adminB, 'Birch');
  const answer = await signInOverHttp(designerEmail, TEST_PASSWORD);
  expect(answer.signedIn).toBe(true);
  designer = answer.client;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function makeLink(days = 7): Promise<{ path: string; token: string; id: string }> {
  const response = await designer.request(`/api/sheets/${sheetA.sheetId}/shares`, { method: 'POST', body: { expiresInDays: days } });
  expect(response.status).toBe(201);
  const body = (await response.json()) as { path: string; token: string; share: { id: string } };
  return { path: body.path, token: body.token, id: body.share.id };
}

describe('a read-only link over HTTP', () => {
  it('opens the sheet without signing in: inputs, chosen candidate, flags, review status, cautions; noindex; no way into the team', async () => {
    const link = await makeLink();
    expect(link.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const response = await fetch(appUrl(link.path), { redirect: 'manual' });
    expect(response.status).toBe(200);
    const html = await response.text();
    for (const text of [sheetA.circuitTag, sheetA.title, sheetA.projectName, '240 mm² Cu XLPE', 'Design current', 'Ambient temperature assumed', 'Not approved.', CAUTION_TEXT[2]]) {
      expect(html, text).toContain(text.replace(/'/g, '&#x27;'));
    }
    expect(html).toMatch(/<meta name="robots" content="noindex, nofollow/);
    // Nothing of team B, and no path into the team's pages: only its own PDF and the app's static files.
    for (const secret of [sheetB.circuitTag, sheetB.title, sheetB.projectName, sheetA.sheetId, sheetA.projectId]) expect(html).not.toContain(secret);
    // The page's icon (app/icon.svg) is a static file, not a way into the team.
    const elsewhere = linksIn(html).filter((href) => href !== `/share/${link.token}/pdf` && !href.startsWith('/_next/') && !href.startsWith('data:') && !/^\/icon\.svg(\?|$)/.test(href));
    expect(elsewhere).toEqual([]);
    // Read-only: no form and no button that changes anything is rendered on the server.
    expect(html).not.toMatch(/<form|>Save<|>Submit for review<|>Approve</);
  });

  it('offers the PDF through the token, with the circuit, the chosen cable and the NOT APPROVED marking', async () => {
    const link = await makeLink();
    const response = await fetch(appUrl(`${link.path}/pdf`));
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/pdf');
    const text = await pdfText(await response.arrayBuffer());
    expect(text).toContain(sheetA.circuitTag);
    expect(text).toContain('240 mm²');
    expect(text).toContain('NOT APPROVED');
  });

  it('a revoked link says so plainly, and its PDF is refused (410)', async () => {
    const link = await makeLink();
    const revoked = await designer.request(`/api/sheets/${sheetA.sheetId}/shares/${link.id}`, { method: 'DELETE' });
    expect(revoked.status).toBe(200);
    const page = await (await fetch(appUrl(link.path))).text();
    expect(page).toContain('This link was revoked');
    expect(page).not.toContain(sheetA.circuitTag);
    const pdf = await fetch(appUrl(`${link.path}/pdf`));
    expect(pdf.status).toBe(410);
    expect(((await pdf.json()) as { error: { code: string } }).error.code).toBe('link_revoked');
  });

  it('an expired link says so plainly', async () => {
    const share = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 1, now: new Date(Date.now() - 2 * 86_400_000) }))!;
    const page = await (await fetch(appUrl(`/share/${share.token}`))).text();
    expect(page).toContain('This link has expired');
    expect(page).not.toContain(sheetA.circuitTag);
    expect((await fetch(appUrl(`/share/${share.token}/pdf`))).status).toBe(410);
  });

  it('wrong tokens (random, malformed) all get the same "not valid" answer, 404', async () => {
    const answers = new Set<string>();
    for (const token of [randomBytes(32).toString('base64url'), randomBytes(32).toString('base64url'), 'x', 'A'.repeat(43), randomUUID()]) {
      const response = await fetch(appUrl(`/share/${token}`));
      expect(response.status).toBe(404);
      const html = await response.text();
      expect(html).toContain('This link is not valid');
      answers.add(/<main[^>]*>([\s\S]*?)<\/main>/.exec(html)?.[1] ?? '');
      expect((await fetch(appUrl(`/share/${token}/pdf`))).status).toBe(404);
    }
    expect(answers.size).toBe(1);
  });

  it('team B’s admin cannot list or revoke team A’s links (404, as for a sheet that does not exist)', async () => {
    const link = await makeLink();
    const teamB = await createTestTeam('share-e2e-c');
    const outsider = await createTestUser(teamB.id, 'admin');
    const { client } = await signInOverHttp(outsider.email, TEST_PASSWORD);
    expect((await client.request(`/api/sheets/${sheetA.sheetId}/shares`)).status).toBe(404);
    expect((await client.request(`/api/sheets/${sheetA.sheetId}/shares/${link.id}`, { method: 'DELETE' })).status).toBe(404);
    expect((await fetch(appUrl(link.path))).status).toBe(200);
  });
});

describe('e-mail', () => {
  it('arrives at the catcher with the PDF attached and a link that opens the shared sheet; the history records recipient and message', async () => {
    const to = `colleague-${randomUUID().slice(0, 8)}@test.example`;
    const message = 'Please look at the ambient assumption before Friday.';
    const sent = await designer.request(`/api/sheets/${sheetA.sheetId}/email`, { method: 'POST', body: { to, message, attachPdf: true, expiresInDays: 7 } });
    expect(sent.status).toBe(201);
    const mail = await waitForMail(to);
    expect(mail.subject).toContain(sheetA.circuitTag);
    expect(mail.text).toContain(message);
    expect(mail.text).toContain(CAUTION_TEXT[2]);
    const match = /https?:\/\/\S+\/share\/[A-Za-z0-9_-]{43}/.exec(mail.text);
    expect(match).not.toBeNull();
    const link = new URL(match![0]);
    expect(link.origin).toBe(new URL(appUrl()).origin);
    const page = await fetch(link);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(sheetA.circuitTag);

    expect(mail.attachments.map((a) => a.contentType)).toEqual(['application/pdf']);
    const full = (await (await fetch(`${catcher()}/messages/${mail.id}`)).json()) as CaughtMessage;
    const attached = await pdfText(Buffer.from(full.attachments[0].contentBase64!, 'base64'));
    expect(attached).toContain(sheetA.circuitTag);

    const history = (await (await designer.request(`/api/sheets/${sheetA.sheetId}/history`)).json()) as { history: { action: string; detail: Record<string, unknown> }[] };
    const entry = history.history.find((h) => h.action === 'sheet.email' && h.detail.to === to);
    expect(entry?.detail).toMatchObject({ to, message, pdfAttached: true });
  });

  it('refuses a malformed address and names the field', async () => {
    const response = await designer.request(`/api/sheets/${sheetA.sheetId}/email`, { method: 'POST', body: { to: 'not an address', attachPdf: false } });
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues.map((i) => i.path)).toContain('to');
  });
});

describe('candidate exports over HTTP', () => {
  it('CSV and XLSX download for a member', async () => {
    const csv = await designer.request(`/api/sheets/${sheetA.sheetId}/candidates/export?format=csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers.get('content-type')).toContain('text/csv');
    const text = await csv.text();
    expect(text).toContain('cu-xlpe-240');
    expect(text).toContain('hot spot (°C)');
    const xlsx = await designer.request(`/api/sheets/${sheetA.sheetId}/candidates/export?format=xlsx`);
    expect(xlsx.status).toBe(200);
    expect(Buffer.from(await xlsx.arrayBuffer()).subarray(0, 2).toString()).toBe('PK');
    expect((await httpClient().request(`/api/sheets/${sheetA.sheetId}/candidates/export?format=csv`)).status).toBe(401);
  });
});

describe('in Chromium', () => {
  it('the designer makes a link in the share panel; a stranger opens it and sees the sheet read-only with its plots', async () => {
    const page = await signInInBrowser(browser, designerEmail);
    const context = page.context();
    await page.goto(appUrl(`/sheets/${sheetA.sheetId}`));
    await page.getByTestId('share-panel').waitFor();
    await page.getByTestId('make-link').click();
    const linkInput = page.getByTestId('new-link');
    await linkInput.waitFor();
    const link = await linkInput.inputValue();
    expect(link).toMatch(/\/share\/[A-Za-z0-9_-]{43}$/);
    await page.getByTestId('share-list').waitFor();
    await context.close();

    const stranger = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const view = await stranger.newPage();
    await view.goto(link);
    await view.getByTestId('shared-sheet').waitFor();
    await view.getByTestId('candidate-grid').waitFor();
    await view.getByTestId('profile-plot').locator('.main-svg').first().waitFor({ timeout: 60_000 });
    expect(await view.getByTestId('hot-spot').innerText()).toMatch(/°C/);
    expect(await view.getByTestId('flags-panel').innerText()).toContain('Ambient temperature assumed');
    expect(await view.getByTestId('shared-review-status').innerText()).toContain('Not approved');
    // The link says which units it is in, as the PDF does (issue 22).
    expect(await view.getByTestId('shared-units-line').innerText()).toMatch(/^Units: SI throughout/);
    expect(await view.locator('nav').count()).toBe(0);
    // No field of ours to type into (the grid's and the plot's own internal controls aside) and no form.
    const fields = await view.evaluate(() =>
      [...document.querySelectorAll('input, textarea, select')]
        .filter((el) => (el as HTMLInputElement).type !== 'hidden' && !el.closest('.ag-root-wrapper, .js-plotly-plot'))
        .map((el) => el.outerHTML.slice(0, 120)),
    );
    expect(fields).toEqual([]);
    expect(await view.locator('form').count()).toBe(0);
    await screenshot(view, 'share-page');

    // The PDF's first page as an image, where poppler's pdftoppm is installed (the text checks above do not need it).
    let hasPdftoppm = true;
    try {
      execFileSync('pdftoppm', ['-v'], { stdio: 'ignore' });
    } catch {
      hasPdftoppm = false;
    }
    if (hasPdftoppm) {
      const pdf = Buffer.from(await (await fetch(`${link}/pdf`)).arrayBuffer());
      const dir = path.resolve('test-results', 'screenshots');
      fs.mkdirSync(dir, { recursive: true });
      fs.writeFileSync(path.join(dir, 'share-pdf.pdf'), pdf);
      execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '1', '-singlefile', path.join(dir, 'share-pdf.pdf'), path.join(dir, 'share-pdf-page1')]);
      expect(fs.statSync(path.join(dir, 'share-pdf-page1.png')).size).toBeGreaterThan(10_000);
    }
    await stranger.close();
  });
});
