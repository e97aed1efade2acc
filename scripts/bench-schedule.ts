/**
 * `npm run bench:schedule` — rows per second for a 1,000-row schedule end to end (upload →
 * preview → queue → every row sized and stored by worker processes), and the share of that time
 * spent in the solver (sizeCircuit, measured by the workers per row).
 *
 * Needs a migrated database in DATABASE_URL, e.g. the one `npm start` runs:
 *   eval "$(scripts/dev-env.sh)" && npm run bench:schedule
 * Options (environment): BENCH_ROWS (default 1000), BENCH_WORKERS (default 1), SCHEDULE_BATCH_ROWS,
 * BENCH_WARMUP_ROWS (an untimed schedule sized first, default 100 per worker; 0 for none);
 * BENCH_PROF=1 writes a V8 CPU profile of each worker process to /tmp/wprof (open it in Chrome DevTools).
 * It works in a team of its own (slug bench-…) and deletes it afterwards.
 */
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { loadavg } from 'node:os';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import Papa from 'papaparse';
import { closeDb, getDb } from '../db/client';
import { createProject } from '../db/queries/projects';
import { createSchedule, getSchedule, previewScheduleUpload, queueSchedule } from '../db/queries/schedules';
import { copyStandardCatalogueToTeam } from '../db/seed/catalogue';
import { scheduleRows, teams, users } from '../db/schema';
import { SCHEDULE_COLUMNS } from '../lib/schedule';
import { enqueueScheduleBatches, stopWebBoss } from '../server/jobs/boss';

const ROWS = Number(process.env.BENCH_ROWS ?? 1000);
const WORKERS = Number(process.env.BENCH_WORKERS ?? 1);

/** A mixed schedule of ordinary feeders (inputs only; nothing here is a check value). */
function benchCsv(rows: number): Uint8Array {
  const families = ['copper XLPE single-core', 'copper PVC single-core', 'aluminium XLPE single-core'];
  const data: Array<Array<string | number>> = [];
  for (let i = 0; i < rows; i++) {
    const buried = i % 4 === 3;
    const cells: Record<string, string | number> = {
      circuitTag: `BN-${String(i + 1).padStart(5, '0')}`,
      from: 'MSB-1',
      to: `Load ${i + 1}`,
      designCurrentA: 25 + ((i * 53) % 300),
      nominalVoltageV: 230,
      phases: 3,
      frequencyHz: 50,
      lengthM: 15 + ((i * 17) % 120),
      powerFactor: 0.9,
      installation: buried ? 'buried' : 'cable in air',
      depthM: buried ? 0.8 : '',
      ambientC: buried ? 20 : 35,
      faultCurrentKA: 6,
      clearingTimeS: 0.2,
      family: families[i % families.length],
      maxVoltageDropPercent: 5,
      maxParallel: 2,
    };
    data.push(SCHEDULE_COLUMNS.map((c) => cells[c.field] ?? ''));
  }
  return new TextEncoder().encode(Papa.unparse({ fields: SCHEDULE_COLUMNS.map((c) => c.header), data }));
}

