/**
 * Team membership: invitations, roles, deactivation, password reset. Each change runs in one
 * transaction with its audit entry; mail is sent inside that transaction so that a failed send
 * leaves nothing half-saved (the admin sees the error and can try again).
 */
import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, type Executor } from '@/db/client';
import { invitations, passwordResetTokens, teams, users } from '@/db/schema';
import { recordAudit } from '@/db/queries/audit';
import { countActiveAdmins, findSignInRow, getTeamMember, lockTeam, newerInvitationExists } from '@/db/queries/members';
import { ApiError } from '@/server/http/errors';
import { appBaseUrl, sendMail } from '@/server/mail/send';
import { invitationMail, passwordResetMail } from '@/server/mail/templates';
import { clearAccountFailures } from '@/server/limits/signIn';
import { ROLES, type Role } from '@/lib/auth/permissions';
import { hashPassword, passwordSchema } from '@/lib/auth/password';
import type { SessionUser } from './session';
import { hashLinkToken, INVITATION_LIFETIME_MS, looksLikeLinkToken, newLinkToken, RESET_LIFETIME_MS, type LinkState } from '@/lib/auth/linkTokens';

export const emailSchema = z.string().trim().toLowerCase().email('Enter an e-mail address.').max(320, 'Use at most 320 characters.');
export const roleSchema = z.enum(ROLES, { message: 'Choose admin, designer, reviewer or viewer.' });

export const inviteSchema = z.object({ email: emailSchema, role: roleSchema });
export const memberChangeSchema = z
  .object({ role: roleSchema.optional(), active: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.active !== undefined, { message: 'Say what to change: role or active.' });
export const acceptInvitationSchema = z.object({
  token: z.string().min(1).max(100),
  name: z.string().trim().min(1, 'Enter your name.').max(120, 'Use at most 120 characters.'),
  password: passwordSchema,
});
export const resetRequestSchema = z.object({ email: emailSchema });
export const resetPasswordSchema = z.object({ token: z.string().min(1).max(100), password: passwordSchema });

export type { LinkState };

function linkStateOf(row: { acceptedAt?: Date | null; revokedAt?: Date | null; usedAt?: Date | null; expiresAt: Date } | null): LinkState {
  if (!row) return 'unknown';
  if (row.acceptedAt || row.revokedAt || row.usedAt) return 'used';
  if (row.expiresAt.getTime() <= Date.now()) return 'expired';
  return 'valid';
}

/**
 * An invitation that no longer works says why: `replaced` when the team sent a newer invitation to
 * the same address (the newer e-mail holds the working link), `revoked` when an admin withdrew it;
 * "already been used" only when someone joined with it.
 */
export type InvitationState = LinkState | 'replaced' | 'revoked';

async function invitationStateOf(
  row: { id: string; teamId: string; email: string; createdAt: Date; acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date } | null,
  tx: Executor = getDb(),
): Promise<InvitationState> {
  if (row && !row.acceptedAt && row.revokedAt) return (await newerInvitationExists(row.teamId, row.email, row, tx)) ? 'replaced' : 'revoked';
  return linkStateOf(row);
}

const LINK_REFUSALS: Record<Exclude<InvitationState, 'valid'>, ApiError> = {
  replaced: new ApiError(410, 'link_replaced', 'This invitation was replaced by a newer invitation to the same address. Use the link in the most recent invitation e-mail.'),
  revoked: new ApiError(410, 'link_revoked', 'This invitation was withdrawn by an admin of the team. Ask them to invite you again.'),
  used: new ApiError(410, 'link_used', 'This link has already been used. Ask for a new one.'),
  expired: new ApiError(410, 'link_expired', 'This link has expired. Ask for a new one.'),
  unknown: new ApiError(404, 'link_unknown', 'This link is not valid. Check that it was copied whole, or ask for a new one.'),
};

// ── invitations ────────────────────────────────────────────────────────────────────────────────

export async function inviteMember(actor: SessionUser, input: z.infer<typeof inviteSchema>) {
  return getDb().transaction(async (tx) => {
    const team = await lockTeam(actor.teamId, tx);
    if (!team) throw new ApiError(404, 'not_found', 'Your team no longer exists.');
    if (await findSignInRow(input.email, tx)) {
      throw new ApiError(409, 'email_taken', 'That e-mail address already has an Ampwarden account.', 'email');
    }
    // A new invitation replaces any earlier one still open for the same address.
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.teamId, actor.teamId), eq(sql`lower(${invitations.email})`, input.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
    const token = newLinkToken();
    const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
    const [invitation] = await tx
      .insert(invitations)
      .values({ teamId: actor.teamId, email: input.email, role: input.role, tokenHash: hashLinkToken(token), invitedBy: actor.id, expiresAt })
      .returning({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt });
    await recordAudit(tx, {
      teamId: actor.teamId,
      actorId: actor.id,
      action: 'member.invite',
      entity: 'invitation',
      entityId: invitation.id,
      detail: { email: input.email, role: input.role },
    });
    await sendMail(
      invitationMail({ to: input.email, teamName: team.name, inviterName: actor.name, role: input.role, link: `${appBaseUrl()}/invite/${token}`, expiresAt }),
    );
    return invitation;
  });
}

export async function revokeInvitation(actor: SessionUser, invitationId: string) {
  return getDb().transaction(async (tx) => {
    const [revoked] = await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.teamId, actor.teamId), eq(invitations.id, invitationId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
      .returning({ id: invitations.id, email: invitations.email });
    if (!revoked) throw new ApiError(404, 'not_found', 'No open invitation with that id in your team.');
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.id, action: 'member.invite_revoke', entity: 'invitation', entityId: revoked.id, detail: { email: revoked.email } });
    return revoked;
  });
}

