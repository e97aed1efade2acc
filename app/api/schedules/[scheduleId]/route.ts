import { getSchedule, loadTeamFamilies, previewRowsOf, scheduleProgress } from '@/db/queries/schedules';
import { apiHandler, ApiError } from '@/server/http/api';

/** The schedule: file, preview problems (while a draft), progress and the team's families. */
export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const schedule = await getSchedule(user!.teamId, params.scheduleId);
  if (!schedule) throw new ApiError(404, 'not_found', 'No such schedule.');
  const draft = schedule.status === 'draft';
  const [progress, previewRows, families] = await Promise.all([
    scheduleProgress(user!.teamId, schedule.id),
    draft ? previewRowsOf(user!.teamId, schedule.id) : Promise.resolve([]),
    draft ? loadTeamFamilies(user!.teamId) : Promise.resolve([]),
  ]);
  return Response.json({ schedule, progress, previewRows, families: families.map((f) => ({ key: f.key, label: f.label, kind: f.kind, sizes: f.candidates.length })) });
});