function startWorker(id: string) {
  const child = spawn(process.execPath, [...(process.env.BENCH_PROF ? ['--cpu-prof', '--cpu-prof-dir=/tmp/wprof'] : []), '--import', 'tsx', 'scripts/worker.ts'], {
    cwd: path.resolve(import.meta.dirname, '..'),
    env: { ...process.env, WORKER_ID: id, SCHEDULE_POLL_SECONDS: process.env.SCHEDULE_POLL_SECONDS ?? '0.5' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const batches: Array<{ solverMs: number; startedAtMs: number; endedAtMs: number; stored: number[] }> = [];
  let buffered = '';
  const ready = new Promise<void>((resolve, reject) => {
    child.stdout!.on('data', (chunk) => {
      buffered += String(chunk);
      const lines = buffered.split('\n');
      buffered = lines.pop() ?? '';
      for (const line of lines) {
        if (line.includes('"event":"ready"')) resolve();
        if (line.includes('"event":"batch"')) batches.push(JSON.parse(line));
      }
    });
    child.on('exit', (code) => reject(new Error(`worker ${id} exited with ${code}`)));
  });
  return { child, ready, batches };
}

async function main() {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: eval "$(scripts/dev-env.sh)" first (with `npm start` running)');
  const db = getDb();
  const suffix = randomUUID().slice(0, 8);
  const [team] = await db.insert(teams).values({ slug: `bench-${suffix}`, name: `Schedule benchmark ${suffix} (demo)` }).returning();
  const workers: ReturnType<typeof startWorker>[] = [];
  try {
    const [user] = await db.insert(users).values({ teamId: team.id, email: `bench-${suffix}@bench.example`, name: 'Benchmark (demo)', role: 'designer' }).returning();
    const project = await createProject(team.id, user.id, { name: 'Benchmark schedule' });
    await copyStandardCatalogueToTeam(team.id);
    const bytes = benchCsv(ROWS);

    for (let i = 0; i < WORKERS; i++) workers.push(startWorker(`bench-${i + 1}`));
    await Promise.all(workers.map((w) => w.ready));

    const runSchedule = async (name: string, file: Uint8Array) => {
      const t0 = performance.now();
      const { id: scheduleId } = await createSchedule(team.id, user.id, { projectId: project.id, name });
      const preview = await previewScheduleUpload(team.id, user.id, scheduleId, { fileName: 'bench.csv', mediaType: 'text/csv', bytes: file });
      if (preview.problems.length) throw new Error(`the bench file has problems: ${JSON.stringify(preview.problems.slice(0, 3))}`);
      const tPreview = performance.now();
      await queueSchedule(team.id, user.id, scheduleId, { dropBadRows: false }, enqueueScheduleBatches);
      const tQueued = performance.now();
      for (;;) {
        if ((await getSchedule(team.id, scheduleId))?.status === 'done') break;
        await new Promise((r) => setTimeout(r, 50));
      }
      return { scheduleId, t0, tPreview, tQueued, t1: performance.now() };
    };
    // A short untimed schedule first, so that every worker process has compiled its code and its
    // JIT has warmed up before the timed one (a long-lived worker is always warm).
    const warmUpRows = Number(process.env.BENCH_WARMUP_ROWS ?? 100 * WORKERS);
    if (warmUpRows > 0) {
      await runSchedule('Benchmark warm-up', benchCsv(warmUpRows));
      for (const w of workers) w.batches.length = 0;
    }
    const { scheduleId, t0, tPreview, tQueued, t1 } = await runSchedule('Benchmark', bytes);

    const [stats] = await db
      .select({
        rows: sql<number>`count(*)::int`,
        solverMs: sql<number>`sum(${scheduleRows.solverMs})::float8`,
        sized: sql<number>`count(*) filter (where ${scheduleRows.status} = 'sized')::int`,
        firstAt: sql<string>`min(${scheduleRows.sizedAt})::text`,
      })
      .from(scheduleRows)
      .where(eq(scheduleRows.scheduleId, scheduleId));
    const wallMs = t1 - t0;
    const workerMs = wallMs * WORKERS;
    const share = stats.solverMs / workerMs;
    const line = (label: string, value: string) => console.log(`${label.padEnd(44)} ${value}`);
    console.log(`\nSchedule benchmark — ${stats.rows} rows, ${WORKERS} worker process(es), batches of ${process.env.SCHEDULE_BATCH_ROWS ?? 50} rows`);
    line('upload + preview (parse, validate, store)', `${(tPreview - t0).toFixed(0)} ms`);
    line('queue (rows + jobs, one transaction)', `${(tQueued - tPreview).toFixed(0)} ms`);
    line('end to end, upload → all rows stored', `${(wallMs / 1000).toFixed(2)} s`);
    line('rows per second, end to end', `${(stats.rows / (wallMs / 1000)).toFixed(1)}`);
    line('solver time (sum of sizeCircuit per row)', `${(stats.solverMs / 1000).toFixed(2)} s  (${(stats.solverMs / stats.rows).toFixed(1)} ms per row)`);
    line('rows per second, solver alone (per worker)', `${(stats.rows / (stats.solverMs / 1000)).toFixed(1)}`);
    line('share of worker time in the solver', `${(100 * share).toFixed(1)} %`);
    line('queue + database + idle (rest)', `${((workerMs - stats.solverMs) / 1000).toFixed(2)} s  (${(100 * (1 - share)).toFixed(1)} %)`);
    line('rows with a passing size', `${stats.sized} of ${stats.rows}`);
    // Each worker's own time: from the start of its first batch to the end of its last one.
    for (const [i, w] of workers.entries()) {
      if (w.batches.length === 0) continue;
      const windowMs = Math.max(...w.batches.map((b) => b.endedAtMs)) - Math.min(...w.batches.map((b) => b.startedAtMs));
      const solver = w.batches.reduce((sum, b) => sum + b.solverMs, 0);
      const rows = w.batches.reduce((sum, b) => sum + b.stored.length, 0);
      line(`worker ${i + 1}: busy window, rows, solver share`, `${(windowMs / 1000).toFixed(2)} s, ${rows} rows (${(rows / (windowMs / 1000)).toFixed(0)} rows/s), ${((100 * solver) / windowMs).toFixed(1)} % in the solver (target ≥ 85 %)`);
    }
    console.log(`Machine load average: ${loadavg().map((x) => x.toFixed(1)).join(' / ')} (other work on the machine stretches every figure)`);
  } finally {
    for (const w of workers) {
      w.child.kill('SIGTERM');
    }
    await Promise.all(workers.map((w) => new Promise((r) => (w.child.exitCode !== null ? r(null) : w.child.on('exit', r)))));
    await db.delete(teams).where(eq(teams.id, team.id));
    await stopWebBoss();
    await closeDb();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
