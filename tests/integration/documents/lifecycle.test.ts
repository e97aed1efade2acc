// Managing documents (issue 23) against the real PostgreSQL server: rename, duplicate (a new draft
// whose history starts fresh and names its origin), archive (hidden from the lists), soft delete
// (hidden, audited, restorable by an admin for 30 days, then purged), approved revisions never
// deleted, the rights of each role, and team isolation.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { auditLog, projects, schedules, sheets } from '@/db/schema';
import { createProject, getProject, listProjects } from '@/db/queries/projects';
import { getSheet, listReviewQueue, listSheetsForProject, sheetHistory } from '@/db/queries/sheets';
import { createSchedule, getSchedule, listSchedulesForProject } from '@/db/queries/schedules';
import {
  deleteDocument,
  DocumentError,
  duplicateDocument,
  listArchivedInProject,
  listArchivedProjects,
  listRecentlyDeleted,
  purgeExpiredDeletions,
  renameDocument,
  restoreDocument,
  setArchived,
  type DocumentActor,
} from '@/db/queries/documents';
import { transitionSheet } from '@/db/queries/sheets';
import type { Role } from '@/lib/auth/permissions';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { acknowledgeEveryReviewFlag, actorOf, newSubmittableSheet } from '../../helpers/reviewSteps';

afterAll(() => closeDb());

async function refusal(promise: Promise<unknown>): Promise<{ status: number; code: string }> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof DocumentError) return { status: error.status, code: error.code };
    throw error;
  }
  throw new Error('expected the operation to be refused, but it succeeded');
}

type Person = { id: string; role: Role };
const people = {} as Record<'designer' | 'reviewer' | 'viewer' | 'admin' | 'otherAdmin', Person>;
const doc = (p: Person): DocumentActor => ({ userId: p.id, role: p.role });
let teamId: string;
let otherTeamId: string;
let projectId: string;

beforeAll(async () => {
  teamId = (await createTestTeam('docs')).id;
  otherTeamId = (await createTestTeam('docs-other')).id;
  people.designer = await createTestUser(teamId, 'designer');
  people.reviewer = await createTestUser(teamId, 'reviewer');
  people.viewer = await createTestUser(teamId, 'viewer');
  people.admin = await createTestUser(teamId, 'admin');
  people.otherAdmin = await createTestUser(otherTeamId, 'admin');
  projectId = (await createProject(teamId, people.designer.id, { name: 'Document rules yard' })).id;
});

async function approvedSheet() {
  const id = await newSubmittableSheet(teamId, projectId, people.designer, 'Approved feeder');
  await transitionSheet(teamId, actorOf(people.designer), id, 'submit');
  await acknowledgeEveryReviewFlag(teamId, id, people.reviewer);
  await transitionSheet(teamId, actorOf(people.reviewer), id, 'approve');
  return id;
}

const auditActions = async (entity: string, id: string) =>
  (await getDb().select({ action: auditLog.action }).from(auditLog).where(and(eq(auditLog.teamId, teamId), eq(auditLog.entity, entity), eq(auditLog.entityId, id)))).map((r) => r.action);

describe('rename', () => {
  it('renames a draft sheet, a project and a schedule, each audited; an approved sheet keeps its title', async () => {
    const draft = await newSubmittableSheet(teamId, projectId, people.designer);
    await renameDocument(teamId, doc(people.designer), 'sheet', draft, 'Chiller plant feeder');
    expect((await getSheet(teamId, draft))!.title).toBe('Chiller plant feeder');
    expect(await auditActions('sheet', draft)).toContain('sheet.rename');
    const approved = await approvedSheet();
    expect(await refusal(renameDocument(teamId, doc(people.designer), 'sheet', approved, 'Changed'))).toEqual({ status: 409, code: 'wrong_state' });
    expect((await getSheet(teamId, approved))!.title).toBe('Approved feeder');

    const project = (await createProject(teamId, people.designer.id, { name: 'To be renamed' })).id;
    await renameDocument(teamId, doc(people.designer), 'project', project, 'Renamed yard');
    expect((await getProject(teamId, project))!.name).toBe('Renamed yard');
    expect(await refusal(renameDocument(teamId, doc(people.designer), 'project', project, 'Document rules yard'))).toEqual({ status: 409, code: 'name_taken' });

    const schedule = (await createSchedule(teamId, people.designer.id, { projectId, name: 'Level 1 board' })).id;
    await renameDocument(teamId, doc(people.designer), 'schedule', schedule, 'Level 1 distribution board');
    expect((await getSchedule(teamId, schedule))!.name).toBe('Level 1 distribution board');
  });
});

