/**
 * "Make sizing sheets" for a chosen set of schedule rows (issue 23). The request stores the batch,
 * one item per row and its job in one transaction; a worker then makes each row's draft sheet and
 * fills the item in the same transaction (so a retried job never makes a row's sheet twice). Every
 * function takes the team id first; the worker's job carries it and is checked against the batch.
 */
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { scheduleRows, scheduleSheetBatches, scheduleSheetBatchItems, sheets, users } from '../schema';
import { recordAudit } from './audit';
import { getSchedule, getScheduleRow, ScheduleOperationError, withClientTransaction } from './schedules';
import { createSheet, SheetOperationError } from './sheets';
import { scheduleRowToSheetInputs, sheetTitleOf } from '../../lib/schedule';
import { can, isRole } from '../../lib/auth/permissions';
import type { Actor } from '../../lib/sheet';

/** At most this many rows per request: a whole schedule is up to 5,000 circuits, a batch of sheets is a working set. */
export const MAX_SHEETS_PER_BATCH = 500;

export type EnqueueSheetBatch = (executeSql: (text: string, values: unknown[]) => Promise<{ rows: unknown[] }>, job: { teamId: string; batchId: string }) => Promise<void>;

export async function requestSheetBatch(teamId: string, actorId: string, scheduleId: string, rowNumbers: readonly number[], enqueue: EnqueueSheetBatch) {
  const wanted = [...new Set(rowNumbers)].sort((a, b) => a - b);
  if (wanted.length === 0) throw new ScheduleOperationError(409, 'no_rows', 'Choose at least one row.');
  if (wanted.length > MAX_SHEETS_PER_BATCH) throw new ScheduleOperationError(409, 'too_many_rows', `Choose at most ${MAX_SHEETS_PER_BATCH} rows at a time.`);
  const schedule = await getSchedule(teamId, scheduleId);
  if (!schedule) throw new ScheduleOperationError(404, 'not_found', 'No such schedule.');
  return withClientTransaction(async (db, client) => {
    const found = await db
      .select({ rowNumber: scheduleRows.rowNumber })
      .from(scheduleRows)
      .where(and(eq(scheduleRows.teamId, teamId), eq(scheduleRows.scheduleId, scheduleId), inArray(scheduleRows.rowNumber, wanted)));
    const known = new Set(found.map((r) => r.rowNumber));
    const missing = wanted.filter((n) => !known.has(n));
    if (missing.length > 0) throw new ScheduleOperationError(404, 'no_such_rows', `No such rows in this schedule: ${missing.slice(0, 10).join(', ')}${missing.length > 10 ? ' …' : ''}.`, { missing });
    const [batch] = await db.insert(scheduleSheetBatches).values({ teamId, scheduleId, requestedBy: actorId, total: wanted.length }).returning({ id: scheduleSheetBatches.id });
    await db.insert(scheduleSheetBatchItems).values(wanted.map((rowNumber) => ({ teamId, batchId: batch.id, rowNumber })));
    await enqueue((text, values) => client.query(text, values as unknown[]), { teamId, batchId: batch.id });
    await recordAudit(db, { teamId, actorId, action: 'schedule.sheets_request', entity: 'schedule', entityId: scheduleId, detail: { batchId: batch.id, rows: wanted } });
    return { id: batch.id, total: wanted.length };
  });
}

export interface SheetBatchProgress {
  id: string;
  scheduleId: string;
  status: 'queued' | 'done';
  total: number;
  done: number;
  failed: number;
  created: Array<{ rowNumber: number; sheetId: string; circuitTag: string; title: string }>;
  failures: Array<{ rowNumber: number; message: string }>;
}

export async function sheetBatchProgress(teamId: string, batchId: string): Promise<SheetBatchProgress | null> {
  if (!/^[0-9a-f-]{36}$/i.test(batchId)) return null;
  const [batch] = await getDb()
    .select({ id: scheduleSheetBatches.id, scheduleId: scheduleSheetBatches.scheduleId, status: scheduleSheetBatches.status, total: scheduleSheetBatches.total })
    .from(scheduleSheetBatches)
    .where(and(eq(scheduleSheetBatches.teamId, teamId), eq(scheduleSheetBatches.id, batchId)));
  if (!batch) return null;
  const items = await getDb()
    .select({ rowNumber: scheduleSheetBatchItems.rowNumber, sheetId: scheduleSheetBatchItems.sheetId, error: scheduleSheetBatchItems.error, circuitTag: sheets.circuitTag, title: sheets.title })
    .from(scheduleSheetBatchItems)
    .leftJoin(sheets, and(eq(sheets.id, scheduleSheetBatchItems.sheetId), eq(sheets.teamId, teamId)))
    .where(and(eq(scheduleSheetBatchItems.teamId, teamId), eq(scheduleSheetBatchItems.batchId, batchId)))
    .orderBy(asc(scheduleSheetBatchItems.rowNumber));
  const created = items.filter((i) => i.sheetId).map((i) => ({ rowNumber: i.rowNumber, sheetId: i.sheetId!, circuitTag: i.circuitTag ?? '', title: i.title ?? '' }));
  const failures = items.filter((i) => !i.sheetId && i.error).map((i) => ({ rowNumber: i.rowNumber, message: i.error! }));
  return { ...batch, done: created.length + failures.length, failed: failures.length, created, failures };
}

