/** The schedule API as the browser calls it (react-query query and mutation functions). */
import type { ScheduleProgress, ScheduleSummary } from '@/db/queries/schedules';
import type { SheetBatchProgress } from '@/db/queries/sheetBatches';
import type { ResultLine, ScheduleProblem, ScheduleRow, ScheduleTotals } from '@/lib/schedule';

export class ScheduleApiFailure extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly code?: string,
  ) {
    super(message);
  }
}

async function failureOf(response: Response): Promise<ScheduleApiFailure> {
  const body = (await response.json().catch(() => null)) as { error?: { message?: string; code?: string } } | null;
  return new ScheduleApiFailure(response.status, body?.error?.message ?? `The server answered ${response.status}.`, body?.error?.code);
}

async function json<T>(response: Response): Promise<T> {
  if (!response.ok) throw await failureOf(response);
  return (await response.json()) as T;
}

export type ScheduleSummaryJson = Omit<ScheduleSummary, 'createdAt' | 'queuedAt' | 'completedAt'> & { createdAt: string; queuedAt: string | null; completedAt: string | null };

export interface ScheduleDetail {
  schedule: ScheduleSummaryJson;
  progress: ScheduleProgress;
  previewRows: ScheduleRow[];
  families: Array<{ key: string; label: string; kind: 'cable' | 'bar'; sizes: number }>;
}

export const fetchSchedule = async (id: string) => json<ScheduleDetail>(await fetch(`/api/schedules/${id}`, { cache: 'no-store' }));

export const fetchProgress = async (id: string) => (await json<{ progress: ScheduleProgress }>(await fetch(`/api/schedules/${id}/progress`, { cache: 'no-store' }))).progress;

export const fetchResults = async (id: string) => json<{ lines: ResultLine[]; totals: ScheduleTotals; solverVersion: string | null }>(await fetch(`/api/schedules/${id}/results`, { cache: 'no-store' }));

export async function uploadScheduleFile(id: string, file: File) {
  const form = new FormData();
  form.set('file', file);
  return (await json<{ preview: { fileRowCount: number; cleanRowCount: number; problems: ScheduleProblem[]; badRows: number[] } }>(await fetch(`/api/schedules/${id}/file`, { method: 'POST', body: form }))).preview;
}

export async function queueScheduleRows(id: string, dropBadRows: boolean) {
  return json<{ queued: { rows: number; droppedRows: number[]; jobs: number } }>(
    await fetch(`/api/schedules/${id}/queue`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ dropBadRows }) }),
  );
}

export async function createScheduleRequest(projectId: string, name: string) {
  return (await json<{ schedule: { id: string } }>(await fetch('/api/schedules', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ projectId, name }) }))).schedule;
}

export async function openRowAsSheet(id: string, rowNumber: number) {
  return (await json<{ sheet: { id: string } }>(await fetch(`/api/schedules/${id}/rows/${rowNumber}/sheet`, { method: 'POST' }))).sheet;
}

/** "Make sizing sheets" for chosen rows (issue 23): answers the batch at once; the sheets are made in the background. */
export async function requestSheetsForRows(id: string, rowNumbers: number[]) {
  return (
    await json<{ batch: { id: string; total: number } }>(
      await fetch(`/api/schedules/${id}/sheets`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ rowNumbers }) }),
    )
  ).batch;
}

export const fetchSheetBatch = async (id: string, batchId: string) =>
  (await json<{ progress: SheetBatchProgress }>(await fetch(`/api/schedules/${id}/sheets/${batchId}`, { cache: 'no-store' }))).progress;
