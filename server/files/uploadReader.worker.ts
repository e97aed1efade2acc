/**
 * Worker thread of server/files/uploadReader.ts: reads one uploaded schedule or catalogue file with
 * the same functions the request would have called (lib/schedule, lib/catalogue), off the request thread.
 */
import { readCatalogueFile } from '@/lib/catalogue/files';
import { readScheduleFile } from '@/lib/schedule/files';
import { serveTasks } from '@/server/threads/serve';
import type { UploadTask } from './uploadReader';

serveTasks(async (task: UploadTask) => (task.what === 'schedule' ? readScheduleFile(task.fileName, task.bytes) : readCatalogueFile(task.kind, task.fileName, task.bytes)));