export type InvitationView = { state: 'valid'; email: string; role: Role; teamName: string } | { state: Exclude<InvitationState, 'valid'> };

/** What the /invite/[token] page shows before the form. */
export async function inspectInvitation(token: string): Promise<InvitationView> {
  if (!looksLikeLinkToken(token)) return { state: 'unknown' };
  const [row] = await getDb()
    .select({
      id: invitations.id,
      teamId: invitations.teamId,
      email: invitations.email,
      role: invitations.role,
      teamName: teams.name,
      createdAt: invitations.createdAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .where(eq(invitations.tokenHash, hashLinkToken(token)));
  const state = await invitationStateOf(row ?? null);
  if (state !== 'valid') return { state };
  return { state, email: row!.email, role: row!.role, teamName: row!.teamName };
}

/** Sets the password once: creates the member with the invited role and closes the invitation. */
export async function acceptInvitation(input: z.infer<typeof acceptInvitationSchema>) {
  // The link is checked before the (deliberately slow) hash, so that bad links cost the server little.
  const seen = await inspectInvitation(input.token);
  if (seen.state !== 'valid') throw LINK_REFUSALS[seen.state];
  const passwordHash = await hashPassword(input.password);
  return getDb().transaction(async (tx) => {
    const [invitation] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hashLinkToken(input.token))).for('update');
    const state = await invitationStateOf(invitation ?? null, tx);
    if (state !== 'valid') throw LINK_REFUSALS[state];
    if (await findSignInRow(invitation.email, tx)) {
      throw new ApiError(409, 'email_taken', 'That e-mail address already has an Ampwarden account; sign in or reset its password.');
    }
    const [user] = await tx
      .insert(users)
      .values({ teamId: invitation.teamId, email: invitation.email, name: input.name, role: invitation.role, passwordHash })
      .returning({ id: users.id, email: users.email, role: users.role });
    await tx.update(invitations).set({ acceptedAt: new Date(), acceptedUserId: user.id }).where(eq(invitations.id, invitation.id));
    await recordAudit(tx, { teamId: invitation.teamId, actorId: user.id, action: 'member.join', entity: 'user', entityId: user.id, detail: { invitationId: invitation.id, role: user.role } });
    await recordAudit(tx, { teamId: invitation.teamId, actorId: user.id, action: 'password.set', entity: 'user', entityId: user.id, detail: { via: 'invitation' } });
    return user;
  });
}

// ── roles and deactivation ───────────────────────────────────────────────────────────────────────

async function refuseLosingLastAdmin(tx: Executor, actor: SessionUser, target: { id: string; role: Role; active: boolean }) {
  if (target.role !== 'admin' || !target.active) return;
  if ((await countActiveAdmins(actor.teamId, tx)) <= 1) {
    const who = target.id === actor.id ? 'You are' : 'This member is';
    throw new ApiError(409, 'last_admin', `${who} the team's only active admin. Make another member admin first.`);
  }
}

export async function changeMember(actor: SessionUser, userId: string, change: z.infer<typeof memberChangeSchema>) {
  return getDb().transaction(async (tx) => {
    await lockTeam(actor.teamId, tx);
    const target = await getTeamMember(actor.teamId, userId, tx);
    if (!target) throw new ApiError(404, 'not_found', 'No member with that id in your team.');
    const roleChanges = change.role !== undefined && change.role !== target.role;
    const deactivates = change.active === false && target.active;
    const reactivates = change.active === true && !target.active;
    if ((roleChanges && change.role !== 'admin') || deactivates) await refuseLosingLastAdmin(tx, actor, target);

    const set: Partial<typeof users.$inferInsert> = { updatedAt: new Date() };
    if (roleChanges) set.role = change.role;
    if (deactivates) {
      set.active = false;
      // Ends every session of the member at their next request (getSessionUser compares the epoch).
      set.sessionEpoch = target.sessionEpoch + 1;
    }
    if (reactivates) set.active = true;
    const [updated] = await tx
      .update(users)
      .set(set)
      .where(and(eq(users.teamId, actor.teamId), eq(users.id, userId)))
      .returning({ id: users.id, email: users.email, name: users.name, role: users.role, active: users.active });
    if (roleChanges) {
      await recordAudit(tx, { teamId: actor.teamId, actorId: actor.id, action: 'member.role_change', entity: 'user', entityId: userId, detail: { from: target.role, to: change.role } });
    }
    if (deactivates) await recordAudit(tx, { teamId: actor.teamId, actorId: actor.id, action: 'member.deactivate', entity: 'user', entityId: userId, detail: { email: target.email } });
    if (reactivates) await recordAudit(tx, { teamId: actor.teamId, actorId: actor.id, action: 'member.reactivate', entity: 'user', entityId: userId, detail: { email: target.email } });
    return updated;
  });
}

