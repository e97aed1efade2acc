// The worker-thread pool that keeps upload reading and PDF rendering off the request thread
// (issue 19, items 5 and PDF): a task runs in another thread, the main thread keeps running
// meanwhile, a task past its time limit ends its thread, a thread past its heap limit ends and the
// server does not. The workers here are plain JavaScript (eval), so no build is needed.
import { Worker } from 'node:worker_threads';
import { describe, expect, it } from 'vitest';
import { ThreadCrashError, ThreadPool, ThreadTaskError, ThreadTimeLimitError } from '@/server/threads/pool';

const SERVE = `
const { parentPort, threadId } = require('node:worker_threads');
parentPort.on('message', ({ id, payload }) => {
  try {
    if (payload.spinMs) { const until = Date.now() + payload.spinMs; while (Date.now() < until) {} }
    if (payload.hog) { const keep = []; for (;;) keep.push(new Array(1e6).fill(Math.random())); }
    if (payload.fail) { const e = new Error('refused in the thread'); e.name = 'FileRefusal'; e.status = 413; e.code = 'too_many_rows'; throw e; }
    parentPort.postMessage({ id, ok: true, result: { threadId, echo: payload.echo } });
  } catch (e) {
    parentPort.postMessage({ id, ok: false, failure: { name: e.name, message: e.message, status: e.status, code: e.code } });
  }
});`;

const poolOf = (timeLimitMs = 10_000, heapMb = 64) =>
  new ThreadPool<Record<string, unknown>, { threadId: number; echo: unknown }>({
    name: 'test',
    threads: 1,
    timeLimitMs,
    maxQueued: 4,
    create: () => new Worker(SERVE, { eval: true, resourceLimits: { maxOldGenerationSizeMb: heapMb } }),
  });

describe('ThreadPool', () => {
  it('runs the task in another thread while the main thread keeps going', async () => {
    const pool = poolOf();
    const order: string[] = [];
    const task = pool.run({ spinMs: 400, echo: 'done' }).then((r) => {
      order.push('task');
      return r;
    });
    // A timer of the main thread fires while the thread is still busy (the loop is not blocked).
    await new Promise((resolve) => setTimeout(resolve, 50)).then(() => order.push('main timer'));
    const result = await task;
    expect(result.echo).toBe('done');
    expect(result.threadId).not.toBe(0);
    expect(order).toEqual(['main timer', 'task']);
  });

  it('hands back what the thread threw, status and code included', async () => {
    const error = await poolOf().run({ fail: true }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ThreadTaskError);
    expect((error as ThreadTaskError).failure).toMatchObject({ name: 'FileRefusal', status: 413, code: 'too_many_rows' });
  });

  it('ends a task past its time limit and serves the next task with a fresh thread', async () => {
    const pool = poolOf(300);
    const error = await pool.run({ spinMs: 5_000 }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ThreadTimeLimitError);
    expect((await pool.run({ echo: 'again' })).echo).toBe('again');
  });

  it('a task that needs more heap than the limit ends its thread (out of memory), not this process', async () => {
    const pool = poolOf(60_000, 32);
    const error = await pool.run({ hog: true }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ThreadCrashError);
    expect((error as ThreadCrashError).outOfMemory).toBe(true);
    expect((await pool.run({ echo: 'still here' })).echo).toBe('still here');
  });
});
