import { and, asc, eq, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { teams, users } from '../schema';

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
