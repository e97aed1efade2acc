import { createProject, listProjects } from '@/db/queries/projects';
import { apiHandler, ApiError } from '@/server/http/api';
import { createProjectBodySchema } from '../sheets/_shared/sheetApi';
import { readJsonBody } from '@/server/http/body';

export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user }) => {
  return Response.json({ projects: await listProjects(user!.teamId) });
});

export const POST = apiHandler({ permission: 'project:write' }, async (req, { user }) => {
  const body = await readJsonBody(req, createProjectBodySchema);
  try {
    const project = await createProject(user!.teamId, user!.id, body);
    return Response.json({ project }, { status: 201 });
  } catch (error) {
    if ((error as { code?: string; cause?: { code?: string } }).code === '23505' || (error as { cause?: { code?: string } }).cause?.code === '23505') {
      throw new ApiError(409, 'duplicate_name', 'Your team already has a project with this name.', 'name');
    }
    throw error;
  }
});
