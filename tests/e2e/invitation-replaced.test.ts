// Issue 23: an invitation replaced by a newer one for the same address said "already been used",
// which sends people looking for an account they never made. Through the built app and the SMTP
// catcher: the older link says it was replaced by a newer invitation, in the browser and in the
// API's refusal; the newer link still works; a link that was used still says so.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '@/db/client';
import { appUrl, launchBrowser } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { httpClient, signInOverHttp, type HttpClient } from './auth-http';

interface CaughtMessage {
  to: string[];
  text: string;
  receivedAt: string;
}

/** The invitation links that reached `address`, oldest first. */
async function inviteLinks(address: string, count: number): Promise<string[]> {
  const catcher = process.env.MAIL_CATCHER_URL;
  if (!catcher) throw new Error('MAIL_CATCHER_URL is not set: run through npm test');
  for (let attempt = 0; attempt < 100; attempt += 1) {
    const messages = ((await (await fetch(`${catcher}/messages`)).json()) as CaughtMessage[]).filter((m) => m.to.includes(address));
    if (messages.length >= count) {
      return messages
        .sort((a, b) => Date.parse(a.receivedAt) - Date.parse(b.receivedAt))
        .map((m) => /https?:\/\/\S+\/invite\/[A-Za-z0-9_-]{43}/.exec(m.text)![0]);
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`fewer than ${count} invitations reached ${address}`);
}

let browser: Browser;
let admin: HttpClient;

beforeAll(async () => {
  const team = await createTestTeam('invite-replaced');
  const answer = await signInOverHttp((await createTestUser(team.id, 'admin')).email, TEST_PASSWORD);
  expect(answer.signedIn).toBe(true);
  admin = answer.client;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('an invitation replaced by a newer one', () => {
  it('says it was replaced by a newer invitation, not that it was used; the newer link works', async () => {
    const email = `twice-${randomUUID().slice(0, 8)}@test.example`;
    for (const role of ['viewer', 'designer']) {
      expect((await admin.request('/api/members/invitations', { method: 'POST', body: { email, role } })).status).toBe(201);
    }
    const [older, newer] = await inviteLinks(email, 2);
    const page = await (await browser.newContext()).newPage();
    await page.goto(older);
    const refusal = await page.getByRole('main').innerText();
    expect(refusal).toContain('This invitation was replaced by a newer one');
    expect(refusal).not.toContain('already been used');
    // The API says the same when the old link is sent anyway.
    const token = older.split('/').pop()!;
    const accept = await httpClient().request('/api/auth/invitation', { method: 'POST', body: { token, name: 'Old Link', password: 'seven unrelated words make a password' } });
    expect(accept.status).toBe(410);
    expect((await accept.json()).error).toMatchObject({ code: 'link_replaced', message: expect.stringMatching(/replaced by a newer invitation/) });
    // The newer link is the one that works, with the newer role.
    await page.goto(newer);
    await page.getByText('You are invited as').waitFor();
    expect(await page.getByRole('main').innerText()).toMatch(/invited as\s+designer/i);
  });

  it('a used invitation still says it has been used', async () => {
    const email = `used-${randomUUID().slice(0, 8)}@test.example`;
    expect((await admin.request('/api/members/invitations', { method: 'POST', body: { email, role: 'viewer' } })).status).toBe(201);
    const [link] = await inviteLinks(email, 1);
    const token = link.split('/').pop()!;
    expect((await httpClient().request('/api/auth/invitation', { method: 'POST', body: { token, name: 'Used Once', password: 'seven unrelated words make a password' } })).status).toBe(201);
    const text = await (await fetch(link)).text();
    expect(text).toContain('already been used');
    expect(text).not.toContain('replaced by a newer');
  });
});
