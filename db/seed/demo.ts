/**
 * The invented demo scenario: a consulting team sizing the electrical works of an invented
 * cold-store extension. No real company, product or person. Every step is idempotent: a second
 * run finds what it would insert and changes nothing.
 */
import bcrypt from 'bcryptjs';
import { and, eq, inArray } from 'drizzle-orm';
import type { Db } from '../client';
import { projects, teams, users } from '../schema';
import { hashPassword, needsRehash } from '../../lib/auth/password';

export const DEMO_TEAM = { slug: 'harrow-fell', name: 'Harrow Fell Consulting (demo)' } as const;
/** For local use only; printed in the README. */
export const DEMO_PASSWORD = 'warden-demo-2026';
export const DEMO_USERS = [
  { email: 'admin@harrowfell.example', name: 'Odile Marchetti (demo admin)', role: 'admin' },
  { email: 'designer@harrowfell.example', name: 'Tobias Wren (demo designer)', role: 'designer' },
  { email: 'reviewer@harrowfell.example', name: 'Priya Castellane (demo reviewer)', role: 'reviewer' },
  { email: 'viewer@harrowfell.example', name: 'Jonas Brekke (demo viewer)', role: 'viewer' },
] as const;
export const DEMO_PROJECT = {
  name: 'Kestrel Yard cold store extension',
  site: 'Kestrel Yard, LV switchroom and yard (invented)',
  description: 'Transformer to main switchboard bus-bar run, chiller feeder, EV charger feeder across the yard, rooftop refrigeration rack feeder.',
} as const;

export interface SeedReport {
  teamCreated: boolean;
  usersCreated: number;
  projectsCreated: number;
}

export async function seedDemo(db: Db): Promise<SeedReport> {
  return db.transaction(async (tx) => {
    const report: SeedReport = { teamCreated: false, usersCreated: 0, projectsCreated: 0 };
    let [team] = await tx.select().from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    if (!team) {
      [team] = await tx.insert(teams).values(DEMO_TEAM).returning();
      report.teamCreated = true;
    }
    // The same bcrypt cost as every other hash (server/auth/password.ts), so that sign-in timing does not single out demo accounts.
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    for (const user of DEMO_USERS) {
      const inserted = await tx
        .insert(users)
        .values({ ...user, teamId: team.id, passwordHash })
        .onConflictDoNothing()
        .returning({ id: users.id });
      report.usersCreated += inserted.length;
    }
    // Demo accounts seeded earlier with another cost, still on the demo password, get the current one.
    const seeded = await tx
      .select({ id: users.id, passwordHash: users.passwordHash })
      .from(users)
      .where(inArray(users.email, DEMO_USERS.map((u) => u.email)));
    for (const row of seeded) {
      if (row.passwordHash && needsRehash(row.passwordHash) && (await bcrypt.compare(DEMO_PASSWORD, row.passwordHash))) {
        await tx.update(users).set({ passwordHash }).where(eq(users.id, row.id));
      }
    }
    const [designer] = await tx.select().from(users).where(eq(users.email, DEMO_USERS[1].email));
    const existing = await tx
      .select({ id: projects.id })
      .from(projects)
      .where(and(eq(projects.teamId, team.id), eq(projects.name, DEMO_PROJECT.name)));
    if (existing.length === 0) {
      await tx.insert(projects).values({ ...DEMO_PROJECT, teamId: team.id, createdBy: designer?.id ?? null });
      report.projectsCreated += 1;
    }
    return report;
  });
}
