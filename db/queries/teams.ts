import { and, asc, eq, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { teams, users } from '../schema';
import { checkBound } from '../../lib/inputBounds';
import type { FamilyOptions } from '../../lib/schedule';

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

/** The team's options for sizing schedules (null columns: the library's defaults). */
export async function teamSizingOptions(teamId: string, tx: Executor = getDb()): Promise<FamilyOptions> {
  const [team] = await tx.select({ minParallelSectionMm2: teams.minParallelSectionMm2 }).from(teams).where(eq(teams.id, teamId));
  return team?.minParallelSectionMm2 == null ? {} : { minParallelSectionMm2: Number(team.minParallelSectionMm2) };
}

/** Sets (or, with null, clears back to the default) the team's smallest section for parallel runs. */
export async function setTeamMinParallelSection(teamId: string, sectionMm2: number | null, tx: Executor = getDb()): Promise<void> {
  if (sectionMm2 !== null) checkBound('minParallelSectionMm2', sectionMm2, 'minParallelSectionMm2');
  await tx.update(teams).set({ minParallelSectionMm2: sectionMm2 === null ? null : String(sectionMm2) }).where(eq(teams.id, teamId));
}