// ───────────────────────── worker side (the job carries the team) ─────────────────────────

/** Makes the sheets still missing for a batch; safe to run again (made items are skipped). */
export async function processSheetBatchItems(job: { teamId: string; batchId: string }): Promise<{ made: number; failed: number; completed: boolean }> {
  const [batch] = await getDb()
    .select({ id: scheduleSheetBatches.id, scheduleId: scheduleSheetBatches.scheduleId, requestedBy: scheduleSheetBatches.requestedBy, status: scheduleSheetBatches.status })
    .from(scheduleSheetBatches)
    .where(and(eq(scheduleSheetBatches.teamId, job.teamId), eq(scheduleSheetBatches.id, job.batchId)));
  if (!batch || batch.status === 'done') return { made: 0, failed: 0, completed: false };
  // The sheets are made as the member who asked, with their rights as they are now.
  const [requester] = batch.requestedBy
    ? await getDb().select({ id: users.id, role: users.role, active: users.active }).from(users).where(and(eq(users.teamId, job.teamId), eq(users.id, batch.requestedBy)))
    : [];
  const actor: Actor | null = requester && requester.active && isRole(requester.role) ? { userId: requester.id, can: (p) => can(requester.role, p) } : null;
  const pending = await getDb()
    .select({ rowNumber: scheduleSheetBatchItems.rowNumber })
    .from(scheduleSheetBatchItems)
    .where(and(eq(scheduleSheetBatchItems.batchId, batch.id), isNull(scheduleSheetBatchItems.sheetId), isNull(scheduleSheetBatchItems.error)))
    .orderBy(asc(scheduleSheetBatchItems.rowNumber));
  let made = 0;
  let failed = 0;
  for (const { rowNumber } of pending) {
    const outcome = await makeOneSheet(job.teamId, batch.id, batch.scheduleId, rowNumber, actor);
    if (outcome === 'made') made += 1;
    if (outcome === 'failed') failed += 1;
  }
  const [{ left }] = await getDb()
    .select({ left: sql<number>`count(*)::int` })
    .from(scheduleSheetBatchItems)
    .where(and(eq(scheduleSheetBatchItems.batchId, batch.id), isNull(scheduleSheetBatchItems.sheetId), isNull(scheduleSheetBatchItems.error)));
  if (left === 0) {
    await getDb().update(scheduleSheetBatches).set({ status: 'done', completedAt: new Date() }).where(and(eq(scheduleSheetBatches.id, batch.id), eq(scheduleSheetBatches.status, 'queued')));
  }
  return { made, failed, completed: left === 0 };
}

async function makeOneSheet(teamId: string, batchId: string, scheduleId: string, rowNumber: number, actor: Actor | null): Promise<'made' | 'failed' | 'skipped'> {
  const failItem = (message: string) =>
    getDb()
      .update(scheduleSheetBatchItems)
      .set({ error: message, doneAt: new Date() })
      .where(and(eq(scheduleSheetBatchItems.batchId, batchId), eq(scheduleSheetBatchItems.rowNumber, rowNumber), isNull(scheduleSheetBatchItems.sheetId)));
  if (!actor) {
    await failItem('The member who asked is no longer active in the team: no sheet was made.');
    return 'failed';
  }
  const row = await getScheduleRow(teamId, scheduleId, rowNumber);
  if (!row) {
    await failItem('The schedule or this row no longer exists.');
    return 'failed';
  }
  if (!row.family) {
    await failItem('The family of this row is not stored with the schedule.');
    return 'failed';
  }
  const inputs = scheduleRowToSheetInputs(row.input, row.sizing, row.family.candidates);
  try {
    return await getDb().transaction(async (tx) => {
      // Another attempt holding this item is making its sheet: leave it to that attempt.
      const [item] = await tx
        .select({ id: scheduleSheetBatchItems.id })
        .from(scheduleSheetBatchItems)
        .where(and(eq(scheduleSheetBatchItems.batchId, batchId), eq(scheduleSheetBatchItems.rowNumber, rowNumber), isNull(scheduleSheetBatchItems.sheetId), isNull(scheduleSheetBatchItems.error)))
        .for('update', { skipLocked: true });
      if (!item) return 'skipped' as const;
      const sheet = await createSheet(teamId, actor, { projectId: row.projectId, circuitTag: row.input.circuitTag.slice(0, 40), title: sheetTitleOf(row.input), inputs }, tx);
      await tx.update(scheduleSheetBatchItems).set({ sheetId: sheet.id, doneAt: new Date() }).where(eq(scheduleSheetBatchItems.id, item.id));
      return 'made' as const;
    });
  } catch (error) {
    if (error instanceof SheetOperationError) {
      await failItem(error.message);
      return 'failed';
    }
    throw error;
  }
}
