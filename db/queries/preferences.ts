/** A user's own screen settings (users.preferences); team id first, like every query. */
import { and, eq, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { users } from '../schema';
import { readUserPreferences, type UserPreferences } from '../../lib/user/preferences';

export async function getUserPreferences(teamId: string, userId: string): Promise<UserPreferences> {
  const [row] = await getDb()
    .select({ preferences: users.preferences })
    .from(users)
    .where(and(eq(users.teamId, teamId), eq(users.id, userId)));
  return readUserPreferences(row?.preferences);
}

/**
 * Replaces the given keys only (jsonb `||`), so that two screens saving their own settings at the
 * same moment do not undo each other. Answers false when the user is not in the team.
 */
export async function updateUserPreferences(teamId: string, userId: string, change: Partial<UserPreferences>): Promise<boolean> {
  const updated = await getDb()
    .update(users)
    .set({ preferences: sql`${users.preferences} || ${JSON.stringify(change)}::jsonb`, updatedAt: new Date() })
    .where(and(eq(users.teamId, teamId), eq(users.id, userId)))
    .returning({ id: users.id });
  return updated.length > 0;
}