describe('duplicate', () => {
  it('makes a new draft of an approved sheet whose history starts fresh and names its origin', async () => {
    const origin = await approvedSheet();
    const originSheet = (await getSheet(teamId, origin))!;
    const copy = await duplicateDocument(teamId, doc(people.designer), 'sheet', origin);
    const copied = (await getSheet(teamId, copy.id))!;
    expect(copied.status).toBe('draft');
    expect(copied.revision).toBe(1);
    expect(copied.previousRevisionId).toBeNull();
    expect(copied.title).toBe(`Copy of ${originSheet.title} from revision ${originSheet.revision}`);
    expect(copied.inputs).toEqual(originSheet.inputs);
    expect(copied.authorId).toBe(people.designer.id);
    const history = await sheetHistory(teamId, copy.id);
    expect(history.map((h) => h.action)).toEqual(['sheet.create']);
    expect(history[0].detail).toMatchObject({ duplicateOf: origin, fromRevision: originSheet.revision });
    const [row] = await getDb().select({ from: sheets.duplicatedFromId, rev: sheets.duplicatedFromRevision }).from(sheets).where(eq(sheets.id, copy.id));
    expect(row).toEqual({ from: origin, rev: originSheet.revision });
    // The origin is untouched and still approved.
    expect((await getSheet(teamId, origin))!.status).toBe('approved');
  });

  it('duplicates a project with the newest revision of each sheet in use, and a schedule as a draft', async () => {
    const source = (await createProject(teamId, people.designer.id, { name: 'Source yard' })).id;
    const a = await newSubmittableSheet(teamId, source, people.designer, 'Feeder A');
    const b = await newSubmittableSheet(teamId, source, people.designer, 'Feeder B');
    await setArchived(teamId, doc(people.designer), 'sheet', b, true);
    const copy = await duplicateDocument(teamId, doc(people.designer), 'project', source);
    expect(copy.name).toBe('Copy of Source yard');
    const copiedSheets = await listSheetsForProject(teamId, copy.id);
    expect(copiedSheets.map((s) => s.title)).toEqual([`Copy of Feeder A from revision 1`]);
    expect(copiedSheets[0].id).not.toBe(a);
    expect((await duplicateDocument(teamId, doc(people.designer), 'project', source)).name).toBe('Copy of Source yard (2)');

    const schedule = (await createSchedule(teamId, people.designer.id, { projectId: source, name: 'Board schedule' })).id;
    const scheduleCopy = await duplicateDocument(teamId, doc(people.designer), 'schedule', schedule);
    expect((await getSchedule(teamId, scheduleCopy.id))).toMatchObject({ name: 'Copy of Board schedule', status: 'draft', projectId: source });
  });
});

describe('archive', () => {
  it('hides archived projects, sheets and schedules from the normal lists and shows them apart', async () => {
    const project = (await createProject(teamId, people.designer.id, { name: 'Archive yard' })).id;
    const sheet = await newSubmittableSheet(teamId, project, people.designer);
    const schedule = (await createSchedule(teamId, people.designer.id, { projectId: project, name: 'Archived schedule' })).id;
    await setArchived(teamId, doc(people.designer), 'sheet', sheet, true);
    await setArchived(teamId, doc(people.designer), 'schedule', schedule, true);
    expect((await listSheetsForProject(teamId, project)).map((s) => s.id)).not.toContain(sheet);
    expect((await listSchedulesForProject(teamId, project)).map((s) => s.id)).not.toContain(schedule);
    const apart = await listArchivedInProject(teamId, project);
    expect(apart.sheets.map((s) => s.id)).toEqual([sheet]);
    expect(apart.schedules.map((s) => s.id)).toEqual([schedule]);
    // Still readable where linked (kept as it is).
    expect(await getSheet(teamId, sheet)).not.toBeNull();

    await setArchived(teamId, doc(people.designer), 'project', project, true);
    expect((await listProjects(teamId)).map((p) => p.id)).not.toContain(project);
    expect((await listArchivedProjects(teamId)).map((p) => p.id)).toContain(project);
    await setArchived(teamId, doc(people.designer), 'project', project, false);
    expect((await listProjects(teamId)).map((p) => p.id)).toContain(project);
  });

  it('an approved sheet can be archived; a sheet in review cannot until withdrawn', async () => {
    const approved = await approvedSheet();
    await setArchived(teamId, doc(people.designer), 'sheet', approved, true);
    expect((await listSheetsForProject(teamId, projectId)).map((s) => s.id)).not.toContain(approved);
    const inReview = await newSubmittableSheet(teamId, projectId, people.designer);
    await transitionSheet(teamId, actorOf(people.designer), inReview, 'submit');
    expect(await refusal(setArchived(teamId, doc(people.designer), 'sheet', inReview, true))).toEqual({ status: 409, code: 'wrong_state' });
  });
});

