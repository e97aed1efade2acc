import { scheduleProgress } from '@/db/queries/schedules';
import { apiHandler, ApiError } from '@/server/http/api';

/** Rows done / total, rate and time left — polled by the schedule page while it runs. */
export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const progress = await scheduleProgress(user!.teamId, params.scheduleId);
  if (!progress) throw new ApiError(404, 'not_found', 'No such schedule.');
  return Response.json({ progress });
});
