/**
 * Sizing sheets: create, save (optimistic lock), review transitions, flag acknowledgements,
 * revisions, queue and history. Every function takes the team id first and never touches another
 * team's rows; every write records its audit entry in the same transaction.
 *
 * Result snapshots are computed here on the server from the inputs being saved (lib/sheet
 * buildSnapshot) — a client's numbers are never stored.
 */
import { aliasedTable, and, asc, desc, eq, isNull, ne, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { auditLog, projects, sheetContributions, sheetFlagAcknowledgements, sheets, teams, users } from '../schema';
import { recordAudit } from './audit';
import { recordTransitionNotices, type MailNotice } from './notifications';
import { notificationKindOf } from '../../lib/notifications/kinds';
import {
  approvalReadiness,
  buildSnapshot,
  decide,
  readSheetInputs,
  readSnapshot,
  SHEET_SCHEMA_VERSION,
  TRANSITIONS,
  type Actor,
  type SheetInputs,
  type SheetStatus,
} from '../../lib/sheet';
import { arrangementRefusalOf, refusalSentence, refusalSubject } from '../../lib/sheet/arrangementCheck';
import type { ResultSnapshot } from '../../lib/sheet/snapshot';
import type { SheetListItem, SheetRecord } from '../../lib/sheet/records';

export type { SheetListItem, SheetRecord };

export class SheetOperationError extends Error {
  constructor(
    readonly status: 400 | 403 | 404 | 409,
    readonly code: string,
    message: string,
    readonly detail?: Record<string, unknown>,
  ) {
    super(message);
  }
}

const notFound = () => new SheetOperationError(404, 'not_found', 'No such sizing sheet.');

const authors = aliasedTable(users, 'author');
const reviewers = aliasedTable(users, 'reviewer');

const sheetColumns = {
  id: sheets.id,
  teamId: sheets.teamId,
  projectId: sheets.projectId,
  projectName: projects.name,
  circuitTag: sheets.circuitTag,
  title: sheets.title,
  status: sheets.status,
  revision: sheets.revision,
  previousRevisionId: sheets.previousRevisionId,
  inputs: sheets.inputs,
  result: sheets.result,
  schemaVersion: sheets.schemaVersion,
  solverVersion: sheets.solverVersion,
  version: sheets.version,
  authorId: sheets.authorId,
  authorName: authors.name,
  reviewerId: sheets.reviewerId,
  reviewerName: reviewers.name,
  approvedAt: sheets.approvedAt,
  createdAt: sheets.createdAt,
  updatedAt: sheets.updatedAt,
  newerRevisionId: sql<string | null>`(select n.id from ${sheets} n where n.previous_revision_id = "sheets"."id" and n.deleted_at is null limit 1)`,
  editorIds: contributorsOf('edited'),
  submitterIds: contributorsOf('submitted'),
  // The team's money (teams.currency): every amount the sheet prints, shares or exports names it.
  teamCurrency: sql<string>`(select t.currency from ${teams} t where t.id = ${sheets.teamId})`,
};

function contributorsOf(kind: 'edited' | 'submitted') {
  return sql<string[]>`(select coalesce(json_agg(c.user_id order by c.first_at), '[]'::json) from ${sheetContributions} c where c.sheet_id = ${sheets.id} and c.kind = ${kind})`;
}

/** Records that this person edited or submitted this revision (once per person and kind; the last time is kept). */
export async function recordContribution(tx: Executor, teamId: string, sheetId: string, userId: string, kind: 'edited' | 'submitted') {
  await tx
    .insert(sheetContributions)
    .values({ teamId, sheetId, userId, kind })
    .onConflictDoUpdate({ target: [sheetContributions.sheetId, sheetContributions.userId, sheetContributions.kind], set: { lastAt: sql`now()` } });
}


async function loadSheetRow(teamId: string, sheetId: string, tx: Executor) {
  if (!isUuid(sheetId)) return null;
  const [row] = await tx
    .select(sheetColumns)
    .from(sheets)
    .innerJoin(projects, eq(projects.id, sheets.projectId))
    .leftJoin(authors, eq(authors.id, sheets.authorId))
    .leftJoin(reviewers, eq(reviewers.id, sheets.reviewerId))
    // A deleted sheet, or one of a deleted project, is not found (issue 23: soft delete).
    .where(and(eq(sheets.teamId, teamId), eq(sheets.id, sheetId), isNull(sheets.deletedAt), isNull(projects.deletedAt)));
  return row ?? null;
}

async function loadAcknowledgements(teamId: string, sheetId: string, tx: Executor) {
  return tx
    .select({
      flagCode: sheetFlagAcknowledgements.flagCode,
      comment: sheetFlagAcknowledgements.comment,
      reviewerName: users.name,
      createdAt: sheetFlagAcknowledgements.createdAt,
    })
    .from(sheetFlagAcknowledgements)
    .leftJoin(users, eq(users.id, sheetFlagAcknowledgements.reviewerId))
    .where(and(eq(sheetFlagAcknowledgements.teamId, teamId), eq(sheetFlagAcknowledgements.sheetId, sheetId)))
    .orderBy(asc(sheetFlagAcknowledgements.createdAt));
}

export async function getSheet(teamId: string, sheetId: string, tx: Executor = getDb()): Promise<SheetRecord | null> {
  if (!isUuid(sheetId)) return null;
  // Both reads at once: the page that shows a sheet waits for one round trip, not two.
  const [row, acknowledgements] = await Promise.all([loadSheetRow(teamId, sheetId, tx), loadAcknowledgements(teamId, sheetId, tx)]);
  if (!row) return null;
  return {
    ...row,
    status: row.status as SheetStatus,
    inputs: readSheetInputs(row.inputs, row.schemaVersion),
    storedSchemaVersion: row.schemaVersion,
    result: readSnapshot(row.result),
    acknowledgements,
  };
}

const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** A malformed id is simply "not found" (PostgreSQL would otherwise reject the cast with a 500). */
export function isUuid(value: string): boolean {
  return UUID_PATTERN.test(value);
}


function listItem(row: {
  id: string;
  projectId: string;
  projectName: string;
  circuitTag: string;
  title: string;
  status: string;
  revision: number;
  authorId: string;
  authorName: string | null;
  updatedAt: Date;
  newerRevisionId: string | null;
  result: unknown;
}): SheetListItem {
  const snapshot = readSnapshot(row.result);
  const chosen = snapshot?.evaluations.find((e) => e.id === snapshot.chosenCandidateId) ?? null;
  const { result: _result, ...rest } = row;
  return { ...rest, status: row.status as SheetStatus, chosenLabel: chosen?.label ?? null, chosenPasses: snapshot?.chosenPasses ?? null };
}

const listColumns = {
  id: sheets.id,
  projectId: sheets.projectId,
  projectName: projects.name,
  circuitTag: sheets.circuitTag,
  title: sheets.title,
  status: sheets.status,
  revision: sheets.revision,
  authorId: sheets.authorId,
  authorName: authors.name,
  updatedAt: sheets.updatedAt,
  newerRevisionId: sheetColumns.newerRevisionId,
  result: sheets.result,
};

export async function listSheetsForProject(teamId: string, projectId: string): Promise<SheetListItem[]> {
  if (!isUuid(projectId)) return [];
  const rows = await getDb()
    .select(listColumns)
    .from(sheets)
    .innerJoin(projects, eq(projects.id, sheets.projectId))
    .leftJoin(authors, eq(authors.id, sheets.authorId))
    .where(and(eq(sheets.teamId, teamId), eq(sheets.projectId, projectId), isNull(sheets.archivedAt), isNull(sheets.deletedAt)))
    .orderBy(asc(sheets.circuitTag), desc(sheets.revision));
  return rows.map(listItem);
}

/** Sheets waiting for review that this user may review (not their own, nor ones they edited or submitted). */
export async function listReviewQueue(teamId: string, reviewerId: string): Promise<SheetListItem[]> {
  const rows = await getDb()
    .select(listColumns)
    .from(sheets)
    .innerJoin(projects, eq(projects.id, sheets.projectId))
    .leftJoin(authors, eq(authors.id, sheets.authorId))
    .where(
      and(
        eq(sheets.teamId, teamId),
        eq(sheets.status, 'in_review'),
        isNull(sheets.archivedAt),
        isNull(sheets.deletedAt),
        isNull(projects.deletedAt),
        ne(sheets.authorId, reviewerId),
        sql`not exists (select 1 from ${sheetContributions} c where c.sheet_id = ${sheets.id} and c.user_id = ${reviewerId})`,
      ),
    )
    .orderBy(asc(sheets.updatedAt));
  return rows.map(listItem);
}

export interface NewSheet {
  projectId: string;
  circuitTag: string;
  title: string;
  inputs: SheetInputs;
  /** A duplicate names its origin (issue 23); its history starts fresh. */
  duplicatedFrom?: { id: string; revision: number };
}

/** `within`: the caller's transaction (the sheet is then made in a savepoint of it, e.g. with a batch item). */
export async function createSheet(teamId: string, actor: Actor, input: NewSheet, within: Executor = getDb()) {
  const decision = decide('edit', { status: 'draft', authorId: actor.userId }, actor);
  if (!decision.allowed) throw new SheetOperationError(403, decision.code, decision.reason);
  const snapshot = buildSnapshot(input.inputs);
  return within.transaction(async (tx) => {
    const [project] = await tx
      .select({ id: projects.id })
      .from(projects)
      .where(and(eq(projects.teamId, teamId), eq(projects.id, input.projectId), isNull(projects.deletedAt)));
    if (!project) throw new SheetOperationError(404, 'not_found', 'No such project.');
    const [sheet] = await tx
      .insert(sheets)
      .values({
        teamId,
        projectId: input.projectId,
        circuitTag: input.circuitTag,
        title: input.title,
        inputs: input.inputs,
        result: snapshot,
        schemaVersion: SHEET_SCHEMA_VERSION,
        solverVersion: snapshot.solverVersion,
        authorId: actor.userId,
        ...(input.duplicatedFrom ? { duplicatedFromId: input.duplicatedFrom.id, duplicatedFromRevision: input.duplicatedFrom.revision } : {}),
      })
      .returning({ id: sheets.id, version: sheets.version, title: sheets.title });
    await recordContribution(tx, teamId, sheet.id, actor.userId, 'edited');
    await tx.update(projects).set({ updatedAt: new Date() }).where(eq(projects.id, input.projectId));
    await recordAudit(tx, {
      teamId,
      actorId: actor.userId,
      action: 'sheet.create',
      entity: 'sheet',
      entityId: sheet.id,
      detail: {
        ...(input.duplicatedFrom ? { duplicateOf: input.duplicatedFrom.id, fromRevision: input.duplicatedFrom.revision } : {}),
        circuitTag: input.circuitTag,
        title: input.title,
      },
    });
    return sheet;
  });
}

export interface SheetSave {
  /** The version the editor started from; a save over a newer one is refused. */
  expectedVersion: number;
  inputs: SheetInputs;
  title?: string;
  circuitTag?: string;
}

/** Top-level input sections that differ, for the audit entry and the conflict message. */
export function changedSections(before: SheetInputs, after: SheetInputs): string[] {
  const keys = new Set([...Object.keys(before), ...Object.keys(after)] as (keyof SheetInputs)[]);
  return [...keys].filter((key) => JSON.stringify(before[key]) !== JSON.stringify(after[key]));
}

/**
 * A cross-section the library refuses for a candidate on the sheet (cables overlapping, not
 * fitting their ducts, outside the backfill) is a mistake in the inputs: the save is refused with
 * the field named, and nothing is written.
 */
function refuseBadArrangement(snapshot: ResultSnapshot): void {
  const refusal = arrangementRefusalOf(snapshot.evaluations, snapshot.error);
  if (!refusal) return;
  throw new SheetOperationError(400, 'invalid_arrangement', `Not saved: ${refusalSubject(refusal)}. ${refusalSentence(refusal)}.`, {
    fieldPath: refusal.field,
    issues: [{ path: refusal.field, message: refusal.message }],
  });
}

export async function saveSheet(teamId: string, actor: Actor, sheetId: string, save: SheetSave) {
  // The heat balance runs before the transaction: no row lock is held while the solver works.
  const snapshot = buildSnapshot(save.inputs);
  refuseBadArrangement(snapshot);
  return getDb().transaction(async (tx) => {
    const current = await getSheet(teamId, sheetId, tx);
    if (!current) throw notFound();
    const decision = decide('edit', current, actor);
    if (!decision.allowed) throw new SheetOperationError(decision.code === 'forbidden' ? 403 : 409, decision.code, decision.reason);
    // The version check and the write are one statement, so two concurrent saves cannot both win.
    const updated = await tx
      .update(sheets)
      .set({
        inputs: save.inputs,
        result: snapshot,
        schemaVersion: SHEET_SCHEMA_VERSION,
        solverVersion: snapshot.solverVersion,
        title: save.title ?? current.title,
        circuitTag: save.circuitTag ?? current.circuitTag,
        version: sql`${sheets.version} + 1`,
        updatedAt: new Date(),
      })
      .where(and(eq(sheets.teamId, teamId), eq(sheets.id, sheetId), eq(sheets.version, save.expectedVersion)))
      .returning({ version: sheets.version });
    if (updated.length === 0) {
      // The save that won committed after our read above: answer with the row as it is now (a
      // statement of its own sees that commit under READ COMMITTED), so that "take theirs" loads
      // what was really saved, not what this request read before.
      const latest = await getSheet(teamId, sheetId, tx);
      if (!latest) throw notFound();
      throw conflict(latest, save.inputs);
    }
    await recordContribution(tx, teamId, sheetId, actor.userId, 'edited');
    await recordAudit(tx, {
      teamId,
      actorId: actor.userId,
      action: 'sheet.save',
      entity: 'sheet',
      entityId: sheetId,
      detail: {
        fromVersion: save.expectedVersion,
        toVersion: updated[0].version,
        changed: changedSections(current.inputs, save.inputs),
        chosenCandidateId: save.inputs.chosenCandidateId,
        solverVersion: snapshot.solverVersion,
      },
    });
    return { version: updated[0].version, result: snapshot };
  });
}

function conflict(current: SheetRecord, attempted: SheetInputs) {
  return new SheetOperationError(
    409,
    'version_conflict',
    `Someone saved this sheet after you opened it (now version ${current.version}). Your changes were not saved.`,
    {
      currentVersion: current.version,
      changedSections: changedSections(attempted, current.inputs),
      updatedAt: current.updatedAt.toISOString(),
      current: { inputs: current.inputs, title: current.title, circuitTag: current.circuitTag, status: current.status },
    },
  );
}

export type TransitionAction = 'submit' | 'withdraw' | 'approve' | 'return';

export async function transitionSheet(
  teamId: string,
  actor: Actor,
  sheetId: string,
  action: TransitionAction,
  options: { comment?: string; expectedVersion?: number } = {},
) {
  return getDb().transaction(async (tx) => {
    // Lock the row so that an approval and a flag acknowledgement or a second decision serialise.
    await tx.execute(sql`select 1 from ${sheets} where ${sheets.id} = ${isUuid(sheetId) ? sheetId : null} and ${sheets.teamId} = ${teamId} for update`);
    const current = await getSheet(teamId, sheetId, tx);
    if (!current) throw notFound();
    if (options.expectedVersion !== undefined && options.expectedVersion !== current.version) {
      throw conflict(current, current.inputs);
    }
    const readiness = approvalReadiness(current.result, current.acknowledgements.map((a) => a.flagCode));
    const decision = decide(action, { ...current, hasNewerRevision: current.newerRevisionId !== null }, actor, readiness);
    if (!decision.allowed) {
      throw new SheetOperationError(decision.code === 'forbidden' || decision.code === 'own_sheet' ? 403 : 409, decision.code, decision.reason, {
        readiness,
      });
    }
    if (action === 'return' && !options.comment?.trim()) {
      throw new SheetOperationError(409, 'comment_required', 'Say why the sheet is returned: a comment is required.');
    }
    const to = TRANSITIONS[action].to;
    const now = new Date();
    if (action === 'submit') {
      // Acknowledgements belong to the reviewed snapshot; a new submission is reviewed afresh.
      await tx.delete(sheetFlagAcknowledgements).where(and(eq(sheetFlagAcknowledgements.teamId, teamId), eq(sheetFlagAcknowledgements.sheetId, sheetId)));
    }
    const [updated] = await tx
      .update(sheets)
      .set({
        status: to,
        version: sql`${sheets.version} + 1`,
        updatedAt: now,
        ...(action === 'approve' || action === 'return' ? { reviewerId: actor.userId } : {}),
        ...(action === 'approve' ? { approvedAt: now } : {}),
      })
      .where(and(eq(sheets.teamId, teamId), eq(sheets.id, sheetId)))
      .returning({ version: sheets.version, status: sheets.status });
    if (action === 'submit') await recordContribution(tx, teamId, sheetId, actor.userId, 'submitted');
    // The licence the approver signs with, as it stands now: a later profile change does not rewrite the package.
    const [reviewerLicence] =
      action === 'approve' ? await tx.select({ licenceNumber: users.licenceNumber, licenceJurisdiction: users.licenceJurisdiction }).from(users).where(and(eq(users.teamId, teamId), eq(users.id, actor.userId))) : [];
    await recordAudit(tx, {
      teamId,
      actorId: actor.userId,
      action: `sheet.${action}`,
      entity: 'sheet',
      entityId: sheetId,
      detail: {
        from: current.status,
        to,
        ...(options.comment?.trim() ? { comment: options.comment.trim() } : {}),
        ...(action === 'approve'
          ? { solverVersion: current.solverVersion, acknowledged: current.acknowledgements.map((a) => a.flagCode), chosenCandidateId: current.result?.chosenCandidateId ?? null, ...(reviewerLicence ? { reviewerLicence } : {}) }
          : {}),
      },
    });
    // Who is told: written with the decision, so a notification exists exactly when the decision does.
    const kind = notificationKindOf(action);
    let notices: MailNotice[] = [];
    if (kind) {
      const [me] = await tx.select({ name: users.name }).from(users).where(and(eq(users.teamId, teamId), eq(users.id, actor.userId)));
      notices = await recordTransitionNotices(tx, teamId, {
        kind,
        actorId: actor.userId,
        actorName: me?.name ?? 'A member',
        sheet: { id: sheetId, authorId: current.authorId, circuitTag: current.circuitTag, title: current.title, revision: current.revision },
      });
    }
    return { ...updated, notices };
  });
}

export async function acknowledgeFlag(teamId: string, actor: Actor, sheetId: string, flagCode: string, comment: string) {
  return getDb().transaction(async (tx) => {
    await tx.execute(sql`select 1 from ${sheets} where ${sheets.id} = ${isUuid(sheetId) ? sheetId : null} and ${sheets.teamId} = ${teamId} for update`);
    const current = await getSheet(teamId, sheetId, tx);
    if (!current) throw notFound();
    const decision = decide('acknowledge', current, actor);
    if (!decision.allowed) {
      throw new SheetOperationError(decision.code === 'forbidden' || decision.code === 'own_sheet' ? 403 : 409, decision.code, decision.reason);
    }
    const flag = current.result?.chosenFlags.find((f) => f.code === flagCode);
    if (!flag) throw new SheetOperationError(404, 'not_found', `The chosen candidate has no such flag.`);
    if (flag.severity !== 'review') {
      throw new SheetOperationError(409, 'not_acknowledgeable', flag.severity === 'blocker' ? 'A blocker cannot be acknowledged away; the sheet must be changed.' : 'Notes need no acknowledgement.');
    }
    await tx
      .insert(sheetFlagAcknowledgements)
      .values({ teamId, sheetId, flagCode, comment, reviewerId: actor.userId })
      .onConflictDoUpdate({
        target: [sheetFlagAcknowledgements.sheetId, sheetFlagAcknowledgements.flagCode],
        set: { comment, reviewerId: actor.userId, createdAt: new Date() },
      });
    await tx.update(sheets).set({ version: sql`${sheets.version} + 1`, updatedAt: new Date() }).where(eq(sheets.id, sheetId));
    await recordAudit(tx, {
      teamId,
      actorId: actor.userId,
      action: 'sheet.flag.acknowledge',
      entity: 'sheet',
      entityId: sheetId,
      detail: { flagCode, comment, message: flag.message },
    });
  });
}

/** An approved sheet stays frozen; editing starts a new draft revision that points back to it. */
export async function reviseSheet(teamId: string, actor: Actor, sheetId: string) {
  return getDb().transaction(async (tx) => {
    await tx.execute(sql`select 1 from ${sheets} where ${sheets.id} = ${isUuid(sheetId) ? sheetId : null} and ${sheets.teamId} = ${teamId} for update`);
    const current = await getSheet(teamId, sheetId, tx);
    if (!current) throw notFound();
    const decision = decide('revise', { ...current, hasNewerRevision: current.newerRevisionId !== null }, actor);
    if (!decision.allowed) throw new SheetOperationError(decision.code === 'forbidden' ? 403 : 409, decision.code, decision.reason);
    const snapshot = buildSnapshot(current.inputs);
    const [created] = await tx
      .insert(sheets)
      .values({
        teamId,
        projectId: current.projectId,
        circuitTag: current.circuitTag,
        title: current.title,
        revision: current.revision + 1,
        previousRevisionId: current.id,
        inputs: current.inputs,
        result: snapshot,
        schemaVersion: SHEET_SCHEMA_VERSION,
        solverVersion: snapshot.solverVersion,
        authorId: actor.userId,
      })
      .returning({ id: sheets.id, revision: sheets.revision });
    await recordContribution(tx, teamId, created.id, actor.userId, 'edited');
    await recordAudit(tx, {
      teamId,
      actorId: actor.userId,
      action: 'sheet.revise',
      entity: 'sheet',
      entityId: current.id,
      detail: { newSheetId: created.id, newRevision: created.revision },
    });
    await recordAudit(tx, {
      teamId,
      actorId: actor.userId,
      action: 'sheet.create',
      entity: 'sheet',
      entityId: created.id,
      detail: { revisionOf: current.id, revision: created.revision },
    });
    return created;
  });
}

export interface HistoryEntry {
  id: string;
  action: string;
  actorName: string | null;
  at: Date;
  detail: Record<string, unknown>;
}

/** The sheet's history: every audit entry for it, oldest first, with who did it. */
export async function sheetHistory(teamId: string, sheetId: string): Promise<HistoryEntry[]> {
  if (!isUuid(sheetId)) return [];
  const rows = await getDb()
    .select({ id: auditLog.id, action: auditLog.action, actorName: users.name, at: auditLog.at, detail: auditLog.detail })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(and(eq(auditLog.teamId, teamId), eq(auditLog.entity, 'sheet'), eq(auditLog.entityId, sheetId)))
    .orderBy(asc(auditLog.at), asc(auditLog.id));
  return rows.map((r) => ({ ...r, detail: (r.detail ?? {}) as Record<string, unknown> }));
}

/** Counts per state for a project's page header. */
export async function sheetStatusCounts(teamId: string, projectId: string) {
  if (!isUuid(projectId)) return {};
  const rows = await getDb()
    .select({ status: sheets.status, count: sql<number>`count(*)::int` })
    .from(sheets)
    .where(and(eq(sheets.teamId, teamId), eq(sheets.projectId, projectId), isNull(sheets.archivedAt), isNull(sheets.deletedAt)))
    .groupBy(sheets.status);
  return Object.fromEntries(rows.map((r) => [r.status, r.count])) as Partial<Record<SheetStatus, number>>;
}
