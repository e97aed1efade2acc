import { z } from 'zod';
import { getSchedule, queueSchedule } from '@/db/queries/schedules';
import { enqueueScheduleBatches } from '@/server/jobs/boss';
import { apiHandler, ApiError } from '@/server/http/api';
import { scheduleOperation } from '../../_shared/scheduleApi';
import { readJsonBody } from '@/server/http/body';

const queueBodySchema = z.object({ dropBadRows: z.boolean().default(false) });

/** Queues the clean rows for the workers (202): the request only stores rows and jobs. */
export const POST = apiHandler({ permission: 'schedule:write' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, queueBodySchema, { optional: true });
  if (!(await getSchedule(user!.teamId, params.scheduleId))) throw new ApiError(404, 'not_found', 'No such schedule.');
  return scheduleOperation(async () => {
    const queued = await queueSchedule(user!.teamId, user!.id, params.scheduleId, body, enqueueScheduleBatches);
    return Response.json({ queued }, { status: 202 });
  });
});
