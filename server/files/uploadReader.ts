/**
 * Uploaded schedule and catalogue files are read in a worker thread, never on the request thread:
 * a workbook within every size limit can still take a second or two of exceljs, and the server
 * must keep answering others meanwhile. One thread (the machine has few cores and reading is
 * rare), a time limit and a heap limit per file, each refusal naming its limit (422); the size,
 * row and cell limits are checked while reading (lib/files/spreadsheet.ts, 413).
 */
import { Worker } from 'node:worker_threads';
import type { RawRecord } from '@/lib/catalogue/files';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import { FileRefusal, type FileRefusalCode } from '@/lib/files/spreadsheet';
import type { ScheduleRecord } from '@/lib/schedule/files';
import { ThreadCrashError, ThreadPool, ThreadTaskError, ThreadTimeLimitError } from '@/server/threads/pool';

export type UploadTask = { what: 'schedule'; fileName: string; bytes: Uint8Array } | { what: 'catalogue'; kind: CatalogueKind; fileName: string; bytes: Uint8Array };

/** Longer than any file within the limits needs (a 5,000-row workbook reads in about 2 s on a loaded core). */
export const UPLOAD_READ_TIME_LIMIT_MS = 30_000;
/** Heap of the reading thread; a 5,000-row workbook needs well under half of it. */
export const UPLOAD_READ_MEMORY_MB = 512;

const holder = globalThis as unknown as { ampwardenUploadPool?: ThreadPool<UploadTask, unknown> };

function pool(): ThreadPool<UploadTask, unknown> {
  holder.ampwardenUploadPool ??= new ThreadPool<UploadTask, unknown>({
    name: 'file reading',
    threads: 1,
    timeLimitMs: UPLOAD_READ_TIME_LIMIT_MS,
    maxQueued: 8,
    create: () => new Worker(new URL('./uploadReader.worker.ts', import.meta.url), { resourceLimits: { maxOldGenerationSizeMb: UPLOAD_READ_MEMORY_MB } }),
  });
  return holder.ampwardenUploadPool;
}

async function readOffThread<T>(task: UploadTask): Promise<T> {
  try {
    return (await pool().run(task)) as T;
  } catch (error) {
    if (error instanceof ThreadTaskError && error.failure.name === 'FileRefusal' && error.failure.status && error.failure.code) {
      throw new FileRefusal(error.failure.status as FileRefusal['status'], error.failure.code as FileRefusalCode, error.failure.message);
    }
    if (error instanceof ThreadTimeLimitError) {
      throw new FileRefusal(422, 'too_complex', `"${task.fileName}" took longer than ${UPLOAD_READ_TIME_LIMIT_MS / 1000} s to read, the limit for one file. Save it again as CSV, or split it into smaller files.`);
    }
    if (error instanceof ThreadCrashError && error.outOfMemory) {
      throw new FileRefusal(422, 'too_complex', `"${task.fileName}" needs more than ${UPLOAD_READ_MEMORY_MB} MB of memory to read, the limit for one file. Save it again as CSV, or split it into smaller files.`);
    }
    throw error;
  }
}

export function readScheduleFileOffThread(fileName: string, bytes: Uint8Array): Promise<ScheduleRecord[]> {
  return readOffThread({ what: 'schedule', fileName, bytes });
}

export function readCatalogueFileOffThread(kind: CatalogueKind, fileName: string, bytes: Uint8Array): Promise<RawRecord[]> {
  return readOffThread({ what: 'catalogue', kind, fileName, bytes });
}
