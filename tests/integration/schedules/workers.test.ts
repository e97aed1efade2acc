// Issue 9: worker processes. Killing the worker mid-run (SIGKILL, no clean-up) and restarting it
// completes the schedule with every row stored exactly once; two workers on one database share a
// schedule, again with every row stored exactly once.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule, getSchedule, listScheduleRows, previewScheduleUpload, queueSchedule, scheduleFamilies } from '@/db/queries/schedules';
import { scheduleRows } from '@/db/schema';
import { sizeCircuit } from '@/lib/schedule';
import { enqueueScheduleBatches, stopWebBoss } from '@/server/jobs/boss';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { circuitRows, scheduleCsv, seedSmallCatalogue, spawnWorker, waitFor, type WorkerProcess } from './helpers';

const started: WorkerProcess[] = [];
afterEach(async () => {
  for (const w of started.splice(0)) {
    if (w.child.exitCode === null && w.child.signalCode === null) {
      w.child.kill('SIGTERM');
      await w.exited;
    }
  }
});
afterAll(async () => {
  await stopWebBoss();
  await closeDb();
});

let teamId: string;
let userId: string;
let projectId: string;

beforeAll(async () => {
  teamId = (await createTestTeam('sched-workers')).id;
  userId = (await createTestUser(teamId, 'designer')).id;
  projectId = (await createProject(teamId, userId, { name: 'Schedule workers' })).id;
  await seedSmallCatalogue(teamId);
});

/**
 * A queued schedule of small batches whose jobs expire after 8 s (both are the enqueuer's
 * settings, written into each job), so a killed worker's batch is retried within seconds.
 */
async function queued(name: string, rows: number, prefix: string, batchRows: number) {
  const { id } = await createSchedule(teamId, userId, { projectId, name });
  await previewScheduleUpload(teamId, userId, id, { fileName: `${name}.csv`, mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(rows, prefix)) });
  process.env.SCHEDULE_BATCH_ROWS = String(batchRows);
  process.env.SCHEDULE_JOB_EXPIRE_SECONDS = '8';
  try {
    await queueSchedule(teamId, userId, id, { dropBadRows: false }, enqueueScheduleBatches);
  } finally {
    delete process.env.SCHEDULE_BATCH_ROWS;
    delete process.env.SCHEDULE_JOB_EXPIRE_SECONDS;
  }
  return id;
}

async function sizedCount(scheduleId: string) {
  const [{ n }] = await getDb().select({ n: sql<number>`count(*)::int` }).from(scheduleRows).where(sql`${scheduleRows.scheduleId} = ${scheduleId} and ${scheduleRows.status} <> 'pending'`);
  return n;
}

async function storedRowNumbers(scheduleId: string) {
  const rows = await getDb()
    .select({ n: scheduleRows.rowNumber })
    .from(scheduleRows)
    .where(sql`${scheduleRows.scheduleId} = ${scheduleId} and ${scheduleRows.status} <> 'pending'`)
    .orderBy(scheduleRows.rowNumber);
  return rows.map((r) => r.n);
}

/** Every row present once, sized, and equal to the row sized alone. */
async function expectEachRowOnce(scheduleId: string, total: number) {
  const [{ count, distinct }] = await getDb()
    .select({ count: sql<number>`count(*)::int`, distinct: sql<number>`count(distinct row_number)::int` })
    .from(scheduleRows)
    .where(eq(scheduleRows.scheduleId, scheduleId));
  expect(count).toBe(total);
  expect(distinct).toBe(total);
  const rows = await listScheduleRows(teamId, scheduleId);
  const families = (await scheduleFamilies(teamId, scheduleId))!;
  for (const row of rows) {
    expect(row.sizing, `row ${row.rowNumber}`).not.toBeNull();
    expect(row.sizing).toEqual(JSON.parse(JSON.stringify(sizeCircuit(row.input, families[row.input.family].candidates))));
  }
  return rows;
}

describe('schedule workers', () => {
  it('resumes after the worker is killed mid-run: every row stored exactly once', { timeout: 180_000 }, async () => {
    const total = 40;
    const scheduleId = await queued('killed', total, 'K', 5);
    const first = spawnWorker('first');
    started.push(first);
    await first.ready;
    // Kill it as soon as some, but not all, rows are stored: no chance to finish or clean up.
    const doneAtKill = await waitFor('a first batch', async () => {
      const n = await sizedCount(scheduleId);
      return n > 0 ? n : null;
    }, 60_000, 20);
    first.child.kill('SIGKILL');
    await first.exited;
    const storedBeforeRestart = await storedRowNumbers(scheduleId);
    expect(doneAtKill).toBeGreaterThan(0);
    expect(storedBeforeRestart.length, 'the worker had finished before it was killed; the test did not interrupt it').toBeLessThan(total);
    expect((await getSchedule(teamId, scheduleId))?.status).toBe('queued');

    const second = spawnWorker('second');
    started.push(second);
    await second.ready;
    await waitFor('the schedule to complete after the restart', async () => (await getSchedule(teamId, scheduleId))?.status === 'done', 120_000, 200);

    const rows = await expectEachRowOnce(scheduleId, total);
    // The killed process may have stored a batch without living to print it, so the database says
    // who stored what: the rows stored before the restart are the first worker's, untouched; the
    // restarted worker stored exactly the rest (its own report agrees), none of them twice.
    const bySecond = second.lines.filter((l) => l.event === 'batch' && l.scheduleId === scheduleId).flatMap((l) => l.stored as number[]);
    expect(new Set(bySecond).size).toBe(bySecond.length);
    expect(rows.filter((r) => r.sizedBy === 'first').map((r) => r.rowNumber)).toEqual(storedBeforeRestart);
    expect([...bySecond].sort((a, b) => a - b)).toEqual(rows.filter((r) => r.sizedBy === 'second').map((r) => r.rowNumber));
    expect(bySecond.filter((n) => storedBeforeRestart.includes(n))).toEqual([]);
    expect(storedBeforeRestart.length + bySecond.length).toBe(total);
  });

  it('two workers on one database share a schedule: every row stored exactly once', { timeout: 180_000 }, async () => {
    // Enough rows that one worker alone needs well over the other's polling interval (0.5 s):
    // with 48 rows a fast worker could drain the queue before the other's first poll.
    const total = 144;
    const workers = [spawnWorker('alpha'), spawnWorker('beta')];
    started.push(...workers);
    await Promise.all(workers.map((w) => w.ready));
    // Batches of 4 rows, queued once both workers are polling.
    const scheduleId = await queued('shared', total, 'S', 4);
    await waitFor('the shared schedule to complete', async () => (await getSchedule(teamId, scheduleId))?.status === 'done', 150_000, 200);

    const rows = await expectEachRowOnce(scheduleId, total);
    const reported = workers.map((w) => w.lines.filter((l) => l.event === 'batch' && l.scheduleId === scheduleId).flatMap((l) => l.stored as number[]));
    const all = reported.flat().sort((a, b) => a - b);
    expect(all).toEqual(rows.map((r) => r.rowNumber));
    // Both took part, and the rows each stored are the rows that name it.
    expect(reported[0].length).toBeGreaterThan(0);
    expect(reported[1].length).toBeGreaterThan(0);
    expect(rows.filter((r) => r.sizedBy === 'alpha').map((r) => r.rowNumber)).toEqual([...reported[0]].sort((a, b) => a - b));
    expect(rows.filter((r) => r.sizedBy === 'beta').map((r) => r.rowNumber)).toEqual([...reported[1]].sort((a, b) => a - b));
  });
});
