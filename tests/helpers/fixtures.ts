import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { getDb } from '@/db/client';
import { teams, users } from '@/db/schema';

export type Role = 'admin' | 'designer' | 'reviewer' | 'viewer';

/** A team of its own for one test file, so that tests never see each other's rows. */
export async function createTestTeam(label = 'test') {
  const suffix = randomUUID().slice(0, 8);
  const [team] = await getDb()
    .insert(teams)
    .values({ slug: `${label}-${suffix}`, name: `Test team ${label} ${suffix}` })
    .returning();
  return team;
}

export const TEST_PASSWORD = 'correct horse battery staple';
let cachedHash: string | undefined;

export async function createTestUser(teamId: string, role: Role, overrides: Partial<typeof users.$inferInsert> = {}) {
  cachedHash ??= await bcrypt.hash(TEST_PASSWORD, 4);
  const suffix = randomUUID().slice(0, 8);
  const [user] = await getDb()
    .insert(users)
    .values({ teamId, role, email: `${role}-${suffix}@test.example`, name: `${role} ${suffix}`, passwordHash: cachedHash, ...overrides })
    .returning();
  return user;
}
