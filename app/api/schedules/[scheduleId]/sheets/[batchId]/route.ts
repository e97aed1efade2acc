import { sheetBatchProgress } from '@/db/queries/sheetBatches';
import { apiHandler, ApiError } from '@/server/http/api';

/** The progress of a "make sizing sheets" batch and the sheets made so far (polled by the schedule page). */
export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const progress = await sheetBatchProgress(user!.teamId, params.batchId);
  if (!progress || progress.scheduleId !== params.scheduleId) throw new ApiError(404, 'not_found', 'No such batch of sheets.');
  return Response.json({ progress });
});
