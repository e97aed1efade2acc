import { z } from 'zod';
import { createSchedule } from '@/db/queries/schedules';
import { apiHandler } from '@/server/http/api';
import { scheduleOperation } from './_shared/scheduleApi';
import { readJsonBody } from '@/server/http/body';

const createScheduleBodySchema = z.object({
  projectId: z.string().trim().min(1, 'Project is required'),
  name: z.string().trim().min(1, 'Name is required').max(200, 'Name must be at most 200 characters'),
});

/** A new, empty schedule in a project; the file is uploaded to /api/schedules/[id]/file. */
export const POST = apiHandler({ permission: 'schedule:write' }, async (req, { user }) => {
  const body = await readJsonBody(req, createScheduleBodySchema);
  return scheduleOperation(async () => {
    const schedule = await createSchedule(user!.teamId, user!.id, body);
    return Response.json({ schedule }, { status: 201 });
  });
});