describe('delete', () => {
  it('never deletes an approved revision, nor a project that holds one', async () => {
    const approved = await approvedSheet();
    expect(await refusal(deleteDocument(teamId, doc(people.admin), 'sheet', approved))).toEqual({ status: 409, code: 'approved_kept' });
    expect(await getSheet(teamId, approved)).not.toBeNull();
    expect(await refusal(deleteDocument(teamId, doc(people.admin), 'project', projectId))).toEqual({ status: 409, code: 'approved_kept' });
    expect(await getProject(teamId, projectId)).not.toBeNull();
    // The purge leaves an approved sheet alone even if a row were marked deleted by hand.
    await getDb().update(sheets).set({ deletedAt: sql`now() - interval '31 days'` }).where(eq(sheets.id, approved));
    await purgeExpiredDeletions();
    const [kept] = await getDb().select({ id: sheets.id, status: sheets.status }).from(sheets).where(eq(sheets.id, approved));
    expect(kept).toEqual({ id: approved, status: 'approved' });
    await getDb().update(sheets).set({ deletedAt: null }).where(eq(sheets.id, approved));
  });

  it('deletes a draft softly: hidden everywhere at once, audited, listed for admins, restorable by an admin only', async () => {
    const draft = await newSubmittableSheet(teamId, projectId, people.designer, 'Deleted feeder');
    await deleteDocument(teamId, doc(people.designer), 'sheet', draft);
    expect(await getSheet(teamId, draft)).toBeNull();
    expect((await listSheetsForProject(teamId, projectId)).map((s) => s.id)).not.toContain(draft);
    const [row] = await getDb().select({ deletedAt: sheets.deletedAt, deletedBy: sheets.deletedBy }).from(sheets).where(eq(sheets.id, draft));
    expect(row.deletedAt).not.toBeNull();
    expect(row.deletedBy).toBe(people.designer.id);
    expect(await auditActions('sheet', draft)).toContain('sheet.delete');
    const listed = await listRecentlyDeleted(teamId);
    expect(listed.find((i) => i.id === draft)).toMatchObject({ kind: 'sheet', deletedByName: expect.any(String) });

    expect(await refusal(restoreDocument(teamId, doc(people.designer), 'sheet', draft))).toEqual({ status: 403, code: 'forbidden' });
    await restoreDocument(teamId, doc(people.admin), 'sheet', draft);
    expect((await getSheet(teamId, draft))!.title).toBe('Deleted feeder');
    expect(await auditActions('sheet', draft)).toContain('sheet.restore');
    expect((await listRecentlyDeleted(teamId)).map((i) => i.id)).not.toContain(draft);
  });

  it('a sheet in review cannot be deleted, and leaves the review queue once its draft revision is deleted', async () => {
    const inReview = await newSubmittableSheet(teamId, projectId, people.designer);
    await transitionSheet(teamId, actorOf(people.designer), inReview, 'submit');
    expect(await refusal(deleteDocument(teamId, doc(people.designer), 'sheet', inReview))).toEqual({ status: 409, code: 'wrong_state' });
    await transitionSheet(teamId, actorOf(people.designer), inReview, 'withdraw');
    await deleteDocument(teamId, doc(people.designer), 'sheet', inReview);
    expect((await listReviewQueue(teamId, people.reviewer.id)).map((s) => s.id)).not.toContain(inReview);
  });

  it('a deleted project hides its sheets and schedules; restoring a sheet waits for its project', async () => {
    const project = (await createProject(teamId, people.designer.id, { name: 'Deleted yard' })).id;
    const sheet = await newSubmittableSheet(teamId, project, people.designer);
    const schedule = (await createSchedule(teamId, people.designer.id, { projectId: project, name: 'Gone schedule' })).id;
    await deleteDocument(teamId, doc(people.designer), 'sheet', sheet);
    await deleteDocument(teamId, doc(people.designer), 'project', project);
    expect(await getProject(teamId, project)).toBeNull();
    expect(await getSchedule(teamId, schedule)).toBeNull();
    expect((await listProjects(teamId)).map((p) => p.id)).not.toContain(project);
    expect(await refusal(restoreDocument(teamId, doc(people.admin), 'sheet', sheet))).toEqual({ status: 409, code: 'project_deleted' });
    await restoreDocument(teamId, doc(people.admin), 'project', project);
    expect(await getSchedule(teamId, schedule)).not.toBeNull();
    await restoreDocument(teamId, doc(people.admin), 'sheet', sheet);
    expect(await getSheet(teamId, sheet)).not.toBeNull();
  });

  it('after 30 days a deletion can no longer be restored and is purged', async () => {
    const draft = await newSubmittableSheet(teamId, projectId, people.designer);
    const schedule = (await createSchedule(teamId, people.designer.id, { projectId, name: 'Old schedule' })).id;
    await deleteDocument(teamId, doc(people.designer), 'sheet', draft);
    await deleteDocument(teamId, doc(people.designer), 'schedule', schedule);
    await getDb().update(sheets).set({ deletedAt: sql`now() - interval '31 days'` }).where(eq(sheets.id, draft));
    await getDb().update(schedules).set({ deletedAt: sql`now() - interval '31 days'` }).where(eq(schedules.id, schedule));
    expect((await listRecentlyDeleted(teamId)).map((i) => i.id)).not.toContain(draft);
    expect(await refusal(restoreDocument(teamId, doc(people.admin), 'sheet', draft))).toEqual({ status: 409, code: 'expired' });
    const gone = await purgeExpiredDeletions();
    expect(gone.sheets).toBeGreaterThanOrEqual(1);
    expect(await getDb().select().from(sheets).where(eq(sheets.id, draft))).toHaveLength(0);
    expect(await getDb().select().from(schedules).where(eq(schedules.id, schedule))).toHaveLength(0);
  });
});

