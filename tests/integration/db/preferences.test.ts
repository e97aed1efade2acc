// A user's own screen settings (users.preferences, issue 23's column picker) against the real
// database: an update replaces only its own key, stays inside the user's team, and a new row
// starts with none.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { users } from '@/db/schema';
import { getUserPreferences, updateUserPreferences } from '@/db/queries/preferences';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';

let teamId: string;
let otherTeamId: string;
let userId: string;

beforeAll(async () => {
  teamId = (await createTestTeam('prefs')).id;
  otherTeamId = (await createTestTeam('prefs-other')).id;
  userId = (await createTestUser(teamId, 'designer')).id;
});
afterAll(() => closeDb());

describe('users.preferences', () => {
  it('a new user has no preferences', async () => {
    await expect(getUserPreferences(teamId, userId)).resolves.toEqual({});
  });

  it('stores the grid columns, and a later choice replaces the earlier one', async () => {
    await expect(updateUserPreferences(teamId, userId, { candidateGridColumns: { mass: false, cost: false } })).resolves.toBe(true);
    await expect(updateUserPreferences(teamId, userId, { candidateGridColumns: { mass: true } })).resolves.toBe(true);
    await expect(getUserPreferences(teamId, userId)).resolves.toEqual({ candidateGridColumns: { mass: true } });
  });

  it('keeps the keys of other screens that it does not name', async () => {
    await getDb().update(users).set({ preferences: sql`${users.preferences} || '{"someOtherScreen":{"on":true}}'::jsonb` }).where(eq(users.id, userId));
    await updateUserPreferences(teamId, userId, { candidateGridColumns: { flags: false } });
    const [row] = await getDb().select({ preferences: users.preferences }).from(users).where(eq(users.id, userId));
    expect(row.preferences).toEqual({ someOtherScreen: { on: true }, candidateGridColumns: { flags: false } });
  });

  it('another team cannot write a user of this team', async () => {
    await expect(updateUserPreferences(otherTeamId, userId, { candidateGridColumns: { flags: true } })).resolves.toBe(false);
    await expect(getUserPreferences(teamId, userId)).resolves.toEqual({ candidateGridColumns: { flags: false } });
    await expect(getUserPreferences(otherTeamId, userId)).resolves.toEqual({});
  });
});
