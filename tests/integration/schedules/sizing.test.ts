// Issue 9: a clean 200-row schedule sizes completely, and every stored result equals the sizing
// library run on that row alone (lib/schedule sizeCircuit, and lib/electrical compareCandidates'
// smallest passing candidate as an independent path).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule, getSchedule, listScheduleRows, previewScheduleUpload, queueSchedule, scheduleFamilies, scheduleProgress } from '@/db/queries/schedules';
import { scheduleRows } from '@/db/schema';
import { compareCandidates } from '@/lib/electrical';
import { expandFamily, rowConditions, sizeCircuit } from '@/lib/schedule';
import { enqueueScheduleBatches, stopWebBoss } from '@/server/jobs/boss';
import { startScheduleWorker, type RunningWorker } from '@/server/jobs/scheduleWorker';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { circuitRows, scheduleCsv, seedSmallCatalogue, waitFor } from './helpers';

let worker: RunningWorker | undefined;
afterAll(async () => {
  await worker?.stop();
  await stopWebBoss();
  await closeDb();
});

describe('a clean 200-row schedule', () => {
  let teamId: string;
  let userId: string;
  let projectId: string;

  beforeAll(async () => {
    const team = await createTestTeam('sched-200');
    teamId = team.id;
    userId = (await createTestUser(teamId, 'designer')).id;
    projectId = (await createProject(teamId, userId, { name: 'Schedule 200' })).id;
    await seedSmallCatalogue(teamId);
  });

  it('sizes every row once, and each result equals sizing that row alone', { timeout: 240_000 }, async () => {
    const { id: scheduleId } = await createSchedule(teamId, userId, { projectId, name: '200 circuits' });
    const preview = await previewScheduleUpload(teamId, userId, scheduleId, { fileName: 'circuits.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(200)) });
    expect(preview.problems).toEqual([]);
    expect(preview.cleanRowCount).toBe(200);

    const queued = await queueSchedule(teamId, userId, scheduleId, { dropBadRows: false }, enqueueScheduleBatches);
    expect(queued.rows).toBe(200);
    worker = await startScheduleWorker({ workerId: 'in-test' });
    await waitFor('the schedule to complete', async () => (await getSchedule(teamId, scheduleId))?.status === 'done', 200_000, 250);

    const progress = await scheduleProgress(teamId, scheduleId);
    expect(progress).toMatchObject({ status: 'done', total: 200, done: 200 });
    const [{ count, distinct }] = await getDb()
      .select({ count: sql<number>`count(*)::int`, distinct: sql<number>`count(distinct row_number)::int` })
      .from(scheduleRows)
      .where(eq(scheduleRows.scheduleId, scheduleId));
    expect(count).toBe(200);
    expect(distinct).toBe(200);

    const rows = await listScheduleRows(teamId, scheduleId);
    const families = (await scheduleFamilies(teamId, scheduleId))!;
    let sized = 0;
    for (const [i, row] of rows.entries()) {
      expect(row.sizing, `row ${row.rowNumber}`).not.toBeNull();
      const candidates = families[row.input.family].candidates;
      // The same row sized alone, outside the queue, JSON-round-tripped as stored.
      const alone = JSON.parse(JSON.stringify(sizeCircuit(row.input, candidates)));
      expect(row.sizing, `row ${row.rowNumber}`).toEqual(alone);
      if (row.sizing!.status === 'sized') sized++;
      // Every 4th row also through compareCandidates: its smallest passing candidate is the chosen size.
      if (i % 4 === 0) {
        const comparison = compareCandidates(expandFamily(candidates, row.input.maxParallel), rowConditions(row.input));
        const smallest = comparison.smallestPassingIndex === null ? null : comparison.evaluations[comparison.smallestPassingIndex];
        if (row.sizing!.status === 'sized') {
          expect(smallest && smallest.ok ? smallest.id : null, `row ${row.rowNumber}`).toBe(row.sizing!.chosen.candidateId);
          expect(smallest && smallest.ok ? smallest.hotSpotC : null).toBe(row.sizing!.chosen.hotSpotC);
        } else {
          expect(smallest, `row ${row.rowNumber}: compareCandidates found a passing size`).toBeNull();
        }
      }
    }
    // The inputs are ordinary feeders of 20–200 A: most must size (a sanity check that the run did real work).
    expect(sized).toBeGreaterThan(150);
  });
});
