/**
 * Managing documents — projects, sizing sheets, schedules (issue 23): rename, duplicate, archive,
 * soft delete and restore, with the rules of lib/documents/rules. Every function takes the team id
 * first and touches only that team's rows (another team's id is "not found"); every change writes
 * its audit entry in the same transaction.
 */
import { and, desc, eq, gt, inArray, isNotNull, isNull, lt, ne, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { projects, schedules, sheets, users } from '../schema';
import { recordAudit } from './audit';
import { createSheet, getSheet, isUuid } from './sheets';
import type { SheetStatus } from '../../lib/sheet';
import { can, type Role } from '../../lib/auth/permissions';
import {
  DELETE_RETENTION_DAYS,
  duplicateName,
  duplicateSheetTitle,
  mayManage,
  projectDeleteRefusal,
  restorable,
  sheetRefusal,
  type DocumentKind,
  type DocumentOp,
} from '../../lib/documents/rules';

export class DocumentError extends Error {
  constructor(
    readonly status: 400 | 403 | 404 | 409,
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

export interface DocumentActor {
  userId: string;
  role: Role;
}

const NOUN: Record<DocumentKind, string> = { project: 'project', sheet: 'sizing sheet', schedule: 'schedule' };
const notFound = (kind: DocumentKind) => new DocumentError(404, 'not_found', `No such ${NOUN[kind]}.`);

function authorise(actor: DocumentActor, kind: DocumentKind, op: DocumentOp) {
  if (!mayManage(actor.role, kind, op)) throw new DocumentError(403, 'forbidden', `Your role (${actor.role}) may not ${op} a ${NOUN[kind]}.`);
}

const retentionCutoff = () => sql`now() - make_interval(days => ${DELETE_RETENTION_DAYS})`;

// ── loading one live document (not deleted, in a project not deleted), locked ─────────────────

async function lockProject(tx: Executor, teamId: string, id: string) {
  if (!isUuid(id)) return null;
  const [row] = await tx
    .select({ id: projects.id, name: projects.name, archivedAt: projects.archivedAt })
    .from(projects)
    .where(and(eq(projects.teamId, teamId), eq(projects.id, id), isNull(projects.deletedAt)))
    .for('update');
  return row ?? null;
}

async function lockSheet(tx: Executor, teamId: string, id: string) {
  if (!isUuid(id)) return null;
  const [row] = await tx
    .select({ id: sheets.id, title: sheets.title, status: sheets.status, revision: sheets.revision, projectId: sheets.projectId, archivedAt: sheets.archivedAt })
    .from(sheets)
    .innerJoin(projects, eq(projects.id, sheets.projectId))
    .where(and(eq(sheets.teamId, teamId), eq(sheets.id, id), isNull(sheets.deletedAt), isNull(projects.deletedAt)))
    .for('update', { of: sheets });
  return row ? { ...row, status: row.status as SheetStatus } : null;
}

async function lockSchedule(tx: Executor, teamId: string, id: string) {
  if (!isUuid(id)) return null;
  const [row] = await tx
    .select({ id: schedules.id, name: schedules.name, projectId: schedules.projectId, archivedAt: schedules.archivedAt })
    .from(schedules)
    .innerJoin(projects, eq(projects.id, schedules.projectId))
    .where(and(eq(schedules.teamId, teamId), eq(schedules.id, id), isNull(schedules.deletedAt), isNull(projects.deletedAt)))
    .for('update', { of: schedules });
  return row ?? null;
}

// ── rename ─────────────────────────────────────────────────────────────────────────────────────

export async function renameDocument(teamId: string, actor: DocumentActor, kind: DocumentKind, id: string, name: string) {
  authorise(actor, kind, 'rename');
  return getDb().transaction(async (tx) => {
    const now = new Date();
    if (kind === 'project') {
      const project = await lockProject(tx, teamId, id);
      if (!project) throw notFound(kind);
      const [clash] = await tx.select({ id: projects.id }).from(projects).where(and(eq(projects.teamId, teamId), eq(projects.name, name), ne(projects.id, id)));
      if (clash) throw new DocumentError(409, 'name_taken', 'Your team already has a project with this name (perhaps archived or recently deleted).');
      await tx.update(projects).set({ name, updatedAt: now }).where(eq(projects.id, id));
      await recordAudit(tx, { teamId, actorId: actor.userId, action: 'project.rename', entity: 'project', entityId: id, detail: { from: project.name, to: name } });
    } else if (kind === 'sheet') {
      const sheet = await lockSheet(tx, teamId, id);
      if (!sheet) throw notFound(kind);
      const refusal = sheetRefusal('rename', sheet.status);
      if (refusal) throw new DocumentError(409, 'wrong_state', refusal);
      // The version moves on: an editor open on the old title is told someone saved meanwhile.
      await tx.update(sheets).set({ title: name, version: sql`${sheets.version} + 1`, updatedAt: now }).where(eq(sheets.id, id));
      await recordAudit(tx, { teamId, actorId: actor.userId, action: 'sheet.rename', entity: 'sheet', entityId: id, detail: { from: sheet.title, to: name } });
    } else {
      const schedule = await lockSchedule(tx, teamId, id);
      if (!schedule) throw notFound(kind);
      await tx.update(schedules).set({ name, updatedAt: now }).where(eq(schedules.id, id));
      await recordAudit(tx, { teamId, actorId: actor.userId, action: 'schedule.rename', entity: 'schedule', entityId: id, detail: { from: schedule.name, to: name } });
    }
    return { id, name };
  });
}

// ── duplicate ──────────────────────────────────────────────────────────────────────────────────

/** A new draft from a sheet's inputs: revision 1, no review history, naming where it came from. */
/** A new draft of the sheet's newest inputs in `projectId`, through createSheet (recomputed by today's solver: the copy is a new document, not the origin's reviewed result). */
async function copySheetInto(tx: Executor, teamId: string, actor: DocumentActor, sheetId: string, projectId: string) {
  const origin = await getSheet(teamId, sheetId, tx);
  if (!origin) throw notFound('sheet');
  const created = await createSheet(
    teamId,
    { userId: actor.userId, can: (permission) => can(actor.role, permission) },
    {
      projectId,
      circuitTag: origin.circuitTag,
      title: duplicateSheetTitle(origin.title, origin.revision),
      inputs: origin.inputs,
      duplicatedFrom: { id: origin.id, revision: origin.revision },
    },
    tx,
  );
  await recordAudit(tx, { teamId, actorId: actor.userId, action: 'sheet.duplicate', entity: 'sheet', entityId: origin.id, detail: { copyId: created.id, projectId } });
  return created;
}

export async function duplicateDocument(teamId: string, actor: DocumentActor, kind: DocumentKind, id: string): Promise<{ id: string; name: string }> {
  authorise(actor, kind, 'duplicate');
  return getDb().transaction(async (tx) => {
    if (kind === 'sheet') {
      const sheet = await lockSheet(tx, teamId, id);
      if (!sheet) throw notFound(kind);
      const created = await copySheetInto(tx, teamId, actor, id, sheet.projectId);
      await tx.update(projects).set({ updatedAt: new Date() }).where(eq(projects.id, sheet.projectId));
      return { id: created.id, name: created.title };
    }
    if (kind === 'project') {
      const project = await lockProject(tx, teamId, id);
      if (!project) throw notFound(kind);
      const taken = (await tx.select({ name: projects.name }).from(projects).where(eq(projects.teamId, teamId))).map((p) => p.name);
      const name = duplicateName(project.name, taken);
      const [full] = await tx.select().from(projects).where(eq(projects.id, id));
      const [created] = await tx
        .insert(projects)
        .values({ teamId, name, site: full.site, description: full.description, createdBy: actor.userId })
        .returning({ id: projects.id, name: projects.name });
      // The newest revision of each circuit in use; superseded, archived and deleted sheets stay behind.
      const latest = await tx
        .select({ id: sheets.id })
        .from(sheets)
        .where(
          and(
            eq(sheets.teamId, teamId),
            eq(sheets.projectId, id),
            isNull(sheets.deletedAt),
            isNull(sheets.archivedAt),
            sql`not exists (select 1 from ${sheets} n where n.previous_revision_id = "sheets"."id" and n.deleted_at is null)`,
          ),
        )
        .orderBy(sheets.circuitTag);
      for (const sheet of latest) await copySheetInto(tx, teamId, actor, sheet.id, created.id);
      await recordAudit(tx, { teamId, actorId: actor.userId, action: 'project.create', entity: 'project', entityId: created.id, detail: { name, duplicateOf: id, sheets: latest.length } });
      await recordAudit(tx, { teamId, actorId: actor.userId, action: 'project.duplicate', entity: 'project', entityId: id, detail: { copyId: created.id } });
      return created;
    }
    const schedule = await lockSchedule(tx, teamId, id);
    if (!schedule) throw notFound(kind);
    const [full] = await tx.select().from(schedules).where(eq(schedules.id, id));
    const taken = (await tx.select({ name: schedules.name }).from(schedules).where(and(eq(schedules.teamId, teamId), eq(schedules.projectId, full.projectId)))).map((s) => s.name);
    // The file and its preview come along; the copy waits to be queued again (sized afresh).
    const [created] = await tx
      .insert(schedules)
      .values({
        teamId,
        projectId: full.projectId,
        name: duplicateName(full.name, taken),
        status: 'draft',
        fileName: full.fileName,
        mediaType: full.mediaType,
        sizeBytes: full.sizeBytes,
        content: full.content,
        previewRows: full.status === 'draft' ? full.previewRows : sql`coalesce((select jsonb_agg(r.input order by r.row_number) from schedule_rows r where r.schedule_id = ${id}), '[]'::jsonb)`,
        problems: full.problems,
        fileRowCount: full.fileRowCount,
        createdBy: actor.userId,
      })
      .returning({ id: schedules.id, name: schedules.name });
    await recordAudit(tx, { teamId, actorId: actor.userId, action: 'schedule.create', entity: 'schedule', entityId: created.id, detail: { name: created.name, duplicateOf: id } });
    await recordAudit(tx, { teamId, actorId: actor.userId, action: 'schedule.duplicate', entity: 'schedule', entityId: id, detail: { copyId: created.id } });
    return created;
  });
}

// ── archive ────────────────────────────────────────────────────────────────────────────────────

export async function setArchived(teamId: string, actor: DocumentActor, kind: DocumentKind, id: string, archived: boolean) {
  const op = archived ? 'archive' : 'unarchive';
  authorise(actor, kind, op);
  return getDb().transaction(async (tx) => {
    const value = archived ? new Date() : null;
    if (kind === 'project') {
      if (!(await lockProject(tx, teamId, id))) throw notFound(kind);
      await tx.update(projects).set({ archivedAt: value }).where(eq(projects.id, id));
    } else if (kind === 'sheet') {
      const sheet = await lockSheet(tx, teamId, id);
      if (!sheet) throw notFound(kind);
      const refusal = sheetRefusal(op, sheet.status);
      if (refusal) throw new DocumentError(409, 'wrong_state', refusal);
      await tx.update(sheets).set({ archivedAt: value }).where(eq(sheets.id, id));
    } else {
      if (!(await lockSchedule(tx, teamId, id))) throw notFound(kind);
      await tx.update(schedules).set({ archivedAt: value }).where(eq(schedules.id, id));
    }
    await recordAudit(tx, { teamId, actorId: actor.userId, action: `${kind}.${op}`, entity: kind, entityId: id });
    return { id, archived };
  });
}

// ── soft delete and restore ────────────────────────────────────────────────────────────────────

export async function deleteDocument(teamId: string, actor: DocumentActor, kind: DocumentKind, id: string) {
  authorise(actor, kind, 'delete');
  return getDb().transaction(async (tx) => {
    const now = new Date();
    let detail: Record<string, unknown> = {};
    if (kind === 'project') {
      const project = await lockProject(tx, teamId, id);
      if (!project) throw notFound(kind);
      const [{ approved }] = await tx
        .select({ approved: sql<number>`count(*)::int` })
        .from(sheets)
        .where(and(eq(sheets.teamId, teamId), eq(sheets.projectId, id), eq(sheets.status, 'approved')));
      const refusal = projectDeleteRefusal(approved);
      if (refusal) throw new DocumentError(409, 'approved_kept', refusal);
      await tx.update(projects).set({ deletedAt: now, deletedBy: actor.userId }).where(eq(projects.id, id));
      detail = { name: project.name };
    } else if (kind === 'sheet') {
      const sheet = await lockSheet(tx, teamId, id);
      if (!sheet) throw notFound(kind);
      const refusal = sheetRefusal('delete', sheet.status);
      if (refusal) throw new DocumentError(409, sheet.status === 'approved' ? 'approved_kept' : 'wrong_state', refusal);
      await tx.update(sheets).set({ deletedAt: now, deletedBy: actor.userId }).where(eq(sheets.id, id));
      detail = { title: sheet.title, status: sheet.status, revision: sheet.revision };
    } else {
      const schedule = await lockSchedule(tx, teamId, id);
      if (!schedule) throw notFound(kind);
      await tx.update(schedules).set({ deletedAt: now, deletedBy: actor.userId }).where(eq(schedules.id, id));
      detail = { name: schedule.name };
    }
    await recordAudit(tx, { teamId, actorId: actor.userId, action: `${kind}.delete`, entity: kind, entityId: id, detail: { ...detail, restorableDays: DELETE_RETENTION_DAYS } });
    return { id, deletedAt: now };
  });
}

const TABLE = { project: projects, sheet: sheets, schedule: schedules } as const;

export async function restoreDocument(teamId: string, actor: DocumentActor, kind: DocumentKind, id: string) {
  authorise(actor, kind, 'restore');
  if (!isUuid(id)) throw notFound(kind);
  return getDb().transaction(async (tx) => {
    const table = TABLE[kind];
    const [row] = await tx
      .select({ deletedAt: table.deletedAt, projectId: kind === 'project' ? projects.id : (table as typeof sheets).projectId })
      .from(table)
      .where(and(eq(table.teamId, teamId), eq(table.id, id), isNotNull(table.deletedAt)))
      .for('update');
    if (!row || !row.deletedAt) throw notFound(kind);
    if (!restorable(row.deletedAt)) throw new DocumentError(409, 'expired', `Deleted more than ${DELETE_RETENTION_DAYS} days ago: it can no longer be restored.`);
    if (kind !== 'project') {
      const [project] = await tx.select({ deletedAt: projects.deletedAt }).from(projects).where(and(eq(projects.teamId, teamId), eq(projects.id, row.projectId)));
      if (project?.deletedAt) throw new DocumentError(409, 'project_deleted', 'Its project is deleted too: restore the project first.');
    }
    await tx.update(table).set({ deletedAt: null, deletedBy: null }).where(and(eq(table.teamId, teamId), eq(table.id, id)));
    await recordAudit(tx, { teamId, actorId: actor.userId, action: `${kind}.restore`, entity: kind, entityId: id, detail: { deletedAt: row.deletedAt.toISOString() } });
    return { id };
  });
}

export interface DeletedItem {
  kind: DocumentKind;
  id: string;
  name: string;
  projectName: string | null;
  deletedAt: Date;
  deletedByName: string | null;
}

/** The team's documents deleted in the last 30 days, newest first (the admins' "Recently deleted"). */
export async function listRecentlyDeleted(teamId: string): Promise<DeletedItem[]> {
  const db = getDb();
  const cutoff = retentionCutoff();
  const [p, s, c] = await Promise.all([
    db
      .select({ id: projects.id, name: projects.name, deletedAt: projects.deletedAt, deletedByName: users.name })
      .from(projects)
      .leftJoin(users, eq(users.id, projects.deletedBy))
      .where(and(eq(projects.teamId, teamId), isNotNull(projects.deletedAt), gt(projects.deletedAt, cutoff))),
    db
      .select({ id: sheets.id, name: sql<string>`${sheets.circuitTag} || ' — ' || ${sheets.title}`, projectName: projects.name, deletedAt: sheets.deletedAt, deletedByName: users.name })
      .from(sheets)
      .innerJoin(projects, eq(projects.id, sheets.projectId))
      .leftJoin(users, eq(users.id, sheets.deletedBy))
      .where(and(eq(sheets.teamId, teamId), isNotNull(sheets.deletedAt), gt(sheets.deletedAt, cutoff))),
    db
      .select({ id: schedules.id, name: schedules.name, projectName: projects.name, deletedAt: schedules.deletedAt, deletedByName: users.name })
      .from(schedules)
      .innerJoin(projects, eq(projects.id, schedules.projectId))
      .leftJoin(users, eq(users.id, schedules.deletedBy))
      .where(and(eq(schedules.teamId, teamId), isNotNull(schedules.deletedAt), gt(schedules.deletedAt, cutoff))),
  ]);
  const items: DeletedItem[] = [
    ...p.map((r) => ({ kind: 'project' as const, projectName: null, ...r, deletedAt: r.deletedAt! })),
    ...s.map((r) => ({ kind: 'sheet' as const, ...r, deletedAt: r.deletedAt! })),
    ...c.map((r) => ({ kind: 'schedule' as const, ...r, deletedAt: r.deletedAt! })),
  ];
  return items.sort((a, b) => b.deletedAt.getTime() - a.deletedAt.getTime());
}

/** Archived projects of the team, and archived sheets and schedules of one project (shown apart from the normal lists). */
export async function listArchivedProjects(teamId: string) {
  return getDb()
    .select({ id: projects.id, name: projects.name, archivedAt: projects.archivedAt })
    .from(projects)
    .where(and(eq(projects.teamId, teamId), isNotNull(projects.archivedAt), isNull(projects.deletedAt)))
    .orderBy(desc(projects.archivedAt));
}

export async function listArchivedInProject(teamId: string, projectId: string) {
  if (!isUuid(projectId)) return { sheets: [], schedules: [] };
  const db = getDb();
  const [s, c] = await Promise.all([
    db
      .select({ id: sheets.id, circuitTag: sheets.circuitTag, title: sheets.title, status: sheets.status, revision: sheets.revision })
      .from(sheets)
      .where(and(eq(sheets.teamId, teamId), eq(sheets.projectId, projectId), isNotNull(sheets.archivedAt), isNull(sheets.deletedAt)))
      .orderBy(sheets.circuitTag),
    db
      .select({ id: schedules.id, name: schedules.name })
      .from(schedules)
      .where(and(eq(schedules.teamId, teamId), eq(schedules.projectId, projectId), isNotNull(schedules.archivedAt), isNull(schedules.deletedAt)))
      .orderBy(schedules.name),
  ]);
  return { sheets: s.map((r) => ({ ...r, status: r.status as SheetStatus })), schedules: c };
}

/**
 * Purges what was deleted more than 30 days ago (run by the workers' maintenance). Approved
 * revisions are never purged: a sheet cannot be deleted while approved, and a project holding one
 * cannot be deleted, but the guard stays here as well.
 */
export async function purgeExpiredDeletions(): Promise<{ projects: number; sheets: number; schedules: number }> {
  return getDb().transaction(async (tx) => {
    const cutoff = retentionCutoff();
    const goneSchedules = await tx.delete(schedules).where(and(isNotNull(schedules.deletedAt), lt(schedules.deletedAt, cutoff))).returning({ id: schedules.id, teamId: schedules.teamId });
    const goneSheets = await tx
      .delete(sheets)
      .where(and(isNotNull(sheets.deletedAt), lt(sheets.deletedAt, cutoff), ne(sheets.status, 'approved')))
      .returning({ id: sheets.id, teamId: sheets.teamId });
    const expiredProjects = await tx
      .select({ id: projects.id })
      .from(projects)
      .where(and(isNotNull(projects.deletedAt), lt(projects.deletedAt, cutoff), sql`not exists (select 1 from ${sheets} s where s.project_id = "projects"."id" and s.status = 'approved')`));
    const goneProjects = expiredProjects.length
      ? await tx.delete(projects).where(inArray(projects.id, expiredProjects.map((p) => p.id))).returning({ id: projects.id, teamId: projects.teamId })
      : [];
    for (const [kind, rows] of [['schedule', goneSchedules], ['sheet', goneSheets], ['project', goneProjects]] as const) {
      for (const row of rows) await recordAudit(tx, { teamId: row.teamId, actorId: null, action: `${kind}.purge`, entity: kind, entityId: row.id, detail: { afterDays: DELETE_RETENTION_DAYS } });
    }
    return { projects: goneProjects.length, sheets: goneSheets.length, schedules: goneSchedules.length };
  });
}
