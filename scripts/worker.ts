/**
 * One schedule worker process: `node --import tsx scripts/worker.ts` with DATABASE_URL set.
 * `npm start` runs one; run more (on this or other machines) against the same PostgreSQL to
 * share the work — see README "Running more instances". Prints one JSON line per stored batch.
 * SIGTERM/SIGINT finish the batch in hand, then exit.
 */
import { hostname } from 'node:os';
import { closeDb } from '../db/client';
import { startScheduleWorker } from '../server/jobs/scheduleWorker';
import { purgeExpiredDeletions } from '../db/queries/documents';

/** Deleted documents are kept 30 days (issue 23); every worker purges the expired ones hourly (idempotent). */
const PURGE_EVERY_MS = 3600_000;

async function main() {
  const workerId = process.env.WORKER_ID || `${hostname()}:${process.pid}`;
  const worker = await startScheduleWorker({
    workerId,
    onBatch: (report) => console.log(JSON.stringify({ event: 'batch', worker: workerId, ...report })),
  });
  console.log(JSON.stringify({ event: 'ready', worker: worker.workerId }));
  const purge = () =>
    purgeExpiredDeletions()
      .then((gone) => {
        if (gone.projects + gone.sheets + gone.schedules > 0) console.log(JSON.stringify({ event: 'purge', worker: workerId, ...gone }));
      })
      .catch((error) => console.error(`purge of expired deletions failed: ${error instanceof Error ? error.message : String(error)}`));
  const purgeTimer = setInterval(purge, PURGE_EVERY_MS);
  purgeTimer.unref();
  void purge();
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    await worker.stop().catch((error) => console.error(error));
    await closeDb();
    process.exit(0);
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

main().catch((error) => {
  console.error(`worker failed to start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
