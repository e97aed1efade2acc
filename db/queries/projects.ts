import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { projects, sheets } from '../schema';
import { recordAudit } from './audit';

export async function listProjects(teamId: string) {
  return getDb()
    .select({
      id: projects.id,
      name: projects.name,
      site: projects.site,
      description: projects.description,
      updatedAt: projects.updatedAt,
      // Written with an alias and the outer table named in full: in a select from one table drizzle
      // renders a column without its table, so sheets.projectId = projects.id became
      // `"project_id" = "id"` inside the subquery — both read from sheets, and every project counted 0
      // (issue 23). The count is of the sheets the project page lists (not archived, not deleted).
      sheetCount: sql<number>`(select count(*)::int from ${sheets} s where s.project_id = "projects"."id" and s.archived_at is null and s.deleted_at is null)`,
    })
    .from(projects)
    // Archived and deleted projects are kept out of the normal list (issue 23).
    .where(and(eq(projects.teamId, teamId), isNull(projects.archivedAt), isNull(projects.deletedAt)))
    .orderBy(desc(projects.updatedAt));
}

export async function getProject(teamId: string, projectId: string, tx: Executor = getDb()) {
  const [project] = await tx
    .select()
    .from(projects)
    // A deleted project is gone for everyone but the admins' restore (db/queries/documents).
    .where(and(eq(projects.teamId, teamId), eq(projects.id, projectId), isNull(projects.deletedAt)));
  return project ?? null;
}

export interface NewProject {
  name: string;
  site?: string;
  description?: string;
}

/** Creates a project and its audit entry in one transaction. */
export async function createProject(teamId: string, actorId: string, input: NewProject) {
  return getDb().transaction(async (tx) => {
    const [project] = await tx
      .insert(projects)
      .values({ teamId, name: input.name, site: input.site ?? '', description: input.description ?? '', createdBy: actorId })
      .returning();
    await recordAudit(tx, { teamId, actorId, action: 'project.create', entity: 'project', entityId: project.id, detail: { name: input.name } });
    return project;
  });
}
