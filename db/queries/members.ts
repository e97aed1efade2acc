import { and, asc, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { invitations, teams, users } from '../schema';

/** The row behind a session: the user with their team's name, or null when gone. */
export async function findSessionRow(userId: string, tx: Executor = getDb()) {
  const [row] = await tx
    .select({
      id: users.id,
      teamId: users.teamId,
      teamName: teams.name,
      role: users.role,
      name: users.name,
      email: users.email,
      unitSystem: users.unitSystem,
      active: users.active,
      sessionEpoch: users.sessionEpoch,
    })
    .from(users)
    .innerJoin(teams, eq(teams.id, users.teamId))
    .where(eq(users.id, userId));
  return row ?? null;
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
