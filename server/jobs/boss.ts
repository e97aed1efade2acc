/**
 * The job queue (pg-boss 10 on the app's own PostgreSQL). Web requests only ENQUEUE — inside the
 * same transaction that stores the rows, so a schedule is never queued without its rows nor its
 * rows without jobs; worker processes (scripts/worker.ts) fetch the jobs with SKIP LOCKED, so any
 * number of app and worker instances can share one database.
 *
 * A job is a batch of schedule rows. A worker that dies mid-batch leaves its job `active`; once
 * the job's expiry passes, pg-boss maintenance (run by any live worker) fails it and the retry
 * hands it to another worker, which sizes only the rows still pending.
 */
import PgBoss from 'pg-boss';

export const SCHEDULE_QUEUE = 'schedule-rows';
/** "Make sizing sheets" for chosen schedule rows (issue 23): one job per request. */
export const SHEET_BATCH_QUEUE = 'schedule-sheets';

export interface SheetBatchJob {
  teamId: string;
  batchId: string;
}

export interface ScheduleBatchJob {
  teamId: string;
  scheduleId: string;
  rowNumbers: number[];
}

function envNumber(name: string, fallback: number): number {
  const raw = process.env[name];
  const value = raw === undefined || raw === '' ? NaN : Number(raw);
  return Number.isFinite(value) && value > 0 ? value : fallback;
}

export const queueSettings = () => ({
  /** Rows per job: small enough that a crash loses little work, large enough to amortise the round trips. */
  batchRows: Math.floor(envNumber('SCHEDULE_BATCH_ROWS', 50)),
  /** A batch still active after this is taken as abandoned (its worker died) and retried. */
  expireInSeconds: Math.floor(envNumber('SCHEDULE_JOB_EXPIRE_SECONDS', 300)),
  /** How often a worker runs pg-boss maintenance (expiry of abandoned jobs). */
  maintenanceIntervalSeconds: Math.floor(envNumber('SCHEDULE_MAINTENANCE_SECONDS', 30)),
  pollingIntervalSeconds: envNumber('SCHEDULE_POLL_SECONDS', 0.5),
  retryLimit: 20,
  retryDelaySeconds: 1,
});

export function bossOptions(role: 'web' | 'worker'): PgBoss.ConstructorOptions {
  const connectionString = process.env.DATABASE_URL;
  if (!connectionString) throw new Error('DATABASE_URL is not set');
  const settings = queueSettings();
  return {
    connectionString,
    schema: 'pgboss',
    application_name: `ampwarden-${role}`,
    max: role === 'web' ? 2 : 3,
    // Only workers supervise (expire abandoned jobs, archive); the web only enqueues.
    supervise: role === 'worker',
    schedule: false,
    maintenanceIntervalSeconds: settings.maintenanceIntervalSeconds,
    archiveCompletedAfterSeconds: 3600,
  };
}

export async function ensureScheduleQueue(boss: PgBoss): Promise<void> {
  const settings = queueSettings();
  const options = {
    name: SCHEDULE_QUEUE,
    policy: 'standard' as const,
    retryLimit: settings.retryLimit,
    retryDelay: settings.retryDelaySeconds,
    expireInSeconds: settings.expireInSeconds,
  };
  for (const name of [SCHEDULE_QUEUE, SHEET_BATCH_QUEUE]) {
    if (!(await boss.getQueue(name))) {
      try {
        await boss.createQueue(name, { ...options, name });
      } catch (error) {
        // Another process created it at the same moment.
        if (!(await boss.getQueue(name))) throw error;
      }
    }
  }
}

const holder = globalThis as unknown as { ampwardenBoss?: Promise<PgBoss> };

/** The web process's pg-boss: started once, used only to insert jobs. */
export function getWebBoss(): Promise<PgBoss> {
  holder.ampwardenBoss ??= (async () => {
    const boss = new PgBoss(bossOptions('web'));
    boss.on('error', (error) => console.error('[pg-boss]', error.message));
    await boss.start();
    await ensureScheduleQueue(boss);
    return boss;
  })().catch((error) => {
    holder.ampwardenBoss = undefined;
    throw error;
  });
  return holder.ampwardenBoss;
}

export async function stopWebBoss(): Promise<void> {
  const pending = holder.ampwardenBoss;
  holder.ampwardenBoss = undefined;
  if (pending) await (await pending).stop({ graceful: false, wait: true });
}

/** The row batches of a schedule as job inserts. */
export function batchJobs(teamId: string, scheduleId: string, rowNumbers: readonly number[]): PgBoss.JobInsert<ScheduleBatchJob>[] {
  const { batchRows, expireInSeconds, retryLimit, retryDelaySeconds } = queueSettings();
  const jobs: PgBoss.JobInsert<ScheduleBatchJob>[] = [];
  for (let i = 0; i < rowNumbers.length; i += batchRows) {
    jobs.push({
      name: SCHEDULE_QUEUE,
      data: { teamId, scheduleId, rowNumbers: rowNumbers.slice(i, i + batchRows) },
      expireInSeconds,
      retryLimit,
      retryDelay: retryDelaySeconds,
    });
  }
  return jobs;
}

/**
 * Inserts the jobs through `executeSql` — the caller's transaction — so they become visible to
 * workers only when the rows they point at are committed.
 */
export async function enqueueScheduleBatches(
  executeSql: PgBoss.Db['executeSql'],
  teamId: string,
  scheduleId: string,
  rowNumbers: readonly number[],
): Promise<number> {
  const boss = await getWebBoss();
  const jobs = batchJobs(teamId, scheduleId, rowNumbers);
  if (jobs.length > 0) await boss.insert(jobs, { db: { executeSql } });
  return jobs.length;
}

/** Inserts the job of a sheet batch through the caller's transaction (visible once the batch is committed). */
export async function enqueueSheetBatch(executeSql: PgBoss.Db['executeSql'], job: SheetBatchJob): Promise<void> {
  const boss = await getWebBoss();
  const { expireInSeconds, retryLimit, retryDelaySeconds } = queueSettings();
  await boss.insert([{ name: SHEET_BATCH_QUEUE, data: job, expireInSeconds, retryLimit, retryDelay: retryDelaySeconds }], { db: { executeSql } });
}
