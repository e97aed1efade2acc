/**
 * The worker side of server/threads/pool.ts: answers each task message with its result or with
 * what it threw, as plain data (an error's status and code travel along, so that a refusal thrown
 * in the thread becomes the same refusal in the request).
 */
import { parentPort, type TransferListItem } from 'node:worker_threads';
import type { ThreadAnswer, ThreadFailure } from './pool';

export function serveTasks<P, R>(handle: (payload: P) => Promise<R>, transferOf: (result: R) => TransferListItem[] = () => []): void {
  if (!parentPort) throw new Error('serveTasks runs only inside a worker thread');
  const port = parentPort;
  port.on('message', async ({ id, payload }: { id: number; payload: P }) => {
    try {
      const result = await handle(payload);
      port.postMessage({ id, ok: true, result } satisfies ThreadAnswer<R>, transferOf(result));
    } catch (error) {
      const e = error as Partial<ThreadFailure> & { name?: string; message?: string };
      const failure: ThreadFailure = {
        name: typeof e?.name === 'string' ? e.name : 'Error',
        message: typeof e?.message === 'string' ? e.message : String(error),
        ...(typeof e?.status === 'number' ? { status: e.status } : {}),
        ...(typeof e?.code === 'string' ? { code: e.code } : {}),
      };
      port.postMessage({ id, ok: false, failure } satisfies ThreadAnswer<R>);
    }
  });
}
