import { getSchedule, getScheduleFile, previewScheduleUpload, recordRefusedUpload } from '@/db/queries/schedules';
import { MAX_SCHEDULE_BYTES } from '@/lib/schedule';
import { apiHandler, ApiError } from '@/server/http/api';
import { downloadResponse } from '@/server/http/download';
import { readScheduleFileOffThread } from '@/server/files/uploadReader';
import { scheduleOperation } from '../../_shared/scheduleApi';

/** Upload (multipart field "file"): reads and checks every row; nothing is queued here. */
export const POST = apiHandler({ permission: 'schedule:write' }, async (req, { user, params }) => {
  const declared = Number(req.headers.get('content-length') ?? '0');
  // Refuse before reading a body far beyond any schedule (multipart adds a little overhead).
  if (declared > MAX_SCHEDULE_BYTES + 64 * 1024) {
    const message = `The upload is ${(declared / 1048576).toFixed(1)} MB; a schedule file may be at most ${MAX_SCHEDULE_BYTES / 1048576} MB. Split it into smaller schedules.`;
    // Like every refused upload, it clears the file before it (only ever in the caller's own team).
    await recordRefusedUpload(user!.teamId, user!.id, params.scheduleId, { fileName: 'the upload', message });
    throw new ApiError(413, 'file_too_large', message);
  }
  // Another team's schedule answers 404 before its body is even read.
  if (!(await getSchedule(user!.teamId, params.scheduleId))) throw new ApiError(404, 'not_found', 'No such schedule.');
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new ApiError(400, 'invalid_input', 'Send the schedule as a multipart form with a "file" field.', 'file');
  }
  const file = form.get('file');
  if (!(file instanceof File)) throw new ApiError(400, 'invalid_input', 'Choose a CSV or XLSX file to upload.', 'file');
  const bytes = new Uint8Array(await file.arrayBuffer());
  return scheduleOperation(async () => {
    const preview = await previewScheduleUpload(
      user!.teamId,
      user!.id,
      params.scheduleId,
      { fileName: file.name || 'schedule', mediaType: file.type || 'application/octet-stream', bytes },
      readScheduleFileOffThread,
    );
    return Response.json({ preview });
  });
});

/** The original file, exactly as uploaded. */
export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const stored = await getScheduleFile(user!.teamId, params.scheduleId);
  if (!stored || !stored.content) throw new ApiError(404, 'not_found', 'No such schedule file.');
  return downloadResponse(new Uint8Array(stored.content), { fileName: stored.fileName ?? 'schedule', kind: 'original' });
});
