/**
 * The schedule worker: fetches row-batch jobs, sizes the rows still pending with lib/schedule's
 * sizeCircuit and stores each result exactly once (db/queries/schedules storeRowResults).
 * Results are stored in one statement per batch (or per second of work when a batch is slow), so a
 * crash loses at most that much work and never half-writes a row.
 */
import { hostname } from 'node:os';
import PgBoss from 'pg-boss';
import { completeScheduleIfDone, loadScheduleForWorker, pendingRows, storeRowResults, type RowResultWrite } from '../../db/queries/schedules';
import { sizeCircuit } from '../../lib/schedule';
import { processSheetBatchItems } from '../../db/queries/sheetBatches';
import { bossOptions, ensureScheduleQueue, queueSettings, SCHEDULE_QUEUE, SHEET_BATCH_QUEUE, type ScheduleBatchJob, type SheetBatchJob } from './boss';

export interface BatchReport {
  scheduleId: string;
  /** Row numbers this worker stored (rows another attempt had already stored are not counted). */
  stored: number[];
  skipped: number;
  solverMs: number;
  totalMs: number;
  /** Wall-clock start and end of the batch, ms since the epoch (benchmarks read the worker's busy window). */
  startedAtMs: number;
  endedAtMs: number;
  completed: boolean;
}

const FAMILIES_CACHE_SIZE = 20;
/** Longest stretch of sizing kept in memory before it is stored, ms. */
const FLUSH_AFTER_MS = 1000;
const familiesCache = new Map<string, Awaited<ReturnType<typeof loadScheduleForWorker>>>();

/** Sizes and stores one batch; safe to run again for the same batch (already stored rows are skipped). */
export async function processScheduleBatch(job: ScheduleBatchJob, workerId: string): Promise<BatchReport> {
  const started = performance.now();
  const startedAtMs = Date.now();
  let schedule = familiesCache.get(job.scheduleId);
  if (!schedule) {
    schedule = await loadScheduleForWorker(job.scheduleId);
    // Families are frozen once queued, so they can be kept for the life of the process.
    if (schedule && schedule.status !== 'draft') {
      familiesCache.set(job.scheduleId, schedule);
      // Keep the few schedules in hand, not every schedule a long-lived worker has seen.
      if (familiesCache.size > FAMILIES_CACHE_SIZE) familiesCache.delete(familiesCache.keys().next().value as string);
    }
  }
  if (!schedule || schedule.teamId !== job.teamId) {
    // The schedule was deleted (or the job is not what it claims): nothing to size.
    return { scheduleId: job.scheduleId, stored: [], skipped: job.rowNumbers.length, solverMs: 0, totalMs: performance.now() - started, startedAtMs, endedAtMs: Date.now(), completed: false };
  }
  const rows = await pendingRows(job.scheduleId, job.rowNumbers);
  const stored: number[] = [];
  let writes: RowResultWrite[] = [];
  let solverMs = 0;
  let lastFlush = performance.now();
  for (const row of rows) {
    const family = schedule.families[row.input.family];
    const t0 = performance.now();
    const sizing = sizeCircuit(row.input, family?.candidates ?? [], schedule.sizingOptions);
    const ms = performance.now() - t0;
    solverMs += ms;
    writes.push({ teamId: row.teamId, scheduleId: job.scheduleId, rowNumber: row.rowNumber, circuitTag: row.circuitTag, input: row.input, sizing, solverMs: ms, sizedBy: workerId });
    // On a slow machine a batch may outlast its job's expiry and be retried: storing at least
    // every second keeps the work done so far, so a retry always makes progress.
    if (performance.now() - lastFlush > FLUSH_AFTER_MS) {
      stored.push(...(await storeRowResults(writes)));
      writes = [];
      lastFlush = performance.now();
    }
  }
  stored.push(...(await storeRowResults(writes)));
  const completed = stored.length > 0 || rows.length === 0 ? await completeScheduleIfDone(job.scheduleId) : false;
  return { scheduleId: job.scheduleId, stored, skipped: job.rowNumbers.length - stored.length, solverMs, totalMs: performance.now() - started, startedAtMs, endedAtMs: Date.now(), completed };
}

export interface RunningWorker {
  workerId: string;
  boss: PgBoss;
  stop(): Promise<void>;
}

/**
 * Starts a worker in this process. `onBatch` sees every stored batch (the worker script prints
 * it as one JSON line; tests and the benchmark read those lines).
 */
export async function startScheduleWorker(options: { workerId?: string; onBatch?: (report: BatchReport) => void } = {}): Promise<RunningWorker> {
  const workerId = options.workerId ?? `${hostname()}:${process.pid}`;
  const boss = new PgBoss(bossOptions('worker'));
  boss.on('error', (error) => console.error(`[worker ${workerId}] pg-boss: ${error.message}`));
  await boss.start();
  await ensureScheduleQueue(boss);
  // Three fetch loops per process: while one sizes (synchronously), the others fetch, store and
  // complete their batches, so the CPU is not left idle waiting on the database.
  const loops = Math.max(1, Math.floor(Number(process.env.SCHEDULE_LOOPS_PER_WORKER ?? 3)) || 1);
  // pg-boss waits its polling interval after every fetch, even one that found work; a loop that
  // just finished a batch asks for the next one at once instead (notifyWorker), so a queue with
  // work is drained back to back and the polling delay is only paid when the queue is empty.
  for (let i = 0; i < loops; i++) {
    let loopId: string | null = null;
    loopId = await boss.work<ScheduleBatchJob>(
      SCHEDULE_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: queueSettings().pollingIntervalSeconds },
      async (jobs) => {
        for (const job of jobs) {
          const report = await processScheduleBatch(job.data, workerId);
          options.onBatch?.(report);
        }
        if (jobs.length > 0 && loopId) boss.notifyWorker(loopId);
      },
    );
  }
  // One loop makes the sizing sheets asked for from schedule rows (issue 23); each job is one request.
  await boss.work<SheetBatchJob>(SHEET_BATCH_QUEUE, { batchSize: 1, pollingIntervalSeconds: queueSettings().pollingIntervalSeconds }, async (jobs) => {
    for (const job of jobs) {
      if (typeof job.data?.teamId !== 'string' || typeof job.data?.batchId !== 'string') continue;
      await processSheetBatchItems(job.data);
    }
  });
  return {
    workerId,
    boss,
    stop: async () => {
      await boss.stop({ graceful: true, wait: true, timeout: 30_000 });
    },
  };
}
