// Invitations, roles, closing access and password reset against the real database and the real
// SMTP catcher that scripts/test.sh runs (issue 6).
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import bcrypt from 'bcryptjs';
import { closeDb, getDb } from '@/db/client';
import { auditLog, invitations, passwordResetTokens, users } from '@/db/schema';
import { acceptInvitation, changeMember, inspectInvitation, inviteMember, requestPasswordReset, resetPassword, revokeInvitation } from '@/server/auth/members';
import { resolveSessionUser, type SessionUser } from '@/server/auth/session';
import { ApiError } from '@/server/http/errors';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';

const NEW_PASSWORD = 'a fresh and long passphrase';
// Links in mail are built on the app's public address; the integration phase runs before the app is served.
process.env.NEXTAUTH_URL ??= 'http://127.0.0.1:3999';

interface CaughtMessage {
  to: string[];
  subject: string;
  text: string;
}

async function mailTo(address: string): Promise<CaughtMessage> {
  const catcher = process.env.MAIL_CATCHER_URL;
  if (!catcher) throw new Error('MAIL_CATCHER_URL is not set: run through npm test');
  for (let attempt = 0; attempt < 50; attempt += 1) {
    const messages = (await (await fetch(`${catcher}/messages`)).json()) as CaughtMessage[];
    const found = messages.find((m) => m.to.includes(address));
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no mail to ${address} arrived`);
}

function linkToken(text: string, kind: 'invite' | 'reset'): string {
  const match = new RegExp(`/${kind}/([A-Za-z0-9_-]{43})`).exec(text);
  if (!match) throw new Error(`no /${kind}/ link in: ${text}`);
  return match[1];
}

async function refusal(promise: Promise<unknown>): Promise<{ status: number; code: string }> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ApiError) return { status: error.status, code: error.code };
    throw error;
  }
  throw new Error('expected a refusal');
}

function asSessionUser(row: { id: string; teamId: string; role: SessionUser['role']; name: string; email: string }, teamName: string): SessionUser {
  return { id: row.id, teamId: row.teamId, role: row.role, name: row.name, email: row.email, teamName, unitSystem: 'si', decimalSeparator: null, teamCurrency: 'EUR' };
}

let team: Awaited<ReturnType<typeof createTestTeam>>;
let admin: SessionUser;
let otherAdmin: SessionUser;

beforeAll(async () => {
  team = await createTestTeam('members');
  const other = await createTestTeam('members-other');
  admin = asSessionUser(await createTestUser(team.id, 'admin'), team.name);
  otherAdmin = asSessionUser(await createTestUser(other.id, 'admin'), other.name);
});
afterAll(() => closeDb());

describe('invitations', () => {
  it('mails a link whose token is stored only as its SHA-256 hash; the link sets a password once with the invited role', async () => {
    const email = `invited-${Date.now()}@test.example`;
    const invitation = await inviteMember(admin, { email, role: 'reviewer' });
    const mail = await mailTo(email);
    expect(mail.subject).toContain(team.name);
    const token = linkToken(mail.text, 'invite');
    expect(mail.text).toContain(`${process.env.NEXTAUTH_URL ?? process.env.APP_URL}/invite/${token}`);

    const [row] = await getDb().select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    const stored = JSON.stringify(await getDb().execute(sql`select * from invitations where id = ${invitation.id}`));
    expect(stored).not.toContain(token);

    expect(await inspectInvitation(token)).toMatchObject({ state: 'valid', email, role: 'reviewer', teamName: team.name });
    const created = await acceptInvitation({ token, name: 'Invited Person', password: NEW_PASSWORD });
    expect(created.role).toBe('reviewer');
    const [user] = await getDb().select().from(users).where(eq(users.id, created.id));
    expect(user.teamId).toBe(team.id);
    expect(await bcrypt.compare(NEW_PASSWORD, user.passwordHash!)).toBe(true);

    expect(await refusal(acceptInvitation({ token, name: 'Someone Else', password: NEW_PASSWORD }))).toEqual({ status: 410, code: 'link_used' });
    expect(await inspectInvitation(token)).toEqual({ state: 'used' });

    const actions = (await getDb().select({ action: auditLog.action }).from(auditLog).where(eq(auditLog.teamId, team.id))).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(['member.invite', 'member.join', 'password.set']));
  });

  it('refuses an expired link and an unknown one', async () => {
    const email = `late-${Date.now()}@test.example`;
    const invitation = await inviteMember(admin, { email, role: 'viewer' });
    const token = linkToken((await mailTo(email)).text, 'invite');
    await getDb().update(invitations).set({ expiresAt: sql`now() - interval '1 minute'` }).where(eq(invitations.id, invitation.id));
    expect(await refusal(acceptInvitation({ token, name: 'Too Late', password: NEW_PASSWORD }))).toEqual({ status: 410, code: 'link_expired' });
    expect(await refusal(acceptInvitation({ token: 'B'.repeat(43), name: 'Nobody', password: NEW_PASSWORD }))).toEqual({ status: 404, code: 'link_unknown' });
    expect((await getDb().select().from(users).where(eq(users.email, email))).length).toBe(0);
  });

  it('a new invitation to the same address replaces the open one; a withdrawn link stops working', async () => {
    const email = `twice-${Date.now()}@test.example`;
    await inviteMember(admin, { email, role: 'viewer' });
    const firstToken = linkToken((await mailTo(email)).text, 'invite');
    const second = await inviteMember(admin, { email, role: 'designer' });
    // Issue 23: replaced, not "used" — nobody joined with it.
    expect(await inspectInvitation(firstToken)).toEqual({ state: 'replaced' });
    expect(await refusal(acceptInvitation({ token: firstToken, name: 'Old Link', password: NEW_PASSWORD }))).toEqual({ status: 410, code: 'link_replaced' });
    const catcher = process.env.MAIL_CATCHER_URL!;
    let secondToken: string | undefined;
    for (let attempt = 0; attempt < 50 && !secondToken; attempt += 1) {
      const messages = ((await (await fetch(`${catcher}/messages`)).json()) as CaughtMessage[]).filter((m) => m.to.includes(email));
      secondToken = messages.map((m) => linkToken(m.text, 'invite')).find((t) => t !== firstToken);
      if (!secondToken) await new Promise((resolve) => setTimeout(resolve, 100));
    }
    expect(await inspectInvitation(secondToken!)).toMatchObject({ state: 'valid', role: 'designer' });
    await revokeInvitation(admin, second.id);
    // Withdrawn by an admin with no newer invitation: says so, and is still not "used".
    expect(await inspectInvitation(secondToken!)).toEqual({ state: 'revoked' });
    expect(await refusal(acceptInvitation({ token: secondToken!, name: 'Withdrawn', password: NEW_PASSWORD }))).toEqual({ status: 410, code: 'link_revoked' });
    const open = await getDb().select().from(invitations).where(and(eq(invitations.email, email), sql`revoked_at is null`));
    expect(open).toEqual([]);
    expect(await refusal(revokeInvitation(otherAdmin, second.id))).toMatchObject({ status: 404 });
  });

  it('refuses an address that already has an account', async () => {
    expect(await refusal(inviteMember(admin, { email: admin.email.toUpperCase(), role: 'viewer' }))).toEqual({ status: 409, code: 'email_taken' });
  });
});

describe('roles and closing access', () => {
  it('the only active admin cannot demote or deactivate themselves; with a second admin they can', async () => {
    const soloTeam = await createTestTeam('solo');
    const solo = asSessionUser(await createTestUser(soloTeam.id, 'admin'), soloTeam.name);
    expect(await refusal(changeMember(solo, solo.id, { role: 'designer' }))).toEqual({ status: 409, code: 'last_admin' });
    expect(await refusal(changeMember(solo, solo.id, { active: false }))).toEqual({ status: 409, code: 'last_admin' });
    // A deactivated admin does not count as the second one.
    const closedAdmin = await createTestUser(soloTeam.id, 'admin', { active: false });
    expect(await refusal(changeMember(solo, solo.id, { role: 'viewer' }))).toEqual({ status: 409, code: 'last_admin' });
    await changeMember(solo, closedAdmin.id, { active: true });
    const demoted = await changeMember(solo, solo.id, { role: 'designer' });
    expect(demoted.role).toBe('designer');
  });

  it("another team's admin gets 404 for this team's members and changes nothing", async () => {
    const member = await createTestUser(team.id, 'viewer');
    expect(await refusal(changeMember(otherAdmin, member.id, { role: 'admin' }))).toEqual({ status: 404, code: 'not_found' });
    const [unchanged] = await getDb().select().from(users).where(eq(users.id, member.id));
    expect(unchanged.role).toBe('viewer');
  });

  it('a role change applies to the next request; deactivation ends open sessions (session epoch) and is audited', async () => {
    const member = await createTestUser(team.id, 'designer');
    const claims = { sub: member.id, teamId: team.id, role: 'designer' as const, epoch: member.sessionEpoch };
    expect((await resolveSessionUser(claims))?.role).toBe('designer');
    await changeMember(admin, member.id, { role: 'viewer' });
    expect((await resolveSessionUser(claims))?.role).toBe('viewer');

    await changeMember(admin, member.id, { active: false });
    expect(await resolveSessionUser(claims)).toBeNull();
    const [closed] = await getDb().select().from(users).where(eq(users.id, member.id));
    expect(closed.sessionEpoch).toBe(member.sessionEpoch + 1);
    // Reactivating does not revive the old session.
    await changeMember(admin, member.id, { active: true });
    expect(await resolveSessionUser(claims)).toBeNull();

    const entries = await getDb().select({ action: auditLog.action, detail: auditLog.detail }).from(auditLog).where(eq(auditLog.entityId, member.id));
    expect(entries.map((e) => e.action)).toEqual(expect.arrayContaining(['member.role_change', 'member.deactivate', 'member.reactivate']));
    expect(entries.find((e) => e.action === 'member.role_change')?.detail).toEqual({ from: 'designer', to: 'viewer' });
  });
});

describe('password reset', () => {
  it('mails a single-use link; saving ends the older sessions and the old password', async () => {
    const member = await createTestUser(team.id, 'designer');
    const oldClaims = { sub: member.id, teamId: team.id, role: 'designer' as const, epoch: member.sessionEpoch };
    await requestPasswordReset(member.email.toUpperCase());
    const token = linkToken((await mailTo(member.email)).text, 'reset');
    const [stored] = await getDb().select().from(passwordResetTokens).where(eq(passwordResetTokens.userId, member.id));
    expect(stored.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));

    await resetPassword({ token, password: NEW_PASSWORD });
    const [after] = await getDb().select().from(users).where(eq(users.id, member.id));
    expect(await bcrypt.compare(NEW_PASSWORD, after.passwordHash!)).toBe(true);
    expect(await resolveSessionUser(oldClaims)).toBeNull();
    expect(await refusal(resetPassword({ token, password: 'another long passphrase' }))).toEqual({ status: 410, code: 'link_used' });
  });

  it('sends nothing for an unknown or deactivated address, and refuses an expired link', async () => {
    const closed = await createTestUser(team.id, 'viewer', { active: false });
    await requestPasswordReset(closed.email);
    await requestPasswordReset(`nobody-${Date.now()}@test.example`);
    expect(await getDb().select().from(passwordResetTokens).where(eq(passwordResetTokens.userId, closed.id))).toEqual([]);

    const member = await createTestUser(team.id, 'viewer');
    await requestPasswordReset(member.email);
    const token = linkToken((await mailTo(member.email)).text, 'reset');
    await getDb().update(passwordResetTokens).set({ expiresAt: sql`now() - interval '1 second'` }).where(eq(passwordResetTokens.userId, member.id));
    expect(await refusal(resetPassword({ token, password: NEW_PASSWORD }))).toEqual({ status: 410, code: 'link_expired' });
  });
});
