// Drizzle against the real PostgreSQL server that scripts/test.sh starts (no mocks).
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { auditLog, projects, teams, users } from '@/db/schema';
import { createProject, getProject, listProjects } from '@/db/queries/projects';
import { recordAudit } from '@/db/queries/audit';
import { seedDemo, DEMO_TEAM, DEMO_USERS } from '@/db/seed/demo';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';

afterAll(() => closeDb());

describe('projects through Drizzle on the real server', () => {
  it('writes a project with its audit entry and reads it back, scoped to the team', async () => {
    const team = await createTestTeam('foundation');
    const other = await createTestTeam('foundation-other');
    const designer = await createTestUser(team.id, 'designer');

    const created = await createProject(team.id, designer.id, { name: 'Switchroom A', site: 'Level 1' });
    expect(await getProject(team.id, created.id)).toMatchObject({ name: 'Switchroom A', site: 'Level 1' });
    // Team isolation: the same id asked for by another team is not found.
    expect(await getProject(other.id, created.id)).toBeNull();
    expect((await listProjects(other.id)).map((p) => p.id)).not.toContain(created.id);

    const audit = await getDb().select().from(auditLog).where(eq(auditLog.entityId, created.id));
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ action: 'project.create', actorId: designer.id, teamId: team.id });
  });

  it('a failed write inside a transaction leaves nothing behind', async () => {
    const team = await createTestTeam('rollback');
    const designer = await createTestUser(team.id, 'designer');
    await expect(
      getDb().transaction(async (tx) => {
        const [project] = await tx.insert(projects).values({ teamId: team.id, name: 'Half-saved' }).returning();
        await recordAudit(tx, { teamId: team.id, actorId: designer.id, action: 'project.create', entity: 'project', entityId: project.id });
        // The same name again violates projects_team_name_unique: the whole transaction must roll back.
        await tx.insert(projects).values({ teamId: team.id, name: 'Half-saved' });
      }),
    ).rejects.toThrow();
    expect(await listProjects(team.id)).toHaveLength(0);
    const audit = await getDb().select().from(auditLog).where(eq(auditLog.teamId, team.id));
    expect(audit).toHaveLength(0);
  });

  it('rejects a user with an unknown role at the database', async () => {
    const team = await createTestTeam('role');
    await expect(
      getDb()
        .insert(users)
        // @ts-expect-error: the enum in the database is the last line of defence
        .values({ teamId: team.id, email: 'x@test.example', name: 'x', role: 'superuser' }),
    ).rejects.toThrow();
  });
});

describe('demo seed', () => {
  it('seeds the invented team once; a second run changes nothing', async () => {
    const first = await seedDemo(getDb());
    const second = await seedDemo(getDb());
    expect(first.teamCreated || first.usersCreated >= 0).toBe(true);
    expect(second).toEqual({ teamCreated: false, usersCreated: 0, projectsCreated: 0 });
    const [team] = await getDb().select().from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    const members = await getDb().select().from(users).where(eq(users.teamId, team.id));
    expect(members.map((m) => m.role).sort()).toEqual(['admin', 'designer', 'reviewer', 'viewer']);
    expect(members.map((m) => m.email).sort()).toEqual(DEMO_USERS.map((u) => u.email).sort());
    // Passwords are stored as bcrypt hashes only.
    for (const member of members) expect(member.passwordHash).toMatch(/^\$2[aby]\$/);
  });
});