// ── password reset ───────────────────────────────────────────────────────────────────────────────

/**
 * Sends a reset link when the address belongs to an active member. The caller answers the same
 * either way, so that the form does not tell who has an account.
 */
export async function requestPasswordReset(email: string): Promise<void> {
  const row = await findSignInRow(email);
  if (!row || !row.active) return;
  await getDb().transaction(async (tx) => {
    const token = newLinkToken();
    const expiresAt = new Date(Date.now() + RESET_LIFETIME_MS);
    const [reset] = await tx.insert(passwordResetTokens).values({ userId: row.id, tokenHash: hashLinkToken(token), expiresAt }).returning({ id: passwordResetTokens.id });
    await recordAudit(tx, { teamId: row.teamId, actorId: null, action: 'password.reset_request', entity: 'user', entityId: row.id, detail: { resetId: reset.id } });
    await sendMail(passwordResetMail({ to: row.email, link: `${appBaseUrl()}/reset/${token}`, expiresAt }));
  });
}

export type ResetView = { state: 'valid'; email: string } | { state: Exclude<LinkState, 'valid'> };

export async function inspectResetToken(token: string): Promise<ResetView> {
  if (!looksLikeLinkToken(token)) return { state: 'unknown' };
  const [row] = await getDb()
    .select({ usedAt: passwordResetTokens.usedAt, expiresAt: passwordResetTokens.expiresAt, email: users.email, active: users.active })
    .from(passwordResetTokens)
    .innerJoin(users, eq(users.id, passwordResetTokens.userId))
    .where(eq(passwordResetTokens.tokenHash, hashLinkToken(token)));
  if (row && !row.active) return { state: 'unknown' };
  const state = linkStateOf(row ?? null);
  return state === 'valid' ? { state, email: row!.email } : { state };
}

/** Saves the new password once, ends the member's other sessions and closes every open reset link. */
export async function resetPassword(input: z.infer<typeof resetPasswordSchema>) {
  const seen = await inspectResetToken(input.token);
  if (seen.state !== 'valid') throw LINK_REFUSALS[seen.state];
  const passwordHash = await hashPassword(input.password);
  const result = await getDb().transaction(async (tx) => {
    const [reset] = await tx.select().from(passwordResetTokens).where(eq(passwordResetTokens.tokenHash, hashLinkToken(input.token))).for('update');
    const state = linkStateOf(reset ?? null);
    if (state !== 'valid') throw LINK_REFUSALS[state];
    const [user] = await tx
      .update(users)
      .set({ passwordHash, sessionEpoch: sql`${users.sessionEpoch} + 1`, updatedAt: new Date() })
      .where(and(eq(users.id, reset.userId), eq(users.active, true)))
      .returning({ id: users.id, teamId: users.teamId, email: users.email });
    if (!user) throw LINK_REFUSALS.unknown;
    await tx
      .update(passwordResetTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResetTokens.userId, user.id), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, sql`now() - interval '1 day'`)));
    await recordAudit(tx, { teamId: user.teamId, actorId: user.id, action: 'password.set', entity: 'user', entityId: user.id, detail: { via: 'reset' } });
    return user;
  });
  await clearAccountFailures(result.email);
  return result;
}

// ── preferences ──────────────────────────────────────────────────────────────────────────────────

export const unitSystemSchema = z.enum(['si', 'imperial'], { message: 'Choose si or imperial.' });

/** '.' or ',', or 'browser' to let the browser's locale decide again (stored as null). */
export const decimalSeparatorSchema = z.enum(['.', ',', 'browser'], { message: 'Choose ".", "," or "browser".' });

export async function setDecimalSeparator(user: SessionUser, choice: z.infer<typeof decimalSeparatorSchema>) {
  await getDb()
    .update(users)
    .set({ decimalSeparator: choice === 'browser' ? null : choice, updatedAt: new Date() })
    .where(and(eq(users.teamId, user.teamId), eq(users.id, user.id)));
}

export async function setUnitSystem(user: SessionUser, unitSystem: z.infer<typeof unitSystemSchema>) {
  await getDb()
    .update(users)
    .set({ unitSystem, updatedAt: new Date() })
    .where(and(eq(users.teamId, user.teamId), eq(users.id, user.id)));
}
