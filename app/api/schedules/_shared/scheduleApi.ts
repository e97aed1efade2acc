/** Shared by the schedule route handlers: operation errors and file refusals as JSON answers, downloads. */
import { ScheduleOperationError } from '@/db/queries/schedules';
import { ScheduleFileRefusal } from '@/lib/schedule';
import { ApiError } from '@/server/http/api';

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

/** A file download; the name is made safe for the header. */
export function download(body: string | Uint8Array, fileName: string, format: 'csv' | 'xlsx'): Response {
  const safe = fileName.replace(/[^A-Za-z0-9._ -]+/g, '_').slice(0, 120) || 'schedule';
  const type = format === 'csv' ? 'text/csv; charset=utf-8' : 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
  const payload = typeof body === 'string' ? `\uFEFF${body}` : body;
  return new Response(payload as BodyInit, {
    headers: { 'content-type': type, 'content-disposition': `attachment; filename="${safe}"`, 'cache-control': 'no-store' },
  });
}
