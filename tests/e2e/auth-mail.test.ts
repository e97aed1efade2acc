// End to end through the built app and the real SMTP catcher (issue 6): an admin invites, the
// message arrives, its link sets a password once, the new member signs in with the invited role;
// password reset; wrong passwords hit the limiter; a deactivated member is shut out at once.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { invitations } from '@/db/schema';
import { ACCOUNT_LIMIT } from '@/server/limits/signIn';
import { appUrl } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { httpClient, signInOverHttp, type HttpClient } from './auth-http';

interface CaughtMessage {
  id: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

async function waitForMail(address: string, after = 0): Promise<CaughtMessage> {
  const catcher = process.env.MAIL_CATCHER_URL;
  if (!catcher) throw new Error('MAIL_CATCHER_URL is not set: run through npm test');
  for (let attempt = 0; attempt < 100; attempt += 1) {
    const messages = (await (await fetch(`${catcher}/messages`)).json()) as CaughtMessage[];
    const found = messages.find((m) => m.to.includes(address) && Date.parse(m.receivedAt) >= after);
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no mail to ${address} reached the catcher`);
}

function linkIn(text: string, kind: 'invite' | 'reset'): URL {
  const match = new RegExp(`https?://\\S+/${kind}/[A-Za-z0-9_-]{43}`).exec(text);
  if (!match) throw new Error(`no ${kind} link in the mail: ${text}`);
  return new URL(match[0]);
}

const NEW_PASSWORD = 'seven unrelated words make a password';
let team: Awaited<ReturnType<typeof createTestTeam>>;
let adminClient: HttpClient;

beforeAll(async () => {
  team = await createTestTeam('mail-e2e');
  const admin = await createTestUser(team.id, 'admin');
  const answer = await signInOverHttp(admin.email, TEST_PASSWORD);
  expect(answer.signedIn).toBe(true);
  adminClient = answer.client;
});
afterAll(() => closeDb());

describe('invitation through the mail catcher', () => {
  it('arrives, sets a password once, and the new member signs in with the invited role', async () => {
    const email = `invitee-${randomUUID().slice(0, 8)}@test.example`;
    const invited = await adminClient.request('/api/members/invitations', { method: 'POST', body: { email, role: 'reviewer' } });
    expect(invited.status).toBe(201);

    const mail = await waitForMail(email);
    expect(mail.subject).toBe(`Join ${team.name} on Ampwarden`);
    const link = linkIn(mail.text, 'invite');
    expect(link.origin).toBe(new URL(appUrl()).origin);
    const token = link.pathname.split('/').pop()!;

    const page = await fetch(link);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(`Join ${team.name}`);

    const anonymous = httpClient();
    const accepted = await anonymous.request('/api/auth/invitation', { method: 'POST', body: { token, name: 'New Reviewer', password: NEW_PASSWORD } });
    expect(accepted.status).toBe(201);
    const again = await anonymous.request('/api/auth/invitation', { method: 'POST', body: { token, name: 'Second Use', password: NEW_PASSWORD } });
    expect(again.status).toBe(410);
    expect((await again.json()).error.code).toBe('link_used');
    expect(await (await fetch(link)).text()).toContain('already been used');

    const member = await signInOverHttp(email, NEW_PASSWORD);
    expect(member.error).toBeNull();
    expect(member.signedIn).toBe(true);
    // A reviewer: the review queue opens, the members list does not.
    expect((await member.client.request('/api/sheets/review-queue')).status).toBe(200);
    expect((await member.client.request('/api/members')).status).toBe(403);
    const session = (await (await member.client.request('/api/auth/session')).json()) as { role?: string; user?: { email?: string } };
    expect(session).toMatchObject({ role: 'reviewer', user: { email } });
  });

  it('refuses an expired link, on the page and in the API', async () => {
    const email = `late-${randomUUID().slice(0, 8)}@test.example`;
    expect((await adminClient.request('/api/members/invitations', { method: 'POST', body: { email, role: 'designer' } })).status).toBe(201);
    const link = linkIn((await waitForMail(email)).text, 'invite');
    await getDb().update(invitations).set({ expiresAt: sql`now() - interval '1 minute'` }).where(eq(invitations.email, email));

    expect(await (await fetch(link)).text()).toContain('has expired');
    const response = await httpClient().request('/api/auth/invitation', { method: 'POST', body: { token: link.pathname.split('/').pop(), name: 'Too Late', password: NEW_PASSWORD } });
    expect(response.status).toBe(410);
    expect((await response.json()).error.code).toBe('link_expired');
    expect((await signInOverHttp(email, NEW_PASSWORD)).signedIn).toBe(false);
  });
});

describe('password reset through the mail catcher', () => {
  it('mails a link that sets a new password once and ends the sessions opened before', async () => {
    const member = await createTestUser(team.id, 'designer');
    const before = await signInOverHttp(member.email, TEST_PASSWORD);
    expect((await before.client.request('/api/projects')).status).toBe(200);

    const started = Date.now();
    const asked = await httpClient().request('/api/auth/reset-request', { method: 'POST', body: { email: member.email } });
    expect(asked.status).toBe(202);
    const link = linkIn((await waitForMail(member.email, started - 1000)).text, 'reset');
    const token = link.pathname.split('/').pop();

    expect((await httpClient().request('/api/auth/reset', { method: 'POST', body: { token, password: NEW_PASSWORD } })).status).toBe(200);
    expect((await httpClient().request('/api/auth/reset', { method: 'POST', body: { token, password: 'yet another long passphrase' } })).status).toBe(410);

    expect((await before.client.request('/api/projects')).status).toBe(401);
    expect((await signInOverHttp(member.email, TEST_PASSWORD)).signedIn).toBe(false);
    expect((await signInOverHttp(member.email, NEW_PASSWORD)).signedIn).toBe(true);
  });
});

describe('sign-in limits and closed access over HTTP', () => {
  it(`wrong passwords hit the limiter: after ${ACCOUNT_LIMIT.points} the right one is refused too, with the wait`, async () => {
    const member = await createTestUser(team.id, 'viewer');
    const errors: (string | null)[] = [];
    for (let i = 0; i < ACCOUNT_LIMIT.points; i += 1) errors.push((await signInOverHttp(member.email, `wrong ${i}`)).error);
    expect(errors.slice(0, -1)).toEqual(Array(ACCOUNT_LIMIT.points - 1).fill('CredentialsSignin'));
    expect(errors.at(-1)).toMatch(/^limited:\d+$/);
    const right = await signInOverHttp(member.email, TEST_PASSWORD);
    expect(right.signedIn).toBe(false);
    expect(right.error).toMatch(/^limited:\d+$/);
    // The sign-in page turns the code into words.
    const page = await (await fetch(appUrl(`/sign-in?error=${encodeURIComponent(right.error!)}`))).text();
    expect(page).toContain('Too many failed attempts');
  });

  it('a deactivated member cannot use an open session nor sign in again', async () => {
    const member = await createTestUser(team.id, 'designer');
    const session = await signInOverHttp(member.email, TEST_PASSWORD);
    expect((await session.client.request('/api/projects')).status).toBe(200);
    const workspace = await session.client.request('/projects');
    expect(workspace.status).toBe(200);

    expect((await adminClient.request(`/api/members/${member.id}`, { method: 'PATCH', body: { active: false } })).status).toBe(200);

    expect((await session.client.request('/api/projects')).status).toBe(401);
    const page = await session.client.request('/projects');
    expect(page.status).toBe(307);
    expect(page.headers.get('location')).toMatch(/\/sign-in/);
    const again = await signInOverHttp(member.email, TEST_PASSWORD);
    expect(again.signedIn).toBe(false);
    expect(again.error).toBe('CredentialsSignin');
  });

  it('the last admin of a team cannot demote or close themselves over HTTP', async () => {
    const soloTeam = await createTestTeam('solo-e2e');
    const solo = await createTestUser(soloTeam.id, 'admin');
    const client = (await signInOverHttp(solo.email, TEST_PASSWORD)).client;
    const demote = await client.request(`/api/members/${solo.id}`, { method: 'PATCH', body: { role: 'viewer' } });
    expect(demote.status).toBe(409);
    expect((await demote.json()).error.code).toBe('last_admin');
    expect((await client.request(`/api/members/${solo.id}`, { method: 'PATCH', body: { active: false } })).status).toBe(409);
  });

  it('sends the session cookie httpOnly and SameSite=Lax, and the security headers on pages', async () => {
    const client = httpClient();
    const csrf = (await (await client.request('/api/auth/csrf')).json()) as { csrfToken: string };
    const member = await createTestUser(team.id, 'viewer');
    const response = await client.request('/api/auth/callback/credentials', {
      method: 'POST',
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email: member.email, password: TEST_PASSWORD, json: 'true' }).toString(),
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    const cookie = response.headers.getSetCookie().find((c) => c.includes('next-auth.session-token='));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    // Secure only when the app is served over https (NEXTAUTH_URL); the tests run over http.
    expect(/;\s*Secure/i.test(cookie!)).toBe((process.env.NEXTAUTH_URL ?? '').startsWith('https://'));

    const page = await fetch(appUrl('/sign-in'));
    const csp = page.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("script-src 'self' 'unsafe-inline'");
    expect(csp).not.toContain('unsafe-eval');
    expect(page.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    expect(page.headers.get('x-content-type-options')).toBe('nosniff');
    expect(page.headers.get('permissions-policy')).toContain('camera=()');
  });
});
