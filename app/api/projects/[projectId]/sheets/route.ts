import { getProject } from '@/db/queries/projects';
import { createSheet, isUuid, listSheetsForProject } from '@/db/queries/sheets';
import { defaultSheetInputs } from '@/lib/sheet';
import { apiHandler, ApiError } from '@/server/http/api';
import { createSheetBodySchema, sheetActor, sheetOperation } from '../../../sheets/_shared/sheetApi';
import { readJsonBody } from '@/server/http/body';

export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const project = isUuid(params.projectId) ? await getProject(user!.teamId, params.projectId) : null;
  if (!project) throw new ApiError(404, 'not_found', 'No such project.');
  return Response.json({ sheets: await listSheetsForProject(user!.teamId, project.id) });
});

/** A new sizing sheet in the project, with the defaults of its installation and no candidates yet. */
export const POST = apiHandler({ permission: 'sheet:write' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, createSheetBodySchema);
  if (!isUuid(params.projectId)) throw new ApiError(404, 'not_found', 'No such project.');
  return sheetOperation(async () => {
    const sheet = await createSheet(user!.teamId, sheetActor(user!), {
      projectId: params.projectId,
      circuitTag: body.circuitTag,
      title: body.title,
      inputs: defaultSheetInputs(body.installation),
    });
    return Response.json({ sheet }, { status: 201 });
  });
});