describe('rights and teams', () => {
  it('reviewers and viewers may not rename, duplicate, archive or delete', async () => {
    const draft = await newSubmittableSheet(teamId, projectId, people.designer);
    for (const who of [people.reviewer, people.viewer]) {
      expect(await refusal(renameDocument(teamId, doc(who), 'sheet', draft, 'x'))).toEqual({ status: 403, code: 'forbidden' });
      expect(await refusal(duplicateDocument(teamId, doc(who), 'sheet', draft))).toEqual({ status: 403, code: 'forbidden' });
      expect(await refusal(setArchived(teamId, doc(who), 'project', projectId, true))).toEqual({ status: 403, code: 'forbidden' });
      expect(await refusal(deleteDocument(teamId, doc(who), 'sheet', draft))).toEqual({ status: 403, code: 'forbidden' });
    }
    expect(await getSheet(teamId, draft)).not.toBeNull();
  });

  it('another team’s admin finds none of this team’s documents, to change, delete or restore', async () => {
    const draft = await newSubmittableSheet(teamId, projectId, people.designer);
    const other = doc(people.otherAdmin);
    for (const op of [
      () => renameDocument(otherTeamId, other, 'sheet', draft, 'Taken over'),
      () => duplicateDocument(otherTeamId, other, 'project', projectId),
      () => setArchived(otherTeamId, other, 'sheet', draft, true),
      () => deleteDocument(otherTeamId, other, 'sheet', draft),
    ]) {
      expect(await refusal(op())).toEqual({ status: 404, code: 'not_found' });
    }
    await deleteDocument(teamId, doc(people.designer), 'sheet', draft);
    expect(await refusal(restoreDocument(otherTeamId, other, 'sheet', draft))).toEqual({ status: 404, code: 'not_found' });
    expect((await listRecentlyDeleted(otherTeamId)).map((i) => i.id)).not.toContain(draft);
    const [p] = await getDb().select({ name: projects.name }).from(projects).where(eq(projects.id, projectId));
    expect(p.name).toBe('Document rules yard');
  });
});
