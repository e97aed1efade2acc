/** Shared by the schedule route handlers: operation errors and file refusals as JSON answers, downloads. */
import { ScheduleOperationError } from '@/db/queries/schedules';
import { ScheduleFileRefusal } from '@/lib/schedule';
import { ApiError } from '@/server/http/api';
import { downloadResponse } from '@/server/http/download';

export async function scheduleOperation(operation: () => Promise<Response>): Promise<Response> {
  try {
    return await operation();
  } catch (error) {
    if (error instanceof ScheduleOperationError) {
      return Response.json({ error: { code: error.code, message: error.message, ...(error.detail ?? {}) } }, { status: error.status });
    }
    if (error instanceof ScheduleFileRefusal) throw new ApiError(error.status, error.code, error.message);
    throw error;
  }
}

export function exportFormat(url: string): 'csv' | 'xlsx' | null {
  const format = new URL(url).searchParams.get('format');
  if (format === null) return null;
  if (format !== 'csv' && format !== 'xlsx') throw new ApiError(400, 'invalid_input', 'format must be csv or xlsx', 'format');
  return format;
}

/** A file download through the shared helper (server/http/download.ts: RFC 6266 file names). */
export function download(body: string | Uint8Array, fileName: string, format: 'csv' | 'xlsx'): Response {
  return downloadResponse(body, { fileName, kind: format });
}
