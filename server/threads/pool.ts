/**
 * A small pool of worker threads for work that must not hold up the request thread (reading an
 * uploaded workbook, rendering a PDF): one task per thread at a time, waiting tasks queued up to a
 * bound, a time limit per task (the thread is ended and replaced when it is exceeded) and a heap
 * limit per thread (Node's resourceLimits: a task that needs more ends its thread, not the server).
 *
 * The Worker itself is made by the caller (`create`), because the bundler finds a worker's entry
 * only in a literal `new Worker(new URL('./x.worker.ts', import.meta.url))` next to it.
 * The worker side answers through serveTasks (server/threads/serve.ts).
 */
import type { Worker } from 'node:worker_threads';
import { ApiError } from '@/server/http/errors';

export interface ThreadFailure {
  name: string;
  message: string;
  /** Present when the worker threw an error that carries an HTTP meaning (e.g. FileRefusal). */
  status?: number;
  code?: string;
}

export type ThreadAnswer<R> = { id: number; ok: true; result: R } | { id: number; ok: false; failure: ThreadFailure };

/** The task took longer than the pool's limit; its thread was ended. */
export class ThreadTimeLimitError extends Error {
  constructor(readonly limitMs: number) {
    super(`The task took longer than ${limitMs / 1000} s.`);
    this.name = 'ThreadTimeLimitError';
  }
}

/** The thread died under the task (out of memory, or a crash). */
export class ThreadCrashError extends Error {
  constructor(
    readonly outOfMemory: boolean,
    message: string,
  ) {
    super(message);
    this.name = 'ThreadCrashError';
  }
}

/** The worker threw; `failure` is what it threw, as plain data. */
export class ThreadTaskError extends Error {
  constructor(readonly failure: ThreadFailure) {
    super(failure.message);
    this.name = 'ThreadTaskError';
  }
}

export interface PoolOptions {
  name: string;
  create: () => Worker;
  threads: number;
  timeLimitMs: number;
  maxQueued: number;
}

interface Task {
  id: number;
  payload: unknown;
  resolve: (value: unknown) => void;
  reject: (error: unknown) => void;
}

interface Slot {
  worker: Worker | null;
  task: Task | null;
  timer: ReturnType<typeof setTimeout> | null;
}

export class ThreadPool<P, R> {
  private readonly slots: Slot[];
  private readonly queue: Task[] = [];
  private nextId = 1;

  constructor(private readonly options: PoolOptions) {
    this.slots = Array.from({ length: options.threads }, () => ({ worker: null, task: null, timer: null }));
  }

  run(payload: P): Promise<R> {
    if (this.queue.length >= this.options.maxQueued) {
      return Promise.reject(new ApiError(503, 'busy', `The server is working on ${this.queue.length} other ${this.options.name} tasks; try again in a moment.`));
    }
    return new Promise<R>((resolve, reject) => {
      this.queue.push({ id: this.nextId++, payload, resolve: resolve as (value: unknown) => void, reject });
      this.dispatch();
    });
  }

  private dispatch(): void {
    for (const slot of this.slots) {
      if (slot.task || this.queue.length === 0) continue;
      const task = this.queue.shift()!;
      slot.task = task;
      const worker = (slot.worker ??= this.start(slot));
      slot.timer = setTimeout(() => this.fail(slot, new ThreadTimeLimitError(this.options.timeLimitMs), true), this.options.timeLimitMs);
      slot.timer.unref?.();
      worker.postMessage({ id: task.id, payload: task.payload });
    }
  }

  private start(slot: Slot): Worker {
    const worker = this.options.create();
    worker.unref();
    worker.on('message', (answer: ThreadAnswer<R>) => {
      const task = slot.task;
      if (!task || answer.id !== task.id) return;
      this.finish(slot);
      if (answer.ok) task.resolve(answer.result);
      else task.reject(new ThreadTaskError(answer.failure));
      this.dispatch();
    });
    worker.on('error', (error: Error & { code?: string }) => {
      const outOfMemory = error.code === 'ERR_WORKER_OUT_OF_MEMORY';
      this.fail(slot, new ThreadCrashError(outOfMemory, error.message), false);
    });
    worker.on('exit', () => {
      if (slot.worker === worker) {
        slot.worker = null;
        if (slot.task) this.fail(slot, new ThreadCrashError(false, `The ${this.options.name} thread stopped.`), false);
      }
    });
    return worker;
  }

  private finish(slot: Slot): void {
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    slot.task = null;
  }

  private fail(slot: Slot, error: Error, terminate: boolean): void {
    const task = slot.task;
    const worker = slot.worker;
    this.finish(slot);
    slot.worker = null;
    if (terminate && worker) void worker.terminate();
    task?.reject(error);
    this.dispatch();
  }
}
