/**
 * Calculation API requests are computed in worker threads, never on the request thread: a bus-bar
 * system or a dozen buried candidates can take seconds, and the server must keep answering the
 * sheets, sign-ins and health checks meanwhile. The request thread reads the body and checks the
 * token; the thread validates, computes and serialises (./answers.ts), and hands back the JSON text.
 *
 * Threads: one fewer than the machine's cores (at least one, at most four) — the request thread and
 * PostgreSQL need the rest. Waiting requests are queued up to a bound (then 503 `busy`), and a
 * calculation that runs past the time limit ends its thread (503 naming the limit).
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { ApiError } from '@/server/http/errors';
import { ThreadCrashError, ThreadPool, ThreadTimeLimitError } from '@/server/threads/pool';
import type { CalculationAnswer, CalculationTask } from './answers';

/** Far beyond any request within the API's limits (the largest, a dozen bar systems, takes seconds). */
export const CALCULATION_TIME_LIMIT_MS = 60_000;
/** Heap of a calculation thread. */
export const CALCULATION_MEMORY_MB = 1024;
/** Requests that may wait for a thread; more answer 503 busy. */
export const CALCULATION_MAX_QUEUED = 256;

export function calculationThreadCount(cores = availableParallelism()): number {
  return Math.min(4, Math.max(1, cores - 1));
}

const holder = globalThis as unknown as { ampwardenCalculationPool?: ThreadPool<CalculationTask, CalculationAnswer> };

/** Run from the TypeScript sources (tests, scripts), the thread needs tsx to load its module; the production build ships JavaScript. */
const FROM_SOURCES = import.meta.url.endsWith('.ts');

function pool(): ThreadPool<CalculationTask, CalculationAnswer> {
  holder.ampwardenCalculationPool ??= new ThreadPool<CalculationTask, CalculationAnswer>({
    name: 'calculation',
    threads: calculationThreadCount(),
    timeLimitMs: CALCULATION_TIME_LIMIT_MS,
    maxQueued: CALCULATION_MAX_QUEUED,
    // The literal `new Worker(new URL(...))` is how the bundler finds the thread's entry.
    create: () =>
      new Worker(new URL('./calculation.worker.ts', import.meta.url), {
        ...(FROM_SOURCES ? { execArgv: ['--require', 'tsx/cjs'] } : {}),
        resourceLimits: { maxOldGenerationSizeMb: CALCULATION_MEMORY_MB },
      }),
  });
  return holder.ampwardenCalculationPool;
}

/** The calculation's answer as a JSON response (the token handler adds the rate headers). */
export async function calculateOffThread(task: CalculationTask): Promise<Response> {
  let answer: CalculationAnswer;
  try {
    answer = await pool().run(task);
  } catch (error) {
    if (error instanceof ThreadTimeLimitError) {
      throw new ApiError(503, 'calculation_timeout', `The calculation took longer than ${CALCULATION_TIME_LIMIT_MS / 1000} s, the limit for one request; send fewer candidates per request.`);
    }
    if (error instanceof ThreadCrashError && error.outOfMemory) {
      throw new ApiError(503, 'calculation_too_large', `The calculation needed more than ${CALCULATION_MEMORY_MB} MB of memory; send fewer candidates per request.`);
    }
    throw error;
  }
  return new Response(answer.json, { status: answer.status, headers: { 'content-type': 'application/json' } });
}
