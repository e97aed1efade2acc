import { and, asc, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { recordAudit } from './audit';
import { invitations, revokedSessions, teams, users } from '../schema';

/**
 * The row behind a session: the user with their team's name, or null when gone. `revoked` says
 * whether this session id was ended by signing out (false for a session without an id).
 */
export async function findSessionRow(userId: string, sessionId?: string, tx: Executor = getDb()) {
  const revoked = sessionId
    ? sql<boolean>`exists (select 1 from ${revokedSessions} where ${revokedSessions.sessionId} = ${sessionId})`
    : sql<boolean>`false`;
  const [row] = await tx
    .select({
      id: users.id,
      teamId: users.teamId,
      teamName: teams.name,
      role: users.role,
      name: users.name,
      email: users.email,
      unitSystem: users.unitSystem,
      decimalSeparator: users.decimalSeparator,
      teamCurrency: teams.currency,
      active: users.active,
      sessionEpoch: users.sessionEpoch,
      revoked,
    })
    .from(users)
    .innerJoin(teams, eq(teams.id, users.teamId))
    .where(eq(users.id, userId));
  return row ?? null;
}

/**
 * Ends one session at sign-out: its id joins the revoked list until the session would have
 * expired anyway (rows past that are cleared on the way). A session without an id (issued before
 * sessions had one) cannot be named, so all of the user's sessions of that epoch end instead.
 * Audited in the same transaction.
 */
export async function endSession(session: { userId: string; epoch: number; sessionId?: string; expiresAt: Date }) {
  await getDb().transaction(async (tx) => {
    await tx.delete(revokedSessions).where(sql`${revokedSessions.expiresAt} < now()`);
    const [owner] = await tx.select({ teamId: users.teamId }).from(users).where(eq(users.id, session.userId));
    // A user who is gone has no session left to end.
    if (!owner) return;
    if (session.sessionId) {
      await tx.insert(revokedSessions).values({ sessionId: session.sessionId, userId: session.userId, expiresAt: session.expiresAt }).onConflictDoNothing();
    } else {
      await tx
        .update(users)
        .set({ sessionEpoch: sql`${users.sessionEpoch} + 1` })
        .where(and(eq(users.id, session.userId), eq(users.sessionEpoch, session.epoch)));
    }
    await recordAudit(tx, {
      teamId: owner.teamId,
      actorId: session.userId,
      action: 'session.sign_out',
      entity: 'user',
      entityId: session.userId,
      detail: { scope: session.sessionId ? 'this session' : 'every session of this epoch' },
    });
  });
}

/** For sign-in only: looks the account up by e-mail across teams (e-mail is unique). */
export async function findSignInRow(email: string, tx: Executor = getDb()) {
  const [row] = await tx
    .select({
      id: users.id,
      teamId: users.teamId,
      role: users.role,
      name: users.name,
      email: users.email,
      passwordHash: users.passwordHash,
      active: users.active,
      sessionEpoch: users.sessionEpoch,
    })
    .from(users)
    .where(eq(sql`lower(${users.email})`, email.trim().toLowerCase()));
  return row ?? null;
}

export async function listTeamMembers(teamId: string, tx: Executor = getDb()) {
  return tx
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      active: users.active,
      hasPassword: sql<boolean>`${users.passwordHash} is not null`,
      createdAt: users.createdAt,
    })
    .from(users)
    .where(eq(users.teamId, teamId))
    .orderBy(asc(users.name));
}

export async function getTeamMember(teamId: string, userId: string, tx: Executor = getDb()) {
  const [row] = await tx.select().from(users).where(and(eq(users.teamId, teamId), eq(users.id, userId)));
  return row ?? null;
}

/** Locks the team row: member changes of one team happen one at a time (last-admin rule). */
export async function lockTeam(teamId: string, tx: Executor) {
  const [team] = await tx.select({ id: teams.id, name: teams.name }).from(teams).where(eq(teams.id, teamId)).for('update');
  return team ?? null;
}

export async function countActiveAdmins(teamId: string, tx: Executor): Promise<number> {
  const [row] = await tx
    .select({ count: sql<number>`count(*)::int` })
    .from(users)
    .where(and(eq(users.teamId, teamId), eq(users.role, 'admin'), eq(users.active, true)));
  return row?.count ?? 0;
}

export async function listPendingInvitations(teamId: string, tx: Executor = getDb()) {
  return tx
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, createdAt: invitations.createdAt, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, sql`now()`)))
    .orderBy(desc(invitations.createdAt));
}

/**
 * Every address this team has mail for: its members, the people it invited, and the recipients of
 * sheets it sent by e-mail (the audit log keeps them). Lower case. For the local mailbox, which
 * shows an admin only their own team's mail.
 */
export async function teamMailAddresses(teamId: string, tx: Executor = getDb()): Promise<Set<string>> {
  const rows = await tx.execute<{ address: string }>(sql`
    select lower(email) as address from users where team_id = ${teamId}
    union select lower(email) from invitations where team_id = ${teamId}
    union select lower(detail->>'to') from audit_log where team_id = ${teamId} and action = 'sheet.email' and detail ? 'to'`);
  return new Set(rows.rows.map((r) => r.address));
}


/**
 * Whether the team invited the same address again after this invitation: a revoked invitation
 * with a newer one was replaced (inviteMember revokes the open one when it sends the next), not
 * withdrawn, and its link should say so.
 */
export async function newerInvitationExists(teamId: string, email: string, invitation: { id: string; createdAt: Date }, tx: Executor = getDb()): Promise<boolean> {
  const [row] = await tx
    .select({ id: invitations.id })
    .from(invitations)
    .where(
      and(
        eq(invitations.teamId, teamId),
        eq(sql`lower(${invitations.email})`, email.toLowerCase()),
        sql`${invitations.id} <> ${invitation.id}`,
        sql`${invitations.createdAt} >= ${invitation.createdAt}`,
      ),
    )
    .limit(1);
  return row !== undefined;
}

/** The team's currency (ISO 4217), named with every amount. */
export async function teamCurrencyOf(teamId: string, tx: Executor = getDb()): Promise<string> {
  const [row] = await tx.select({ currency: teams.currency }).from(teams).where(eq(teams.id, teamId));
  return row?.currency ?? 'EUR';
}

/** Sets the team's currency; audited in the same transaction. Relabels the amounts, converts nothing. */
export async function setTeamCurrency(actor: { teamId: string; id: string }, currency: string) {
  await getDb().transaction(async (tx) => {
    const [before] = await tx.select({ currency: teams.currency }).from(teams).where(eq(teams.id, actor.teamId));
    await tx.update(teams).set({ currency }).where(eq(teams.id, actor.teamId));
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.id, action: 'team.currency', entity: 'team', entityId: actor.teamId, detail: { from: before?.currency ?? null, to: currency } });
  });
}
