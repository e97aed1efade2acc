import { getProject } from '@/db/queries/projects';
import { isUuid, listSheetsForProject } from '@/db/queries/sheets';
import { apiHandler, ApiError } from '@/server/http/api';

export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const project = isUuid(params.projectId) ? await getProject(user!.teamId, params.projectId) : null;
  if (!project) throw new ApiError(404, 'not_found', 'No such project.');
  return Response.json({ project, sheets: await listSheetsForProject(user!.teamId, project.id) });
});
