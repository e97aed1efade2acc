// "Make sizing sheets" for chosen schedule rows (issue 23), against the real PostgreSQL server and
// pg-boss: the request stores the batch and its job; a worker makes one draft sheet per chosen row
// in the schedule's project, once each even when the job runs twice; progress lists the sheets;
// another team can neither ask for nor read a batch.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { sheets, users } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { createSchedule, previewScheduleUpload, queueSchedule, ScheduleOperationError } from '@/db/queries/schedules';
import { processSheetBatchItems, requestSheetBatch, sheetBatchProgress } from '@/db/queries/sheetBatches';
import { getSheet, listSheetsForProject } from '@/db/queries/sheets';
import { enqueueScheduleBatches, enqueueSheetBatch, SHEET_BATCH_QUEUE, stopWebBoss } from '@/server/jobs/boss';
import { processScheduleBatch } from '@/server/jobs/scheduleWorker';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { circuitRows, scheduleCsv, seedSmallCatalogue } from './helpers';

let teamId: string;
let otherTeamId: string;
let designerId: string;
let projectId: string;
let scheduleId: string;

beforeAll(async () => {
  teamId = (await createTestTeam('sheet-batch')).id;
  otherTeamId = (await createTestTeam('sheet-batch-other')).id;
  designerId = (await createTestUser(teamId, 'designer')).id;
  await createTestUser(otherTeamId, 'designer');
  projectId = (await createProject(teamId, designerId, { name: 'Batch sheets yard' })).id;
  await seedSmallCatalogue(teamId);
  scheduleId = (await createSchedule(teamId, designerId, { projectId, name: 'Six circuits' })).id;
  await previewScheduleUpload(teamId, designerId, scheduleId, { fileName: 'six.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(6, 'B')) });
  await queueSchedule(teamId, designerId, scheduleId, { dropBadRows: false }, enqueueScheduleBatches);
  // Sized here rather than by a worker process: the rows' results are what the sheets start from.
  await processScheduleBatch({ teamId, scheduleId, rowNumbers: [2, 3, 4, 5, 6, 7] }, 'in-test');
});

afterAll(async () => {
  await stopWebBoss();
  await closeDb();
});

async function jobsFor(batchId: string) {
  const result = await getDb().execute(sql`select count(*)::int as n from pgboss.job where name = ${SHEET_BATCH_QUEUE} and data->>'batchId' = ${batchId}`);
  return Number((result.rows[0] as { n: number }).n);
}

describe('sizing sheets from chosen schedule rows', () => {
  it('queues one job, then makes one draft sheet per chosen row in the schedule’s project, listed in the progress', async () => {
    const before = (await listSheetsForProject(teamId, projectId)).length;
    const batch = await requestSheetBatch(teamId, designerId, scheduleId, [5, 2, 4, 2], enqueueSheetBatch);
    expect(batch.total).toBe(3);
    expect(await jobsFor(batch.id)).toBe(1);
    expect(await sheetBatchProgress(teamId, batch.id)).toMatchObject({ status: 'queued', total: 3, done: 0, created: [] });

    const outcome = await processSheetBatchItems({ teamId, batchId: batch.id });
    expect(outcome).toEqual({ made: 3, failed: 0, completed: true });
    const progress = (await sheetBatchProgress(teamId, batch.id))!;
    expect(progress).toMatchObject({ status: 'done', total: 3, done: 3, failed: 0 });
    expect(progress.created.map((c) => c.rowNumber)).toEqual([2, 4, 5]);
    expect(progress.created.map((c) => c.circuitTag)).toEqual(['B-0001', 'B-0003', 'B-0004']);
    for (const made of progress.created) {
      const sheet = (await getSheet(teamId, made.sheetId))!;
      expect(sheet).toMatchObject({ status: 'draft', projectId, authorId: designerId, circuitTag: made.circuitTag });
      expect(sheet.inputs.candidates.length).toBeGreaterThan(0);
    }
    expect((await listSheetsForProject(teamId, projectId)).length).toBe(before + 3);
  });

  it('running the same job again makes no second sheet for a row', async () => {
    const batch = await requestSheetBatch(teamId, designerId, scheduleId, [3, 6], enqueueSheetBatch);
    await processSheetBatchItems({ teamId, batchId: batch.id });
    const again = await processSheetBatchItems({ teamId, batchId: batch.id });
    expect(again).toEqual({ made: 0, failed: 0, completed: false });
    const [{ n }] = await getDb()
      .select({ n: sql<number>`count(*)::int` })
      .from(sheets)
      .where(sql`${sheets.teamId} = ${teamId} and ${sheets.circuitTag} in ('B-0002', 'B-0005')`);
    expect(n).toBe(2);
  });

  it('refuses rows the schedule does not have, and asks nothing of the queue then', async () => {
    const refusal = await requestSheetBatch(teamId, designerId, scheduleId, [2, 99], enqueueSheetBatch).catch((e) => e);
    expect(refusal).toBeInstanceOf(ScheduleOperationError);
    expect(refusal).toMatchObject({ status: 404, code: 'no_such_rows' });
  });

  it('another team can neither ask for sheets from this schedule nor read a batch, and a forged job makes nothing', async () => {
    const otherDesigner = (await createTestUser(otherTeamId, 'designer')).id;
    const refusal = await requestSheetBatch(otherTeamId, otherDesigner, scheduleId, [2], enqueueSheetBatch).catch((e) => e);
    expect(refusal).toMatchObject({ status: 404, code: 'not_found' });
    const batch = await requestSheetBatch(teamId, designerId, scheduleId, [7], enqueueSheetBatch);
    expect(await sheetBatchProgress(otherTeamId, batch.id)).toBeNull();
    // A job naming the wrong team finds no batch.
    expect(await processSheetBatchItems({ teamId: otherTeamId, batchId: batch.id })).toEqual({ made: 0, failed: 0, completed: false });
    expect((await sheetBatchProgress(teamId, batch.id))!.done).toBe(0);
    const [{ n }] = await getDb().select({ n: sql<number>`count(*)::int` }).from(sheets).where(eq(sheets.teamId, otherTeamId));
    expect(n).toBe(0);
  });

  it('a member deactivated before the worker runs gets no sheets made in their name', async () => {
    const leaver = await createTestUser(teamId, 'designer');
    const batch = await requestSheetBatch(teamId, leaver.id, scheduleId, [6], enqueueSheetBatch);
    await getDb().update(users).set({ active: false }).where(eq(users.id, leaver.id));
    expect(await processSheetBatchItems({ teamId, batchId: batch.id })).toEqual({ made: 0, failed: 1, completed: true });
    const progress = (await sheetBatchProgress(teamId, batch.id))!;
    expect(progress.failures[0].message).toMatch(/no longer active/);
  });
});
