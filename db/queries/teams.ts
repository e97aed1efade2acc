import { and, asc, eq, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { teams, users } from '../schema';

export async function findTeamBySlug(slug: string, tx: Executor = getDb()) {
  const [team] = await tx.select().from(teams).where(eq(teams.slug, slug));
  return team ?? null;
}

export async function findUserByEmail(email: string, tx: Executor = getDb()) {
  const [user] = await tx.select().from(users).where(eq(sql`lower(${users.email})`, email.trim().toLowerCase()));
  return user ?? null;
}

export async function findUserInTeam(teamId: string, userId: string, tx: Executor = getDb()) {
  const [user] = await tx.select().from(users).where(and(eq(users.teamId, teamId), eq(users.id, userId)));
  return user ?? null;
}

export async function listMembers(teamId: string) {
  return getDb()
    .select({ id: users.id, email: users.email, name: users.name, role: users.role, active: users.active })
    .from(users)
    .where(eq(users.teamId, teamId))
    .orderBy(asc(users.name));
}
